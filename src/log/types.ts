/**
 * The record model of a test log: the one place where the shape of every stored and exported record is defined.
 *
 * Field names are the names the records carry at every edge (IndexedDB, the JSON log file, CSV headers):
 * snake_case with the unit in the name, SI throughout. A standard uncertainty of a quantity `x_unit` is
 * `u_x_unit` (GUM, JCGM 100:2008, 2.3.1: one standard deviation).
 */

/** The kinds of record a log holds. */
export type RecordKind = 'site' | 'specimen' | 'day' | 'reading' | 'series' | 'drop';

/** ISO 8601 instant in UTC, e.g. "2026-06-14T09:12:03.412Z". */
export type IsoInstant = string;
/** Calendar date, "YYYY-MM-DD". */
export type IsoDate = string;

/**
 * One earlier version of a record, kept in its history when the record is edited.
 * `body` is the record's fields as they were (without the envelope and without the history itself).
 */
export interface Revision<B> {
  rev: string;
  device: string;
  updated_at: IsoInstant;
  /** Why this version was replaced; required when a measured value or an exclusion changed. */
  reason: string | null;
  deleted: boolean;
  body: B;
}

/**
 * What every record carries besides its own fields.
 * `rev` is a hybrid logical clock stamp (see hlc.ts); the higher stamp is the newer revision everywhere.
 */
export interface Envelope<K extends RecordKind, B> {
  id: string;
  kind: K;
  created_at: IsoInstant;
  updated_at: IsoInstant;
  rev: string;
  device: string;
  /** A deleted record stays as a tombstone so the deletion travels to other phones. */
  deleted: boolean;
  /** Previous versions, oldest first. */
  history: Revision<B>[];
}

export type PressureReference = 'station' | 'sea_level';

export interface SiteBody {
  name: string;
  latitude_deg: number;
  longitude_deg: number;
  elevation_m: number;
  /** Where the elevation came from: GPS elevation is rough, a surveyed or map value is better. */
  elevation_source: 'survey' | 'map' | 'gps' | 'other';
  notes: string;
}

export type SpecimenShape =
  | { kind: 'sphere'; diameter_m: number; u_diameter_m: number }
  /** A cylinder falling with its axis vertical. */
  | { kind: 'cylinder'; diameter_m: number; u_diameter_m: number; length_m: number; u_length_m: number }
  /** A flat disc falling face down. */
  | { kind: 'disc'; diameter_m: number; u_diameter_m: number; thickness_m: number; u_thickness_m: number }
  /** A box falling with its length × width face down. */
  | {
      kind: 'box';
      length_m: number;
      u_length_m: number;
      width_m: number;
      u_width_m: number;
      height_m: number;
      u_height_m: number;
    }
  /** Any other body: its frontal area and its volume given directly. */
  | { kind: 'custom'; area_m2: number; u_area_m2: number; volume_m3: number; u_volume_m3: number };

export type ShapeKind = SpecimenShape['kind'];

export interface SpecimenBody {
  name: string;
  mass_kg: number;
  u_mass_kg: number;
  shape: SpecimenShape;
  /** A drag coefficient known from elsewhere (a handbook, a wind tunnel); used to predict fall times. */
  reference_drag_coefficient: number | null;
  notes: string;
}

export interface DayBody {
  site_id: string;
  date: IsoDate;
  crew: string[];
  notes: string;
}

export type Humidity =
  | { kind: 'relative'; relative_humidity_pct: number; u_relative_humidity_pct: number }
  | { kind: 'dew_point'; dew_point_C: number; u_dew_point_C: number };

export interface ReadingBody {
  day_id: string;
  taken_at: IsoInstant;
  temperature_C: number;
  u_temperature_C: number;
  pressure_Pa: number;
  u_pressure_Pa: number;
  pressure_reference: PressureReference;
  humidity: Humidity;
  wind_speed_m_s: number | null;
  /** Standard uncertainty of the horizontal wind speed; null: derived from the wind itself (see the physics). */
  u_wind_speed_m_s: number | null;
  /** Vertical air motion, positive upward (a thermal, a draught in a stairwell); null: not measured (taken as 0). */
  vertical_wind_m_s: number | null;
  /** Its standard uncertainty; null: derived from the recorded wind (see the physics). */
  u_vertical_wind_m_s: number | null;
  /** Where the reading was taken, above the landing surface (0: at the landing surface). */
  height_m: number;
  instrument: string;
  notes: string;
}

export type HeightMethod = 'tape' | 'laser' | 'survey' | 'marked' | 'other';
export type TimingMethod = 'typed' | 'stopwatch' | 'tap' | 'sound' | 'video' | 'gates';

export interface SeriesBody {
  day_id: string;
  specimen_id: string;
  /** The release height above the landing surface. A drop may override it (a series over several heights). */
  height_m: number;
  u_height_m: number;
  height_method: HeightMethod;
  timing_method: TimingMethod;
  /** Standard uncertainty of one drop's time from random causes. */
  u_time_s: number;
  /** Relative standard uncertainty of C_d the crew aims for (0.05 = 5 %). */
  target_relative_uncertainty: number;
  /** The air reading the analysis uses; null means the reading nearest in time to the series start. */
  reading_id: string | null;
  /**
   * A second reading at another height, typically at the release point of a tall drop: the analysis then
   * interpolates the air between the two. Null: one reading, the air above it following the standard atmosphere.
   */
  reading_aloft_id: string | null;
  /** Fit a constant start/stop delay together with C_d (needs at least three distinct heights). */
  timing_offset: 'none' | 'fit';
  /**
   * A series timed by several gates: each gate's distance fallen from the release point, m, strictly increasing,
   * typed once; each drop's marks pair them with that drop's gate times. Absent: not a gates series.
   */
  gate_distances_m?: number[];
  /**
   * The constant start/stop delay of the timing, measured minus true, the same in every drop; null: the timing
   * method's default (physics/timingMethodDefaults.ts).
   */
  timing_delay_s: number | null;
  /** Its standard uncertainty; null: the timing method's default. */
  u_timing_delay_s: number | null;
  started_at: IsoInstant;
  notes: string;
}

