/**
 * The CSV tables with the physics' results, for sharing from the phone and for the office command alike.
 *
 * The record model writes the tables (src/log/csv-tables.ts) from a computation handed in; this is that
 * computation built on the physics' analyzeSeries: the records of a series become the analysis request
 * (src/physics/analysisTypes.ts), the result becomes table values. No Node or DOM API here, so the screens
 * use it as the office command does.
 */
import { logCsv, type ComputeSeries, type LogRecord, type SeriesInput, type SeriesResult } from '../log';
import type { AnalysisRequest, AnalysisResult } from '../physics/index';
import { buildRequest } from '../analysis';
import { analyzeSeries, validateAnalysisRequest } from '../physics/index';
import type { ShareableFile } from './shareable-file';
import { PlummetError, type PlummetErrorOptions } from '../errors';

class SeriesIncomplete extends PlummetError<'series-without-specimen' | 'series-without-reading' | 'series-without-site' | 'series-without-drops'> {
  constructor(options: PlummetErrorOptions<SeriesIncomplete['code']>) {
    super(options);
    this.name = 'SeriesIncomplete';
  }
}

/** The analysis request for one series of the log (the shape of src/physics/analysisTypes.ts). */
export function seriesRequest(input: SeriesInput): AnalysisRequest {
  const { series, site, specimen, reading, drops } = input;
  if (!specimen) throw new SeriesIncomplete({ code: 'series-without-specimen', field: 'series.specimen_id', value: series.specimen_id, allowed: 'a specimen in the log', message: `series ${series.id}: its specimen ${series.specimen_id} is not in the log` });
  if (!reading) throw new SeriesIncomplete({ code: 'series-without-reading', field: 'series.reading_id', value: series.reading_id ?? null, allowed: 'an air reading of the day', message: `series ${series.id}: the day has no air reading` });
  if (!site) throw new SeriesIncomplete({ code: 'series-without-site', field: 'series.day_id', value: series.day_id, allowed: 'a day and site in the log', message: `series ${series.id}: its day or site is not in the log` });
  if (drops.length === 0) throw new SeriesIncomplete({ code: 'series-without-drops', field: 'drops', value: drops.length, allowed: 'at least one included drop', message: `series ${series.id}: no drops to analyse (all excluded or none yet)` });
  // The same request the screens build, so the office's tables and the phone's screens agree to the digit.
  return buildRequest(site, reading, specimen, series, drops);
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

/** Both tables as files to share: "<stem>-drops.csv" and "<stem>-series.csv". */
export function logCsvFiles(records: readonly LogRecord[], stem: string, compute: ComputeSeries = physicsSeriesComputer()): ShareableFile[] {
  const tables = logCsv(records, compute);
  return [
    { name: `${stem}-drops.csv`, text: tables.drops, type: 'text/csv;charset=utf-8' },
    { name: `${stem}-series.csv`, text: tables.series, type: 'text/csv;charset=utf-8' },
  ];
}
