// Demo bodies for tests: our own scenario (a footbridge over a disused quarry pond, a crew of two, a steel
// ball and a cardboard disc). Invented for the tests, not measurements.
import type { DayBody, DropBody, ReadingBody, SeriesBody, SiteBody, SpecimenBody } from '../../src/log/types';

export const SITE_ID = '3f1c2a9e-5b7d-4e21-9c0a-1d2e3f405162';
export const SPECIMEN_ID = '0a9b8c7d-6e5f-4a3b-8c2d-1e0f9a8b7c6d';
export const DAY_ID = 'c2d3e4f5-a6b7-4c8d-9e0f-1a2b3c4d5e6f';
export const READING_ID = 'd4e5f6a7-b8c9-4d0e-8f1a-2b3c4d5e6f70';
export const SERIES_ID = 'e5f6a7b8-c9d0-4e1f-a2b3-c4d5e6f70819';

export const site = (): SiteBody => ({
  name: 'Hollin pond footbridge',
  latitude_deg: 53.8123,
  longitude_deg: -1.5621,
  elevation_m: 74.5,
  elevation_source: 'map',
  notes: 'Release from the east railing.',
});

export const steelBall = (): SpecimenBody => ({
  name: 'Steel ball 25 mm',
  mass_kg: 0.0637,
  u_mass_kg: 0.0001,
  shape: { kind: 'sphere', diameter_m: 0.025, u_diameter_m: 0.00002 },
  reference_drag_coefficient: 0.47,
  notes: '',
});

export const day = (): DayBody => ({ site_id: SITE_ID, date: '2026-06-14', crew: ['Ada', 'Bo'], notes: '' });

export const reading = (): ReadingBody => ({
  day_id: DAY_ID,
  taken_at: '2026-06-14T09:05:00.000Z',
  temperature_C: 17.4,
  u_temperature_C: 0.3,
  pressure_Pa: 100_820,
  u_pressure_Pa: 50,
  pressure_reference: 'station',
  humidity: { kind: 'relative', relative_humidity_pct: 62, u_relative_humidity_pct: 3 },
  wind_speed_m_s: 1.2,
  u_wind_speed_m_s: null,
  vertical_wind_m_s: null,
  u_vertical_wind_m_s: null,
  height_m: 0,
  instrument: 'handheld weather meter',
  notes: '',
});

export const series = (): SeriesBody => ({
  day_id: DAY_ID,
  specimen_id: SPECIMEN_ID,
  height_m: 6.12,
  u_height_m: 0.01,
  height_method: 'tape',
  timing_method: 'tap',
  u_time_s: 0.03,
  target_relative_uncertainty: 0.05,
  reading_id: null,
  timing_offset: 'none',
  reading_aloft_id: null,
  timing_delay_s: null,
  u_timing_delay_s: null,
  started_at: '2026-06-14T09:10:00.000Z',
  notes: '',
});

export const drop = (seq = 1): DropBody => ({
  series_id: SERIES_ID,
  seq,
  raw: { kind: 'taps', timestamps_ms: [10_000, 11_121] },
  time_s: 1.121,
  height_m: null,
  excluded: false,
  exclusion_reason: null,
  note: '',
  captured_at: '2026-06-14T09:10:12.000Z',
});
