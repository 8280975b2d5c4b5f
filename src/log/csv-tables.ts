/**
 * The two CSV tables of a log: one row per drop and one row per series, with the series, specimen and air
 * reading beside each, and the computed results. Units are in the column names (SI).
 *
 * The results come from a function handed in (`ComputeSeries`), so the record model does not depend on the
 * physics: the screens and the office command pass one built on the physics' analyzeSeries. Deleted records
 * are left out; excluded drops are listed (excluded = true) but are not handed to the computation.
 */
import { toCsv, type CsvOptions, type CsvValue } from './csv';
import { readingForSeries, readingAloftForSeries } from './reading-for-series';
import type { TransferProgress } from './transfer-progress';

export { readingForSeries, readingAloftForSeries, seriesReadingChoice, type SeriesReadingChoice } from './reading-for-series';
import type { DayRecord, DropRecord, LogRecord, ReadingRecord, SeriesRecord, SiteRecord, SpecimenRecord } from './types';

/** Everything the computation of one series needs, taken from the log. */
export interface SeriesInput {
  series: SeriesRecord;
  day: DayRecord | null;
  site: SiteRecord | null;
  specimen: SpecimenRecord | null;
  /** The series' own reading, or the day's reading nearest in time to the series start. */
  reading: ReadingRecord | null;
  /** The series' second reading at another height, when it names one (see SeriesBody.reading_aloft_id). */
  readingAloft?: ReadingRecord | null;
  /** The drops to analyse: live, not excluded, in order of seq. */
  drops: DropRecord[];
}

/**
 * Results for one drop. With drop_id they are joined to the drop by it; without, by their order in
 * SeriesInput.drops. Missing values are left blank in the table.
 */
export interface DropResult {
  /** The drop record's id. */
  drop_id?: string;
  drag_coefficient?: number | null;
  predicted_time_s?: number | null;
  /** The predicted time's standard uncertainty (the standard sphere curve's own, carried to the time). */
  u_predicted_time_s?: number | null;
  residual_s?: number | null;
  vacuum_time_s?: number | null;
  impact_speed_m_s?: number | null;
  impact_energy_J?: number | null;
  reynolds_number?: number | null;
  /** A drop with marks: each mark's fitted time and measured minus fitted, in the order of the drop's marks. */
  marks?: readonly { fitted_time_s: number; residual_s: number }[];
  /** A drop with marks: the fitted shift of its estimated release, s; null when the release time is known. */
  release_shift_s?: number | null;
}

export interface SeriesResult {
  air_density_kg_m3?: number | null;
  gravity_m_s2?: number | null;
  drag_coefficient?: number | null;
  drag_coefficient_standard_uncertainty?: number | null;
  drag_coefficient_interval_95?: readonly [number, number] | null;
  timing_offset_s?: number | null;
  terminal_velocity_m_s?: number | null;
  drops?: readonly DropResult[];
  warnings?: readonly { code: string; message: string }[];
  /** Set when the series could not be computed; the row then carries the code and the message. */
  error?: { code: string; message: string } | null;
}

export type ComputeSeries = (input: SeriesInput) => SeriesResult;

export const DROP_COLUMNS = [
  'day_date',
  'site_name',
  'series_id',
  'series_started_at',
  'specimen_id',
  'specimen_name',
  'drop_id',
  'seq',
  'captured_at',
  'height_m',
  'time_s',
  'timing_method',
  'excluded',
  'exclusion_reason',
  'note',
  'reading_id',
  'temperature_C',
  'pressure_Pa',
  'pressure_reference',
  'relative_humidity_pct',
  'dew_point_C',
  'wind_speed_m_s',
  'vertical_wind_m_s',
  'reading_height_m',
  'air_density_kg_m3',
  'gravity_m_s2',
  'drag_coefficient',
  'predicted_time_s',
  'u_predicted_time_s',
  'residual_s',
  'vacuum_time_s',
  'impact_speed_m_s',
  'impact_energy_J',
  'reynolds_number',
  // Drops with marks (their rows are in the marks table) and drops timed from a clip: the clip's summary.
  'mark_count',
  'release_time_known',
  'release_shift_s',
  'clip_codec',
  'clip_frame_rate_hz',
  'clip_release_s',
  'u_clip_release_s',
  'clip_impact_s',
  'u_clip_impact_s',
] as const;

