// The source tree against its own guards: the import rule table (.dependency-cruiser.cjs) and the pure core's
// clock-and-randomness check. The pure core's own compile (tsconfig.core.json) runs in `npm run typecheck`.
// test/architecture-escapes.test.ts proves that each guard fails on a planted escape.
import { spawnSync } from 'node:child_process';
import { readdirSync, statSync } from 'node:fs';
import { createRequire } from 'node:module';
import { join, relative, sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import ts from 'typescript';
import { describe, expect, it } from 'vitest';
import { checkPureCalls } from '../scripts/check-pure-calls.mjs';

const root = fileURLToPath(new URL('..', import.meta.url));
const depcruise = join(root, 'node_modules/dependency-cruiser/bin/dependency-cruise.mjs');
const config = createRequire(import.meta.url)('../.dependency-cruiser.cjs') as {
  forbidden: { name: string; from: { path?: string | string[] } }[];
};

function walk(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const p = join(dir, name);
    return statSync(p).isDirectory() ? walk(p) : [relative(root, p).split(sep).join('/')];
  });
}

describe('the import rules', () => {
  it('hold for the whole of src/ and sw/', { timeout: 60_000 }, () => {
    const run = spawnSync(process.execPath, [depcruise, '--config', '.dependency-cruiser.cjs', '--output-type', 'err', 'src', 'sw'], {
      cwd: root,
      encoding: 'utf8',
    });
    expect(run.stdout + run.stderr).toContain('no dependency violations found');
    expect(run.status).toBe(0);
  });
});

describe('the pure core', () => {
  it('reads no clock and draws no random numbers', { timeout: 60_000 }, () => {
    const { files, findings } = checkPureCalls(root);
    expect(findings.map((f) => `${f.file}:${f.line} ${f.rule}: ${f.message}`)).toEqual([]);
    expect(files).toBeGreaterThan(40);
  });

  it('is the same list of files for the import rules and for the platform-free compile', () => {
    const rule = config.forbidden.find((r) => r.name === 'pure-core-no-packages');
    const patterns = [rule?.from.path ?? []].flat().map((p) => new RegExp(p));
    expect(patterns.length).toBeGreaterThan(0);
    const parsed = ts.getParsedCommandLineOfConfigFile(join(root, 'tsconfig.core.json'), {}, { ...ts.sys, onUnRecoverableConfigFileDiagnostic: () => {} });
    const compiled = (parsed?.fileNames ?? []).map((f) => relative(root, f).split(sep).join('/')).sort();
    const matched = walk(join(root, 'src'))
      .filter((f) => /\.tsx?$/.test(f) && patterns.some((p) => p.test(f)))
      .sort();
    expect(compiled.length).toBeGreaterThan(40);
    expect(compiled).toEqual(matched);
  });
});
