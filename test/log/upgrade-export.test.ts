import { describe, expect, it } from 'vitest';
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { exportLog, LOG_FORMAT_VERSION, readLogFile, upgradeLogFile, validateRecord, type DropRecord, type LogRecord } from '../../src/log';
import { makeAjv, SCHEMA_FILE_V1, SCHEMA_FILE_V2, SCHEMA_FILE_V3 } from './schema-files';

const root = fileURLToPath(new URL('../../', import.meta.url));
/**
 * A real format 1 file: written by the exporter of the app before format 2 (commit 27f3a74), from the sample
 * log plus a series timed by sound as its drop entry stored it (the correction only in the note), one of those
 * drops revised so a sound capture sits in its history too. Invented values, not measurements.
 */
const V1_TEXT = readFileSync(`${root}test/log/fixtures/plummet-log-v1.json`, 'utf8');
const v1 = JSON.parse(V1_TEXT) as { format_version: number; records: Record<string, any>[] };

/** What format 3 adds to readings and series, at the values that say what the older file meant. */
const FORMAT_3_ADDED: Record<string, Record<string, unknown>> = {
  reading: { u_wind_speed_m_s: null, vertical_wind_m_s: null, u_vertical_wind_m_s: null, height_m: 0 },
  series: { reading_aloft_id: null, timing_delay_s: null, u_timing_delay_s: null },
};
/** A record of an older file as format 3 reads it: the added fields at their defaults, in its history too. */
function withFormat3(record: Record<string, any>): Record<string, any> {
  const added = FORMAT_3_ADDED[record['kind']];
  if (!added) return record;
  return { ...record, ...added, history: record['history'].map((e: Record<string, any>) => ({ ...e, body: { ...e['body'], ...added } })) };
}

describe('reading a format 1 file', () => {
  it('is a real format 1 file: the published format 1 schema accepts it', () => {
    const schema = JSON.parse(readFileSync(root + SCHEMA_FILE_V1, 'utf8'));
    const validate = makeAjv(false).compile(schema);
    expect(validate(v1), JSON.stringify(validate.errors)).toBe(true);
    expect(v1.format_version).toBe(1);
    expect(v1.records.filter((r) => r.kind === 'drop' && r.raw.kind === 'sound')).toHaveLength(2);
    expect(V1_TEXT).not.toContain('sound_travel');
  });

  it('is upgraded on import: sound captures say sound_travel null, in their history too; nothing else changes', () => {
    const file = readLogFile(V1_TEXT);
    expect(file.format_version).toBe(LOG_FORMAT_VERSION);
    expect(file.records).toHaveLength(v1.records.length);
    file.records.forEach((record, i) => {
      const before = v1.records[i]!;
      if (record.kind === 'drop' && record.raw.kind === 'sound') {
        expect(record.raw).toEqual({ ...before.raw, sound_travel: null });
        // The correction made then stays where that app wrote it.
        expect(record.note).toMatch(/^sound travel correction 29\.1 ms/);
        expect({ ...record, raw: before.raw, history: before.history }).toEqual(before);
        record.history.forEach((entry, h) => {
          expect(entry.body).toEqual({ ...before.history[h].body, raw: { ...before.history[h].body.raw, sound_travel: null } });
        });
      } else {
        expect(record).toEqual(withFormat3(before));
      }
    });
    const revised = file.records.find((r): r is DropRecord => r.kind === 'drop' && r.history.length > 0 && r.raw.kind === 'sound');
    expect(revised?.history[0]!.body.raw).toMatchObject({ kind: 'sound', sound_travel: null });
  });

  it('round-trips: the upgraded records export in the current format and read back the same', () => {
    const records = readLogFile(V1_TEXT).records;
    const text = exportLog(records, { device: 'phoneA', app_version: '0.2.0' });
    expect(JSON.parse(text).format_version).toBe(LOG_FORMAT_VERSION);
    expect(readLogFile(text).records).toEqual(records);
    for (const r of records) expect(validateRecord(r)).toEqual([]);
  });

  it('leaves a current file, a newer one and something that is not a log as they are', () => {
    const current = { format: 'plummet-log', format_version: LOG_FORMAT_VERSION, records: [] };
    expect(upgradeLogFile(current)).toBe(current);
    const newer = { ...current, format_version: LOG_FORMAT_VERSION + 1 };
    expect(upgradeLogFile(newer)).toBe(newer);
    expect(upgradeLogFile([1, 2])).toEqual([1, 2]);
    expect(upgradeLogFile(null)).toBeNull();
    // The upgrade does not change the object it was given.
    upgradeLogFile(v1);
    expect(JSON.stringify(v1)).toBe(JSON.stringify(JSON.parse(V1_TEXT)));
  });
});

