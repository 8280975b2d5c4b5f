import { describe, expect, it } from 'vitest';
import { DROP_COLUMNS, MARK_COLUMNS, SERIES_COLUMNS, logCsv, readingForSeries, roundWithUncertainty, type ComputeSeries, type SeriesInput } from '../../src/log/csv-tables';
import { byKind, idMaker, revise, sampleLog, tombstone } from '../sync/sample-log';
import { parseCsv } from './csv-reader';
import type { DropRecord, ReadingRecord } from '../../src/log/types';
import { logWithMarks } from './marks-demo';

const T = Date.UTC(2026, 6, 1);

/** A stand-in computation that echoes what it was given, so the tests can see the wiring. */
const echo: ComputeSeries = (input) => ({
  air_density_kg_m3: 1.15,
  gravity_m_s2: 9.806,
  drag_coefficient: 0.5,
  drag_coefficient_standard_uncertainty: 0.02,
  drag_coefficient_interval_95: [0.46, 0.54],
  terminal_velocity_m_s: 30,
  drops: input.drops.map((d) => ({ drag_coefficient: d.seq / 10, residual_s: -0.004, predicted_time_s: d.time_s + 0.004 })),
  warnings: [{ code: 'density-out-of-range', message: 'outside 15–27 °C' }],
});

function table(text: string): Record<string, string>[] {
  const [header, ...rows] = parseCsv(text.replace(/^\ufeff/, ''));
  return rows.map((r) => Object.fromEntries(header!.map((h, i) => [h, r[i]!])));
}

// Columns that are numbers without a unit: counts, ordinals and ratios.
const DIMENSIONLESS = new Set(['mark_count', 'mark_index', 'release_time_known', 'clip_codec', 'seq', 'drag_coefficient', 'u_drag_coefficient', 'U_drag_coefficient_k2', 'drag_coefficient_95_low', 'drag_coefficient_95_high', 'reynolds_number', 'drops_total', 'drops_used']);
const UNIT = /_(m|s|kg|C|Pa|pct|deg|m_s|m_s2|kg_m3|J|Hz|hz)$/;

