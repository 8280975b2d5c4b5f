// `npm start`: serve the production build on http://127.0.0.1:4173 (PORT and HOST may override).
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
});
console.log(`Plummet is served at ${server.url}/ (Ctrl+C stops it). After the first load it works offline.`);
const stop = () => server.close().then(() => process.exit(0));
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
