/**
 * The office command's bundle: `npm run build:cli` writes dist-cli/plummet.mjs (and the chunks it loads on
 * demand), run by bin/plummet.mjs. Node 20 runs it as it is: no TypeScript compiled at start. Each subcommand's
 * work is a dynamic import, so `plummet --help` loads only the command table.
 */
import { readFileSync } from 'node:fs';
import { defineConfig } from 'vite';

const pkg = JSON.parse(readFileSync(new URL('./package.json', import.meta.url), 'utf8')) as { version: string };

export default defineConfig({
  // No public/ copy, no index.html: a program for Node, not a page.
  publicDir: false,
  logLevel: 'warn',
  define: { __APP_VERSION__: JSON.stringify(pkg.version) },
  build: {
    // The entry, and the series pool's worker thread beside it (src/cli/series-pool.ts looks for it there).
    ssr: true,
    outDir: 'dist-cli',
    emptyOutDir: true,
    target: 'node20',
    sourcemap: false,
    minify: false,
    reportCompressedSize: false,
    rolldownOptions: {
      input: { plummet: 'src/cli/main.ts', 'series-worker': 'src/cli/series-worker.ts' },
      output: {
        format: 'es',
        entryFileNames: '[name].mjs',
        chunkFileNames: 'chunks/[name]-[hash].mjs',
      },
    },
  },
});
