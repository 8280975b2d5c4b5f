// Every error the app throws has one shape: a PlummetError with a stable code, the field, the value and the
// allowed range, and a message for people that names all three.
import { NoPartFolder } from '../../src/sync/sync-run';
import { ReportInputError, ReportUsageError } from '../../src/cli/commands/report';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import * as errors from '../../src/errors';
import { describeError, formatValue, PlummetError } from '../../src/errors';
import * as analysis from '../../src/analysis';
import * as log from '../../src/log';
import { assertValidBody, parseHlc, readLogFile } from '../../src/log';
import { JsonSchemaError, checkJsonSchema } from '../../src/log/json-schema-check';
import * as physics from '../../src/physics';
import { validateAnalysisRequest } from '../../src/physics';
import * as store from '../../src/store';
import { createMemoryStore, MemoryDatabase } from '../../src/store';
import * as sync from '../../src/sync';
import { checkSyncSettings, parseXml, previewImport } from '../../src/sync';
import { seriesRequest } from '../../src/analysis';
import * as timing from '../../src/timing';
import * as motion from '../../src/motion';
import { checkFallTime } from '../../src/timing';
import * as video from '../../src/video';
import * as demo from '../log/demo-bodies';
import { AIR, BALL, SITE, UNCERTAINTY } from '../physics/syntheticSeries';
import { fakeEnvironment } from '../store/fake-environment';

const SRC = join(import.meta.dirname, '../../src');

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const p = join(dir, name);
    return statSync(p).isDirectory() ? sourceFiles(p) : /\.tsx?$/.test(name) ? [p] : [];
  });
}

/** Every class in src that extends an error class, with the class it extends (from the source text). */
function errorClassesInSource(): Map<string, { base: string; file: string }> {
  const all = new Map<string, { base: string; file: string }>();
  for (const file of sourceFiles(SRC)) {
    for (const m of readFileSync(file, 'utf8').matchAll(/\bclass\s+(\w+)(?:<[^>]*>)?\s+extends\s+(\w+)/g)) {
      all.set(m[1]!, { base: m[2]!, file: relative(SRC, file) });
    }
  }
  const isError = (name: string, seen = new Set<string>()): boolean => {
    if (/^(Error|RangeError|TypeError|SyntaxError)$/.test(name)) return true;
    const entry = all.get(name);
    if (!entry || seen.has(name)) return false;
    seen.add(name);
    return isError(entry.base, seen);
  };
  return new Map([...all].filter(([name]) => name !== 'PlummetError' && isError(name)));
}

/** Error classes exported by each folder's public face. */
const FACES: Record<string, Record<string, unknown>> = { errors, physics, log, timing, motion, sync, store, analysis, video };

function catchFrom(run: () => unknown): unknown {
  try {
    run();
  } catch (error) {
    return error;
  }
  throw new Error('expected a throw');
}

async function rejectionOf(promise: Promise<unknown>): Promise<unknown> {
  try {
    await promise;
  } catch (error) {
    return error;
  }
  throw new Error('expected a rejection');
}

const validRequest = (drops: { height_m: number; time_s: number }[]) => ({
  site: SITE,
  air: AIR,
  specimen: BALL,
  drops,
  timing: { standard_uncertainty_s: 0.004 },
  uncertainty: UNCERTAINTY,
});

