/**
 * The built office command (`plummet …` through bin/plummet.mjs and the bundle) as the office runs it: a child
 * process, its exit status, stdout and stderr. The merge is compared with the phone's own import path (an
 * in-memory store taking the same files through previewImport and applyImport), and the figures with the
 * analysis run in this process on the same records. The demo logs are invented (test/sync/sample-log.ts).
 */
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { physicsSeriesComputer } from '../../src/analysis';
import { canonicalJson } from '../../src/log/canonical';
import { exportLog, sortRecords } from '../../src/log/export';
import { logCsv, seriesInputs } from '../../src/log/csv-tables';
import { logFileProblems, readLogFile } from '../../src/log/export-parse';
import type { LogRecord } from '../../src/log/types';
import { createMemoryStore } from '../../src/store';
import { applyImport, loadConflicts, previewImport } from '../../src/sync/import-log';
import { environment, T0 } from '../sync/hostile-logs';
import { revise, sampleLog, tombstone } from '../sync/sample-log';
import { officeDayLog } from '../../bench/office-day-logs';
import { buildCommand, runBuilt } from './built-command';

let built: Awaited<ReturnType<typeof buildCommand>>;
const work = mkdtempSync(join(tmpdir(), 'plummet-command-'));
beforeAll(async () => {
  built = await buildCommand();
}, 120_000);
afterAll(() => {
  built?.dispose();
  rmSync(work, { recursive: true, force: true });
});
const plummet = (args: readonly string[], input?: string) => runBuilt(built.bin, args, { input, cwd: work });

// Three phones: A's day as sent; B and C each edited the site's notes without seeing the other's edit (a
// conflict); C also deleted a drop and B excluded another (a tombstone and a revision travel like any edit).
const HOUR = 3_600_000;
const a = sampleLog({ device: 'phoneA', days: 1, seriesPerDay: 3, dropsPerSeries: 6 });
const site = a.find((r) => r.kind === 'site')!;
const drops = a.filter((r) => r.kind === 'drop');
const swap = (records: LogRecord[], from: LogRecord, to: LogRecord) => records.map((r) => (r === from ? to : r));
let b = swap(a, site, revise(site, { notes: 'west railing' } as never, T0 + HOUR, 'phoneB'));
b = swap(b, drops[1]!, revise(drops[1]!, { excluded: true, exclusion_reason: 'hit the railing' } as never, T0 + HOUR + 1000, 'phoneB', 'excluded'));
let c = swap(a, site, revise(site, { notes: 'east railing' } as never, T0 + 2 * HOUR, 'phoneC'));
c = swap(c, drops[4]!, tombstone(drops[4]!, T0 + 2 * HOUR + 1000, 'phoneC'));
const texts = {
  'plummet-log-phoneA.json': exportLog(a, { device: 'phoneA', app_version: '0.1.0' }),
  'plummet-log-phoneB.json': exportLog(b, { device: 'phoneB', app_version: '0.1.0' }),
  'plummet-log-phoneC.json': exportLog(c, { device: 'phoneC', app_version: '0.1.0' }),
};
const folder = join(work, 'office');
mkdirSync(folder);
for (const [name, text] of Object.entries(texts)) writeFileSync(join(folder, name), text);

/** The phone's merge of the same files, in the same order, through its import path. */
async function appMerge(names: readonly string[]) {
  const store = await createMemoryStore({ environment: environment(7, T0) });
  for (const name of names) {
    const { file } = await previewImport(store, texts[name as keyof typeof texts], name);
    await applyImport(store, file, name);
  }
  return { records: sortRecords(await store.allRecords({ includeDeleted: true })), conflicts: await loadConflicts(store) };
}

describe('plummet and its help', () => {
  it('lists its commands on --help and answers each command --help on stdout with exit 0', () => {
    const top = plummet(['--help']);
    expect(top.status).toBe(0);
    for (const name of ['analyze', 'merge', 'check']) {
      expect(top.stdout).toMatch(new RegExp(`^  ${name} `, 'm'));
      const one = plummet([name, '--help']);
      expect(one.status, one.stderr).toBe(0);
      expect(one.stdout.startsWith(`plummet ${name} - `)).toBe(true);
      expect(one.stdout).toMatch(/exit status: 0/);
      expect(one.stderr).toBe('');
    }
  }, 60_000);

  it('refuses an unknown command and a bare call with exit 1 and words on stderr only', () => {
    const unknown = plummet(['frobnicate']);
    expect(unknown.status).toBe(1);
    expect(unknown.stdout).toBe('');
    expect(unknown.stderr).toContain('"frobnicate" is not a command');
    const bare = plummet([]);
    expect(bare.status).toBe(1);
    expect(bare.stderr).toContain('usage: plummet <command>');
  }, 60_000);

  it('refuses an unknown option by name instead of reading it as a file', () => {
    const result = plummet(['merge', '--jsno', folder]);
    expect(result.status).toBe(1);
    expect(result.stderr).toContain('unknown option "--jsno"');
  }, 60_000);
});

