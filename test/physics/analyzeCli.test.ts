import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runAnalyze } from '../../src/cli/analyze';
import { buildCommand, root, runBuilt } from '../cli/built-command';

// The built office command, as `plummet analyze` runs it.
let built: Awaited<ReturnType<typeof buildCommand>>;
beforeAll(async () => {
  built = await buildCommand();
}, 120_000);
afterAll(() => built?.dispose());
const run = (...args: string[]) => runBuilt(built.bin, ['analyze', ...args]);

describe('the analyze command', () => {
  it('prints the analysis of an example request as JSON and exits 0', () => {
    const result = run('examples/footbridge-ball.json');
    expect(result.status).toBe(0);
    const json = JSON.parse(result.stdout);
    expect(json.drag_coefficient).toBeGreaterThan(0.4);
    expect(json.drag_coefficient).toBeLessThan(0.56);
    expect(json.drops).toHaveLength(5);
    expect(json.air.station_pressure_Pa).toBe(94180);
  }, 60_000);

  it('exits 1 on bad input with a message naming the field, the value and the allowed range', () => {
    const dir = mkdtempSync(join(tmpdir(), 'plummet-cli-'));
    const bad = JSON.parse(readFileSync(join(root, 'examples/footbridge-ball.json'), 'utf8'));
    bad.air.relative_humidity_pct = 130;
    const file = join(dir, 'bad.json');
    writeFileSync(file, JSON.stringify(bad));
    const result = run(file);
    expect(result.status).toBe(1);
    expect(result.stdout).toBe('');
    expect(result.stderr).toContain('air.relative_humidity_pct = 130');
    expect(result.stderr).toContain('allowed: 0 to 100 %');
  }, 60_000);

  it('exits 1 for a missing file and for text that is not JSON', () => {
    expect(runAnalyze(['/no/such/request.json'], (p) => readFileSync(p, 'utf8'))).toMatchObject({ exitCode: 1 });
    const notJson = runAnalyze(['x.json'], () => '{ "site": ');
    expect(notJson.exitCode).toBe(1);
    expect(notJson.stderr).toContain('not valid JSON');
  });

  it('prints its usage without a file', () => {
    const outcome = runAnalyze([], () => '');
    expect(outcome.exitCode).toBe(1);
    expect(outcome.stderr).toContain('usage:');
  });

  it('analyses every example in examples/', () => {
    for (const name of ['footbridge-ball.json', 'stairwell-box-offset.json', 'meadow-seed-pod.json', 'gym-beach-ball-video.json']) {
      const outcome = runAnalyze([join(root, 'examples', name)], (p) => readFileSync(p, 'utf8'));
      expect(outcome.exitCode, `${name}: ${outcome.stderr}`).toBe(0);
      expect(JSON.parse(outcome.stdout).drag_resolved).toBe(true);
    }
  });

  it('takes a timing method, a declared delay and the added-mass uncertainty, and refuses bad ones naming the field and range', () => {
    const read = (p: string) => readFileSync(p, 'utf8');
    const ok = runAnalyze([join(root, 'examples/gym-beach-ball-video.json')], read);
    const json = JSON.parse(ok.stdout);
    expect(json.declared_timing_offset).toMatchObject({ method: 'video', offset_s: 0, standard_uncertainty_s: 0.01 });
    expect(json.budget.map((r: { input: string }) => r.input)).toEqual(expect.arrayContaining(['timing_offset_s', 'added_mass_coefficient']));
    const request = JSON.parse(read(join(root, 'examples/gym-beach-ball-video.json')));
    const badMethod = runAnalyze(['x.json'], () => JSON.stringify({ ...request, timing: { method: 'sundial' } }));
    expect(badMethod.exitCode).toBe(1);
    expect(badMethod.stderr).toContain('timing.method');
    expect(badMethod.stderr).toContain('"gates"');
    const badDelay = runAnalyze(['x.json'], () => JSON.stringify({ ...request, timing: { method: 'video', offset_s: 5 } }));
    expect(badDelay.exitCode).toBe(1);
    expect(badDelay.stderr).toContain('timing.offset_s = 5');
    expect(badDelay.stderr).toContain('-2 to 2 s');
  });
});
