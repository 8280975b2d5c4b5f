import { defineConfig } from 'vitest/config';
import preact from '@preact/preset-vite';
import { VitePWA } from 'vite-plugin-pwa';
import { readFileSync } from 'node:fs';
import type { Plugin } from 'vite';
import { pageContentSecurityPolicy, REFERRER_POLICY } from './scripts/security-headers.mjs';

const pkg = JSON.parse(readFileSync(new URL('./package.json', import.meta.url), 'utf8')) as { version: string };

// PLUMMET_BUILD_ID lets the browser tests produce two builds that differ, to exercise the update notice.
const buildId = process.env.PLUMMET_BUILD_ID ?? pkg.version;

// The office folders the page may connect to, when the office builds its own copy (space-separated origins);
// without it the page's policy allows any https folder, and the server's headers narrow it.
const folderOrigins = process.env.PLUMMET_FOLDER_ORIGINS?.split(/\s+/).filter(Boolean);

/**
 * The Content-Security-Policy and the referrer policy in the built page, first in <head> so that they cover
 * everything after them. Build only: the dev server injects inline scripts for hot reload.
 */
function securityMeta(): Plugin {
  return {
    name: 'plummet-security-meta',
    apply: 'build',
    transformIndexHtml(html) {
      // Right after <meta charset>, which must stay within the first 1024 bytes and before any script or link.
      const charset = /<meta charset="utf-8" \/>\n/;
      if (!charset.test(html)) throw new Error('index.html: no <meta charset="utf-8" /> line to put the security policy after');
      const policy = pageContentSecurityPolicy(folderOrigins?.length ? folderOrigins : null);
      return html.replace(
        charset,
        (line) => `${line}    <meta http-equiv="Content-Security-Policy" content="${policy}" />\n    <meta name="referrer" content="${REFERRER_POLICY}" />\n`,
      );
    },
  };
}

export default defineConfig({
  define: {
    __APP_VERSION__: JSON.stringify(pkg.version),
    __BUILD_ID__: JSON.stringify(buildId),
  },
  plugins: [
    securityMeta(),
    preact(),
    VitePWA({
      strategies: 'injectManifest',
      srcDir: 'sw',
      filename: 'sw.ts',
      injectRegister: false,
      // The web manifest and icons are added to the precache by the plugin itself;
      // a wider glob would list them twice.
      injectManifest: { globPatterns: ['**/*.{js,css,html}'], rollupFormat: 'iife', minify: true },
      includeAssets: ['icons/icon.svg', 'robots.txt', 'schema/*.json'],
      manifest: {
        name: 'Plummet field log',
        short_name: 'Plummet',
        description: 'Log timed drop tests offline and compute air density and the effective drag coefficient on the phone.',
        id: '/',
        start_url: '/',
        scope: '/',
        display: 'standalone',
        orientation: 'portrait',
        theme_color: '#0b3d2e',
        background_color: '#f7f5ee',
        lang: 'en',
        categories: ['utilities', 'productivity'],
        icons: [
          { src: 'icons/icon-192.png', sizes: '192x192', type: 'image/png', purpose: 'any' },
          { src: 'icons/icon-512.png', sizes: '512x512', type: 'image/png', purpose: 'any' },
          { src: 'icons/icon-maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
          { src: 'icons/icon.svg', sizes: 'any', type: 'image/svg+xml', purpose: 'any' },
        ],
      },
      devOptions: { enabled: false },
    }),
  ],
  build: {
    target: 'es2022',
    sourcemap: false,
    reportCompressedSize: false,
    // Every browser the app supports has <link rel="modulepreload">: no polyfill in the first screen's code.
    modulePreload: { polyfill: false },
    rolldownOptions: {
      output: {
        codeSplitting: {
          groups: [
            // The physics and the analysis on it travel together: one request after the first render for the
            // figures the day overview fills in, the same one for any later screen that computes. The planner's
            // search and the series curves stay with the screens that draw or plan.
            // Preact and the bundler's small runtime: one file the shell and every screen share.
            { name: 'preact', test: /[\\/]node_modules[\\/]preact[\\/]|rolldown[\\/]runtime/ },
            // The error base every layer extends: its own small file, or the bundler would put it in the physics
            // group (which imports it too) and the shell, whose store errors extend it, would load all the physics.
            { name: 'errors', test: /[\\/]src[\\/]errors[\\/]/ },
            // The catalogue of stored fields and their limits, which every form reads: its own small file, or the
            // analysis (which imports it too) would carry it into the physics group and every form would load it.
            { name: 'fields', test: /[\\/]src[\\/]log[\\/]fields\.ts$/ },
            { name: 'physics', test: /[\\/]src[\\/](physics[\\/](?!planDrop)|analysis[\\/](?!series-curves))|[\\/]day-figures\.ts$/ },
          ],
        },
      },
    },
  },
  preview: { host: '127.0.0.1', port: 4173, strictPort: true },
  test: {
    projects: [
      {
        extends: true,
        test: {
          name: 'unit',
          include: ['test/**/*.test.{ts,tsx}'],
          exclude: ['test/browser/**', 'node_modules/**'],
          environment: 'node',
        },
      },
      {
        extends: true,
        test: {
          name: 'browser',
          include: ['test/browser/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['test/browser/global-setup.ts'],
          fileParallelism: false,
          testTimeout: 90_000,
          hookTimeout: 180_000,
        },
      },
    ],
  },
});
