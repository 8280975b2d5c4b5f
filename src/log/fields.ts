import type { BodyOf, RecordKind } from './types';

/**
 * The field catalogue: every stored field's range, choices and unit, in one place.
 *
 * Validation (validate.ts), the published JSON Schema (schema.ts), the CSV headers (csv-tables.ts, checked by a
 * test) and the forms (which pass a limit to their inputs through `inputRange`) all read it, so a limit is
 * changed here and nowhere else. The physics has its own limits (it may not import the log); a test holds the
 * rule between the layers: what the physics accepts ⊇ what the log stores ⊇ what a form accepts.
 *
 * The ranges are physical bounds, wide enough for any real field day and narrow enough to catch a slip of
 * units (hPa typed as Pa, grams as kilograms, millimetres as metres). Where a bound comes from a known
 * extreme the source is given beside it.
 */

/** A closed or half-open interval with the unit a person reads it in. */
export interface Limit {
  min: number;
  /** True when the minimum itself is allowed (≥), false for > . */
  minIncluded: boolean;
  max: number;
  unit: string;
  /** Shown after the range, e.g. "(station pressure)". */
  note?: string;
}

const atLeast = (min: number, max: number, unit: string, note?: string): Limit => ({ min, minIncluded: true, max, unit, note });
const above = (min: number, max: number, unit: string, note?: string): Limit => ({ min, minIncluded: false, max, unit, note });

/** Largest distance from the phone to the release or landing point for a sound-timed drop. */
const SOUND_DISTANCE_MAX_M = 1000;
/** Slowest speed of sound accepted: about −120 °C air; 420 m/s is about +165 °C (ISO 9613-1, from memory). */
const SPEED_OF_SOUND_MIN_M_S = 250;

