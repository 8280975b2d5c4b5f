/**
 * The computation behind the CSV tables (src/log/csv-tables.ts hands each series to a ComputeSeries): the
 * series' parts checked by the one missing-parts check, its request built as the screens build it, the result
 * turned into table values. Used by the phone's CSV files and the office command alike.
 */
import { PlummetError } from '../errors';
import type { ComputeSeries, SeriesInput, SeriesResult } from '../log';
import { analyzeSeries, validateAnalysisRequest, type AnalysisRequest, type AnalysisResult } from '../physics';
import { buildRequest, seriesParts, type MissingPart } from './series-request';
import { predictedTimeUncertainty } from './drop-rows';

/** A series the tables cannot compute: its code is the missing part's, the message names the series. */
export class SeriesIncomplete extends PlummetError<MissingPart> {
  constructor(input: SeriesInput, code: MissingPart, message: string) {
    const { series } = input;
    const blame: Record<MissingPart, { field: string; value: unknown; allowed: string }> = {
      'series-without-site': { field: 'series.day_id', value: series.day_id, allowed: 'a day and site in the log' },
      'series-without-specimen': { field: 'series.specimen_id', value: series.specimen_id, allowed: 'a specimen in the log' },
      'series-without-reading': { field: 'series.reading_id', value: series.reading_id, allowed: 'an air reading of the day' },
      'series-without-drops': { field: 'drops', value: input.drops.length, allowed: 'at least one included drop' },
    };
    super({ code, ...blame[code], message });
    this.name = 'SeriesIncomplete';
  }
}

/** The analysis request for one series of the log (the shape of src/physics/analysisTypes.ts). */
export function seriesRequest(input: SeriesInput): AnalysisRequest {
  const parts = seriesParts(input);
  if (parts.kind === 'missing') throw new SeriesIncomplete(input, parts.code, parts.detail);
  // The same request the screens build, so the office's tables and the phone's screens agree to the digit.
  return buildRequest(parts.site, parts.reading, parts.specimen, input.series, parts.drops, parts.readingAloft);
}

/** The table values of an analysis result; each drop carries its record's id. */
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
      ...(d.id !== undefined ? { drop_id: d.id } : {}),
      drag_coefficient: d.drag_coefficient,
      predicted_time_s: d.predicted_time_s,
      u_predicted_time_s: d.predicted_time_s === null ? null : predictedTimeUncertainty(result, d.height_m),
      residual_s: d.residual_s,
      vacuum_time_s: d.vacuum_time_s,
      impact_speed_m_s: d.impact_speed_m_s,
      impact_energy_J: d.impact_energy_J,
      reynolds_number: d.reynolds_number,
      ...(d.marks ? { marks: d.marks.map((m) => ({ fitted_time_s: m.fitted_time_s, residual_s: m.residual_s })) } : {}),
      ...(d.release_shift_s !== undefined ? { release_shift_s: d.release_shift_s } : {}),
    })),
    warnings: result.warnings,
  };
}

/** A ComputeSeries over any analysis function with the physics' request and result shapes. */
export function seriesComputer(analyze: (request: AnalysisRequest) => AnalysisResult): ComputeSeries {
  return (input) => seriesResultOf(analyze(seriesRequest(input)));
}

/** The one the phone and the office use: the request checked by the physics, then analysed. */
export function physicsSeriesComputer(): ComputeSeries {
  return seriesComputer((request) => analyzeSeries(validateAnalysisRequest(request)));
}
