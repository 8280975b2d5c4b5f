/**
 * The office command's log part: an exported log in, the two CSV tables out.
 *
 *   npm run --silent analyze -- log.json --csv out/      →  out/drops.csv, out/series.csv
 *
 * `writeLogCsv` reads and checks the log (the published schema and the record rules), computes every series
 * with the computation handed in, and writes both tables (RFC 4180, UTF-8 with a byte order mark, CRLF).
 * `physicsSeriesComputer` is that computation built on the physics' analyzeSeries: it turns the records of a
 * series into the analysis request (src/physics/analysisTypes.ts) and the result into table values.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { LogFile } from '../log/export';
import { readLogFile } from '../log/export-parse';
import { logCsv, seriesInputs, type ComputeSeries, type SeriesInput, type SeriesResult } from '../log/csv-tables';
import { LOG_FORMAT } from '../log/schema';
import type { AnalysisRequest, AnalysisResult, UncertaintyInput } from '../physics/index';
import { analyzeSeries, validateAnalysisRequest } from '../physics/index';

export interface LogCsvSummary {
  drops_csv: string;
  series_csv: string;
  series: number;
  drops: number;
  /** Series that could not be computed: their rows carry error_code and error_message. */
  failed: { series_id: string; code: string; message: string }[];
}

/** True when parsed JSON is a Plummet log file (rather than a single-series analysis request). */
export function isLogFile(json: unknown): boolean {
  return typeof json === 'object' && json !== null && (json as { format?: unknown }).format === LOG_FORMAT;
}

/**
 * Writes out/drops.csv and out/series.csv for the log. `logJson` is the file's text (checked, throws
 * LogFileError naming the field, value and rule) or an already read LogFile.
 */
export function writeLogCsv(logJson: string | LogFile, outDir: string, computeSeries: ComputeSeries): LogCsvSummary {
  const file = typeof logJson === 'string' ? readLogFile(logJson) : logJson;
  const failed: LogCsvSummary['failed'] = [];
  const recording: ComputeSeries = (input) => {
    let result: SeriesResult;
    try {
      result = computeSeries(input);
    } catch (error) {
      const e = error as { code?: unknown; message?: unknown };
      result = { error: { code: typeof e.code === 'string' ? e.code : 'compute-failed', message: String(e.message ?? error) } };
    }
    if (result.error) failed.push({ series_id: input.series.id, ...result.error });
    return result;
  };
  const tables = logCsv(file.records, recording);
  mkdirSync(outDir, { recursive: true });
  const drops_csv = join(outDir, 'drops.csv');
  const series_csv = join(outDir, 'series.csv');
  writeFileSync(drops_csv, tables.drops);
  writeFileSync(series_csv, tables.series);
  const inputs = seriesInputs(file.records);
  return { drops_csv, series_csv, series: inputs.length, drops: inputs.reduce((n, i) => n + i.allDrops.length, 0), failed };
}

class SeriesIncomplete extends Error {
  constructor(
    readonly code: 'series-without-specimen' | 'series-without-reading' | 'series-without-site' | 'series-without-drops',
    message: string,
  ) {
    super(message);
  }
}

