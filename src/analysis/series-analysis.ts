// From the log's records to the physics core's request, and back to what the series screen shows.
import {
  analyzeSeries,
  dragCoefficientFromTime,
  PhysicsInputError,
  type AnalysisRequest,
  type AnalysisResult,
  type SpecimenInput,
  type UncertaintyInput,
} from '../physics';
import { readingForSeries, type DropRecord, type ReadingRecord, type SeriesRecord, type SiteRecord, type SpecimenRecord } from '../log';

export function specimenInput(specimen: SpecimenRecord): { input: SpecimenInput; uncertainty: UncertaintyInput } {
  const s = specimen.shape;
  const common = {
    mass_kg: specimen.mass_kg,
    ...(specimen.reference_drag_coefficient !== null ? { reference_drag_coefficient: specimen.reference_drag_coefficient } : {}),
  };
  const u: UncertaintyInput = { mass_kg: specimen.u_mass_kg };
  switch (s.kind) {
    case 'sphere':
      return { input: { ...common, shape: 'sphere', diameter_m: s.diameter_m }, uncertainty: { ...u, diameter_m: s.u_diameter_m } };
    case 'cylinder':
      return {
        input: { ...common, shape: 'cylinder', diameter_m: s.diameter_m, length_m: s.length_m },
        uncertainty: { ...u, diameter_m: s.u_diameter_m, length_m: s.u_length_m },
      };
    case 'disc':
      return {
        input: { ...common, shape: 'disc', diameter_m: s.diameter_m, thickness_m: s.thickness_m },
        uncertainty: { ...u, diameter_m: s.u_diameter_m, thickness_m: s.u_thickness_m },
      };
    case 'box':
      // The log calls the box's vertical extent its height; the physics core calls it thickness.
      return {
        input: { ...common, shape: 'box', length_m: s.length_m, width_m: s.width_m, thickness_m: s.height_m },
        uncertainty: { ...u, length_m: s.u_length_m, width_m: s.u_width_m, thickness_m: s.u_height_m },
      };
    case 'custom':
      return {
        input: { ...common, shape: 'custom', area_m2: s.area_m2, volume_m3: s.volume_m3 },
        uncertainty: { ...u, area_m2: s.u_area_m2, volume_m3: s.u_volume_m3 },
      };
  }
}

export function airInput(reading: ReadingRecord): { air: AnalysisRequest['air']; uncertainty: UncertaintyInput } {
  const h = reading.humidity;
  return {
    air: {
      temperature_C: reading.temperature_C,
      pressure_Pa: reading.pressure_Pa,
      pressure_reference: reading.pressure_reference,
      ...(h.kind === 'relative' ? { relative_humidity_pct: h.relative_humidity_pct } : { dew_point_C: h.dew_point_C }),
    },
    uncertainty: {
      temperature_C: reading.u_temperature_C,
      pressure_Pa: reading.u_pressure_Pa,
      ...(h.kind === 'relative' ? { relative_humidity_pct: h.u_relative_humidity_pct } : { dew_point_C: h.u_dew_point_C }),
    },
  };
}

export function dropHeight(drop: DropRecord, series: SeriesRecord): number {
  return drop.height_m ?? series.height_m;
}

export function buildRequest(
  site: SiteRecord,
  reading: ReadingRecord,
  specimen: SpecimenRecord,
  series: SeriesRecord,
  drops: DropRecord[],
): AnalysisRequest {
  const sp = specimenInput(specimen);
  const air = airInput(reading);
  const used = drops.filter((d) => !d.excluded && !d.deleted);
  const distinctHeights = new Set(used.map((d) => dropHeight(d, series))).size;
  return {
    site: { latitude_deg: site.latitude_deg, elevation_m: site.elevation_m },
    air: air.air,
    specimen: sp.input,
    drops: used.map((d) => ({ height_m: dropHeight(d, series), time_s: d.time_s })),
    timing: {
      standard_uncertainty_s: series.u_time_s,
      offset: series.timing_offset === 'fit' && distinctHeights >= 3 ? 'fit' : 'none',
    },
    uncertainty: { ...sp.uncertainty, ...air.uncertainty, height_m: series.u_height_m },
  };
}

