import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { buildLogFile, exportLog, logFileName, selectRecords, writeLogFile } from '../../src/log/export';
import { LogFileError, readLogFile } from '../../src/log/export-parse';
import { canonicalJson } from '../../src/log/canonical';
import { LOG_FORMAT_VERSION } from '../../src/log/schema';
import { byKind, revise, sampleLog, tombstone } from '../sync/sample-log';
import type { LogRecord } from '../../src/log/types';

const META = { device: 'phoneA', app_version: '0.1.0' };

function shuffled<T>(items: readonly T[], seed: number): T[] {
  const out = [...items];
  let s = seed;
  for (let i = out.length - 1; i > 0; i--) {
    s = (s * 1103515245 + 12345) % 2147483648;
    const j = s % (i + 1);
    [out[i], out[j]] = [out[j]!, out[i]!];
  }
  return out;
}

describe('exporting a log', () => {
  const log = sampleLog({ days: 2, seriesPerDay: 2, dropsPerSeries: 3 });

  it('writes the format name, its version, the device and the app version', () => {
    const file = JSON.parse(exportLog(log, META));
    expect(file).toMatchObject({ format: 'plummet-log', format_version: LOG_FORMAT_VERSION, device: 'phoneA', app_version: '0.1.0', selection: null });
    expect(file.records).toHaveLength(log.length);
  });

  it('gives the same bytes for the same log whatever order the records come in', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 1_000_000 }), (seed) => {
        expect(exportLog(shuffled(log, seed), META)).toBe(exportLog(log, META));
      }),
      { numRuns: 25 },
    );
  });

  it('writes canonical JSON (RFC 8785): parsing and writing again changes nothing', () => {
    const text = exportLog(log, META);
    expect(canonicalJson(JSON.parse(text))).toBe(text);
  });

  it('orders records parents first (sites, specimens, days, readings, series, drops)', () => {
    const kinds = JSON.parse(exportLog(shuffled(log, 7), META)).records.map((r: LogRecord) => r.kind);
    const order = ['site', 'specimen', 'day', 'reading', 'series', 'drop'];
    expect(kinds).toEqual([...kinds].sort((a: string, b: string) => order.indexOf(a) - order.indexOf(b)));
  });

  it('keeps tombstones and the history of every record', () => {
    const drop = byKind(log, 'drop')[0]!;
    const edited = revise(drop, { time_s: 1.7 }, Date.UTC(2026, 6, 1), 'phoneB', 'misread the stopwatch');
    const gone = tombstone(byKind(log, 'drop')[1]!, Date.UTC(2026, 6, 1), 'phoneB');
    const records = log.map((r) => (r.id === edited.id ? edited : r.id === gone.id ? gone : r));
    const file = readLogFile(exportLog(records, META));
    expect(file.records.find((r) => r.id === gone.id)!.deleted).toBe(true);
    expect(file.records.find((r) => r.id === edited.id)!.history[0]!.reason).toBe('misread the stopwatch');
  });

  it('never writes anything but the records and the header (no settings, no credentials)', () => {
    const file = JSON.parse(exportLog(log, META));
    expect(Object.keys(file).sort()).toEqual(['app_version', 'device', 'format', 'format_version', 'records', 'selection']);
  });

  it('names the file by device and date', () => {
    expect(logFileName('phoneA', '2026-06-14')).toBe('plummet-log-phoneA-2026-06-14.json');
    expect(logFileName('ph:one', '2026-06-14', 'day')).toBe('plummet-log-ph~one-2026-06-14-day.json');
  });
});

describe('choosing part of a log', () => {
  const log = sampleLog({ days: 2, seriesPerDay: 2, dropsPerSeries: 2 });
  const [day1, day2] = byKind(log, 'day');
  const idsOf = (records: LogRecord[]) => new Set(records.map((r) => r.id));

  it('takes a day with its readings, series and drops and the site and specimens they refer to', () => {
    const part = selectRecords(log, { day_ids: [day1!.id] });
    const series = byKind(log, 'series').filter((s) => s.day_id === day1!.id);
    const drops = byKind(log, 'drop').filter((d) => series.some((s) => s.id === d.series_id));
    const expected = [
      ...byKind(log, 'site'),
      ...byKind(log, 'specimen').filter((sp) => series.some((s) => s.specimen_id === sp.id)),
      day1!,
      ...byKind(log, 'reading').filter((r) => r.day_id === day1!.id),
      ...series,
      ...drops,
    ];
    expect(idsOf(part)).toEqual(idsOf(expected));
    expect(part.some((r) => r.id === day2!.id)).toBe(false);
  });

  it('takes a specimen with its series and drops and the days and sites they refer to', () => {
    const specimen = byKind(log, 'specimen')[1]!;
    const part = selectRecords(log, { specimen_ids: [specimen.id] });
    const series = byKind(log, 'series').filter((s) => s.specimen_id === specimen.id);
    expect(series.length).toBe(2);
    for (const s of series) expect(part.some((r) => r.id === s.id)).toBe(true);
    expect(part.filter((r) => r.kind === 'specimen').map((r) => r.id)).toEqual([specimen.id]);
    expect(part.filter((r) => r.kind === 'day')).toHaveLength(2);
    expect(part.filter((r) => r.kind === 'drop')).toHaveLength(4);
    // The days come because the series refer to them; their other series do not come along.
    expect(part.filter((r) => r.kind === 'series')).toHaveLength(2);
  });

  it('takes every record of the chosen kinds, for an office catalogue of specimens and sites', () => {
    const part = selectRecords(log, { kinds: ['specimen', 'site'] });
    expect(new Set(part.map((r) => r.kind))).toEqual(new Set(['specimen', 'site']));
    expect(part).toHaveLength(3);
  });

  it('includes deleted records of the chosen part, so the deletion travels', () => {
    const drop = byKind(log, 'drop').find((d) => byKind(log, 'series').find((s) => s.id === d.series_id)!.day_id === day1!.id)!;
    const records = log.map((r) => (r.id === drop.id ? tombstone(drop, Date.UTC(2026, 6, 2), 'phoneA') : r));
    expect(selectRecords(records, { day_ids: [day1!.id] }).find((r) => r.id === drop.id)!.deleted).toBe(true);
  });

  it('records the choice in the file', () => {
    const file = buildLogFile(log, { ...META, selection: { day_ids: [day1!.id] } });
    expect(file.selection).toEqual({ day_ids: [day1!.id], specimen_ids: [], site_ids: [], kinds: [] });
    expect(readLogFile(writeLogFile(file)).selection).toEqual(file.selection);
  });
});

