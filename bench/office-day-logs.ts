// Log files of a typical field day for the office command's benchmark: our own invented days (demo data, not
// measurements). Each file is one phone's day: a site, two or three air readings, 3 to 5 specimens and 4 to 6
// series of 5 to 15 drops, as a crew logs in a morning. Fall times follow the closed form of a fall with
// quadratic drag from rest (v_t = sqrt(m g / (½ ρ C_d A)), t = (v_t / g) · arcosh(exp(g h / v_t²)); a textbook
// result, from memory) with tap-timing scatter added, so the analysis finds what a real day would give.
import { formatHlc } from '../src/log/hlc';
import { uuidV4 } from '../src/log/uuid';
import { exportLog } from '../src/log/export';
import type { LogRecord } from '../src/log/types';
import { seeded } from '../test/sync/sample-log';

const BALLS = [
  { name: 'steel ball 25 mm', density: 7850, d: 0.025, cd: 0.47 },
  { name: 'rubber ball 65 mm', density: 1100, d: 0.065, cd: 0.47 },
  { name: 'wooden ball 50 mm', density: 700, d: 0.05, cd: 0.47 },
  { name: 'golf ball', density: 1130, d: 0.0427, cd: 0.3 },
  { name: 'table-tennis ball', density: 84, d: 0.04, cd: 0.5 },
];

/** One phone's day as a log file's text (canonical JSON, as the app writes it). */
export function officeDayLog(index: number): string {
  const device = `phone${String(index).padStart(4, '0')}`;
  const random = seeded(10_000 + index);
  const id = () =>
    uuidV4((bytes) => {
      for (let i = 0; i < bytes.length; i++) bytes[i] = Math.floor(random() * 256);
      return bytes;
    });
  let ms = Date.UTC(2026, 4, 1, 7) + (index % 120) * 86_400_000;
  const envelope = (kind: string) => {
    ms += 7000;
    const at = new Date(ms).toISOString();
    return { id: id(), kind, created_at: at, updated_at: at, rev: formatHlc({ ms, counter: 0, device }), device, deleted: false, history: [] };
  };
  const records: LogRecord[] = [];
  const site = { ...envelope('site'), name: `Test tower ${index % 17}`, latitude_deg: 40 + random() * 15, longitude_deg: random() * 20, elevation_m: 100 + random() * 900, elevation_source: 'map', notes: '' };
  const day = { ...envelope('day'), site_id: site.id, date: new Date(ms).toISOString().slice(0, 10), crew: ['Ines', 'Tom'], notes: '' };
  records.push(site as LogRecord, day as LogRecord);
  const specimens = [...BALLS].sort(() => random() - 0.5).slice(0, 3 + Math.floor(random() * 3)).map((b) => {
    const mass = b.density * (Math.PI / 6) * b.d ** 3;
    const record = { ...envelope('specimen'), name: b.name, mass_kg: Math.round(mass * 1e5) / 1e5, u_mass_kg: 0.0001, shape: { kind: 'sphere', diameter_m: b.d, u_diameter_m: 0.0001 }, reference_drag_coefficient: null, notes: '' };
    return { record, ball: b, mass };
  });
  records.push(...specimens.map((s) => s.record as LogRecord));
  const readings = Array.from({ length: 2 + Math.floor(random() * 2) }, () => {
    const r = {
      ...envelope('reading'),
      day_id: day.id,
      taken_at: new Date(ms).toISOString(),
      temperature_C: 15 + random() * 12,
      u_temperature_C: 0.3,
      pressure_Pa: 92_000 + random() * 8000,
      u_pressure_Pa: 30,
      pressure_reference: 'station',
      humidity: { kind: 'relative', relative_humidity_pct: 35 + random() * 50, u_relative_humidity_pct: 3 },
      wind_speed_m_s: Math.round(random() * 20) / 10,
      u_wind_speed_m_s: null,
      vertical_wind_m_s: null,
      u_vertical_wind_m_s: null,
      height_m: 0,
      instrument: 'handheld weather meter',
      notes: '',
    };
    ms += 3_600_000;
    return r;
  });
  records.push(...(readings as LogRecord[]));
  const seriesCount = 4 + Math.floor(random() * 3);
  for (let s = 0; s < seriesCount; s++) {
    const { record: specimen, ball, mass } = specimens[s % specimens.length]!;
    const height = 6 + Math.round(random() * 14);
    const series = {
      ...envelope('series'),
      day_id: day.id,
      specimen_id: specimen.id,
      height_m: height,
      u_height_m: 0.01,
      height_method: 'tape',
      timing_method: 'tap',
      u_time_s: 0.01,
      target_relative_uncertainty: 0.05,
      reading_id: null,
      timing_offset: 'none',
      reading_aloft_id: null,
      timing_delay_s: null,
      u_timing_delay_s: null,
      started_at: new Date(ms).toISOString(),
      notes: '',
    };
    records.push(series as LogRecord);
    const g = 9.81;
    const area = (Math.PI / 4) * ball.d ** 2;
    const vt = Math.sqrt((mass * g) / (0.5 * 1.15 * ball.cd * area));
    const t = (vt / g) * Math.acosh(Math.exp((g * height) / vt ** 2));
    const drops = 5 + Math.floor(random() * 11);
    for (let k = 0; k < drops; k++) {
      const time = Math.round((t + (random() - 0.5) * 0.03) * 1000) / 1000;
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
  return exportLog(records, { device, app_version: '0.1.0' });
}