describe('plummet merge', () => {
  it('merges a folder exactly as the phone imports the same files: the same records, the same conflicts', async () => {
    const out = join(work, 'merged-1');
    const result = plummet(['merge', '--json', '--out', join(out, 'log.json'), '--csv', out, 'office']);
    expect(result.status, result.stderr).toBe(0);
    const report = JSON.parse(result.stdout) as { files: { file: string }[]; conflicts: unknown[]; records: number };
    // The folder is read in name order: A, B, C.
    expect(report.files.map((f) => f.file)).toEqual(Object.keys(texts).map((n) => join('office', n)));
    const app = await appMerge(Object.keys(texts));
    const merged = readLogFile(readFileSync(join(out, 'log.json'), 'utf8'));
    expect(merged.device).toBe('office');
    expect(canonicalJson(merged.records)).toBe(canonicalJson(app.records));
    expect(report.records).toBe(app.records.length);
    expect(canonicalJson(report.conflicts)).toBe(canonicalJson(app.conflicts));
    // Nothing lost: both notes are in the site's versions, the deleted drop is a tombstone, the exclusion kept.
    const mergedSite = merged.records.find((r) => r.id === site.id)!;
    expect([mergedSite, ...mergedSite.history].map((v) => ('body' in v ? (v.body as { notes: string }).notes : (v as { notes: string }).notes)).sort()).toEqual(
      ['', 'east railing', 'west railing'].sort(),
    );
    expect(merged.records.find((r) => r.id === drops[4]!.id)!.deleted).toBe(true);
    expect(merged.records.find((r) => r.id === drops[1]!.id)).toMatchObject({ excluded: true, exclusion_reason: 'hit the railing' });
    expect(app.conflicts).toHaveLength(1);
  }, 60_000);

  it('gives the same merged log whatever order the files come in', () => {
    const forward = join(work, 'order-forward.json');
    const backward = join(work, 'order-backward.json');
    const names = Object.keys(texts).map((n) => join('office', n));
    expect(plummet(['merge', '--out', forward, ...names]).status).toBe(0);
    expect(plummet(['merge', '--out', backward, ...[...names].reverse()]).status).toBe(0);
    expect(readFileSync(backward, 'utf8')).toBe(readFileSync(forward, 'utf8'));
  }, 60_000);

  it('sums up every series with the figures of the analysis run here on the merged records', async () => {
    const result = plummet(['merge', '--json', 'office']);
    expect(result.status, result.stderr).toBe(0);
    const series = (JSON.parse(result.stdout) as { series: { series_id: string; drag_coefficient: number | null; drag_coefficient_95_low: number | null; verdict: string; drops_used: number; flags: string[] }[] }).series;
    const { records } = await appMerge(Object.keys(texts));
    const compute = physicsSeriesComputer();
    const inputs = seriesInputs(records);
    expect(series.map((s) => s.series_id)).toEqual(inputs.map((i) => i.series.id));
    for (const [i, input] of inputs.entries()) {
      const here = compute(input);
      expect(series[i]!.drag_coefficient).toBe(here.drag_coefficient);
      expect(series[i]!.drag_coefficient_95_low).toBe(here.drag_coefficient_interval_95?.[0] ?? null);
      expect(series[i]!.drops_used).toBe(input.drops.length);
      expect(series[i]!.flags).toEqual((here.warnings ?? []).map((w) => ((w as { severity?: string }).severity === 'info' ? `info:${w.code}` : w.code)));
      expect(['enough', 'short', 'unresolved']).toContain(series[i]!.verdict);
    }
    // The first series lost one drop to the exclusion, the second one to the deletion.
    expect(series.map((s) => s.drops_used)).toEqual(inputs.map((i) => i.drops.length));
  }, 60_000);

  it('writes the CSV tables the phone writes for the merged log', async () => {
    const out = join(work, 'merged-csv');
    expect(plummet(['merge', '--csv', out, 'office']).status).toBe(0);
    const { records } = await appMerge(Object.keys(texts));
    const tables = logCsv(records, physicsSeriesComputer());
    expect(readFileSync(join(out, 'drops.csv'), 'utf8')).toBe(tables.drops);
    expect(readFileSync(join(out, 'series.csv'), 'utf8')).toBe(tables.series);
  }, 60_000);

  it('reads standard input with - and writes the merged log to standard output with --out -, the summary to stderr', () => {
    const result = plummet(['merge', '--out', '-', '-', join('office', 'plummet-log-phoneB.json')], texts['plummet-log-phoneA.json']);
    expect(result.status, result.stderr).toBe(0);
    const merged = readLogFile(result.stdout);
    expect(merged.records.length).toBe(a.length);
    expect(result.stderr).toMatch(/\d+ series: /);
  }, 60_000);

  it('names a refused file by record, field, value and rule, merges the others, and exits 1', () => {
    const mixed = join(work, 'mixed');
    mkdirSync(mixed);
    writeFileSync(join(mixed, 'a.json'), texts['plummet-log-phoneA.json']);
    writeFileSync(join(mixed, 'b.json'), texts['plummet-log-phoneB.json'].replace(/"time_s":[0-9.]+/, '"time_s":-1.5'));
    writeFileSync(join(mixed, 'notes.txt'), 'not a log');
    symlinkSync(join(folder, 'plummet-log-phoneC.json'), join(mixed, 'c.json'));
    const out = join(work, 'mixed-out.json');
    const result = plummet(['merge', '--out', out, 'mixed']);
    expect(result.status).toBe(1);
    expect(result.stderr).toContain(join('mixed', 'b.json'));
    expect(result.stderr).toMatch(/field: records\[\d+\]\.(history\[\d+\]\.body\.)?time_s/);
    expect(result.stderr).toContain('value: -1.5');
    expect(result.stderr).toMatch(/rule: must be > 0/);
    expect(result.stderr).toContain(`passed over ${join('mixed', 'c.json')}: a symbolic link`);
    expect(result.stderr).not.toMatch(/\n\s+at .+:\d+:\d+/);
    expect(readLogFile(readFileSync(out, 'utf8')).records.length).toBe(a.length);
    expect(result.stdout).toContain('merged 1 log file from 1 phone');
  }, 60_000);

  it('gives the same figures on several threads as on one (a log large enough for the worker pool)', () => {
    const season = join(work, 'season');
    mkdirSync(season);
    // 16 invented phone days: over 64 series, the pool's threshold (src/cli/series-pool.ts).
    for (let i = 0; i < 16; i++) writeFileSync(join(season, `day-${i}.json`), officeDayLog(i));
    const one = plummet(['merge', '--json', '--jobs', '1', 'season']);
    const two = plummet(['merge', '--json', '--jobs', '2', 'season']);
    expect(one.status, one.stderr).toBe(0);
    expect(two.status, two.stderr).toBe(0);
    const series = (JSON.parse(one.stdout) as { series: unknown[] }).series;
    expect(series.length).toBeGreaterThanOrEqual(64);
    expect(two.stdout).toBe(one.stdout);
    // The pool's worker is part of the bundle, so --jobs 2 did run on two threads.
    expect(existsSync(join(dirname(built.bin), '../dist-cli/series-worker.mjs'))).toBe(true);
  }, 180_000);

  it('refuses a --jobs that is not a whole number of threads', () => {
    const result = plummet(['merge', '--jobs', '0', 'office']);
    expect(result.status).toBe(1);
    expect(result.stderr).toContain('--jobs "0" is not a number of threads');
  }, 60_000);

  it('refuses a missing path and a folder with no log, with exit 1', () => {
    const missing = plummet(['merge', 'no-such-folder']);
    expect(missing.status).toBe(1);
    expect(missing.stderr).toContain('cannot read no-such-folder: no such file or folder');
    mkdirSync(join(work, 'empty'));
    const empty = plummet(['merge', 'empty']);
    expect(empty.status).toBe(1);
    expect(empty.stderr).toContain('no .json file found');
  }, 60_000);
});

