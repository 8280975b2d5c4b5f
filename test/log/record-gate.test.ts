// The one gate every record passes before the store: what it refuses, and that what it accepts can be written.
// Demo bodies are invented (test/log/demo-bodies.ts), not measurements.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { canonicalJson } from '../../src/log/canonical';
import { exportLog } from '../../src/log/export';
import { LogFileError, readLogFile } from '../../src/log/export-parse';
import { checkIncomingRecord, DUPLICATE_ID_RULE, gateRecords } from '../../src/log/record-gate';
import { LogError } from '../../src/log/errors';
import { HybridLogicalClock } from '../../src/log/hlc';
import { validateRecord } from '../../src/log/validate';
import type { LogRecord } from '../../src/log/types';
import { createMemoryStore } from '../../src/store';
import { applyImport, previewImport } from '../../src/sync/import-log';
import { sampleLog } from '../sync/sample-log';

const META = { device: 'phoneB', app_version: '0.1.0' };
const NAME = 'plummet-log-phoneB.json';
const log = sampleLog({ days: 1, seriesPerDay: 1, dropsPerSeries: 2 });
const byKind = (kind: string) => log.find((r) => r.kind === kind)!;
type Json = Record<string, unknown>;
const copy = <T,>(v: T): T => JSON.parse(JSON.stringify(v));

/** The log's export with `change` made to its parsed records; the text to import. */
function mutated(change: (records: Json[]) => void): string {
  const file = JSON.parse(exportLog(log, META));
  change(file.records);
  return JSON.stringify(file);
}

const fileError = (fn: () => unknown): LogFileError => {
  try {
    fn();
  } catch (e) {
    if (e instanceof LogFileError) return e;
    throw e;
  }
  throw new Error('not refused');
};

async function refusedAtPreview(text: string, local: LogRecord[] = log.slice(0, 3)) {
  const store = await createMemoryStore();
  await store.putRecords(local);
  const before = canonicalJson(await store.allRecords({ includeDeleted: true }));
  let error: unknown;
  try {
    await previewImport(store, text, NAME);
  } catch (e) {
    error = e;
  }
  expect(error).toBeInstanceOf(LogFileError);
  expect(canonicalJson(await store.allRecords({ includeDeleted: true }))).toBe(before);
  const e = error as LogFileError;
  expect(e.message).toContain(NAME);
  return e;
}

const entry = (record: Json, body: unknown, rev = '000000000000001-000000-phoneA'): Json => ({
  rev,
  device: 'phoneA',
  updated_at: record.updated_at,
  reason: null,
  deleted: false,
  body,
});