/** One row per mark of every drop with marks: where the drop is, the mark, and its fit when computed. */
export const MARK_COLUMNS = [
  'day_date',
  'series_id',
  'drop_id',
  'seq',
  'excluded',
  'mark_index',
  'distance_m',
  'time_s',
  'fitted_time_s',
  'residual_s',
] as const;

export const SERIES_COLUMNS = [
  'day_date',
  'site_name',
  'latitude_deg',
  'elevation_m',
  'series_id',
  'started_at',
  'specimen_id',
  'specimen_name',
  'mass_kg',
  'shape',
  'height_m',
  'u_height_m',
  'height_method',
  'timing_method',
  'u_time_s',
  'timing_offset',
  'timing_delay_s',
  'u_timing_delay_s',
  'gate_distances_m',
  'drops_total',
  'drops_used',
  'reading_id',
  'temperature_C',
  'u_temperature_C',
  'pressure_Pa',
  'u_pressure_Pa',
  'pressure_reference',
  'relative_humidity_pct',
  'dew_point_C',
  'wind_speed_m_s',
  'u_wind_speed_m_s',
  'vertical_wind_m_s',
  'u_vertical_wind_m_s',
  'reading_height_m',
  'reading_aloft_id',
  'air_density_kg_m3',
  'gravity_m_s2',
  'drag_coefficient',
  'u_drag_coefficient',
  'U_drag_coefficient_k2',
  'drag_coefficient_95_low',
  'drag_coefficient_95_high',
  'timing_offset_s',
  'terminal_velocity_m_s',
  'warnings',
  'error_code',
  'error_message',
] as const;


interface Row {
  input: SeriesInput;
  /** Every live drop of the series, excluded ones too, in order of seq. */
  allDrops: DropRecord[];
  result: SeriesResult;
}

function live<R extends LogRecord>(records: readonly LogRecord[], kind: R['kind']): R[] {
  return records.filter((r) => r.kind === kind && !r.deleted) as R[];
}

/** The inputs of every live series, ordered by day, start time and id. */
export function seriesInputs(records: readonly LogRecord[]): (SeriesInput & { allDrops: DropRecord[] })[] {
  const byId = new Map(records.filter((r) => !r.deleted).map((r) => [r.id, r]));
  const readings = live<ReadingRecord>(records, 'reading');
  const dropsBySeries = new Map<string, DropRecord[]>();
  for (const d of live<DropRecord>(records, 'drop')) {
    const list = dropsBySeries.get(d.series_id) ?? [];
    list.push(d);
    dropsBySeries.set(d.series_id, list);
  }
  const inputs = live<SeriesRecord>(records, 'series').map((series) => {
    const day = (byId.get(series.day_id) as DayRecord | undefined) ?? null;
    const allDrops = (dropsBySeries.get(series.id) ?? []).sort((a, b) => a.seq - b.seq || (a.id < b.id ? -1 : 1));
    return {
      series,
      day,
      site: day ? ((byId.get(day.site_id) as SiteRecord | undefined) ?? null) : null,
      specimen: (byId.get(series.specimen_id) as SpecimenRecord | undefined) ?? null,
      reading: readingForSeries(series, readings),
      readingAloft: readingAloftForSeries(series, readings),
      drops: allDrops.filter((d) => !d.excluded),
      allDrops,
    };
  });
  const key = (i: SeriesInput) => `${i.day?.date ?? ''} ${i.series.started_at} ${i.series.id}`;
  return inputs.sort((a, b) => (key(a) < key(b) ? -1 : 1));
}

function computeRow({ allDrops, ...input }: SeriesInput & { allDrops: DropRecord[] }, compute: ComputeSeries): Row {
  let result: SeriesResult;
  try {
    result = compute(input);
  } catch (error) {
    const e = error as { code?: unknown; message?: unknown };
    result = { error: { code: typeof e.code === 'string' ? e.code : 'compute-failed', message: String(e.message ?? error) } };
  }
  return { input, allDrops, result };
}

/** A time to the microsecond (the tables' resolution for every time; a phone's clock resolves far less). */
function micro(seconds: number | null | undefined): number | null | undefined {
  return seconds === null || seconds === undefined || !Number.isFinite(seconds) ? seconds : Math.round(seconds * 1e6) / 1e6;
}

