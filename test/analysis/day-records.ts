// An invented test day for the analysis tests (demo data, not measurements): one site, one ball, one air reading,
// and a series from three heights whose times fall exactly as the closed-form model says for C_d 0.47, plus a
// constant timer delay and a little alternating noise, so a fitted timing offset is clearly not zero.
import type { DayRecord, DropBody, DropRecord, LogRecord, ReadingRecord, SeriesRecord, SiteRecord, SpecimenRecord } from '../../src/log/types';
import { exactTimes } from '../physics/syntheticSeries';
import { bodyOf, idMaker, instant, makeRecord, revise } from '../sync/sample-log';

const DEVICE = 'phoneT';
const T0 = Date.UTC(2026, 6, 3, 9, 0, 0);

export interface TestDay {
  site: SiteRecord;
  specimen: SpecimenRecord;
  day: DayRecord;
  reading: ReadingRecord;
  series: SeriesRecord;
  drops: DropRecord[];
  records: LogRecord[];
}

/** Heights of the series' drops, m (two from each of three heights). */
export const HEIGHTS = [5, 5, 10, 10, 20, 20];
/** The invented timer delay added to every time, s. */
export const TIMER_DELAY_S = 0.04;

export function testDay(options: { timingOffset?: 'fit' | 'none'; delay_s?: number } = {}): TestDay {
  const nextId = idMaker(77);
  let ms = T0;
  const tick = () => (ms += 1000);
  const site = makeRecord('site', nextId(), { name: 'Test tower', latitude_deg: 46.1, longitude_deg: 7.2, elevation_m: 430, elevation_source: 'map', notes: '' }, tick(), DEVICE);
  const specimen = makeRecord(
    'specimen',
    nextId(),
    { name: 'ball 95 mm', mass_kg: 0.21, u_mass_kg: 0.0005, shape: { kind: 'sphere', diameter_m: 0.095, u_diameter_m: 0.0003 }, reference_drag_coefficient: null, notes: '' },
    tick(),
    DEVICE,
  );
  const day = makeRecord('day', nextId(), { site_id: site.id, date: '2026-07-03', crew: ['A'], notes: '' }, tick(), DEVICE);
  const reading = makeRecord(
    'reading',
    nextId(),
    {
      day_id: day.id,
      taken_at: instant(ms),
      temperature_C: 17.5,
      u_temperature_C: 0.3,
      pressure_Pa: 96_120,
      u_pressure_Pa: 30,
      pressure_reference: 'station',
      humidity: { kind: 'relative', relative_humidity_pct: 55, u_relative_humidity_pct: 3 },
      wind_speed_m_s: null,
      u_wind_speed_m_s: null,
      vertical_wind_m_s: null,
      u_vertical_wind_m_s: null,
      height_m: 0,
      instrument: 'meter',
      notes: '',
    },
    tick(),
    DEVICE,
  );
  const series = makeRecord(
    'series',
    nextId(),
    {
      day_id: day.id,
      specimen_id: specimen.id,
      height_m: 10,
      u_height_m: 0.01,
      height_method: 'tape',
      timing_method: 'typed',
      u_time_s: 0.004,
      target_relative_uncertainty: 0.05,
      reading_id: null,
      timing_offset: options.timingOffset ?? 'fit',
      reading_aloft_id: null,
      timing_delay_s: null,
      u_timing_delay_s: null,
      started_at: instant(ms),
      notes: '',
    },
    tick(),
    DEVICE,
  );
  const delay = options.delay_s ?? TIMER_DELAY_S;
  const times = exactTimes(
    { site: { latitude_deg: 46.1, elevation_m: 430 }, air: { temperature_C: 17.5, pressure_Pa: 96_120, pressure_reference: 'station', relative_humidity_pct: 55 }, specimen: { shape: 'sphere', mass_kg: 0.21, diameter_m: 0.095 } },
    0.47,
    HEIGHTS,
  );
  const drops = HEIGHTS.map((h, i) =>
    makeRecord(
      'drop',
      nextId(),
      {
        series_id: series.id,
        seq: i + 1,
        raw: { kind: 'typed', text: '' },
        time_s: times[i]! + delay + (i % 2 === 0 ? 0.002 : -0.002),
        height_m: h,
        excluded: false,
        exclusion_reason: null,
        note: '',
        captured_at: instant(tick()),
      },
      ms,
      DEVICE,
    ),
  );
  return { site, specimen, day, reading, series, drops, records: [site, specimen, day, reading, series, ...drops] };
}

/** A copy of `drop` (same height and time) as a later drop, left out of the fit with a reason. */
export function excludedCopy(drop: DropRecord, seq: number, id: string): DropRecord {
  const copy = makeRecord('drop', id, { ...(bodyOf(drop) as unknown as DropBody), seq, excluded: false, exclusion_reason: null }, T0 + 100_000, DEVICE);
  return revise(copy, { excluded: true, exclusion_reason: 'a second look at drop ' + drop.seq }, T0 + 101_000, DEVICE, 'excluded');
}

export { revise, DEVICE };
