// Demo logs for the format, merge and sync tests: our own invented field day (a quarry wall, two balls),
// not measurements. Ids are v4 UUIDs from a seeded generator, so every run builds the same log.
import { formatHlc } from '../../src/log/hlc';
import { uuidV4 } from '../../src/log/uuid';
import type {
  BodyOf,
  DayRecord,
  DropRecord,
  LogRecord,
  ReadingRecord,
  RecordKind,
  RecordOf,
  SeriesRecord,
  SiteRecord,
  SpecimenRecord,
} from '../../src/log/types';

/** A small deterministic generator (mulberry32) so ids and values repeat from run to run. */
export function seeded(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export function idMaker(seed: number): () => string {
  const next = seeded(seed);
  return () =>
    uuidV4((bytes) => {
      for (let i = 0; i < bytes.length; i++) bytes[i] = Math.floor(next() * 256);
      return bytes;
    });
}

const BASE_MS = Date.UTC(2026, 5, 14, 8, 0, 0);

export function stamp(ms: number, device: string, counter = 0): string {
  return formatHlc({ ms, counter, device });
}

export function instant(ms: number): string {
  return new Date(ms).toISOString();
}

/** A fresh record of a kind at wall time `ms` on `device`. */
export function makeRecord<K extends RecordKind>(kind: K, id: string, body: BodyOf[K], ms: number, device: string): RecordOf[K] {
  return {
    id,
    kind,
    created_at: instant(ms),
    updated_at: instant(ms),
    rev: stamp(ms, device),
    device,
    deleted: false,
    history: [],
    ...body,
  } as unknown as RecordOf[K];
}

const ENVELOPE = new Set(['id', 'kind', 'created_at', 'updated_at', 'rev', 'device', 'deleted', 'history']);

export function bodyOf(record: LogRecord): Record<string, unknown> {
  const body: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(record)) if (!ENVELOPE.has(k)) body[k] = v;
  return body;
}

/** The next version of a record as an edit on `device` at `ms` makes it: the old version goes into its history. */
export function revise<R extends LogRecord>(
  record: R,
  changes: Partial<Omit<R, 'id' | 'kind' | 'history'>>,
  ms: number,
  device: string,
  reason: string | null = 'corrected',
  counter = 0,
): R {
  const previous = {
    rev: record.rev,
    device: record.device,
    updated_at: record.updated_at,
    reason,
    deleted: record.deleted,
    body: bodyOf(record),
  };
  return {
    ...record,
    ...changes,
    updated_at: instant(ms),
    rev: stamp(ms, device, counter),
    device,
    history: [...record.history, previous],
  } as R;
}

export function tombstone<R extends LogRecord>(record: R, ms: number, device: string): R {
  return revise(record, { deleted: true } as Partial<Omit<R, 'id' | 'kind' | 'history'>>, ms, device, 'deleted');
}

export interface SampleOptions {
  device?: string;
  seed?: number;
  days?: number;
  seriesPerDay?: number;
  dropsPerSeries?: number;
  /** Wall time of the first record, ms since 1970. */
  startMs?: number;
}

/** A whole log: one site, two specimens, days with a reading, series and drops. */
export function sampleLog(options: SampleOptions = {}): LogRecord[] {
  const device = options.device ?? 'phoneA';
  const nextId = idMaker(options.seed ?? 1);
  const random = seeded((options.seed ?? 1) + 1000);
  let ms = options.startMs ?? BASE_MS;
  const tick = () => (ms += 1000);
  const records: LogRecord[] = [];

  const site: SiteRecord = makeRecord(
    'site',
    nextId(),
    {
      name: 'North quarry wall',
      latitude_deg: 46.1,
      longitude_deg: 7.2,
      elevation_m: 430,
      elevation_source: 'map',
      notes: '',
    },
    tick(),
    device,
  );
  records.push(site);
  const specimens: SpecimenRecord[] = [
    makeRecord(
      'specimen',
      nextId(),
      {
        name: 'steel ball 25 mm',
        mass_kg: 0.0641,
        u_mass_kg: 0.0001,
        shape: { kind: 'sphere', diameter_m: 0.025, u_diameter_m: 0.0001 },
        reference_drag_coefficient: 0.47,
        notes: '',
      },
      tick(),
      device,
    ),
    makeRecord(
      'specimen',
      nextId(),
      {
        name: 'foam cube',
        mass_kg: 0.012,
        u_mass_kg: 0.0005,
        shape: { kind: 'box', length_m: 0.1, u_length_m: 0.001, width_m: 0.1, u_width_m: 0.001, height_m: 0.1, u_height_m: 0.001 },
        reference_drag_coefficient: null,
        notes: 'edges rounded',
      },
      tick(),
      device,
    ),
  ];
  records.push(...specimens);

  for (let d = 0; d < (options.days ?? 1); d++) {
    const day: DayRecord = makeRecord(
      'day',
      nextId(),
      { site_id: site.id, date: instant(ms).slice(0, 10), crew: ['Ines', 'Tom'], notes: '' },
      tick(),
      device,
    );
    records.push(day);
    const reading: ReadingRecord = makeRecord(
      'reading',
      nextId(),
      {
        day_id: day.id,
        taken_at: instant(ms),
        temperature_C: 17.5,
        u_temperature_C: 0.3,
        pressure_Pa: 96120,
        u_pressure_Pa: 30,
        pressure_reference: 'station',
        humidity: { kind: 'relative', relative_humidity_pct: 55, u_relative_humidity_pct: 3 },
        wind_speed_m_s: 0.5,
        u_wind_speed_m_s: null,
        vertical_wind_m_s: null,
        u_vertical_wind_m_s: null,
        height_m: 0,
        instrument: 'handheld weather meter',
        notes: '',
      },
      tick(),
      device,
    );
    records.push(reading);
    for (let s = 0; s < (options.seriesPerDay ?? 2); s++) {
      const specimen = specimens[s % specimens.length]!;
      const series: SeriesRecord = makeRecord(
        'series',
        nextId(),
        {
          day_id: day.id,
          specimen_id: specimen.id,
          height_m: 12,
          u_height_m: 0.01,
          height_method: 'tape',
          timing_method: 'tap',
          u_time_s: 0.004,
          target_relative_uncertainty: 0.05,
          reading_id: null,
          timing_offset: 'none',
          reading_aloft_id: null,
          timing_delay_s: null,
          u_timing_delay_s: null,
          started_at: instant(ms),
          notes: '',
        },
        tick(),
        device,
      );
      records.push(series);
      for (let k = 0; k < (options.dropsPerSeries ?? 3); k++) {
        // Plausible demo times from 12 m: the steel ball falls nearly as in vacuum (1.565 s), the foam cube slowly.
        const t = s % 2 === 0 ? 1.575 + Math.round(random() * 6) / 1000 : 3.05 + Math.round(random() * 50) / 1000;
        const at = tick();
        const drop: DropRecord = makeRecord(
          'drop',
          nextId(),
          {
            series_id: series.id,
            seq: k + 1,
            raw: { kind: 'taps', timestamps_ms: [1000, 1000 + t * 1000] },
            time_s: t,
            height_m: null,
            excluded: false,
            exclusion_reason: null,
            note: '',
            captured_at: instant(at),
          },
          at,
          device,
        );
        records.push(drop);
      }
    }
  }
  return records;
}

export const byKind = <K extends RecordKind>(records: readonly LogRecord[], kind: K): RecordOf[K][] =>
  records.filter((r) => r.kind === kind) as RecordOf[K][];