/** A computed figure to `digits` significant digits. */
function sig(value: number | null | undefined, digits: number): number | null | undefined {
  return value === null || value === undefined || !Number.isFinite(value) || value === 0 ? value : Number(value.toPrecision(digits));
}

/**
 * A result with its uncertainty as the GUM advises (JCGM 100:2008, 7.2.6): the uncertainty to two significant
 * digits, the value rounded to the same decimal place. Returns the decimals used, for the interval's bounds.
 */
export function roundWithUncertainty(value: number, u: number): { value: number; u: number; decimals: number } {
  if (!(u > 0) || !Number.isFinite(u)) return { value: sig(value, 4) as number, u, decimals: 4 };
  const decimals = Math.min(15, Math.max(0, 1 - Math.floor(Math.log10(u))));
  return { value: Number(value.toFixed(decimals)), u: Number(u.toPrecision(2)), decimals };
}

function humidityCells(reading: ReadingRecord | null): [CsvValue, CsvValue] {
  if (!reading) return [null, null];
  return reading.humidity.kind === 'relative' ? [reading.humidity.relative_humidity_pct, null] : [null, reading.humidity.dew_point_C];
}

/** A drop's result (joined by id, else by position among the used drops) and whether the drop was in the fit. */
function resultOf(input: SeriesInput, result: SeriesResult, drop: DropRecord): { r: DropResult; used: boolean } {
  const byId = (result.drops ?? []).some((r) => r.drop_id !== undefined);
  const index = input.drops.indexOf(drop);
  const r: DropResult = byId ? ((result.drops ?? []).find((x) => x.drop_id === drop.id) ?? {}) : index >= 0 ? (result.drops?.[index] ?? {}) : {};
  return { r, used: index >= 0 && !result.error };
}

function dropRows(rows: Row[]): CsvValue[][] {
  const out: CsvValue[][] = [];
  for (const { input, allDrops, result } of rows) {
    const { series, day, site, specimen, reading } = input;
    const [rh, dew] = humidityCells(reading);
    for (const drop of allDrops) {
      const { r, used } = resultOf(input, result, drop);
      const clip = drop.clip;
      out.push([
        day?.date,
        site?.name,
        series.id,
        series.started_at,
        series.specimen_id,
        specimen?.name,
        drop.id,
        drop.seq,
        drop.captured_at,
        drop.height_m ?? series.height_m,
        micro(drop.time_s),
        series.timing_method,
        drop.excluded,
        drop.exclusion_reason,
        drop.note,
        reading?.id,
        reading?.temperature_C,
        reading?.pressure_Pa,
        reading?.pressure_reference,
        rh,
        dew,
        reading?.wind_speed_m_s,
        reading?.vertical_wind_m_s,
        reading?.height_m,
        used ? sig(result.air_density_kg_m3, 6) : null,
        used ? sig(result.gravity_m_s2, 7) : null,
        used ? sig(r.drag_coefficient, 4) : null,
        used ? micro(r.predicted_time_s) : null,
        used ? micro(r.u_predicted_time_s) : null,
        used ? micro(r.residual_s) : null,
        used ? micro(r.vacuum_time_s) : null,
        used ? sig(r.impact_speed_m_s, 4) : null,
        used ? sig(r.impact_energy_J, 4) : null,
        used ? sig(r.reynolds_number, 3) : null,
        drop.marks?.length ?? null,
        drop.marks || clip ? drop.release_time_known !== false : null,
        used ? micro(r.release_shift_s) : null,
        clip?.codec,
        clip?.frame_rate_hz,
        micro(clip?.release_s),
        micro(clip?.u_release_s),
        micro(clip?.impact_s),
        micro(clip?.u_impact_s),
      ]);
    }
  }
  return out;
}

function markRows(rows: Row[]): CsvValue[][] {
  const out: CsvValue[][] = [];
  for (const { input, allDrops, result } of rows) {
    for (const drop of allDrops) {
      if (!drop.marks) continue;
      const { r, used } = resultOf(input, result, drop);
      drop.marks.forEach((mark, i) => {
        const fit = used ? r.marks?.[i] : undefined;
        out.push([
          input.day?.date,
          input.series.id,
          drop.id,
          drop.seq,
          drop.excluded,
          i + 1,
          mark.distance_m,
          micro(mark.time_s),
          micro(fit?.fitted_time_s),
          micro(fit?.residual_s),
        ]);
      });
    }
  }
  return out;
}

