// A large demo log for the export benchmark: our own invented days at one site, 100 drops per series.
// Used by bench/export.bench.ts in Node and, through the sync test page, in Chromium.
import { formatHlc } from '../src/log/hlc';
import { uuidV4 } from '../src/log/uuid';
import type { LogRecord } from '../src/log/types';
import { seeded } from '../test/sync/sample-log';

/** A log with `drops` drops: 100 per series, 5 series a day, one site, two specimens. */
export function benchLog(drops: number, device = 'benchphone', seed = 1): LogRecord[] {
  const random = seeded(seed);
  const id = () =>
    uuidV4((bytes) => {
      for (let i = 0; i < bytes.length; i++) bytes[i] = Math.floor(random() * 256);
      return bytes;
    });
  let ms = Date.UTC(2026, 3, 1, 7);
  const envelope = (kind: string) => {
    ms += 1000;
    const at = new Date(ms).toISOString();
    return { id: id(), kind, created_at: at, updated_at: at, rev: formatHlc({ ms, counter: 0, device }), device, deleted: false, history: [] };
  };
  const records: LogRecord[] = [];
  const site = { ...envelope('site'), name: 'North quarry wall', latitude_deg: 46.1, longitude_deg: 7.2, elevation_m: 430, elevation_source: 'map', notes: '' } as LogRecord;
  const specimens = [0.025, 0.04].map(
    (d) =>
      ({
        ...envelope('specimen'),
        name: `steel ball ${d * 1000} mm`,
        mass_kg: 7850 * (Math.PI / 6) * d ** 3,
        u_mass_kg: 0.0001,
        shape: { kind: 'sphere', diameter_m: d, u_diameter_m: 0.0001 },
        reference_drag_coefficient: 0.47,
        notes: '',
      }) as LogRecord,
  );
  records.push(site, ...specimens);
  let made = 0;
  for (let day = 0; made < drops; day++) {
    const dayRecord = { ...envelope('day'), site_id: site.id, date: new Date(Date.UTC(2026, 3, 1 + day)).toISOString().slice(0, 10), crew: ['Ines', 'Tom'], notes: '' } as LogRecord;
    const reading = {
      ...envelope('reading'),
      day_id: dayRecord.id,
      taken_at: new Date(ms).toISOString(),
      temperature_C: 15 + random() * 10,
      u_temperature_C: 0.3,
      pressure_Pa: 95000 + random() * 2000,
      u_pressure_Pa: 30,
      pressure_reference: 'station',
      humidity: { kind: 'relative', relative_humidity_pct: 40 + random() * 40, u_relative_humidity_pct: 3 },
      wind_speed_m_s: null,
      u_wind_speed_m_s: null,
      vertical_wind_m_s: null,
      u_vertical_wind_m_s: null,
      height_m: 0,
      instrument: 'handheld weather meter',
      notes: '',
    } as LogRecord;
    records.push(dayRecord, reading);
    for (let s = 0; s < 5 && made < drops; s++) {
      const series = {
        ...envelope('series'),
        day_id: dayRecord.id,
        specimen_id: specimens[s % 2]!.id,
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
        started_at: new Date(ms).toISOString(),
        notes: '',
      } as LogRecord;
      records.push(series);
      for (let k = 0; k < 100 && made < drops; k++, made++) {
        const time = Math.round((1.575 + random() * 0.01) * 1000) / 1000;
        const env = envelope('drop');
        records.push({
          ...env,
          series_id: series.id,
          seq: k + 1,
          raw: { kind: 'taps', timestamps_ms: [1000, 1000 + time * 1000] },
          time_s: time,
          height_m: null,
          excluded: false,
          exclusion_reason: null,
          note: '',
          captured_at: env.created_at,
        } as LogRecord);
      }
    }
  }
  return records;
}

/** A stand-in for the physics in the CSV benchmark: results of the right shape, so only the tables are timed. */
export function tableOnlyResults(input: { drops: { time_s: number }[] }) {
  return {
    air_density_kg_m3: 1.15,
    gravity_m_s2: 9.806,
    drag_coefficient: 0.47,
    drag_coefficient_standard_uncertainty: 0.02,
    drag_coefficient_interval_95: [0.43, 0.51] as [number, number],
    terminal_velocity_m_s: 42.1,
    drops: input.drops.map((d) => ({ drag_coefficient: 0.47, predicted_time_s: d.time_s, residual_s: -0.001, vacuum_time_s: 1.5645, impact_speed_m_s: 15.1, impact_energy_J: 7.3, reynolds_number: 25000 })),
    warnings: [],
  };
}