describe('plummet check', () => {
  const broken = texts['plummet-log-phoneA.json'].replace(/"time_s":[0-9.]+/, '"time_s":-1.5').replace(/"mass_kg":[0-9.]+/, '"mass_kg":"heavy"');

  it('accepts good files with exit 0 and one line each', () => {
    const result = plummet(['check', 'office']);
    expect(result.status, result.stdout + result.stderr).toBe(0);
    expect(result.stdout.match(/^ok /gm)).toHaveLength(3);
    expect(result.stdout).toContain('3 files checked: 3 accepted, 0 refused');
  }, 60_000);

  it('lists every schema problem of a file with its record, field, value and rule, and exits 1', () => {
    writeFileSync(join(work, 'broken.json'), broken);
    const result = plummet(['check', 'broken.json', join('office', 'plummet-log-phoneA.json')]);
    expect(result.status).toBe(1);
    // The first of each kind in the file's order (records are sorted by kind, then id).
    const inFile = readLogFile(texts['plummet-log-phoneA.json']).records;
    const specimen = inFile.find((r) => r.kind === 'specimen')!;
    const drop = inFile.find((r) => r.kind === 'drop')!;
    expect(result.stdout).toContain('refused broken.json: 2 problems');
    expect(result.stdout).toMatch(new RegExp(`record: records\\[\\d+\\] specimen ${specimen.id}\\n  field:  records\\[\\d+\\]\\.mass_kg\\n  value:  "heavy"\\n  rule:   must be a number`));
    expect(result.stdout).toMatch(new RegExp(`record: records\\[\\d+\\] drop ${drop.id}\\n  field:  records\\[\\d+\\]\\.time_s\\n  value:  -1.5\\n  rule:   must be > 0`));
    expect(result.stdout).toContain('2 files checked: 1 accepted, 1 refused');
  }, 60_000);

  it('gives the same findings as JSON from standard input', () => {
    const result = plummet(['check', '--json', '-'], broken);
    expect(result.status).toBe(1);
    const report = JSON.parse(result.stdout) as { files: { file: string; ok: boolean; problems: { record: { kind: string }; field: string; value: unknown; rule: string }[] }[] };
    expect(report.files[0]).toMatchObject({ file: '(standard input)', ok: false });
    expect(report.files[0]!.problems.map((p) => [p.record.kind, p.field.replace(/^records\[\d+\]\./, ''), p.value])).toEqual([
      ['specimen', 'mass_kg', 'heavy'],
      ['drop', 'time_s', -1.5],
    ]);
  }, 60_000);

  it('lists the gate problems a schema cannot see: a record whose history runs backwards', () => {
    const drop = a.find((r) => r.kind === 'drop')!;
    const later = revise(drop, { time_s: 1.6 } as never, T0 + HOUR, 'phoneA');
    // The current version stamped before the one it replaced: the gate's rule, not the schema's.
    const backwards = { ...later, rev: later.history[0]!.rev.replace(/^\d{15}/, (ms) => String(Number(ms) - 1).padStart(15, '0')) };
    const text = exportLog(swap(a, drop, backwards as LogRecord), { device: 'phoneA', app_version: '0.1.0' });
    const result = plummet(['check', '--json', '-'], text);
    expect(result.status).toBe(1);
    const problems = (JSON.parse(result.stdout) as { files: { problems: { record: { id: string }; field: string; rule: string; code: string }[] }[] }).files[0]!.problems;
    expect(problems.length).toBeGreaterThan(0);
    expect(problems[0]!.record.id).toBe(drop.id);
    expect(problems[0]!.code).toBe('log-record-invalid');
    expect(problems[0]!.rule).toBeTruthy();
  }, 60_000);

  it('calls a file that is not JSON, or nested too deeply, by its name with exit 1 and no stack', () => {
    writeFileSync(join(work, 'not-json.json'), '{ "format": ');
    writeFileSync(join(work, 'deep.json'), '['.repeat(100_000));
    const result = plummet(['check', 'not-json.json', 'deep.json']);
    expect(result.status).toBe(1);
    expect(result.stdout).toContain('refused not-json.json');
    expect(result.stdout).toContain('code:   log-not-json');
    expect(result.stdout).toContain('code:   input-nested-too-deeply');
    expect(result.stdout + result.stderr).not.toMatch(/\n\s+at .+:\d+:\d+/);
  }, 60_000);
});

describe('reading for a report rather than a refusal (logFileProblems)', () => {
  it('starts with the very error readLogFile throws', () => {
    const broken = texts['plummet-log-phoneA.json'].replace(/"time_s":[0-9.]+/g, '"time_s":-1.5');
    const problems = logFileProblems(broken, { name: 'x.json' });
    expect(problems.length).toBe(18);
    expect(() => readLogFile(broken, { name: 'x.json' })).toThrow(problems[0]!.message);
    expect(logFileProblems(broken, { limit: 5 })).toHaveLength(5);
    expect(logFileProblems(texts['plummet-log-phoneA.json'])).toEqual([]);
  });
});
