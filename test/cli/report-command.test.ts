import { mkdtempSync, readFileSync, rmSync, writeFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { PassThrough, Readable } from 'node:stream';
import { afterAll, describe, expect, it } from 'vitest';
import { report } from '../../src/cli/commands/report';
import type { CommandIo } from '../../src/cli/command';
import { exportLog } from '../../src/log';
import { analyzeDay } from '../../src/analysis';
import { dayRecords } from '../../src/report';
import type { DayRecord } from '../../src/log/types';
import { reportLog } from '../report/report-fixture';
import { findChromium } from '../support/chromium';

const dir = mkdtempSync(join(tmpdir(), 'plummet-report-cli-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const { records, day } = reportLog();
const logPath = join(dir, 'log.json');
writeFileSync(logPath, exportLog(records, { app_version: 'test', device: 'phoneT' }));

async function runReport(args: string[], stdinText = '') {
  const stdout = new PassThrough();
  const stderr = new PassThrough();
  let out = '';
  let err = '';
  stdout.on('data', (c: Buffer) => (out += c.toString()));
  stderr.on('data', (c: Buffer) => (err += c.toString()));
  const io: CommandIo = { stdin: Readable.from([Buffer.from(stdinText)]), stdout, stderr, stderrIsTerminal: false, cwd: dir };
  const code = await report.run(args, io);
  return { code, out, err };
}

describe('plummet report', () => {
  it('says how it is used, in full, with --help', async () => {
    const r = await runReport(['--help']);
    expect(r.code).toBe(0);
    expect(r.out).toContain('usage: plummet report');
    expect(r.out).toContain('--pdf FILE');
  });

  it('writes the HTML to a file and summarises it as JSON with the core figures', async () => {
    const r = await runReport(['log.json', '--out', 'out/day.html', '--json', '--draws', '2000']);
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
    const summary = JSON.parse(r.out);
    const html = readFileSync(join(dir, 'out/day.html'), 'utf8');
    expect(html.startsWith('<!doctype html>')).toBe(true);
    const core = analyzeDay(dayRecords(records, day.day as DayRecord), { monteCarloDraws: 2000 })[0]!.outcome;
    if (core.kind !== 'ready') throw new Error('the test day computes');
    expect(summary.days[0].series[0].drag_coefficient).toBe(core.result.drag_coefficient);
    expect(summary.days[0].series[0].drag_coefficient_interval_95).toEqual(core.result.drag_coefficient_interval_95);
    expect(html).toContain(`data-value="${core.result.drag_coefficient}" data-field="drag_coefficient"`);
  });

  it('reads standard input with - and writes the HTML to standard output', async () => {
    const r = await runReport(['-', '--draws', '500'], readFileSync(logPath, 'utf8'));
    expect(r.code).toBe(0);
    expect(r.out).toContain('<h1>Day report 2026-07-03</h1>');
  });

  it('picks a day by its date and refuses one the logs do not hold, naming the dates there are', async () => {
    expect((await runReport(['log.json', '--day', '2026-07-03', '--draws', '500', '-o', 'one.html'])).code).toBe(0);
    const r = await runReport(['log.json', '--day', '2026-07-04']);
    expect(r.code).toBe(1);
    expect(r.err).toContain('--day "2026-07-04" names no day of the logs');
    expect(r.err).toContain('2026-07-03');
  });

  it('refuses a file that is not a log, naming the file and the field', async () => {
    writeFileSync(join(dir, 'bad.json'), JSON.stringify({ format: 'plummet-log', format_version: 2, records: 3 }));
    const r = await runReport(['bad.json']);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/bad\.json/);
    expect(r.err).toMatch(/field: /);
  });

  it('refuses an unknown option and a bad paper size', async () => {
    expect((await runReport(['log.json', '--colour'])).code).toBe(1);
    const r = await runReport(['log.json', '--paper', 'a3', '--pdf', 'x.pdf']);
    expect(r.code).toBe(1);
    expect(r.err).toContain('allowed are a4 and letter');
  });

  const chromium = findChromium();
  it.skipIf(!chromium.path)('prints a PDF with the system Chromium', { timeout: 60_000 }, async () => {
    const r = await runReport(['log.json', '--draws', '500', '-o', 'p.html', '--pdf', 'p.pdf', '--paper', 'letter']);
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
    const pdf = readFileSync(join(dir, 'p.pdf'));
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    expect(existsSync(join(dir, 'p.html'))).toBe(true);
  });
});