function seriesRows(rows: Row[]): CsvValue[][] {
  return rows.map(({ input, allDrops, result }) => {
    const { series, day, site, specimen, reading } = input;
    const [rh, dew] = humidityCells(reading);
    const interval = result.drag_coefficient_interval_95 ?? null;
    const cd = result.drag_coefficient;
    const u = result.drag_coefficient_standard_uncertainty;
    const rounded = typeof cd === 'number' && typeof u === 'number' ? roundWithUncertainty(cd, u) : null;
    // The expanded uncertainty (k = 2, the figure the phone shows) beside the standard one, each to two digits.
    const expanded = typeof u === 'number' ? sig(2 * u, 2) : null;
    const bound = (x: number | undefined) => (x === undefined ? x : rounded ? Number(x.toFixed(rounded.decimals)) : sig(x, 4));
    return [
      day?.date,
      site?.name,
      site?.latitude_deg,
      site?.elevation_m,
      series.id,
      series.started_at,
      series.specimen_id,
      specimen?.name,
      specimen?.mass_kg,
      specimen?.shape.kind,
      series.height_m,
      series.u_height_m,
      series.height_method,
      series.timing_method,
      micro(series.u_time_s),
      series.timing_offset,
      series.timing_delay_s,
      series.u_timing_delay_s,
      series.gate_distances_m?.join(' '),
      allDrops.length,
      input.drops.length,
      reading?.id,
      reading?.temperature_C,
      reading?.u_temperature_C,
      reading?.pressure_Pa,
      reading?.u_pressure_Pa,
      reading?.pressure_reference,
      rh,
      dew,
      reading?.wind_speed_m_s,
      reading?.u_wind_speed_m_s,
      reading?.vertical_wind_m_s,
      reading?.u_vertical_wind_m_s,
      reading?.height_m,
      series.reading_aloft_id,
      sig(result.air_density_kg_m3, 6),
      sig(result.gravity_m_s2, 7),
      rounded ? rounded.value : sig(cd, 4),
      rounded ? rounded.u : typeof u === 'number' ? sig(u, 2) : u,
      expanded,
      bound(interval?.[0]),
      bound(interval?.[1]),
      micro(result.timing_offset_s),
      sig(result.terminal_velocity_m_s, 4),
      (result.warnings ?? []).map((w) => `${w.code}: ${w.message}`).join('; ') || null,
      result.error?.code,
      result.error?.message,
    ];
  });
}

export interface LogCsv {
  /** One row per drop. */
  drops: string;
  /** One row per series. */
  series: string;
  /** One row per mark of each drop with marks (only the header when no drop has marks). */
  marks: string;
}

/** The three tables, computing each series once. */
export function logCsv(records: readonly LogRecord[], compute: ComputeSeries, options: CsvOptions = {}): LogCsv {
  const steps = logCsvSteps(records, compute, options);
  for (;;) {
    const step = steps.next();
    if (step.done) return step.value;
  }
}

/**
 * The three tables in steps: one series computed per step (a series' analysis, with its Monte Carlo, is the long
 * part), each step yielding how many series are done, so a caller can show progress and stop between two series
 * (sync/csv-export.ts). The first report (0 of n) comes before any series is computed; the tables are returned.
 */
export function* logCsvSteps(records: readonly LogRecord[], compute: ComputeSeries, options: CsvOptions = {}): Generator<TransferProgress, LogCsv, void> {
  const inputs = seriesInputs(records);
  const total = inputs.length;
  const rows: Row[] = [];
  yield { phase: 'computing', done: 0, total };
  for (const input of inputs) {
    rows.push(computeRow(input, compute));
    yield { phase: 'computing', done: rows.length, total };
  }
  return {
    drops: toCsv(DROP_COLUMNS, dropRows(rows), options),
    series: toCsv(SERIES_COLUMNS, seriesRows(rows), options),
    marks: toCsv(MARK_COLUMNS, markRows(rows), options),
  };
}