/**
 * A real format 2 file: the format 1 file above as the format 2 exporter wrote it (commit 57dfc95, the last
 * before format 3). Invented values, not measurements.
 */
const V2_TEXT = readFileSync(`${root}test/log/fixtures/plummet-log-v2.json`, 'utf8');
const v2 = JSON.parse(V2_TEXT) as { format_version: number; records: Record<string, any>[] };

describe('reading a format 2 file', () => {
  it('is a real format 2 file: the published format 2 schema accepts it', () => {
    const schema = JSON.parse(readFileSync(root + SCHEMA_FILE_V2, 'utf8'));
    const validate = makeAjv(false).compile(schema);
    expect(validate(v2), JSON.stringify(validate.errors)).toBe(true);
    expect(v2.format_version).toBe(2);
    expect(V2_TEXT).not.toContain('reading_aloft_id');
  });

  it('is upgraded on import: readings on the landing surface with no air motion measured, series with the method delay; nothing else changes', () => {
    const file = readLogFile(V2_TEXT);
    expect(file.format_version).toBe(LOG_FORMAT_VERSION);
    expect(file.records).toHaveLength(v2.records.length);
    file.records.forEach((record, i) => expect(record).toEqual(withFormat3(v2.records[i]!)));
    expect(file.records.filter((r) => r.kind === 'reading' || r.kind === 'series').length).toBeGreaterThan(1);
    for (const r of file.records) expect(validateRecord(r)).toEqual([]);
  });

  it('fills the history bodies too, and never writes over a value that is there', () => {
    const reading = v2.records.find((r) => r['kind'] === 'reading')!;
    const { history: _, id: __, kind: ___, created_at: _c, updated_at: _u, rev: _r, device: _d, deleted: _x, ...body } = reading;
    const revised = { ...reading, history: [{ rev: reading['rev'], device: 'phoneA', updated_at: reading['updated_at'], reason: 'slip', deleted: false, body }] };
    const upgraded = upgradeLogFile({ ...v2, records: [revised, { ...reading, id: 'x', height_m: 12 }] }) as { records: Record<string, any>[] };
    expect(upgraded.records[0]!['history'][0]['body']).toEqual({ ...body, ...FORMAT_3_ADDED['reading'] });
    expect(upgraded.records[1]!['height_m']).toBe(12);
  });
});

/**
 * A real format 3 file: the format 2 file above as the format 3 exporter wrote it (commit 1f3b4bc, the last before
 * format 4). Invented values, not measurements.
 */
const V3_TEXT = readFileSync(`${root}test/log/fixtures/plummet-log-v3.json`, 'utf8');
const v3 = JSON.parse(V3_TEXT) as { format_version: number; records: Record<string, any>[] };