describe('the gate refuses, at the preview, what the store would refuse or could never export', () => {
  it('a lone surrogate in a text, naming the field (it would stop every later export)', async () => {
    const e = await refusedAtPreview(mutated((r) => (r[5]!.notes = 'a\ud800b')));
    expect(e.field).toBe('records[5].notes');
    expect(e.message).toMatch(/records\[5\] \(series [0-9a-f-]+\) notes: "a\\ud800b" holds a lone UTF-16 surrogate/);
  });

  it('a lone surrogate typed into a form, before anything is written', async () => {
    const store = await createMemoryStore();
    const site = { ...(copy(byKind('site')) as unknown as Json) };
    for (const k of ['id', 'kind', 'created_at', 'updated_at', 'rev', 'device', 'deleted', 'history']) delete site[k];
    await expect(store.create('site', { ...site, name: 'Quarry \udc00' } as never)).rejects.toThrow(/name: .* lone UTF-16 surrogate/);
    expect(await store.allRecords()).toEqual([]);
  });

  it('a history body whose only key is "__proto__": read as an own key, never inherited', async () => {
    const text = mutated((r) => (r[0]!.history = [entry(r[0]!, '@@')])).replace('"@@"', '{"__proto__":{"name":"x","latitude_deg":1,"longitude_deg":1,"elevation_m":1,"elevation_source":"map","notes":""}}');
    const e = await refusedAtPreview(text);
    expect(e.field).toMatch(/^records\[0\]\.history\[0\]\.body\./);
    const record = JSON.parse(text).records[0];
    expect(checkIncomingRecord(record).map((p) => p.path)).toContain('history[0].body.__proto__');
  });

  it('an empty history body (it would become a record without fields in a merge)', async () => {
    const e = await refusedAtPreview(mutated((r) => (r[0]!.history = [entry(r[0]!, {})])));
    expect(e.field).toBe('records[0].history[0].body.name');
  });

  it('a history entry newer than the current version', async () => {
    // Within the clock's range (a stamp beyond it is refused for that alone), but newer than the current version.
    const e = await refusedAtPreview(mutated((r) => (r[4]!.history = [entry(r[4]!, copy(r[4]!), '200000000000000-000000-phoneA')])));
    expect(e.field).toBe('records[4].history[0].rev');
    expect(e.message).toMatch(/is not older than the current version/);
  });

  it('an id the log already holds as another kind, naming the file, the record, the field and the value', async () => {
    const site = byKind('site');
    const specimen = { ...byKind('specimen'), id: site.id } as LogRecord;
    const e = await refusedAtPreview(exportLog([specimen], META), [site]);
    expect(e.field).toBe('records[0].id');
    expect(e.message).toContain(`records[0] (specimen ${site.id}) id: "${site.id}" is the id of a site already in this log`);
    const store = await createMemoryStore();
    await store.putRecords([site]);
    await expect(store.putRecords([specimen])).rejects.toThrow(/is the id of a site already in this log/);
  });

  it('very deep nesting in a history body, before anything walks it', async () => {
    const text = mutated((r) => (r[0]!.history = [entry(r[0]!, { name: '@@' })])).replace('"@@"', `${'['.repeat(100_000)}${']'.repeat(100_000)}`);
    const e = await refusedAtPreview(text);
    expect(e.message).toMatch(/nested too deep/);
    expect(e.field).toMatch(/^records\[0\]\.history\[0\]\.body\.name/);
  });

  it('a revision counter at its top is a stamp like any other: the clock rolls over into the next millisecond', () => {
    const record = { ...byKind('specimen') } as LogRecord;
    const top = String(record.rev).replace(/-\d{6}-/, '-999999-');
    expect(validateRecord({ ...record, rev: top } as LogRecord)).toEqual([]);
    const clock = new HybridLogicalClock(String(record.device));
    const next = clock.receive(top, Number(top.slice(0, 15)));
    expect(next > top).toBe(true);
    expect(next.slice(0, 15)).toBe(String(Number(top.slice(0, 15)) + 1).padStart(15, '0'));
  });

  it('a series whose specimen link names a site, in the file and against the store', async () => {
    const site = byKind('site');
    const e = await refusedAtPreview(mutated((r) => (r.find((x) => x.kind === 'series')!.specimen_id = site.id)));
    expect(e.field).toMatch(/^records\[\d+\]\.specimen_id$/);
    expect(e.message).toMatch(/names a site: must be the id of a specimen/);
    const store = await createMemoryStore();
    await store.putRecords([site]);
    const series = { ...byKind('series'), specimen_id: site.id } as LogRecord;
    await expect(store.putRecords([series])).rejects.toThrow(/specimen_id: .* names a site/);
    expect(await store.allRecords()).toEqual([site]);
  });

  it('an upper-case id (ids are kept in lower case, so no record can be there twice)', async () => {
    const e = await refusedAtPreview(mutated((r) => (r[0]!.id = String(r[0]!.id).toUpperCase())));
    expect(e.field).toBe('records[0].id');
    expect(e.message).toMatch(/upper case/);
    const store = await createMemoryStore();
    await expect(store.putRecords([{ ...byKind('site'), id: byKind('site').id.toUpperCase() } as LogRecord])).rejects.toThrow(LogError);
  });

  it('the same id twice in one batch, even as two kinds', async () => {
    const [site, specimen] = [byKind('site'), byKind('specimen')];
    const problems = gateRecords([site, { ...specimen, id: site.id }]);
    expect(problems.map((p) => p.path)).toEqual(['[1].id']);
  });

  it('a field named twice in one object, which JSON.parse would settle in silence', () => {
    const text = exportLog(log, META).replace('"time_s":', '"time_s":2511,"time_s":');
    const e = fileError(() => readLogFile(text, { name: NAME }));
    expect(e.code).toBe('log-duplicate-key');
    expect(e.field).toMatch(/^records\[\d+\]\.time_s$/);
    expect(e.message).toContain(NAME);
  });

  it('a field named twice in an object the structural check stops at (nested too deep): the duplicate is named first', () => {
    const deep = '{"a":{"a":{"a":{"a":{"a":{"a":{"a":{"a":{"a":{"k":1}}}}}}}}}}';
    const text = exportLog(log, META).replace('"time_s":', `"time_s":2511,"deep":${deep},"time_s":`);
    const e = fileError(() => readLogFile(text, { name: NAME }));
    expect(e.code).toBe('log-duplicate-key');
    expect(e.field).toMatch(/^records\[\d+\]\.time_s$/);
  });

  it('and what the preview accepts, the write accepts', async () => {
    const store = await createMemoryStore();
    await store.putRecords(log.slice(0, 3));
    const { file } = await previewImport(store, exportLog(log, META), NAME);
    await expect(applyImport(store, file, NAME)).resolves.toBeDefined();
  });
});