/** The analysis request for one series of the log (the shape of src/physics/analysisTypes.ts). */
export function seriesRequest(input: SeriesInput): AnalysisRequest {
  const { series, site, specimen, reading, drops } = input;
  if (!specimen) throw new SeriesIncomplete('series-without-specimen', `series ${series.id}: its specimen ${series.specimen_id} is not in the log`);
  if (!reading) throw new SeriesIncomplete('series-without-reading', `series ${series.id}: the day has no air reading`);
  if (!site) throw new SeriesIncomplete('series-without-site', `series ${series.id}: its day or site is not in the log`);
  if (drops.length === 0) throw new SeriesIncomplete('series-without-drops', `series ${series.id}: no drops to analyse (all excluded or none yet)`);
  const uncertainty: UncertaintyInput = {
    height_m: series.u_height_m,
    mass_kg: specimen.u_mass_kg,
    temperature_C: reading.u_temperature_C,
    pressure_Pa: reading.u_pressure_Pa,
  };
  const common = { mass_kg: specimen.mass_kg, ...(specimen.reference_drag_coefficient !== null ? { reference_drag_coefficient: specimen.reference_drag_coefficient } : {}) };
  const shape = specimen.shape;
  let spec: AnalysisRequest['specimen'];
  switch (shape.kind) {
    case 'sphere':
      spec = { ...common, shape: 'sphere', diameter_m: shape.diameter_m };
      uncertainty.diameter_m = shape.u_diameter_m;
      break;
    case 'cylinder':
      spec = { ...common, shape: 'cylinder', diameter_m: shape.diameter_m, length_m: shape.length_m };
      Object.assign(uncertainty, { diameter_m: shape.u_diameter_m, length_m: shape.u_length_m });
      break;
    case 'disc':
      spec = { ...common, shape: 'disc', diameter_m: shape.diameter_m, thickness_m: shape.thickness_m };
      Object.assign(uncertainty, { diameter_m: shape.u_diameter_m, thickness_m: shape.u_thickness_m });
      break;
    case 'box':
      // The record's height of a box is its vertical extent, which the physics calls thickness.
      spec = { ...common, shape: 'box', length_m: shape.length_m, width_m: shape.width_m, thickness_m: shape.height_m };
      Object.assign(uncertainty, { length_m: shape.u_length_m, width_m: shape.u_width_m, thickness_m: shape.u_height_m });
      break;
    case 'custom':
      spec = { ...common, shape: 'custom', area_m2: shape.area_m2, volume_m3: shape.volume_m3 };
      Object.assign(uncertainty, { area_m2: shape.u_area_m2, volume_m3: shape.u_volume_m3 });
      break;
  }
  const humidity =
    reading.humidity.kind === 'relative'
      ? { relative_humidity_pct: reading.humidity.relative_humidity_pct }
      : { dew_point_C: reading.humidity.dew_point_C };
  if (reading.humidity.kind === 'relative') uncertainty.relative_humidity_pct = reading.humidity.u_relative_humidity_pct;
  else uncertainty.dew_point_C = reading.humidity.u_dew_point_C;
  return {
    site: { latitude_deg: site.latitude_deg, elevation_m: site.elevation_m },
    air: { temperature_C: reading.temperature_C, pressure_Pa: reading.pressure_Pa, pressure_reference: reading.pressure_reference, ...humidity },
    specimen: spec,
    drops: drops.map((d) => ({ height_m: d.height_m ?? series.height_m, time_s: d.time_s })),
    timing: { standard_uncertainty_s: series.u_time_s, offset: series.timing_offset },
    uncertainty,
  };
}

/** The table values of an analysis result. */
export function seriesResultOf(result: AnalysisResult): SeriesResult {
  return {
    air_density_kg_m3: result.air.density_kg_m3,
    gravity_m_s2: result.gravity_m_s2,
    drag_coefficient: result.drag_coefficient,
    drag_coefficient_standard_uncertainty: result.drag_coefficient_standard_uncertainty,
    drag_coefficient_interval_95: result.drag_coefficient_interval_95,
    timing_offset_s: result.timing_offset_s ?? null,
    terminal_velocity_m_s: result.terminal_velocity_m_s,
    drops: result.drops.map((d) => ({
      drag_coefficient: d.drag_coefficient,
      predicted_time_s: d.predicted_time_s,
      residual_s: d.residual_s,
      vacuum_time_s: d.vacuum_time_s,
      impact_speed_m_s: d.impact_speed_m_s,
      impact_energy_J: d.impact_energy_J,
      reynolds_number: d.reynolds_number,
    })),
    warnings: result.warnings,
  };
}

/** A ComputeSeries over any analysis function with the physics' request and result shapes. */
export function seriesComputer(analyze: (request: AnalysisRequest) => AnalysisResult): ComputeSeries {
  return (input) => seriesResultOf(analyze(seriesRequest(input)));
}

/** The one the office command uses: the request checked by the physics, then analysed. */
export function physicsSeriesComputer(): ComputeSeries {
  return seriesComputer((request) => analyzeSeries(validateAnalysisRequest(request)));
}
