import type { ComputeSeries, SeriesInput, SeriesResult } from '../log/csv-tables';
import { analyzeSeriesRecords } from './series-analysis';

/** The computation the CSV tables and the office command use: a series of the log through analyzeSeries. */
export const computeSeries: ComputeSeries = (input: SeriesInput): SeriesResult => {
  const outcome = analyzeSeriesRecords(
    input.site,
    input.reading ? [input.reading] : [],
    input.specimen ?? undefined,
    { ...input.series, reading_id: input.reading?.id ?? input.series.reading_id },
    input.drops,
  );
  if (outcome.kind === 'missing') return { error: { code: 'series-incomplete', message: outcome.message } };
  if (outcome.kind === 'error') return { error: { code: 'series-not-computable', message: outcome.message } };
  const r = outcome.result;
  return {
    air_density_kg_m3: r.air.density_kg_m3,
    gravity_m_s2: r.gravity_m_s2,
    drag_coefficient: r.drag_coefficient,
    drag_coefficient_standard_uncertainty: r.drag_coefficient_standard_uncertainty,
    drag_coefficient_interval_95: r.drag_coefficient_interval_95,
    timing_offset_s: r.timing_offset_s ?? null,
    terminal_velocity_m_s: r.terminal_velocity_m_s,
    drops: r.drops.map((d) => ({
      drag_coefficient: d.drag_coefficient,
      predicted_time_s: d.predicted_time_s,
      residual_s: d.residual_s,
      vacuum_time_s: d.vacuum_time_s,
      impact_speed_m_s: d.impact_speed_m_s,
      impact_energy_J: d.impact_energy_J,
      reynolds_number: d.reynolds_number,
    })),
    warnings: r.warnings,
    error: null,
  };
};
