import { afterEach, describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runAnalyze } from '../../src/cli/analyze';
import { exportLog } from '../../src/log/export';
import { sampleLog } from '../sync/sample-log';

const dirs: string[] = [];
afterEach(() => {
  for (const d of dirs.splice(0)) rmSync(d, { recursive: true, force: true });
});

function logText(): string {
  return exportLog(sampleLog({ days: 2, seriesPerDay: 2, dropsPerSeries: 4 }), { device: 'phoneA', app_version: '0.1.0' });
}

describe('the office command on an exported log', () => {
  it('writes the drops and series tables with --csv, one row per drop and per series', () => {
    const out = mkdtempSync(join(tmpdir(), 'plummet-cli-'));
    dirs.push(out);
    const result = runAnalyze(['log.json', '--csv', out], () => logText());
    expect(result.exitCode).toBe(0);
    const summary = JSON.parse(result.stdout) as { series: number; drops: number; failed: unknown[] };
    expect(summary).toMatchObject({ series: 4, drops: 16 });
    const drops = readFileSync(join(out, 'drops.csv'), 'utf8').replace(/^\uFEFF/, '').split('\r\n').filter(Boolean);
    const series = readFileSync(join(out, 'series.csv'), 'utf8').replace(/^\uFEFF/, '').split('\r\n').filter(Boolean);
    expect(drops).toHaveLength(1 + 16);
    expect(series).toHaveLength(1 + 4);
    expect(drops[0]).toContain('time_s');
    expect(series[0]).toContain('drag_coefficient');
  });

  it('prints every series as JSON without --csv', () => {
    const result = runAnalyze(['log.json'], () => logText());
    expect(result.exitCode).toBe(0);
    const parsed = JSON.parse(result.stdout) as { series: { series_id: string; drag_coefficient?: number | null }[] };
    expect(parsed.series).toHaveLength(4);
  });

  it('refuses a damaged log with exit 1, naming the field, the value and the rule', () => {
    const text = logText().replace(/"time_s":[0-9.]+/, '"time_s":-1.5');
    const result = runAnalyze(['log.json', '--csv', join(tmpdir(), 'never-written')], () => text);
    expect(result.exitCode).toBe(1);
    expect(result.stderr).toMatch(/time_s/);
    expect(result.stderr).toContain('-1.5');
    expect(result.stderr).toMatch(/rule: must be > 0/);
  });

  it('says so when --csv has no folder', () => {
    expect(runAnalyze(['log.json', '--csv'], () => logText()).exitCode).toBe(1);
  });
});
