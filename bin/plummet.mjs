#!/usr/bin/env node
// The office command. Runs the built bundle (dist-cli/plummet.mjs, made by `npm run build`): plain JavaScript,
// nothing compiled at start.
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const bundle = new URL('../dist-cli/plummet.mjs', import.meta.url);
if (!existsSync(fileURLToPath(bundle))) {
  process.stderr.write('plummet: the office command is not built yet: run `npm run build` (or `npm run build:cli`) in the project folder\n');
  process.exit(2);
}
const { main, processIo } = await import(bundle.href);
process.exitCode = await main(process.argv.slice(2), processIo());
