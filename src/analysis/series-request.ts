// From the log's records to the physics core's request: the one place a series' request is built, and the one
// check of what a series still lacks, read alike by the screens, the CSV tables and the office command.
import type { AnalysisRequest, DropInput, SpecimenInput, UncertaintyInput } from '../physics';
import type { DropRecord, ReadingRecord, SeriesRecord, SiteRecord, SpecimenRecord } from '../log';

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

/**
 * A reading's air for the request. The fields format 3 added (the reading's height, vertical air motion and the
 * wind's uncertainty) are sent only when they say something: at their defaults (on the landing surface, no
 * vertical motion measured, the wind's uncertainty left to the physics' rule) the request is the one earlier
 * formats gave, so old series compute exactly as before.
 */
export function airInput(reading: ReadingRecord): { air: AnalysisRequest['air']; uncertainty: UncertaintyInput } {
  const h = reading.humidity;
  return {
    air: {
      ...(reading.height_m !== 0 ? { height_m: reading.height_m } : {}),
      ...(reading.vertical_wind_m_s !== null ? { vertical_wind_m_s: reading.vertical_wind_m_s } : {}),
      // The horizontal wind pushes the body sideways and adds to the air speed it meets (drag in two dimensions).
      ...(reading.wind_speed_m_s !== null ? { wind_speed_m_s: reading.wind_speed_m_s } : {}),
      temperature_C: reading.temperature_C,
      pressure_Pa: reading.pressure_Pa,
      pressure_reference: reading.pressure_reference,
      // The log keeps a dew point up to 1 °C above the air temperature (a hygrometer's error near saturation);
      // the physics takes such air as saturated, so the dew point is capped at the temperature (common practice).
      ...(h.kind === 'relative' ? { relative_humidity_pct: h.relative_humidity_pct } : { dew_point_C: Math.min(h.dew_point_C, reading.temperature_C) }),
    },
    uncertainty: {
      ...(reading.u_vertical_wind_m_s !== null ? { vertical_wind_m_s: reading.u_vertical_wind_m_s } : {}),
      ...(reading.u_wind_speed_m_s !== null ? { wind_speed_m_s: reading.u_wind_speed_m_s } : {}),
      temperature_C: reading.u_temperature_C,
      pressure_Pa: reading.u_pressure_Pa,
      ...(h.kind === 'relative' ? { relative_humidity_pct: h.u_relative_humidity_pct } : { dew_point_C: h.u_dew_point_C }),
    },
  };
}

/** A second reading at another height, as the request's `air_aloft`. */
export function airAloftInput(reading: ReadingRecord): NonNullable<AnalysisRequest['air_aloft']> {
  const h = reading.humidity;
  return {
    height_m: reading.height_m,
    temperature_C: reading.temperature_C,
    pressure_Pa: reading.pressure_Pa,
    pressure_reference: reading.pressure_reference,
    ...(h.kind === 'relative' ? { relative_humidity_pct: h.relative_humidity_pct } : { dew_point_C: Math.min(h.dew_point_C, reading.temperature_C) }),
    ...(reading.vertical_wind_m_s !== null ? { vertical_wind_m_s: reading.vertical_wind_m_s } : {}),
    ...(reading.wind_speed_m_s !== null ? { wind_speed_m_s: reading.wind_speed_m_s } : {}),
  };
}

export function siteInput(site: SiteRecord): AnalysisRequest['site'] {
  return { latitude_deg: site.latitude_deg, elevation_m: site.elevation_m };
}

export function dropHeight(drop: DropRecord, series: SeriesRecord): number {
  return drop.height_m ?? series.height_m;
}

/**
 * A drop as the physics takes it. A drop with marks passes them and whether its release time is known (a clip's is
 * estimated); its own (height, time) is the landing, the last mark itself when the times agree. In a gates series
 * the marks' distances are the series' gate distances, typed once, so a corrected gate distance reaches every drop.
 */
export function dropInput(drop: DropRecord, series: SeriesRecord): DropInput {
  const height_m = dropHeight(drop, series);
  if (!drop.marks) return { id: drop.id, height_m, time_s: drop.time_s };
  const gates = series.gate_distances_m;
  const fromGates = gates !== undefined && gates.length === drop.marks.length;
  const marks = drop.marks.map((m, i) => ({ distance_m: fromGates ? gates[i]! : m.distance_m, time_s: m.time_s }));
  const last = marks[marks.length - 1]!;
  const landingIsLastMark = drop.time_s === last.time_s;
  return {
    id: drop.id,
    height_m: landingIsLastMark ? last.distance_m : height_m,
    time_s: drop.time_s,
    marks,
    ...(drop.release_time_known === false ? { release_time_known: false } : {}),
  };
}

