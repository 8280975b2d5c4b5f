// Each guard of the source tree, proved to fail: one scratch copy of src/ and sw/ (with the tsconfigs, and the
// project's node_modules linked in), an escape planted in it, the real check run against it, the escape taken
// out again. The checks are the project's own: depcruise with .dependency-cruiser.cjs, tsc -p tsconfig.core.json
// and scripts/check-pure-calls.mjs, each run as `npm run guards` / `npm run typecheck` run them.
import { spawn } from 'node:child_process';
import { appendFileSync, cpSync, existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

const root = fileURLToPath(new URL('..', import.meta.url));
const depcruiseBin = join(root, 'node_modules/dependency-cruiser/bin/dependency-cruise.mjs');
const tscBin = join(root, 'node_modules/typescript/bin/tsc');
const callCheck = join(root, 'scripts/check-pure-calls.mjs');
let scratch = '';

interface Run {
  status: number | null;
  out: string;
}

function run(args: string[]): Promise<Run> {
  return new Promise((done, fail) => {
    const child = spawn(process.execPath, args, { cwd: scratch });
    let out = '';
    child.stdout.on('data', (chunk: Buffer) => (out += chunk.toString()));
    child.stderr.on('data', (chunk: Buffer) => (out += chunk.toString()));
    child.on('error', fail);
    child.on('close', (status) => done({ status, out }));
  });
}
const depcruise = () => run([depcruiseBin, '--config', join(root, '.dependency-cruiser.cjs'), '--output-type', 'err', 'src', 'sw']);
const coreCompile = () => run([tscBin, '-p', 'tsconfig.core.json', '--noEmit', '--pretty', 'false']);
const pureCalls = () => run([callCheck, scratch]);

/** Plants code in the scratch copy (a new file, or appended to one that exists), runs the check, takes it out. */
async function withPlanted(plants: Record<string, string>, check: () => Promise<Run>): Promise<Run> {
  const saved = new Map<string, string | null>();
  try {
    for (const [file, code] of Object.entries(plants)) {
      const path = join(scratch, file);
      saved.set(path, existsSync(path) ? readFileSync(path, 'utf8') : null);
      mkdirSync(dirname(path), { recursive: true });
      appendFileSync(path, `\n${code}\n`);
    }
    return await check();
  } finally {
    for (const [path, before] of saved) {
      if (before === null) rmSync(path);
      else writeFileSync(path, before);
    }
  }
}

/** The lines of a check's output that name the file, and the rule or message, of one escape. */
const named = (out: string, file: string, rule: string) => out.split('\n').filter((line) => line.includes(file) && line.includes(rule));

beforeAll(() => {
  scratch = mkdtempSync(join(tmpdir(), 'plummet-guards-'));
  for (const part of ['src', 'sw']) cpSync(join(root, part), join(scratch, part), { recursive: true });
  for (const file of ['tsconfig.json', 'tsconfig.core.json']) cpSync(join(root, file), join(scratch, file));
  // The one list of Chromium flags, which the office command's PDF printer imports from scripts/.
  for (const file of ['scripts/chromium-args.mjs', 'scripts/chromium-args.d.mts']) cpSync(join(root, file), join(scratch, file), { recursive: true });
  symlinkSync(join(root, 'node_modules'), join(scratch, 'node_modules'), 'dir');
});

afterAll(() => {
  if (scratch) rmSync(scratch, { recursive: true, force: true });
});

describe('the guards, against a scratch copy of the tree', { timeout: 120_000 }, () => {
  it('pass the untouched copy', async () => {
    // Nothing is planted here, so the three may run side by side.
    const [rules, compile, calls] = await Promise.all([depcruise(), coreCompile(), pureCalls()]);
    expect(rules.out).toContain('no dependency violations found');
    expect(rules.status).toBe(0);
    expect(compile.out.trim()).toBe('');
    expect(compile.status).toBe(0);
    expect(calls.out).toContain('pure core: no clock or randomness');
    expect(calls.status).toBe(0);
  });

  it('fail on a platform global anywhere in the pure core', async () => {
    const { status, out } = await withPlanted(
      {
        'src/physics/planted.ts': 'export const width = window.innerWidth;',
        'src/log/planted.ts': "export const title = () => document.title;\nexport const get = () => fetch('/x');",
        'src/analysis/planted.ts': 'export const db = () => indexedDB;\nexport const env = () => process.env;',
        'src/timing/tap-timing.ts': 'export const plantedAgent = () => navigator.userAgent;',
        'src/errors/planted.ts': 'export const where = () => location.href;',
      },
      coreCompile,
    );
    expect(status).not.toBe(0);
    expect(named(out, 'src/physics/planted.ts', "Cannot find name 'window'")).toHaveLength(1);
    expect(named(out, 'src/log/planted.ts', "Cannot find name 'document'")).toHaveLength(1);
    expect(named(out, 'src/log/planted.ts', "Cannot find name 'fetch'")).toHaveLength(1);
    expect(named(out, 'src/analysis/planted.ts', "Cannot find name 'indexedDB'")).toHaveLength(1);
    expect(named(out, 'src/analysis/planted.ts', "Cannot find name 'process'")).toHaveLength(1);
    expect(named(out, 'src/timing/tap-timing.ts', "Cannot find name 'navigator'")).toHaveLength(1);
    expect(named(out, 'src/errors/planted.ts', "Cannot find name 'location'")).toHaveLength(1);
  });

  it('fail on a clock read in the pure core, and let a given time be', async () => {
    const { status, out } = await withPlanted(
      {
        'src/physics/planted.ts': 'export const t = () => Date.now();',
        'src/log/planted.ts': 'export const d = () => new Date();\nexport const given = (ms: number) => new Date(ms).toISOString();',
        'src/analysis/planted.ts': 'export const p = () => performance.now();',
        'src/timing/tap-timing.ts': 'export const plantedClock = () => globalThis.Date.now();',
      },
      pureCalls,
    );
    expect(status).toBe(1);
    expect(named(out, 'src/physics/planted.ts:', 'no-clock')).toHaveLength(1);
    expect(named(out, 'src/log/planted.ts:', 'no-clock')).toHaveLength(1);
    expect(named(out, 'src/analysis/planted.ts:', 'no-clock')).toHaveLength(1);
    expect(named(out, 'src/timing/tap-timing.ts:', 'no-clock')).toHaveLength(1);
  });

  it('fail on a random draw in the pure core', async () => {
    const { status, out } = await withPlanted(
      {
        'src/physics/planted.ts': 'export const r = () => Math.random();',
        'src/log/planted.ts': 'export const id = () => crypto.randomUUID();',
      },
      pureCalls,
    );
    expect(status).toBe(1);
    expect(named(out, 'src/physics/planted.ts:', 'no-randomness')).toHaveLength(1);
    expect(named(out, 'src/log/planted.ts:', 'no-randomness')).toHaveLength(1);
  });

  it('fail on an import past another folder’s index', async () => {
    const { status, out } = await withPlanted(
      {
        'src/ui/planted.ts': "export { openLogStore } from '../store/idb-store';",
        'sw/planted.ts': "export { exportLog } from '../src/log/export';",
      },
      depcruise,
    );
    expect(status).not.toBe(0);
    expect(named(out, 'only-through-index: src/ui/planted.ts', 'src/store/idb-store.ts')).toHaveLength(1);
    expect(named(out, 'only-through-index: sw/planted.ts', 'src/log/export.ts')).toHaveLength(1);
  });

  it('fail on an import from a higher layer', async () => {
    const { status, out } = await withPlanted(
      {
        'src/log/planted.ts': "export { openLogStore } from '../store';",
        'src/physics/planted.ts': "export type { LogRecord } from '../log';",
        'src/errors/planted.ts': "export type { LogRecord } from '../log';",
        'src/store/planted.ts': "export { SyncError } from '../sync';",
      },
      depcruise,
    );
    expect(status).not.toBe(0);
    expect(named(out, 'layer-log: src/log/planted.ts', 'src/store/index.ts')).toHaveLength(1);
    expect(named(out, 'layer-physics: src/physics/planted.ts', 'src/log/index.ts')).toHaveLength(1);
    expect(named(out, 'layer-errors: src/errors/planted.ts', 'src/log/index.ts')).toHaveLength(1);
    expect(named(out, 'layer-store: src/store/planted.ts', 'src/sync/index.ts')).toHaveLength(1);
  });

  it('fail on a circle of imports', async () => {
    const { status, out } = await withPlanted(
      {
        'src/physics/planted-a.ts': "import { b } from './planted-b';\nexport const a = (): number => b() + 1;",
        'src/physics/planted-b.ts': "import { a } from './planted-a';\nexport const b = (): number => a() - 1;",
      },
      depcruise,
    );
    expect(status).not.toBe(0);
    // The circle is named from one of its members and lists the other.
    const circle = out.slice(out.indexOf('no-circular: src/physics/planted-'));
    expect(named(out, 'no-circular: src/physics/planted-', '').length).toBeGreaterThan(0);
    expect(circle).toContain('src/physics/planted-a.ts');
    expect(circle).toContain('src/physics/planted-b.ts');
  });

  it('fail on a package or the platform half of timing in the pure core, a folder off the map and an import that does not resolve', async () => {
    const { status, out } = await withPlanted(
      {
        'src/log/planted.ts': "export { openDB } from 'idb';",
        'src/timing/sound-interval.ts': "export { readFileSync as plantedRead } from 'node:fs';",
        'src/timing/tap-timing.ts': "export { SoundCapture as PlantedCapture } from './audio-capture';",
        'src/elsewhere/planted.ts': "export type { LogRecord } from '../log';",
        'src/analysis/planted.ts': "export { nothing } from './not-there';",
      },
      depcruise,
    );
    expect(status).not.toBe(0);
    expect(named(out, 'pure-core-no-packages: src/log/planted.ts', 'idb')).toHaveLength(1);
    expect(named(out, 'pure-core-no-packages: src/timing/sound-interval.ts', 'fs')).toHaveLength(1);
    expect(named(out, 'pure-core-imports-pure-core: src/timing/tap-timing.ts', 'src/timing/audio-capture.ts')).toHaveLength(1);
    expect(named(out, 'folder-in-the-map: src/elsewhere/planted.ts', 'src/log/index.ts')).toHaveLength(1);
    expect(named(out, 'resolvable: src/analysis/planted.ts', 'not-there')).toHaveLength(1);
  });
});