/**
 * The correction for the time sound takes to reach the phone, as computed when the drop was heard (see
 * timing/sound-travel.ts): its inputs and its value, stored so the time can be recomputed from the record.
 */
export interface SoundTravelRecord {
  distance_to_release_m: number;
  distance_to_landing_m: number;
  speed_of_sound_m_s: number;
  /** The air temperature the speed of sound was computed from; null when a reference temperature was assumed. */
  temperature_C: number | null;
  /** (distance_to_release_m − distance_to_landing_m) / speed_of_sound_m_s. */
  correction_s: number;
}

/** A capture exactly as it came from the phone or the keyboard; never overwritten. */
export type RawCapture =
  | { kind: 'typed'; text: string }
  /** Release and impact taps, milliseconds on the page's monotonic clock. */
  | { kind: 'taps'; timestamps_ms: number[] }
  /**
   * Detected sound onsets in seconds from the start of the recording, and the sound-travel correction
   * added to the heard interval (null: none), so time_s = onsets_s[1] − onsets_s[0] + correction_s.
   */
  | { kind: 'sound'; onsets_s: number[]; sample_rate_Hz: number; sound_travel: SoundTravelRecord | null }
  /** Video frame numbers of release and impact. */
  | { kind: 'frames'; frames: number[]; frame_rate_Hz: number };

/** One point of a drop's fall: the distance fallen from the release point, m, at a time from the release, s. */
export interface DropMark {
  distance_m: number;
  time_s: number;
}

/**
 * What a clip gave for a drop, kept as evidence instead of the clip itself (clips are large): every decoded frame's
 * own timestamp, the body's tracked row in each, the found release and impact with their uncertainties, what the
 * crew set on a still frame, and a few small grey key frames. Plain data; motion/ builds it. Positions are full-frame
 * pixels of the clip as displayed (x to the right, y downward); times are on the clip's own timeline, s.
 */
export interface ClipEvidence {
  codec: string;
  container: string;
  width_px: number;
  height_px: number;
  frame_rate_hz: number;
  /** Every decoded frame's presentation timestamp, s, in order (at most 8000). */
  frame_times_s: number[];
  /** The body's centre row in each frame (same length as frame_times_s); null: not found in that frame. */
  track_y_px: (number | null)[];
  release_s: number;
  u_release_s: number;
  impact_s: number;
  u_impact_s: number;
  fall_line: { x0_px: number; y0_px: number; x1_px: number; y1_px: number };
  landing_y_px: number;
  /** Marks of known height tapped on a still frame: none, 2 or 3. */
  scale: { x_px: number; y_px: number; height_m: number }[];
  /** At most 6 small grey images as data URLs (PNG, JPEG or WebP, base64), each at most 16 KB. */
  key_frames: { time_s: number; image: string }[];
}

export interface DropBody {
  series_id: string;
  /** 1, 2, 3… in the order the drops were made. */
  seq: number;
  raw: RawCapture;
  /** The fall time derived from the raw capture. */
  time_s: number;
  /** Overrides the series' release height for this drop; null means the series height. */
  height_m: number | null;
  excluded: boolean;
  exclusion_reason: string | null;
  note: string;
  captured_at: IsoInstant;
  /**
   * Points along the fall (2 to 64, strictly increasing in distance and time): from a clip with scale marks,
   * from gates, or typed. `time_s` and `height_m` are then the landing, one more point at or after the last mark.
   */
  marks?: DropMark[];
  /** false: the zero of the marks' times is itself an estimate (a clip), fitted per drop. Absent: true. */
  release_time_known?: boolean;
  /** The evidence of a drop timed from a clip: time_s = clip.impact_s − clip.release_s. */
  clip?: ClipEvidence;
}

export type SiteRecord = Envelope<'site', SiteBody> & SiteBody;
export type SpecimenRecord = Envelope<'specimen', SpecimenBody> & SpecimenBody;
export type DayRecord = Envelope<'day', DayBody> & DayBody;
export type ReadingRecord = Envelope<'reading', ReadingBody> & ReadingBody;
export type SeriesRecord = Envelope<'series', SeriesBody> & SeriesBody;
export type DropRecord = Envelope<'drop', DropBody> & DropBody;

export type LogRecord = SiteRecord | SpecimenRecord | DayRecord | ReadingRecord | SeriesRecord | DropRecord;

/** The body type of each kind, for generic code. */
export interface BodyOf {
  site: SiteBody;
  specimen: SpecimenBody;
  day: DayBody;
  reading: ReadingBody;
  series: SeriesBody;
  drop: DropBody;
}

/** The record type of each kind, for generic code. */
export interface RecordOf {
  site: SiteRecord;
  specimen: SpecimenRecord;
  day: DayRecord;
  reading: ReadingRecord;
  series: SeriesRecord;
  drop: DropRecord;
}

export const RECORD_KINDS: readonly RecordKind[] = ['site', 'specimen', 'day', 'reading', 'series', 'drop'];