describe('reading a format 3 file', () => {
  it('is a real format 3 file: the published format 3 schema accepts it', () => {
    const validate = makeAjv(false).compile(JSON.parse(readFileSync(root + SCHEMA_FILE_V3, 'utf8')));
    expect(validate(v3), JSON.stringify(validate.errors)).toBe(true);
    expect(v3.format_version).toBe(3);
    expect(V3_TEXT).not.toContain('marks');
  });

  it('is read as format 4 with every record as it was: marks, gates and clips are optional, absent meaning what format 3 meant', () => {
    const file = readLogFile(V3_TEXT);
    expect(file.format_version).toBe(LOG_FORMAT_VERSION);
    expect(file.records).toEqual(v3.records);
    for (const r of file.records) expect(validateRecord(r)).toEqual([]);
    // Exported again, only the format number changes.
    const again = exportLog(file.records, { device: 'phoneA', app_version: '0.4.0' });
    expect(again).toBe(V3_TEXT.replace('"format_version":3', `"format_version":${LOG_FORMAT_VERSION}`));
  });
});

describe('the published schema files', () => {
  it('keeps format 3 published as format 3 wrote it', () => {
    const text = readFileSync(root + SCHEMA_FILE_V3, 'utf8');
    // The digest of the file as format 3 published it (commit 1f3b4bc); nothing writes it any more.
    expect(createHash('sha256').update(text).digest('hex')).toBe('779b1258dcc29e1d3d0d40e62e0dfd9f8e25bb0cb23a7224523abaac02f9fc7e');
    expect(JSON.parse(text).properties.format_version).toEqual({ const: 3 });
  });

  it('keeps format 1 published byte for byte, for readers of old files', () => {
    const text = readFileSync(root + SCHEMA_FILE_V1, 'utf8');
    // The digest of the file as format 1 published it (commit 27f3a74); nothing writes it any more.
    expect(createHash('sha256').update(text).digest('hex')).toBe('a96764fdbf33c3ba293f5a161fbfef4bd752e24ee4c8a19dbbe9592913f919ca');
    const schema = JSON.parse(text);
    expect(schema.$id).toBe('https://plummet.invalid/schema/plummet-log-1.schema.json');
    expect(schema.properties.format_version).toEqual({ const: 1 });
  });
});

describe('a sound-timed drop whose correction is stored', () => {
  const travel = { distance_to_release_m: 10, distance_to_landing_m: 0, speed_of_sound_m_s: 343.2, temperature_C: 20 };
  const drop = (correction_s: number): Record<string, unknown> => ({
    series_id: '3f1c2a9e-5b7d-4e21-9c0a-1d2e3f405162',
    seq: 1,
    raw: { kind: 'sound', onsets_s: [1, 2.1], sample_rate_Hz: 44_100, sound_travel: { ...travel, correction_s } },
    time_s: 1.1 + correction_s,
    height_m: null,
    excluded: false,
    exclusion_reason: null,
    note: '',
    captured_at: '2026-06-14T09:10:12.000Z',
  });
  const record = (body: Record<string, unknown>) =>
    validateRecord({
      id: '0a9b8c7d-6e5f-4a3b-8c2d-1e0f9a8b7c6d',
      kind: 'drop',
      created_at: '2026-06-14T09:10:12.000Z',
      updated_at: '2026-06-14T09:10:12.000Z',
      rev: '001781428212000-000000-phoneA',
      device: 'phoneA',
      deleted: false,
      history: [],
      ...body,
    } as unknown as LogRecord);

  it('is stored when its value is (distance to release − distance to landing) / speed of sound', () => {
    expect(record(drop(10 / 343.2))).toEqual([]);
  });

  it('is refused when its value does not follow from its inputs, naming both', () => {
    const problems = record(drop(0.03));
    expect(problems.map((p) => p.path)).toEqual(['raw.sound_travel.correction_s']);
    expect(problems[0]!.message).toContain(`(${10 / 343.2} s)`);
  });

  it('is refused when missing: a sound capture says which correction it had, or null', () => {
    const body = drop(0);
    const { sound_travel: _, ...raw } = body.raw as Record<string, unknown>;
    expect(record({ ...body, raw }).map((p) => p.path)).toEqual(['raw.sound_travel']);
  });
});
