// The office command as the office runs it: the bundle built once per test file into a scratch folder
// (vite.cli.config.ts, as `npm run build` makes it) with bin/plummet.mjs beside it, run as a child process.
import { spawnSync, type SpawnSyncReturns } from 'node:child_process';
import { copyFileSync, mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { build } from 'vite';

export const root = join(import.meta.dirname, '../..');

/** Builds the bundle into a fresh folder; returns the path of its bin/plummet.mjs and a clean-up. */
export async function buildCommand(): Promise<{ bin: string; dispose: () => void }> {
  const dir = mkdtempSync(join(tmpdir(), 'plummet-bin-'));
  // mode production: vitest sets NODE_ENV=test, which Vite would otherwise read as a development build.
  await build({ configFile: join(root, 'vite.cli.config.ts'), root, mode: 'production', logLevel: 'warn', build: { outDir: join(dir, 'dist-cli'), emptyOutDir: true } });
  mkdirSync(join(dir, 'bin'));
  copyFileSync(join(root, 'bin/plummet.mjs'), join(dir, 'bin/plummet.mjs'));
  return { bin: join(dir, 'bin/plummet.mjs'), dispose: () => rmSync(dir, { recursive: true, force: true }) };
}

export interface RunOptions {
  input?: string | Buffer;
  cwd?: string;
  env?: Record<string, string>;
}

/** One run of the built command (the timeout guards against a hang; it measures nothing). */
export function runBuilt(bin: string, args: readonly string[], options: RunOptions = {}): SpawnSyncReturns<string> {
  return spawnSync(process.execPath, [bin, ...args], {
    cwd: options.cwd ?? root,
    encoding: 'utf8',
    timeout: 60_000,
    input: options.input,
    env: { ...process.env, ...options.env },
    maxBuffer: 256 * 1024 * 1024,
  });
}