/** The ranges every numeric body field is checked against, for the screens to pass to their inputs too. */
export const LIMITS = {
  latitude_deg: atLeast(-90, 90, '°'),
  longitude_deg: atLeast(-180, 180, '°'),
  // Lowest dry land, the Dead Sea shore, about −430 m; Everest 8849 m (from memory). A margin on each side.
  elevation_m: atLeast(-500, 9000, 'm'),
  // From a seed (well under a gram, but above zero) to a heavy airdrop payload: cargo platforms dropped under
  // parachutes carry up to about 19 t (from memory), so 20 t.
  mass_kg: above(0, 20_000, 'kg'),
  // Beyond 100 kg of doubt the mass is not measured at all (the physics' own bound).
  u_mass_kg: atLeast(0, 100, 'kg'),
  // Lengths of a specimen: seeds of a fraction of a millimetre up to a large canopy (the physics takes 10 m).
  length_m: above(0, 10, 'm'),
  u_length_m: atLeast(0, 1, 'm'),
  area_m2: above(0, 100, 'm²'),
  u_area_m2: atLeast(0, 10, 'm²'),
  // A volume may be zero (a thin sheet whose buoyancy is nil).
  volume_m3: atLeast(0, 100, 'm³'),
  u_volume_m3: atLeast(0, 10, 'm³'),
  // Bluff bodies lie near 0.4–2; a canopy referred to its own area up to about 2.5 (common practice).
  reference_drag_coefficient: above(0, 5, ''),
  // Surface records −89.2 °C (Vostok 1983) and 56.7 °C (Death Valley 1913), WMO extremes archive (from memory).
  temperature_C: atLeast(-90, 60, '°C'),
  u_temperature_C: atLeast(0, 20, '°C'),
  // Station pressure: Everest summit reads about 33.7 kPa, the highest sea-level pressure measured about
  // 108.4 kPa (from memory). Reduced to sea level the lowest measured is 87.0 kPa, typhoon Tip (from memory).
  station_pressure_Pa: atLeast(30_000, 110_000, 'Pa', '(station pressure)'),
  sea_level_pressure_Pa: atLeast(85_000, 110_000, 'Pa', '(reduced to sea level)'),
  u_pressure_Pa: atLeast(0, 5000, 'Pa'),
  relative_humidity_pct: atLeast(0, 100, '%'),
  u_relative_humidity_pct: atLeast(0, 50, '%'),
  dew_point_C: atLeast(-90, 60, '°C'),
  u_dew_point_C: atLeast(0, 20, '°C'),
  // Beyond hurricane force nobody drops anything; the bound catches km/h typed as m/s only above 75.
  wind_speed_m_s: atLeast(0, 75, 'm/s'),
  // Gusts are the wind's uncertainty; a 30 m/s doubt is no reading (the physics' bound).
  u_wind_speed_m_s: atLeast(0, 30, 'm/s'),
  // Vertical air motion, positive upward: thermals near the ground rise at a few m/s (from memory); beyond
  // 10 m/s it is a storm, and the physics' bound.
  vertical_wind_m_s: atLeast(-10, 10, 'm/s'),
  u_vertical_wind_m_s: atLeast(0, 10, 'm/s'),
  // Where a reading was taken, above the landing surface: on the ground (0) up to the highest release.
  reading_height_m: atLeast(0, 10_000, 'm'),
  // From a step ladder to a balloon or an aircraft: the physics follows the air along the fall (lapse rate,
  // pressure, a reading aloft) up to 10 000 m, where the troposphere ends at mid latitudes.
  height_m: above(0, 10_000, 'm'),
  u_height_m: atLeast(0, 10, 'm'),
  // The physics cannot weigh a drop whose timing is perfect: the uncertainty must be above zero.
  u_time_s: above(0, 10, 's'),
  // A constant start/stop delay, measured minus true: hand timing is biased by tenths of a second (0.225 s
  // in sprint timing, see physics/timingMethodDefaults.ts); a second is a slip, not a delay.
  timing_delay_s: atLeast(-1, 1, 's'),
  u_timing_delay_s: atLeast(0, 1, 's'),
  target_relative_uncertainty: above(0, 1, ''),
  // A slow seed (about 0.3 m/s) from the highest release takes close to an hour; an hour is not a drop any more.
  time_s: above(0, 3600, 's'),
  sample_rate_Hz: above(0, 384_000, 'Hz'),
  frame_rate_Hz: above(0, 1_000_000, 'Hz'),
  // Sound travel: the phone is somewhere near the drop.
  sound_distance_m: atLeast(0, SOUND_DISTANCE_MAX_M, 'm'),
  speed_of_sound_m_s: atLeast(SPEED_OF_SOUND_MIN_M_S, 420, 'm/s'),
  // (d_r − d_i) / c can never be larger than the longest distance over the slowest sound.
  sound_travel_correction_s: atLeast(-SOUND_DISTANCE_MAX_M / SPEED_OF_SOUND_MIN_M_S, SOUND_DISTANCE_MAX_M / SPEED_OF_SOUND_MIN_M_S, 's'),
  // A mark along the fall, and a gate: from the release point (0) down to the highest release.
  mark_distance_m: atLeast(0, 10_000, 'm'),
  // A mark's time from the release: ten minutes covers a slow body from a tall release; the landing is time_s.
  mark_time_s: atLeast(0, 600, 's'),
  // A clip's frame in pixels: 16 384 is WebCodecs' and phones' largest frame side by far (8K is 7680).
  clip_size_px: atLeast(1, 16_384, 'px'),
  // A position on the frame; a body's centre may lie a little outside it (half in view): a frame's size either side.
  clip_position_px: atLeast(-16_384, 32_768, 'px'),
  // A clip's own timeline; clips longer than an hour are refused before decoding (video/).
  clip_time_s: atLeast(0, 3600, 's'),
  // A found instant's doubt: a second is thirty frames of the slowest clip, beyond it nothing was found.
  u_clip_time_s: atLeast(0, 1, 's'),
  // A scale mark's height above the landing surface.
  scale_height_m: atLeast(0, 10_000, 'm'),
} as const satisfies Record<string, Limit>;

export type LimitName = keyof typeof LIMITS;

/** The choices of every enumerated field. */
export const ENUMS = {
  elevation_source: ['survey', 'map', 'gps', 'other'],
  shape_kind: ['sphere', 'cylinder', 'disc', 'box', 'custom'],
  pressure_reference: ['station', 'sea_level'],
  humidity_kind: ['relative', 'dew_point'],
  height_method: ['tape', 'laser', 'survey', 'marked', 'other'],
  timing_method: ['typed', 'stopwatch', 'tap', 'sound', 'video', 'gates'],
  timing_offset: ['none', 'fit'],
  raw_kind: ['typed', 'taps', 'sound', 'frames'],
} as const satisfies Record<string, readonly string[]>;

export type EnumName = keyof typeof ENUMS;

/** Text lengths in characters, and list lengths in entries. */
export const TEXT_LIMITS = {
  name: 200,
  notes: 10_000,
  typed: 100,
  crew: 50,
  capture: 10_000,
  /** A clip's codec string ("avc1.64001f") and container name ("mp4"). */
  codec: 100,
} as const;

/**
 * How many entries the lists of marks, gates and clips hold, and the size of a clip's key frames. A clip is kept
 * as evidence, not as video: its timestamps and track (8000 frames is 33 s at 240 frames/s, beyond the longest clip
 * video/ takes) and a few small key frames keep a drop record within a few hundred kilobytes.
 */
