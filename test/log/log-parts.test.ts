// A phone's log split into daily parts with an index, and assembled again. The logs are the invented demo
// field days of test/sync/sample-log.ts, with their days moved to three dates.
import { describe, expect, it } from 'vitest';
import { exportLog, buildLogFile } from '../../src/log/export';
import { readLogFile } from '../../src/log/export-parse';
import { assembleParts, OTHER_PART, readPartIndex, splitLog } from '../../src/log/log-parts';
import { contentHash } from '../../src/log/content-hash';
import { revise, sampleLog, byKind, idMaker } from '../sync/sample-log';
import type { LogRecord } from '../../src/log/types';

const DATES = ['2026-04-20', '2026-05-03', '2026-06-14'];

/** Three days, one in each of three months, and a specimen no series uses yet. */
function spreadLog(): LogRecord[] {
  const records = sampleLog({ device: 'phoneA', seed: 7, days: 3, seriesPerDay: 2, dropsPerSeries: 3 });
  let d = 0;
  const moved = records.map((r) => (r.kind === 'day' ? { ...r, date: DATES[d++ % DATES.length]! } : r));
  const spare: LogRecord = { ...byKind(moved, 'specimen')[0]!, id: idMaker(99)(), history: [] };
  return [...moved, spare];
}

const options = { device: 'phoneA', app_version: '0.1.0' };
const exported = (records: readonly LogRecord[]) => exportLog(records, options);

describe('splitting a log into daily parts', () => {
  it('makes one part per day, and "other" for records no day reaches', () => {
    const split = splitLog(spreadLog(), options);
    expect(split.parts.map((p) => p.key)).toEqual([...DATES, OTHER_PART]);
    expect(split.index.parts.map((p) => p.key)).toEqual([...DATES, OTHER_PART]);
  });

  it('gives parts that each pass the file reader and its gate on their own', () => {
    for (const part of splitLog(spreadLog(), options).parts) {
      const file = readLogFile(part.text, { name: part.key });
      expect(file.records.length).toBeGreaterThan(0);
      expect(part.hash).toBe(contentHash(part.text));
    }
  });

  it('assembles the parts back into exactly the whole log, byte for byte', () => {
    const records = spreadLog();
    const split = splitLog(records, options);
    const whole = assembleParts(split.parts.map((p) => readLogFile(p.text)), options);
    expect(exported(whole.records)).toBe(exported(records));
    // Whatever the order the parts come in.
    const reversed = assembleParts([...split.parts].reverse().map((p) => readLogFile(p.text)), options);
    expect(exported(reversed.records)).toBe(exported(records));
  });

  it('changes only the part of the day whose drop was edited', () => {
    const records = spreadLog();
    const before = splitLog(records, options);
    const drops = byKind(records, 'drop');
    const last = drops[drops.length - 1]!;
    const edited = records.map((r) => (r.id === last.id ? revise(r, { time_s: 1.234 } as never, Date.UTC(2026, 6, 1), 'phoneA', 'retimed') : r));
    const after = splitLog(edited, options);
    const changed = after.parts.filter((p, i) => p.hash !== before.parts[i]!.hash).map((p) => p.key);
    expect(changed).toHaveLength(1);
    expect(after.parts.find((p) => p.key === changed[0])!.file.records.map((r) => r.id)).toContain(last.id);
    expect(after.indexText).not.toBe(before.indexText);
  });

  it('gives the same texts whatever the order of the records', () => {
    const records = spreadLog();
    expect(splitLog([...records].reverse(), options).indexText).toBe(splitLog(records, options).indexText);
  });

  it('splits an empty log into no parts', () => {
    const split = splitLog([], options);
    expect(split.parts).toEqual([]);
    expect(readPartIndex(split.indexText).parts).toEqual([]);
    expect(assembleParts([], options).records).toEqual([]);
    expect(buildLogFile([], options).records).toEqual([]);
  });
});

describe('reading a part index', () => {
  const good = () => JSON.parse(splitLog(spreadLog(), options).indexText) as Record<string, unknown> & { parts: Record<string, unknown>[] };

  it('reads back what splitLog wrote', () => {
    const split = splitLog(spreadLog(), options);
    expect(readPartIndex(split.indexText)).toEqual(split.index);
  });

  const refusals: [string, () => string, string, string][] = [
    ['text that is not JSON', () => '{"format":', 'log-not-json', '(file)'],
    ['a log file in place of an index', () => exported([]), 'log-not-a-log', 'format'],
    ['a newer format', () => JSON.stringify({ ...good(), format_version: 9 }), 'log-format-too-new', 'format_version'],
    ['a part key that is no date', () => JSON.stringify({ ...good(), parts: [{ ...good().parts[0], key: '../../etc' }] }), 'log-schema', '/parts/0/key'],
    ['a month 13', () => JSON.stringify({ ...good(), parts: [{ ...good().parts[0], key: '2026-13-01' }] }), 'log-schema', '/parts/0/key'],
    ['a month without its day', () => JSON.stringify({ ...good(), parts: [{ ...good().parts[0], key: '2026-06' }] }), 'log-schema', '/parts/0/key'],
    ['a hash of another shape', () => JSON.stringify({ ...good(), parts: [{ ...good().parts[0], hash: 'x' }] }), 'log-schema', '/parts/0/hash'],
    ['a negative record count', () => JSON.stringify({ ...good(), parts: [{ ...good().parts[0], records: -1 }] }), 'log-schema', '/parts/0/records'],
    ['an extra field', () => JSON.stringify({ ...good(), secret: 1 }), 'log-schema', '/secret'],
    ['a part listed twice', () => JSON.stringify({ ...good(), parts: [good().parts[0], good().parts[0]] }), 'log-schema', 'parts[1].key'],
    ['a field named twice', () => splitLog(spreadLog(), options).indexText.replace('"device":"phoneA"', '"device":"phoneA","device":"phoneB"'), 'log-schema', '(file)/device'],
  ];
  it.each(refusals)('refuses %s, naming the field', (_what, text, code, field) => {
    let caught: unknown;
    try {
      readPartIndex(text(), { name: 'plummet-log-phoneB.index' });
    } catch (error) {
      caught = error;
    }
    expect(caught).toMatchObject({ code, field });
    expect(String((caught as Error).message)).toMatch(/^plummet-log-phoneB\.index: /);
  });
});