/** One real throw of each error class, from the code that throws it (not from its constructor). */
const THROWN: Record<string, () => unknown | Promise<unknown>> = {
  NoPartFolder: () => new NoPartFolder('plummet-log-0011223344556677.parts', new Error('405')),
  ReportUsageError: () => new ReportUsageError('unknown option --colour'),
  ReportInputError: () => new ReportInputError('no day 2026-13-01 in the logs'),
  PhysicsInputError: () => catchFrom(() => validateAnalysisRequest(validRequest([{ height_m: 12, time_s: -1 }]))),
  TimingError: () => catchFrom(() => checkFallTime(-1)),
  SoundCaptureError: () => new timing.SoundCaptureError({ code: 'microphone-refused', field: 'microphone', value: 'NotAllowedError', allowed: null, message: 'refused' }),
  MotionError: () => catchFrom(() => motion.heightOfRow([{ x_px: 10, y_px: 100, height_m: 1 }], 50)),
  HlcError: () => catchFrom(() => parseHlc('yesterday')),
  JsonSchemaError: () => catchFrom(() => checkJsonSchema({ $schema: 'https://json-schema.org/draft/2020-12/schema', format: 'email' }, 'x')),
  CanonicalJsonError: () => catchFrom(() => log.canonicalJson({ t: Infinity })),
  LogFileError: () => catchFrom(() => readLogFile('{')),
  LogError: () => catchFrom(() => log.deleteRecord(log.createRecord('site', demo.site(), { clock: new log.HybridLogicalClock('dev1'), device: 'dev1', now: 0, id: demo.SITE_ID }), { clock: new log.HybridLogicalClock('dev1'), device: 'dev1', now: 1, reason: ' ' })),
  LogValidationError: () => catchFrom(() => assertValidBody('specimen', { ...demo.steelBall(), mass_kg: -1 })),
  XmlError: () => catchFrom(() => parseXml('<a>&nope;</a>')),
  SyncError: () => catchFrom(() => checkSyncSettings({ folder_url: 'https://files.example.org/dav/', username: 'crew', password: 'pw', enabled: true, timeout_ms: 5 })),
  SeriesIncomplete: () => catchFrom(() => seriesRequest({ series: { ...demo.series(), id: demo.SERIES_ID }, site: null, specimen: null, reading: null, drops: [] } as never)),
  TransferCancelled: async () => {
    const s = await createMemoryStore({ database: new MemoryDatabase(), environment: fakeEnvironment().environment });
    return rejectionOf(previewImport(s, log.exportLog([], { device: 'dev1', app_version: 'test' }), 'empty.json', { signal: { aborted: true } }));
  },
  VideoClipError: () =>
    catchFrom(() =>
      video.checkClipProbe({ codec: 'avc1.64001f', container: 'MP4', width_px: 1280, height_px: 720, duration_s: 45, frame_count: 1350, frame_rate_hz: 30, interval_spread: 0, size_bytes: 9e6 }),
    ),
  StoreError: async () => {
    const s = await createMemoryStore({ database: new MemoryDatabase(), environment: fakeEnvironment().environment });
    return rejectionOf(s.create('day', demo.day()));
  },
};