export const LIST_LIMITS = {
  /** A drop's marks: at least two points (a fall with one point is its single time), at most 64. */
  marks_min: 2,
  marks_max: 64,
  /** A gates series' gates: the same bounds as the marks they give. */
  gates_min: 2,
  gates_max: 64,
  clip_frames_max: 8000,
  key_frames_max: 6,
  /** Bytes of one key frame's image, decoded from its base64. */
  key_frame_bytes_max: 16_384,
  /** A clip's scale marks: none (times only), two (a scale) or three (a scale and the perspective). */
  scale_counts: [0, 2, 3],
} as const;

/** The image types a key frame may be, as its data URL names them, with the bytes each file starts with. */
export const KEY_FRAME_TYPES = {
  'image/png': [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a],
  'image/jpeg': [0xff, 0xd8, 0xff],
  // "RIFF", then the size (any four bytes), then "WEBP": the check reads the first four here, the rest in validate.ts.
  'image/webp': [0x52, 0x49, 0x46, 0x46],
} as const;

/** How a stored drop time may differ from clip.impact_s − clip.release_s: a microsecond, the CSV's digits. */
export const CLIP_TIME_TOLERANCE_S = 1e-6;

/** Dew point may read a little above the air temperature through instrument error, never much. */
export const DEW_POINT_MARGIN_C = 1;

/** How a correction_s stored with a sound capture may differ from (d_r − d_i) / c recomputed from its inputs. */
export const SOUND_TRAVEL_TOLERANCE_S = 1e-9;

/** The dimensions of each shape other than `custom`, each with its uncertainty `u_<name>`. */
export const SHAPE_DIMENSIONS = {
  sphere: ['diameter_m'],
  cylinder: ['diameter_m', 'length_m'],
  disc: ['diameter_m', 'thickness_m'],
  box: ['length_m', 'width_m', 'height_m'],
} as const;

/** What one stored field is: a number in a range, one of a list, or something else (text, ids, lists). */
export type FieldSpec =
  | { type: 'number'; limit: LimitName; unit: string; nullable?: boolean; note?: string }
  | { type: 'uncertainty'; limit: LimitName; of: string; unit: string }
  | { type: 'enum'; values: EnumName }
  | { type: 'other' };

const num = (limit: LimitName, nullable = false): FieldSpec => ({ type: 'number', limit, unit: LIMITS[limit].unit, ...(nullable ? { nullable } : {}) });
const unc = (limit: LimitName, of: string): FieldSpec => ({ type: 'uncertainty', limit, of, unit: LIMITS[limit].unit });
const oneOf = (values: EnumName): FieldSpec => ({ type: 'enum', values });
const other: FieldSpec = { type: 'other' };

type Leaf = string | number | boolean | null | readonly unknown[];
/** Every path of a body: its fields, and `a.b` for the fields of a nested object (each variant of a union). */
export type BodyPath<T> = T extends Leaf
  ? never
  : { [K in keyof T & string]: K | (NonNullable<T[K]> extends Leaf ? never : `${K}.${BodyPath<NonNullable<T[K]>>}`) }[keyof T & string];
/** The paths of a body that hold a number (possibly null). */
export type NumberPath<T, P extends string = ''> = T extends Leaf
  ? never
  : {
      [K in keyof T & string]: NonNullable<T[K]> extends number
        ? `${P}${K}`
        : NonNullable<T[K]> extends Leaf
          ? never
          : NumberPath<NonNullable<T[K]>, `${P}${K}.`>;
    }[keyof T & string];

/**
 * Every stored field of each kind of record, by its path in the body (a nested field as `shape.diameter_m`),
 * with its limit or choices and unit. The unit is also in the field's name, which is the CSV column name.
 */