describe('reading a log file', () => {
  const log = sampleLog({ days: 1, seriesPerDay: 1, dropsPerSeries: 2 });
  const text = exportLog(log, META);

  function failure(input: string): LogFileError {
    try {
      readLogFile(input);
    } catch (error) {
      if (error instanceof LogFileError) return error;
      throw error;
    }
    throw new Error('the file was accepted');
  }

  it('gives back every record exactly as exported', () => {
    const file = readLogFile(text);
    expect(file.records.map(canonicalJson)).toEqual(JSON.parse(text).records.map(canonicalJson));
  });

  it('refuses text that is not JSON, saying so', () => {
    const error = failure('{"format": "plummet-log",');
    expect(error.code).toBe('log-not-json');
    expect(error.message).toMatch(/not JSON/);
  });

  it('refuses a JSON file that is not a log', () => {
    const error = failure('{"type":"FeatureCollection"}');
    expect(error.code).toBe('log-not-a-log');
    expect(error.field).toBe('format');
  });

  it('refuses a file written by a newer app, naming both versions', () => {
    const newer = LOG_FORMAT_VERSION + 1;
    const error = failure(text.replace(`"format_version":${LOG_FORMAT_VERSION}`, `"format_version":${newer}`));
    expect(error.code).toBe('log-format-too-new');
    expect(error.value).toBe(newer);
    expect(error.message).toMatch(new RegExp(`format ${newer}.*reads format ${LOG_FORMAT_VERSION}`));
  });

  it('names the field, the value and the rule of a value out of range', () => {
    const file = JSON.parse(text);
    const index = file.records.findIndex((r: LogRecord) => r.kind === 'drop');
    file.records[index].time_s = -1.6;
    const error = failure(JSON.stringify(file));
    expect(error.code).toBe('log-schema');
    expect(error.field).toBe(`records[${index}].time_s`);
    expect(error.value).toBe(-1.6);
    expect(error.rule).toBe('must be > 0 and ≤ 3600'); // the whole allowed range of time_s
    expect(error.message).toContain(`records[${index}].time_s`);
    expect(error.message).toContain('-1.6');
    expect(error.message).toContain(file.records[index].id);
  });

  it('names a missing field', () => {
    const file = JSON.parse(text);
    delete file.records[0].latitude_deg;
    const error = failure(JSON.stringify(file));
    expect(error.field).toBe('records[0].latitude_deg');
    expect(error.rule).toBe('is required');
  });

  it('names a field that does not belong, with its value', () => {
    const file = JSON.parse(text);
    file.records[0].latitude = 46.1;
    const error = failure(JSON.stringify(file));
    expect(error.field).toBe('records[0].latitude');
    expect(error.value).toBe(46.1);
    expect(error.rule).toMatch(/not a field/);
  });

  it('explains a malformed revision stamp in words, not as a regular expression', () => {
    const file = JSON.parse(text);
    file.records[1].rev = 'yesterday';
    const error = failure(JSON.stringify(file));
    expect(error.field).toBe('records[1].rev');
    expect(error.rule).toMatch(/clock stamp/);
  });

  it('applies the record rules a schema cannot state (an uncertainty larger than its quantity)', () => {
    const file = JSON.parse(text);
    const index = file.records.findIndex((r: LogRecord) => r.kind === 'specimen');
    file.records[index].u_mass_kg = 1;
    const error = failure(JSON.stringify(file));
    expect(error.code).toBe('log-record-invalid');
    expect(error.field).toBe(`records[${index}].u_mass_kg`);
    expect(error.value).toBe(1);
  });

  it('refuses two records with the same id', () => {
    const file = JSON.parse(text);
    file.records.push(file.records[file.records.length - 1]);
    const error = failure(JSON.stringify(file));
    expect(error.code).toBe('log-duplicate-id');
    expect(error.field).toBe(`records[${file.records.length - 1}].id`);
  });
});