describe('one error shape', () => {
  it('keeps the error base a pure leaf: it imports only its own files and uses no platform API', () => {
    const dir = join(SRC, 'errors');
    const files = readdirSync(dir);
    expect(files).toContain('index.ts');
    for (const name of files) {
      const source = readFileSync(join(dir, name), 'utf8');
      for (const m of source.matchAll(/(?:import|export)[^'"]*?from\s+['"]([^'"]+)['"]/g)) {
        expect(m[1], `errors/${name}`).toMatch(/^\.\/[\w-]+$/);
      }
      expect(source, `errors/${name}`).not.toMatch(/\b(window|document|navigator|indexedDB|fetch|process|Date\.now|performance|crypto)\b/);
    }
  });

  it('finds the error classes in the source', () => {
    // A count that cannot pass by finding nothing: the 13 classes of the issue are all there.
    expect(errorClassesInSource().size).toBeGreaterThanOrEqual(13);
  });

  it('has every error class of src extend PlummetError, and a real throw of each is one with a code', async () => {
    for (const [name, { file }] of errorClassesInSource()) {
      const make = THROWN[name];
      expect(make, `${file}: ${name} needs a case in THROWN`).toBeDefined();
      const error = await make!();
      expect(error, `${name} (${file})`).toBeInstanceOf(PlummetError);
      const e = error as PlummetError;
      expect(e.constructor.name).toBe(name);
      expect(e.name).toBe(name);
      expect(typeof e.code).toBe('string');
      expect(e.code.length).toBeGreaterThan(0);
      expect(e.message.length).toBeGreaterThan(0);
    }
  });

  it('has every error class a folder exports extend PlummetError', () => {
    let found = 0;
    for (const [folder, face] of Object.entries(FACES)) {
      for (const [name, value] of Object.entries(face)) {
        if (typeof value !== 'function' || value === PlummetError || !(value.prototype instanceof Error)) continue;
        found++;
        expect(value.prototype, `${folder}/${name}`).toBeInstanceOf(PlummetError);
      }
    }
    expect(found).toBeGreaterThanOrEqual(9);
  });

  it('writes a JSON-safe summary for the office command and stored states', () => {
    // Above the catalogue's longest fall time (3600 s).
    const error = catchFrom(() => checkFallTime(7200)) as PlummetError;
    const json = JSON.parse(JSON.stringify(error));
    expect(json).toEqual({ code: error.code, field: 'time_s', value: '7200', allowed: error.allowed, message: error.message });
    const cyclic: Record<string, unknown> = {};
    cyclic.self = cyclic;
    expect(() => JSON.stringify(new PlummetError({ code: 'x', field: null, value: cyclic, allowed: null }))).not.toThrow();
  });

  it('describes anything thrown for people', () => {
    expect(describeError(catchFrom(() => checkFallTime(-2)))).toMatch(/^time_s = -2: /);
    expect(describeError(catchFrom(() => assertValidBody('specimen', { ...demo.steelBall(), mass_kg: 0, name: '' })))).toContain('mass_kg: 0');
    expect(describeError('plain text')).toBe('plain text');
    expect(describeError(null)).toBe('null');
  });

  it('builds a message from field, value and range when none is given', () => {
    const e = new PlummetError({ code: 'out-of-range', field: 'drops[2].time_s', value: -1, allowed: '> 0 s' });
    expect(e.message).toBe('drops[2].time_s = -1: not allowed; allowed: > 0 s');
    expect(new PlummetError({ code: 'c', field: null, value: 'x', allowed: null, cause: e }).cause).toBe(e);
  });
});

/** The message names the field, the value (as the message writes it) and the allowed range. */
function expectNamed(error: unknown, value: unknown) {
  expect(error).toBeInstanceOf(PlummetError);
  const e = error as PlummetError;
  expect(e.field, e.message).not.toBeNull();
  expect(e.allowed, e.message).not.toBeNull();
  expect(e.message).toContain(e.field!);
  expect(e.message).toContain(e.allowed!);
  const shown = [formatValue(value), String(value)];
  expect(shown.some((text) => e.message.includes(text)), `${e.message} shows ${shown.join(' or ')}`).toBe(true);
  expect(Object.is(e.value, value) || e.value === String(value), `${e.code}: value`).toBe(true);
}

// Values no layer can accept, whatever limits the field catalogue settles on.
const negative = fc.double({ min: -1e6, max: -1e-3, noNaN: true });
const huge = fc.double({ min: 1e7, max: 1e12, noNaN: true });

describe('a bad input of each layer is named with its field, value and allowed range', () => {
  it('physics: a drop time', () => {
    fc.assert(
      fc.property(fc.oneof(negative, huge), fc.integer({ min: 0, max: 4 }), (time_s, index) => {
        const drops = Array.from({ length: 5 }, (_, i) => ({ height_m: 12, time_s: i === index ? time_s : 1.6 }));
        const error = catchFrom(() => validateAnalysisRequest(validRequest(drops)));
        expectNamed(error, time_s);
        expect((error as PlummetError).field).toBe(`drops[${index}].time_s`);
      }),
      { numRuns: 50 },
    );
  });

  it('log: a specimen mass', () => {
    fc.assert(
      fc.property(fc.oneof(negative, huge), (mass_kg) => {
        const error = catchFrom(() => assertValidBody('specimen', { ...demo.steelBall(), mass_kg }));
        expectNamed(error, mass_kg);
        expect((error as PlummetError).field).toBe('mass_kg');
      }),
      { numRuns: 50 },
    );
  });

  it('timing: a fall time', () => {
    fc.assert(
      fc.property(fc.oneof(negative, huge), (time_s) => expectNamed(catchFrom(() => checkFallTime(time_s)), time_s)),
      { numRuns: 50 },
    );
  });

  it('store: a reference to a record that is not there', async () => {
    await fc.assert(
      fc.asyncProperty(fc.uuid({ version: 4 }), async (site_id) => {
        const s = await createMemoryStore({ database: new MemoryDatabase(), environment: fakeEnvironment().environment });
        const error = await rejectionOf(s.create('day', { ...demo.day(), site_id }));
        expectNamed(error, site_id);
        expect((error as PlummetError).code).toBe('reference-missing');
      }),
      { numRuns: 20 },
    );
  });

  it('sync: a request timeout', () => {
    fc.assert(
      fc.property(fc.oneof(fc.integer({ min: -1e6, max: 999 }), fc.integer({ min: 300_001, max: 1e9 })), (timeout_ms) => {
        const error = catchFrom(() =>
          checkSyncSettings({ folder_url: 'https://files.example.org/dav/', username: 'crew', password: 'pw', enabled: true, timeout_ms }),
        );
        expectNamed(error, timeout_ms);
      }),
      { numRuns: 50 },
    );
  });

  it('sync: an entity a WebDAV answer may not use', () => {
    fc.assert(
      fc.property(fc.stringMatching(/^[a-z]{3,8}$/).filter((n) => !['quot', 'apos'].includes(n)), (name) => {
        const error = catchFrom(() => parseXml(`<a>&${name};</a>`));
        expectNamed(error, `&${name};`);
        expect((error as PlummetError).code).toBe('xml-entity');
      }),
      { numRuns: 50 },
    );
  });

  it('log: a JSON schema this checker cannot apply', () => {
    const error = catchFrom(() => checkJsonSchema({ $schema: 'https://json-schema.org/draft/2020-12/schema', minimum: 'one' }, 1));
    expect(error).toBeInstanceOf(JsonSchemaError);
    expectNamed(error, 'one');
  });
});
