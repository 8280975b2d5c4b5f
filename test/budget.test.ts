import { afterEach, describe, expect, it } from 'vitest';
import { mkdtempSync, mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { randomBytes } from 'node:crypto';
import { spawnSync } from 'node:child_process';
import { measure } from '../scripts/budget.mjs';

const dirs: string[] = [];
afterEach(() => {
  for (const d of dirs.splice(0)) rmSync(d, { recursive: true, force: true });
});

/** A fake build folder: index.html loading one script and one stylesheet, sw.js listing a precache. */
function fakeBuild(jsBytes: Buffer): string {
  const dist = mkdtempSync(join(tmpdir(), 'plummet-budget-'));
  dirs.push(dist);
  mkdirSync(join(dist, 'assets'));
  writeFileSync(
    join(dist, 'index.html'),
    '<html><head><script type="module" crossorigin src="/assets/a.js"></script><link rel="stylesheet" crossorigin href="/assets/a.css"></head></html>',
  );
  writeFileSync(join(dist, 'assets/a.js'), jsBytes);
  writeFileSync(join(dist, 'assets/a.css'), 'body{color:red}');
  writeFileSync(join(dist, 'sw.js'), 'x([{"url":"index.html","revision":"1"},{"url":"assets/a.js","revision":null},{"url":"assets/a.css","revision":null}])');
  return dist;
}

describe('the size budget', () => {
  it('passes a small build and measures gzip sizes of what index.html loads', () => {
    const dist = fakeBuild(Buffer.from('console.log("hello");'.repeat(100)));
    const { figures, over, files } = measure(dist);
    expect(files.initialJs).toEqual(['assets/a.js']);
    expect(files.styles).toEqual(['assets/a.css']);
    expect(figures.initialJsGzip).toBeGreaterThan(20);
    expect(figures.initialJsGzip).toBeLessThan(200); // repetitive text compresses well
    expect(over).toEqual([]);
  });

  it('fails when the initial JavaScript is over 45 KB gzip (random bytes do not compress)', () => {
    const dist = fakeBuild(randomBytes(60_000));
    const { over } = measure(dist);
    expect(over).toContain('initialJsGzip');
    const run = spawnSync(process.execPath, ['scripts/budget.mjs', dist], { encoding: 'utf8' });
    expect(run.status).toBe(1);
    expect(run.stderr).toContain('size budget exceeded: initialJsGzip');
  });

  it('fails when the precache is over 300 KB gzip', () => {
    const dist = fakeBuild(randomBytes(310_000));
    expect(measure(dist).over).toContain('precache');
  });
});
