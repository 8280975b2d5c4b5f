// The office command's log part: src/cli/log-to-csv.ts, with the real physics behind it.
import { afterEach, describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { isLogFile, physicsSeriesComputer, seriesRequest, writeLogCsv } from '../../src/cli/log-to-csv';
import { seriesInputs } from '../../src/log/csv-tables';
import { exportLog } from '../../src/log/export';
import { LogFileError } from '../../src/log/export-parse';
import { analyzeSeries, validateAnalysisRequest } from '../../src/physics/index';
import { byKind, revise, sampleLog } from '../sync/sample-log';
import { parseCsv } from './csv-reader';
import { logWithMarks } from './marks-demo';

const dirs: string[] = [];
afterEach(() => dirs.splice(0).forEach((d) => rmSync(d, { recursive: true, force: true })));
const outDir = () => {
  const d = mkdtempSync(join(tmpdir(), 'plummet-csv-'));
  dirs.push(d);
  return join(d, 'out');
};
const table = (path: string) => {
  const [header, ...rows] = parseCsv(readFileSync(path, 'utf8').replace(/^\ufeff/, ''));
  return rows.map((r) => Object.fromEntries(header!.map((h, i) => [h, r[i]!])));
};

describe('writing the marks table of an exported log', () => {
  it('writes marks.csv beside the others: one row per mark of every drop with marks (demo gates and clips)', () => {
    const records = logWithMarks();
    const dir = outDir();
    const summary = writeLogCsv(exportLog(records, { device: 'phoneA', app_version: '0.5.0' }), dir, physicsSeriesComputer());
    expect(summary.marks_csv).toBe(join(dir, 'marks.csv'));
    const rows = table(summary.marks_csv);
    expect(rows).toHaveLength(30);
    expect(rows.filter((r) => r.mark_index === '1')).toHaveLength(10);
    expect(new Set(rows.map((r) => r.distance_m))).toEqual(new Set(['0.5', '1', '1.5', '0.2', '0.6']));
    expect(table(summary.drops_csv).filter((r) => r.clip_codec === 'avc1.64001f')).toHaveLength(5);
  });
});

describe('writing the CSV tables of an exported log', () => {
  const log = sampleLog({ days: 1, seriesPerDay: 2, dropsPerSeries: 3 });
  const text = exportLog(log, { device: 'phoneA', app_version: '0.1.0' });

  it('recognises a log file as opposed to a single-series request', () => {
    expect(isLogFile(JSON.parse(text))).toBe(true);
    expect(isLogFile({ site: {}, air: {}, drops: [] })).toBe(false);
  });

  it('writes drops.csv and series.csv into the folder, creating it', () => {
    const dir = outDir();
    const summary = writeLogCsv(text, dir, physicsSeriesComputer());
    expect(summary).toMatchObject({ drops_csv: join(dir, 'drops.csv'), series_csv: join(dir, 'series.csv'), series: 2, drops: 6 });
    expect(table(summary.drops_csv)).toHaveLength(6);
    expect(table(summary.series_csv)).toHaveLength(2);
  });

  it('puts the physics results of each series in the tables, as analyzeSeries gives them for the same request', () => {
    const dir = outDir();
    const summary = writeLogCsv(text, dir, physicsSeriesComputer());
    const rows = table(summary.series_csv);
    for (const input of seriesInputs(log)) {
      const row = rows.find((r) => r.series_id === input.series.id)!;
      const result = analyzeSeries(validateAnalysisRequest(seriesRequest(input)));
      expect(row.error_code).toBe('');
      expect(row.air_density_kg_m3).toBe(String(Number(result.air.density_kg_m3.toPrecision(6))));
      expect(row.gravity_m_s2).toBe(String(Number(result.gravity_m_s2.toPrecision(7))));
      // The uncertainty to two significant digits and C_d to the same decimal place (GUM, JCGM 100:2008, 7.2.6);
      // the expanded uncertainty (k = 2) beside the standard one.
      const u = result.drag_coefficient_standard_uncertainty;
      const place = 10 ** (Math.floor(Math.log10(u)) - 1);
      expect(Number(row.u_drag_coefficient)).toBe(Number(u.toPrecision(2)));
      expect(Number(row.U_drag_coefficient_k2)).toBe(Number((2 * u).toPrecision(2)));
      expect(Math.abs(Number(row.drag_coefficient) - result.drag_coefficient!)).toBeLessThanOrEqual(place / 2 + 1e-12);
      expect(Math.abs(Number(row.drag_coefficient_95_low) - result.drag_coefficient_interval_95[0])).toBeLessThanOrEqual(place / 2 + 1e-12);
      const drops = table(summary.drops_csv).filter((d) => d.series_id === input.series.id);
      drops.forEach((d, i) => expect(Math.abs(Number(d.residual_s) - result.drops[i]!.residual_s)).toBeLessThanOrEqual(0.5e-6 + 1e-15));
    }
  });

  it('builds the analysis request from the records: site, air, specimen, drops, timing and uncertainties', () => {
    const input = seriesInputs(log)[0]!;
    const request = seriesRequest(input);
    expect(request).toMatchObject({
      site: { latitude_deg: 46.1, elevation_m: 430 },
      air: { temperature_C: 17.5, pressure_Pa: 96120, pressure_reference: 'station', relative_humidity_pct: 55 },
      specimen: { shape: 'sphere', mass_kg: 0.0641, diameter_m: 0.025, reference_drag_coefficient: 0.47 },
      timing: { standard_uncertainty_s: 0.004, offset: 'none' },
      uncertainty: { height_m: 0.01, mass_kg: 0.0001, diameter_m: 0.0001, temperature_C: 0.3, pressure_Pa: 30, relative_humidity_pct: 3 },
    });
    // Each drop carries its record's id, so its result is joined to it by id.
    expect(request.drops).toEqual(input.drops.map((d) => ({ id: d.id, height_m: 12, time_s: d.time_s })));
    // A box's vertical extent is what the physics calls its thickness.
    const box = seriesRequest(seriesInputs(log)[1]!);
    expect(box.specimen).toMatchObject({ shape: 'box', length_m: 0.1, width_m: 0.1, thickness_m: 0.1 });
  });

  it('writes a series it cannot compute with its reason, and the others in full', () => {
    // A drop faster than free fall: the physics refuses that series.
    const drop = byKind(log, 'drop')[0]!;
    const records = log.map((r) => (r.id === drop.id ? revise(drop, { time_s: 0.5 }, Date.UTC(2026, 6, 1), 'phoneA', 'typo') : r));
    const summary = writeLogCsv(exportLog(records, { device: 'phoneA', app_version: '0.1.0' }), outDir(), physicsSeriesComputer());
    expect(summary.failed).toHaveLength(1);
    expect(summary.failed[0]!.series_id).toBe(drop.series_id);
    const rows = table(summary.series_csv);
    expect(rows.find((r) => r.series_id === drop.series_id)!.error_code).toBe(summary.failed[0]!.code);
    expect(rows.find((r) => r.series_id !== drop.series_id)!.error_code).toBe('');
  });

  it('refuses a file that is not a valid log, naming the field', () => {
    const broken = JSON.parse(text);
    broken.records[0].latitude_deg = 123;
    expect(() => writeLogCsv(JSON.stringify(broken), outDir(), physicsSeriesComputer())).toThrow(LogFileError);
    expect(() => writeLogCsv(JSON.stringify(broken), outDir(), physicsSeriesComputer())).toThrow(/records\[0\]\.latitude_deg/);
  });
});
