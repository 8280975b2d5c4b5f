// Builds the production app once into a private folder and serves it on a free port of 127.0.0.1
// for every browser test file; torn down afterwards. Tests run against what ships.
import type { TestProject } from 'vitest/node';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { build } from 'vite';
import { startStaticServer, type StaticServer } from '../../scripts/static-server.mjs';
import { findChromium } from '../support/chromium';

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
    distDir: string;
    chromiumPath: string;
  }
}

let server: StaticServer | undefined;
let outDir: string | undefined;

export async function setup(project: TestProject): Promise<void> {
  const chromium = findChromium();
  project.provide('chromiumPath', chromium.path ?? '');
  if (!chromium.path) {
    const line = `browser tests did not run: ${chromium.reason}`;
    if (process.env.CI === 'true') throw new Error(`${line} (CI=true makes this a failure)`);
    console.warn(line);
    project.provide('baseUrl', '');
    project.provide('distDir', '');
    return;
  }
  outDir = await mkdtemp(join(tmpdir(), 'plummet-dist-'));
  await buildApp(outDir);
  server = await startStaticServer({ root: outDir });
  project.provide('baseUrl', server.url);
  project.provide('distDir', outDir);
}

/** A production build, as `npm run build` makes it (vitest sets NODE_ENV=test, which Vite would read as dev). */
export async function buildApp(dir: string, env: Record<string, string> = {}): Promise<void> {
  const saved = { ...process.env };
  Object.assign(process.env, { NODE_ENV: 'production' }, env);
  try {
    await build({ logLevel: 'warn', mode: 'production', build: { outDir: dir, emptyOutDir: true } });
  } finally {
    for (const key of Object.keys(process.env)) if (!(key in saved)) delete process.env[key];
    Object.assign(process.env, saved);
  }
}

export async function teardown(): Promise<void> {
  await server?.close();
  if (outDir) await rm(outDir, { recursive: true, force: true });
}