describe('refusals quote an excerpt of the value and say what it was written as', () => {
  it('a megabyte of text is quoted as 80 characters and its length', () => {
    const big = 'x'.repeat(1_000_000);
    const e = fileError(() => readLogFile(mutated((r) => (r[0]!.history = [{ ...entry(r[0]!, copy(r[0]!)), reason: big }])), { name: NAME }));
    expect(e.message.length).toBeLessThan(400);
    expect(e.message).toContain('(1000000 characters)');
    const store = Promise.resolve(createMemoryStore()).then(async (s) => s.putRecords([{ ...byKind('site'), notes: big } as LogRecord]));
    return expect(store).rejects.toSatisfy((error: Error) => error.message.length < 400);
  });

  it('1e999999 is reported as written, not as null', () => {
    const text = exportLog(log, META).replace(/"mass_kg":[0-9.e-]+/, '"mass_kg":1e999999');
    const e = fileError(() => readLogFile(text));
    expect(e.message).toMatch(/mass_kg: 1e999999 is a number too large for JSON/);
    expect(e.message).not.toMatch(/null/);
    expect(e.value).toBe('1e999999');
  });

  it('a 400-digit integer likewise', () => {
    const literal = `1${'0'.repeat(400)}`;
    const e = fileError(() => readLogFile(exportLog(log, META).replace(/"elevation_m":[0-9.]+/, `"elevation_m":${literal}`)));
    expect(e.message).toContain(`${literal.slice(0, 37)}...`);
  });
});

describe('anything the gate accepts, the canonical writer and the reader accept', () => {
  const jsonish = fc.oneof(
    fc.anything({ maxDepth: 3 }),
    fc.string({ unit: 'binary', maxLength: 8 }),
    fc.constantFrom(NaN, Infinity, -Infinity, -0, 1e308, '\ud800', '\udc00x', 'ABCDEF00-0000-4000-8000-000000000000'),
  );
  it('for a field of a record, or of an earlier version, replaced by any value', () => {
    let accepted = 0;
    fc.assert(
      fc.property(fc.constantFrom(...log), fc.boolean(), fc.string({ maxLength: 3 }), jsonish, (base, inHistory, extraKey, value) => {
        const record = copy(base) as unknown as Json;
        if (inHistory) record.history = [entry(record, Object.fromEntries(Object.entries(record).filter(([k]) => !['id', 'kind', 'created_at', 'updated_at', 'rev', 'device', 'deleted', 'history'].includes(k))))];
        const target = inHistory ? ((record.history as Json[])[0]!.body as Json) : record;
        const keys = Object.keys(target);
        const key = extraKey.length === 3 ? extraKey : keys[extraKey.length * 7 % keys.length]!;
        target[key] = value;
        if (gateRecords([record]).length > 0) return;
        const text = exportLog([record as unknown as LogRecord], META);
        expect(() => readLogFile(text)).not.toThrow();
        accepted++;
      }),
      { seed: 13, numRuns: 3000 },
    );
    // Not vacuous: many of the values fit their field (a text in a text field, an empty notes).
    expect(accepted).toBeGreaterThan(100);
  });
});

describe('the records one transfer has passed', () => {
  const log = sampleLog({ days: 1, seriesPerDay: 1, dropsPerSeries: 2 });

  it('checks a record once whole, and still checks the batch each time', () => {
    const passed = new WeakSet<object>();
    expect(gateRecords(log, { passed })).toEqual([]);
    for (const r of log) expect(passed.has(r)).toBe(true);
    // The batch's own rule still runs on records passed before: an id twice is refused.
    const twice = gateRecords([...log, log[0]!], { passed });
    expect(twice.map((p) => p.rule)).toContain(DUPLICATE_ID_RULE);
  });

  it('never passes a record it has not checked: a copy is checked whole', () => {
    const passed = new WeakSet<object>();
    gateRecords(log, { passed });
    const broken = { ...log[0]!, created_at: 'yesterday' };
    expect(gateRecords([broken], { passed }).map((p) => p.path)).toEqual(['[0].created_at']);
    expect(passed.has(broken)).toBe(false);
  });
});