export type SeriesOutcome =
  | { kind: 'missing'; message: string }
  | { kind: 'error'; message: string; field: string | null }
  | { kind: 'ready'; request: AnalysisRequest; result: AnalysisResult; reading: ReadingRecord };

export function analyzeSeriesRecords(
  site: SiteRecord | null,
  readings: ReadingRecord[],
  specimen: SpecimenRecord | undefined,
  series: SeriesRecord,
  drops: DropRecord[],
  options: { monteCarloDraws?: number } = {},
): SeriesOutcome {
  if (!site) return { kind: 'missing', message: 'The day’s site record is missing, so gravity cannot be computed.' };
  if (!specimen) return { kind: 'missing', message: 'The specimen of this series is missing from the catalogue.' };
  const reading = readingForSeries(series, readings);
  if (!reading) return { kind: 'missing', message: 'Add an air reading to this day: the air density is needed for the drag coefficient.' };
  const used = drops.filter((d) => !d.excluded && !d.deleted);
  if (used.length === 0) return { kind: 'missing', message: 'No drops yet: enter the first fall time.' };
  const request = buildRequest(site, reading, specimen, series, drops);
  if (options.monteCarloDraws !== undefined) request.options = { ...request.options, monte_carlo_draws: options.monteCarloDraws };
  try {
    return { kind: 'ready', request, result: analyzeSeries(request), reading };
  } catch (error) {
    if (error instanceof PhysicsInputError) return { kind: 'error', message: error.message, field: error.field };
    return { kind: 'error', message: error instanceof Error ? error.message : String(error), field: null };
  }
}

/** One drop's own C_d from the series' body and air (for excluded drops too, which the fit leaves out). */
export function singleDropDragCoefficient(
  request: AnalysisRequest,
  result: AnalysisResult,
  height_m: number,
  time_s: number,
): { value: number | null; message: string | null } {
  try {
    const value = dragCoefficientFromTime(
      {
        mass_kg: request.specimen.mass_kg,
        area_m2: result.model.area_m2,
        volume_m3: result.model.volume_m3,
        density_kg_m3: result.air.density_kg_m3,
        gravity_m_s2: result.gravity_m_s2,
        buoyancy: result.model.buoyancy,
        added_mass_coefficient: result.model.added_mass_coefficient,
      },
      height_m,
      time_s,
    );
    return { value, message: null };
  } catch (error) {
    return { value: null, message: error instanceof Error ? error.message : String(error) };
  }
}

/** What a day view holds, as far as the analysis needs it (the store's DayView has it all). */
export interface DayRecords {
  site: SiteRecord | null;
  readings: ReadingRecord[];
  specimens: SpecimenRecord[];
  series: SeriesRecord[];
  drops: DropRecord[];
}

export interface SeriesOfDay {
  series: SeriesRecord;
  specimen: SpecimenRecord | undefined;
  /** The series' drops, excluded ones too, in the order they were made. */
  drops: DropRecord[];
  outcome: SeriesOutcome;
  /** u(C_d)/C_d, or null when there is no resolved C_d. */
  relativeUncertainty: number | null;
  /** Whether the series reached its target relative uncertainty. */
  targetMet: boolean;
}

/** u(C_d)/C_d of a result, or null when drag is not resolved. */
export function relativeUncertainty(result: AnalysisResult): number | null {
  return result.drag_coefficient ? result.drag_coefficient_standard_uncertainty / result.drag_coefficient : null;
}

/** Every series of a day with its drops and its analysis. */
export function analyzeDay(day: DayRecords, options: { monteCarloDraws?: number } = {}): SeriesOfDay[] {
  return day.series.map((series) => {
    const specimen = day.specimens.find((p) => p.id === series.specimen_id);
    const drops = day.drops.filter((d) => d.series_id === series.id).sort((a, b) => a.seq - b.seq);
    const outcome = analyzeSeriesRecords(day.site, day.readings, specimen, series, drops, options);
    const rel = outcome.kind === 'ready' ? relativeUncertainty(outcome.result) : null;
    return { series, specimen, drops, outcome, relativeUncertainty: rel, targetMet: rel !== null && rel <= series.target_relative_uncertainty };
  });
}
