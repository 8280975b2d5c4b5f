// `npm start`: serve the production build on http://127.0.0.1:4173 (PORT and HOST may override).
// PLUMMET_FOLDER_ORIGINS (space-separated, e.g. "https://files.example.org") lets the page connect to an office
// folder on another origin; a folder on this computer is allowed without it.
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { startStaticServer } from './static-server.mjs';

const root = fileURLToPath(new URL('../dist/', import.meta.url));
if (!existsSync(root)) {
  console.error('dist/ is missing: run `npm run build` first (npm start does it for you).');
  process.exit(1);
}
const server = await startStaticServer({
  root,
  port: Number(process.env.PORT ?? 4173),
  host: process.env.HOST ?? '127.0.0.1',
  folderOrigins: (process.env.PLUMMET_FOLDER_ORIGINS ?? '').split(/\s+/).filter(Boolean),
});
console.log(`Plummet is served at ${server.url}/ (Ctrl+C stops it). After the first load it works offline.`);
const stop = () => server.close().then(() => process.exit(0));
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