describe('the drops and series tables', () => {
  const log = sampleLog({ days: 1, seriesPerDay: 2, dropsPerSeries: 3 });

  it('have a unit in the name of every quantity column', () => {
    const quantities = (cols: readonly string[]) =>
      cols.filter((c) => !/(_id|_date|_at|_name|_method|_reference|excluded|reason|note|shape|timing_offset|warnings|error_code|error_message)$/.test(c));
    for (const c of [...quantities(DROP_COLUMNS), ...quantities(SERIES_COLUMNS)]) {
      expect(UNIT.test(c) || DIMENSIONLESS.has(c), c).toBe(true);
    }
  });

  it('give one row per drop with its series, specimen, air reading and results', () => {
    const rows = table(logCsv(log, echo).drops);
    expect(rows).toHaveLength(6);
    const drop = byKind(log, 'drop')[0]!;
    const row = rows.find((r) => r.drop_id === drop.id)!;
    expect(row).toMatchObject({
      series_id: drop.series_id,
      specimen_name: 'steel ball 25 mm',
      site_name: 'North quarry wall',
      height_m: '12',
      time_s: String(Math.round(drop.time_s * 1e6) / 1e6),
      temperature_C: '17.5',
      pressure_Pa: '96120',
      pressure_reference: 'station',
      relative_humidity_pct: '55',
      dew_point_C: '',
      air_density_kg_m3: '1.15',
      drag_coefficient: '0.1',
      residual_s: '-0.004',
      excluded: 'false',
    });
  });

  it('give one row per series with the fitted drag coefficient and its interval', () => {
    const rows = table(logCsv(log, echo).series);
    expect(rows).toHaveLength(2);
    expect(rows[0]).toMatchObject({
      drops_total: '3',
      drops_used: '3',
      drag_coefficient: '0.5',
      u_drag_coefficient: '0.02',
      U_drag_coefficient_k2: '0.04',
      drag_coefficient_95_low: '0.46',
      drag_coefficient_95_high: '0.54',
      warnings: 'density-out-of-range: outside 15–27 °C',
      error_code: '',
    });
  });

  it('list an excluded drop without handing it to the computation', () => {
    const excluded = revise(byKind(log, 'drop')[1]!, { excluded: true, exclusion_reason: 'hit the wall' }, T, 'phoneA', 'hit the wall');
    const records = log.map((r) => (r.id === excluded.id ? excluded : r));
    const seen: SeriesInput[] = [];
    const rows = table(logCsv(records, (i) => (seen.push(i), echo(i))).drops);
    const row = rows.find((r) => r.drop_id === excluded.id)!;
    expect(row).toMatchObject({ excluded: 'true', exclusion_reason: 'hit the wall', drag_coefficient: '', residual_s: '' });
    expect(seen.flatMap((i) => i.drops).some((d) => d.id === excluded.id)).toBe(false);
    // The results of the other drops stay aligned with their own drops.
    const third = rows.find((r) => r.drop_id === byKind(log, 'drop')[2]!.id)!;
    expect(third.drag_coefficient).toBe('0.3');
  });

  it('leave out deleted drops and deleted series', () => {
    const goneDrop = tombstone(byKind(log, 'drop')[0]!, T, 'phoneA');
    const goneSeries = tombstone(byKind(log, 'series')[1]!, T, 'phoneA');
    const records = log.map((r) => (r.id === goneDrop.id ? goneDrop : r.id === goneSeries.id ? goneSeries : r));
    const csv = logCsv(records, echo);
    expect(table(csv.drops).map((r) => r.drop_id)).not.toContain(goneDrop.id);
    expect(table(csv.drops)).toHaveLength(2);
    expect(table(csv.series)).toHaveLength(1);
  });

  it('report a series that could not be computed and carry on with the others', () => {
    let calls = 0;
    const failing: ComputeSeries = (i) => {
      if (calls++ === 0) throw Object.assign(new Error('faster than free fall: check the height and the timing'), { code: 'faster-than-free-fall' });
      return echo(i);
    };
    const rows = table(logCsv(log, failing).series);
    expect(rows[0]).toMatchObject({ error_code: 'faster-than-free-fall', drag_coefficient: '' });
    expect(rows[0]!.error_message).toMatch(/faster than free fall/);
    expect(rows[1]!.drag_coefficient).toBe('0.5');
  });

  it('neutralise a specimen name that a spreadsheet would run as a formula (OWASP)', () => {
    const specimen = revise(byKind(log, 'specimen')[0]!, { name: '=HYPERLINK("http://example.invalid")' }, T, 'phoneA', null);
    const records = log.map((r) => (r.id === specimen.id ? specimen : r));
    const csv = logCsv(records, echo);
    expect(table(csv.drops)[0]!.specimen_name).toBe(`'=HYPERLINK("http://example.invalid")`);
    expect(table(csv.series)[0]!.specimen_name!.startsWith("'=")).toBe(true);
  });

  it('are RFC 4180 text: CRLF line ends and a UTF-8 byte order mark', () => {
    const { drops } = logCsv(log, echo);
    expect(drops.startsWith('\ufeffday_date,')).toBe(true);
    expect(drops.split('\r\n')).toHaveLength(8);
    expect(drops.replace(/\r\n/g, '')).not.toMatch(/[\r\n]/);
  });
});

describe('the air reading a series uses', () => {
  const log = sampleLog();
  const series = byKind(log, 'series')[0]!;
  const day = byKind(log, 'day')[0]!;
  const nextId = idMaker(99);
  const at = (ms: number, id = nextId()): ReadingRecord => ({ ...byKind(log, 'reading')[0]!, id, taken_at: new Date(ms).toISOString() });
  const start = Date.parse(series.started_at);

  it('is the one the series names', () => {
    const named = at(start - 3_600_000);
    const near = at(start);
    expect(readingForSeries({ ...series, reading_id: named.id }, [near, named])).toBe(named);
  });

  it('is otherwise the reading of the day nearest in time to the start of the series', () => {
    const early = at(start - 600_000);
    const late = at(start + 120_000);
    const otherDay = { ...at(start), day_id: nextId() };
    expect(readingForSeries(series, [early, late, otherDay])).toBe(late);
    expect(day.id).toBe(series.day_id);
  });

  it('is none when the day has no reading', () => {
    expect(readingForSeries(series, [])).toBeNull();
  });
});