/**
 * The distinct distances a fitted timing offset can be told apart at (the physics' rule): every drop's height,
 * and for a drop with marks whose release is known each mark's distance above zero; a drop whose release is
 * estimated takes a constant delay into its own release shift and counts for nothing.
 */
export function distinctDistances(drops: readonly DropInput[]): number {
  const distances = new Set<number>();
  for (const d of drops) {
    if (d.release_time_known === false) continue;
    for (const m of d.marks ?? [{ distance_m: d.height_m }]) if (m.distance_m > 0) distances.add(m.distance_m);
  }
  return distances.size;
}

/** The drops a series' fit uses: live and not excluded, in the order given. */
export function usedDrops(drops: readonly DropRecord[]): DropRecord[] {
  return drops.filter((d) => !d.excluded && !d.deleted);
}

/**
 * The series' timing for the request: the random part, the offset fit, the method (whose documented defaults
 * give the shared start/stop delay, physics/timingMethodDefaults.ts) and the crew's own declared delay when given.
 */
export function timingInput(series: SeriesRecord, distinctHeights: number): AnalysisRequest['timing'] {
  return {
    standard_uncertainty_s: series.u_time_s,
    offset: series.timing_offset === 'fit' && distinctHeights >= 3 ? 'fit' : 'none',
    method: series.timing_method,
    ...(series.timing_delay_s !== null ? { offset_s: series.timing_delay_s } : {}),
    ...(series.u_timing_delay_s !== null ? { offset_standard_uncertainty_s: series.u_timing_delay_s } : {}),
  };
}

export function buildRequest(
  site: SiteRecord,
  reading: ReadingRecord,
  specimen: SpecimenRecord,
  series: SeriesRecord,
  drops: readonly DropRecord[],
  readingAloft: ReadingRecord | null = null,
): AnalysisRequest {
  const sp = specimenInput(specimen);
  const air = airInput(reading);
  // Each drop carries its record's id to its result: rows are joined by it, never by position.
  const dropInputs = usedDrops(drops).map((d) => dropInput(d, series));
  return {
    site: siteInput(site),
    air: air.air,
    specimen: sp.input,
    drops: dropInputs,
    timing: timingInput(series, distinctDistances(dropInputs)),
    uncertainty: { ...sp.uncertainty, ...air.uncertainty, height_m: series.u_height_m },
    // The reading aloft's uncertainties are taken as those of the ground reading's (the same kind of instruments).
    ...(readingAloft ? { air_aloft: airAloftInput(readingAloft) } : {}),
  };
}

/** What a series can lack before it can be computed; stable codes, shown in the CSV's error_code column. */
export type MissingPart = 'series-without-site' | 'series-without-specimen' | 'series-without-reading' | 'series-without-drops';

/** For people on the phone: what is missing and what to do. */
export const MISSING_PART_MESSAGES: Readonly<Record<MissingPart, string>> = {
  'series-without-site': 'The day’s site record is missing, so gravity cannot be computed.',
  'series-without-specimen': 'The specimen of this series is missing from the catalogue.',
  'series-without-reading': 'Add an air reading to this day: the air density is needed for the drag coefficient.',
  'series-without-drops': 'No drops yet: enter the first fall time.',
};

export type SeriesParts =
  | {
      kind: 'missing';
      code: MissingPart;
      /** For the screens (MISSING_PART_MESSAGES). */
      message: string;
      /** For the tables and the office: names the series and the record it lacks. */
      detail: string;
    }
  | { kind: 'complete'; site: SiteRecord; specimen: SpecimenRecord; reading: ReadingRecord; readingAloft: ReadingRecord | null; drops: DropRecord[] };

/** The one check of a series' parts, in a fixed order: site, specimen, air reading, drops in the fit. */
export function seriesParts(parts: {
  series: SeriesRecord;
  site: SiteRecord | null | undefined;
  specimen: SpecimenRecord | null | undefined;
  reading: ReadingRecord | null | undefined;
  readingAloft?: ReadingRecord | null | undefined;
  drops: readonly DropRecord[];
}): SeriesParts {
  const { series, site, specimen, reading } = parts;
  const missing = (code: MissingPart, detail: string): SeriesParts => ({ kind: 'missing', code, message: MISSING_PART_MESSAGES[code], detail: `series ${series.id}: ${detail}` });
  if (!site) return missing('series-without-site', 'its day or site is not in the log');
  if (!specimen) return missing('series-without-specimen', `its specimen ${series.specimen_id} is not in the log`);
  if (!reading) return missing('series-without-reading', 'the day has no air reading');
  const drops = usedDrops(parts.drops);
  if (drops.length === 0) return missing('series-without-drops', 'no drops to analyse (all excluded or none yet)');
  return { kind: 'complete', site, specimen, reading, readingAloft: parts.readingAloft ?? null, drops };
}
