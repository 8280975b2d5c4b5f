import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { LOG_FORMAT_VERSION, LOG_SCHEMA, LOG_SCHEMA_PATH } from '../../src/log/schema';
import { checkJsonSchema } from '../../src/log/json-schema-check';
import { LIMITS } from '../../src/log/validate';
import { validateRecord } from '../../src/log/validate';
import { SCHEMA_FILE, makeAjv, schemaFileText } from './schema-files';
import { sampleLog, byKind } from '../sync/sample-log';
import type { LogRecord } from '../../src/log/types';

const root = fileURLToPath(new URL('../../', import.meta.url));
const compiled = makeAjv(false).compile(LOG_SCHEMA);

type Validator = ((data: unknown) => boolean) & { errors?: { instancePath: string; keyword: string }[] | null };
/** The app's own checker (src/log/json-schema-check.ts), as a validator shaped like ajv's. */
const appChecker: Validator = Object.assign((data: unknown) => {
  const problems = checkJsonSchema(LOG_SCHEMA, data);
  appChecker.errors = problems.map((p) => ({ instancePath: p.path, keyword: p.keyword }));
  return problems.length === 0;
}, { errors: null as Validator['errors'] });
const standaloneValidate = appChecker;
const validators: [string, Validator][] = [
  ['the app’s own schema checker', appChecker],
  ['ajv compiling the schema', compiled as unknown as Validator],
];

function fileOf(records: LogRecord[]) {
  return { format: 'plummet-log', format_version: LOG_FORMAT_VERSION, app_version: '0.1.0', device: 'phoneA', selection: null, records };
}

describe('the published log schema', () => {
  it('is served from public/ at the path the app links to', () => {
    expect(`public${LOG_SCHEMA_PATH}`).toBe(SCHEMA_FILE);
  });

  it('is the schema in src/log/schema.ts, byte for byte (regenerate with npx tsx test/log/schema-generate.ts)', () => {
    expect(readFileSync(root + SCHEMA_FILE, 'utf8')).toBe(schemaFileText());
  });

  it('compiles under the JSON Schema 2020-12 meta-schema with ajv in strict mode', () => {
    const ajv = makeAjv(false);
    expect(ajv.validateSchema(LOG_SCHEMA)).toBe(true);
    expect(LOG_SCHEMA.$schema).toBe('https://json-schema.org/draft/2020-12/schema');
  });

});

describe.each(validators)('validating log files with %s', (_name, validate) => {
  const log = sampleLog({ days: 1, seriesPerDay: 2, dropsPerSeries: 2 });

  it('accepts a log of every kind of record', () => {
    expect(new Set(log.map((r) => r.kind))).toEqual(new Set(['site', 'specimen', 'day', 'reading', 'series', 'drop']));
    expect(validate(fileOf(log)), JSON.stringify(validate.errors)).toBe(true);
  });

  const cases: [string, (records: LogRecord[]) => unknown, string, string][] = [
    ['a negative drop time', (r) => Object.assign(byKind(r, 'drop')[0]!, { time_s: -1.6 }), '/records/', 'exclusiveMinimum'],
    ['a drop time given as text', (r) => Object.assign(byKind(r, 'drop')[0]!, { time_s: '1.6' }), '/time_s', 'type'],
    ['a misspelt field', (r) => Object.assign(byKind(r, 'series')[0]!, { height_M: 12 }), '/records/', 'additionalProperties'],
    ['a missing field', (r) => delete (byKind(r, 'site')[0] as Partial<LogRecord>).rev, '/records/0', 'required'],
    ['a sphere without its diameter', (r) => Object.assign(byKind(r, 'specimen')[0]!, { shape: { kind: 'sphere', u_diameter_m: 0 } }), '/shape', 'required'],
    ['an unknown kind of record', (r) => Object.assign(r[0]!, { kind: 'weather' }), '/records/0/kind', 'enum'],
    ['relative humidity above 100 %', (r) => Object.assign(byKind(r, 'reading')[0]!, { humidity: { kind: 'relative', relative_humidity_pct: 101, u_relative_humidity_pct: 3 } }), '/humidity/relative_humidity_pct', 'maximum'],
    ['a sea-level pressure typed in hPa', (r) => Object.assign(byKind(r, 'reading')[0]!, { pressure_reference: 'sea_level', pressure_Pa: 1013 }), '/pressure_Pa', 'minimum'],
    ['a malformed revision stamp', (r) => Object.assign(r[1]!, { rev: '2026-06-14' }), '/rev', 'pattern'],
    ['a date that is not YYYY-MM-DD', (r) => Object.assign(byKind(r, 'day')[0]!, { date: '14.06.2026' }), '/date', 'pattern'],
    ['a fractional drop number', (r) => Object.assign(byKind(r, 'drop')[1]!, { seq: 1.5 }), '/seq', 'type'],
    ['a tap capture with one tap', (r) => Object.assign(byKind(r, 'drop')[1]!, { raw: { kind: 'taps', timestamps_ms: [5] } }), '/raw/timestamps_ms', 'minItems'],
  ];

  it.each(cases)('refuses %s, pointing at the field and naming the rule', (_what, spoil, path, keyword) => {
    const records = structuredClone(log);
    spoil(records);
    expect(validate(fileOf(records))).toBe(false);
    const error = validate.errors![0]!;
    expect(error.instancePath).toContain(path);
    expect(error.keyword).toBe(keyword);
  });

  it('refuses a file of a newer format version', () => {
    expect(validate({ ...fileOf(log), format_version: LOG_FORMAT_VERSION + 1 })).toBe(false);
    expect(validate.errors![0]!.instancePath).toBe('/format_version');
  });
});

describe('the schema and the record model agree on the limits', () => {
  // Every bound in LIMITS is used by the schema; a value just inside passes both, just outside fails both.
  const drop = byKind(sampleLog(), 'drop')[0]!;
  const reading = byKind(sampleLog(), 'reading')[0]!;
  const probes: [string, LogRecord, string, number, number][] = [
    ['time_s', drop, 'time_s', LIMITS.time_s.max, LIMITS.time_s.max * (1 + 1e-9)],
    ['time_s', drop, 'time_s', 1e-9, LIMITS.time_s.min],
    ['temperature_C', reading, 'temperature_C', LIMITS.temperature_C.min, LIMITS.temperature_C.min - 0.01],
    ['station pressure_Pa', reading, 'pressure_Pa', LIMITS.station_pressure_Pa.max, LIMITS.station_pressure_Pa.max + 1],
    ['wind_speed_m_s', reading, 'wind_speed_m_s', LIMITS.wind_speed_m_s.max, LIMITS.wind_speed_m_s.max + 0.1],
  ];
  it.each(probes)('on %s', (_name, record, field, inside, outside) => {
    const ok = { ...record, [field]: inside } as LogRecord;
    const bad = { ...record, [field]: outside } as LogRecord;
    expect(validateRecord(ok)).toEqual([]);
    expect(standaloneValidate(fileOf([ok]))).toBe(true);
    expect(validateRecord(bad)).not.toEqual([]);
    expect(standaloneValidate(fileOf([bad]))).toBe(false);
  });
});