describe('the digits of the tables', () => {
  it('round a result to its uncertainty as the GUM does (JCGM 100:2008, 7.2.2: 100.021 47 g with u = 0.35 mg)', () => {
    expect(roundWithUncertainty(100.0214712, 0.000352)).toEqual({ value: 100.02147, u: 0.00035, decimals: 5 });
    expect(roundWithUncertainty(0.46831, 0.01234)).toEqual({ value: 0.468, u: 0.012, decimals: 3 });
  });

  it('write times to the microsecond and no floating-point tail anywhere', () => {
    const tails: ComputeSeries = (input) => ({
      ...echo(input),
      drag_coefficient: 0.46831234,
      drag_coefficient_standard_uncertainty: 0.0123456,
      drag_coefficient_interval_95: [0.4441234, 0.4931234],
      drops: input.drops.map(() => ({ drag_coefficient: 0.4683123, residual_s: 0.0032000000000005357, predicted_time_s: 1.5759999999999998 })),
    });
    const csv = logCsv(sampleLog({ days: 1, seriesPerDay: 1, dropsPerSeries: 2 }), tails);
    const drop = table(csv.drops)[0]!;
    expect(drop).toMatchObject({ residual_s: '0.0032', predicted_time_s: '1.576', drag_coefficient: '0.4683' });
    const series = table(csv.series)[0]!;
    expect(series).toMatchObject({ drag_coefficient: '0.468', u_drag_coefficient: '0.012', U_drag_coefficient_k2: '0.025', drag_coefficient_95_low: '0.444', drag_coefficient_95_high: '0.493' });
    for (const text of [csv.drops, csv.series]) expect(text).not.toMatch(/\d\.\d*(0{6,}|9{6,})\d/);
  });
});

describe('the marks table and the clip columns', () => {
  // Demo drops with marks (test/log/marks-demo.ts): gates and clips, invented values.
  const records = logWithMarks();
  /** A computation that gives every mark a fitted time 1 ms early and a release shift of 2 ms to the clip drops. */
  const fitted: ComputeSeries = (input) => ({
    drops: input.drops.map((d) => ({
      drop_id: d.id,
      ...(d.marks ? { marks: d.marks.map((m) => ({ fitted_time_s: m.time_s - 0.001, residual_s: 0.001 })) } : {}),
      release_shift_s: d.release_time_known === false ? 0.002 : null,
    })),
  });

  it('lists one row per mark: day, series, drop, mark index from 1, distance, time, and the fit', () => {
    const rows = table(logCsv(records, fitted).marks);
    const withMarks = records.filter((r): r is DropRecord => r.kind === 'drop' && r.marks !== undefined);
    expect(rows).toHaveLength(withMarks.reduce((n, d) => n + d.marks!.length, 0));
    const drop = withMarks.find((d) => d.clip)!;
    const own = rows.filter((r) => r['drop_id'] === drop.id);
    expect(own.map((r) => [r['mark_index'], r['distance_m'], r['time_s']])).toEqual(drop.marks!.map((m, i) => [String(i + 1), String(m.distance_m), String(m.time_s)]));
    expect(own[0]).toMatchObject({ seq: String(drop.seq), series_id: drop.series_id, excluded: 'false', residual_s: '0.001' });
    expect(Number(own[0]!['fitted_time_s'])).toBeCloseTo(drop.marks![0]!.time_s - 0.001, 9);
  });

  it("gives the drops table the clip's summary and the marks' count", () => {
    const rows = table(logCsv(records, fitted).drops);
    const drop = records.find((r): r is DropRecord => r.kind === 'drop' && r.clip !== undefined)!;
    expect(rows.find((r) => r['drop_id'] === drop.id)).toMatchObject({
      mark_count: '3',
      release_time_known: 'false',
      release_shift_s: '0.002',
      clip_codec: 'avc1.64001f',
      clip_frame_rate_hz: '240',
      clip_release_s: String(drop.clip!.release_s),
      u_clip_release_s: '0.0006',
      clip_impact_s: String(drop.clip!.impact_s),
      u_clip_impact_s: '0.0008',
    });
    const gates = rows.find((r) => r['mark_count'] === '3' && r['clip_codec'] === '')!;
    expect(gates).toMatchObject({ release_time_known: 'true', release_shift_s: '' });
    expect(table(logCsv(records, fitted).series).map((r) => r['gate_distances_m'])).toContain('0.5 1 1.5');
  });

  it('is only its header for a log without marks', () => {
    expect(logCsv(sampleLog({ days: 1, seriesPerDay: 1, dropsPerSeries: 2 }), echo).marks.trim()).toBe(MARK_COLUMNS.join(','));
  });
});