export const FIELDS = {
  site: {
    name: other,
    latitude_deg: num('latitude_deg'),
    longitude_deg: num('longitude_deg'),
    elevation_m: num('elevation_m'),
    elevation_source: oneOf('elevation_source'),
    notes: other,
  },
  specimen: {
    name: other,
    mass_kg: num('mass_kg'),
    u_mass_kg: unc('u_mass_kg', 'mass_kg'),
    shape: other,
    'shape.kind': oneOf('shape_kind'),
    'shape.diameter_m': num('length_m'),
    'shape.u_diameter_m': unc('u_length_m', 'shape.diameter_m'),
    'shape.length_m': num('length_m'),
    'shape.u_length_m': unc('u_length_m', 'shape.length_m'),
    'shape.width_m': num('length_m'),
    'shape.u_width_m': unc('u_length_m', 'shape.width_m'),
    'shape.thickness_m': num('length_m'),
    'shape.u_thickness_m': unc('u_length_m', 'shape.thickness_m'),
    'shape.height_m': num('length_m'),
    'shape.u_height_m': unc('u_length_m', 'shape.height_m'),
    'shape.area_m2': num('area_m2'),
    'shape.u_area_m2': unc('u_area_m2', 'shape.area_m2'),
    'shape.volume_m3': num('volume_m3'),
    'shape.u_volume_m3': unc('u_volume_m3', 'shape.volume_m3'),
    reference_drag_coefficient: num('reference_drag_coefficient', true),
    notes: other,
  },
  day: { site_id: other, date: other, crew: other, notes: other },
  reading: {
    day_id: other,
    taken_at: other,
    temperature_C: num('temperature_C'),
    u_temperature_C: num('u_temperature_C'),
    // The range depends on pressure_reference: station_pressure_Pa or sea_level_pressure_Pa.
    pressure_Pa: num('station_pressure_Pa'),
    u_pressure_Pa: num('u_pressure_Pa'),
    pressure_reference: oneOf('pressure_reference'),
    humidity: other,
    'humidity.kind': oneOf('humidity_kind'),
    'humidity.relative_humidity_pct': num('relative_humidity_pct'),
    'humidity.u_relative_humidity_pct': num('u_relative_humidity_pct'),
    'humidity.dew_point_C': num('dew_point_C'),
    'humidity.u_dew_point_C': num('u_dew_point_C'),
    wind_speed_m_s: num('wind_speed_m_s', true),
    u_wind_speed_m_s: num('u_wind_speed_m_s', true),
    vertical_wind_m_s: num('vertical_wind_m_s', true),
    u_vertical_wind_m_s: num('u_vertical_wind_m_s', true),
    height_m: num('reading_height_m'),
    instrument: other,
    notes: other,
  },
  series: {
    day_id: other,
    specimen_id: other,
    height_m: num('height_m'),
    u_height_m: unc('u_height_m', 'height_m'),
    height_method: oneOf('height_method'),
    timing_method: oneOf('timing_method'),
    u_time_s: num('u_time_s'),
    target_relative_uncertainty: num('target_relative_uncertainty'),
    reading_id: other,
    reading_aloft_id: other,
    timing_offset: oneOf('timing_offset'),
    // A list of distances, each in LIMITS.mark_distance_m, LIST_LIMITS.gates_min to gates_max of them.
    gate_distances_m: other,
    timing_delay_s: num('timing_delay_s', true),
    u_timing_delay_s: num('u_timing_delay_s', true),
    started_at: other,
    notes: other,
  },
  drop: {
    series_id: other,
    seq: other,
    raw: other,
    'raw.kind': oneOf('raw_kind'),
    'raw.sample_rate_Hz': num('sample_rate_Hz'),
    'raw.frame_rate_Hz': num('frame_rate_Hz'),
    'raw.sound_travel.distance_to_release_m': num('sound_distance_m'),
    'raw.sound_travel.distance_to_landing_m': num('sound_distance_m'),
    'raw.sound_travel.speed_of_sound_m_s': num('speed_of_sound_m_s'),
    'raw.sound_travel.temperature_C': num('temperature_C', true),
    'raw.sound_travel.correction_s': num('sound_travel_correction_s'),
    time_s: num('time_s'),
    height_m: num('height_m', true),
    excluded: other,
    exclusion_reason: other,
    note: other,
    captured_at: other,
    // A list of { distance_m (LIMITS.mark_distance_m), time_s (LIMITS.mark_time_s) }, LIST_LIMITS.marks_min to marks_max.
    marks: other,
    release_time_known: other,
    clip: other,
    'clip.width_px': num('clip_size_px'),
    'clip.height_px': num('clip_size_px'),
    'clip.frame_rate_hz': num('frame_rate_Hz'),
    'clip.release_s': num('clip_time_s'),
    'clip.u_release_s': num('u_clip_time_s'),
    'clip.impact_s': num('clip_time_s'),
    'clip.u_impact_s': num('u_clip_time_s'),
    'clip.fall_line.x0_px': num('clip_position_px'),
    'clip.fall_line.y0_px': num('clip_position_px'),
    'clip.fall_line.x1_px': num('clip_position_px'),
    'clip.fall_line.y1_px': num('clip_position_px'),
    'clip.landing_y_px': num('clip_position_px'),
  },
} as const satisfies { [K in RecordKind]: { [P in BodyPath<BodyOf[K]>]?: FieldSpec } };

/**
 * Checked by the compiler: every number of every record type is in the catalogue with a limit (a field added
 * to types.ts without its limit here does not compile), and the catalogue names no path the types lack.
 */
type Unlisted = { [K in RecordKind]: Exclude<NumberPath<BodyOf[K]>, keyof (typeof FIELDS)[K]> }[RecordKind];
type NoneUnlisted<U extends never> = U;
export type EveryNumberHasALimit = NoneUnlisted<Unlisted>;

/** The attributes a quantity input takes from a limit: `<QField {...inputRange(LIMITS.height_m)} />`. */
export function inputRange(limit: Limit): { min: number; max: number; minExclusive: boolean } {
  return { min: limit.min, max: limit.max, minExclusive: !limit.minIncluded };
}
