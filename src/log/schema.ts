/**
 * The JSON Schema (draft 2020-12) of the log file, format version 4.
 *
 * This object is the one source: public/schema/plummet-log-4.schema.json is written from it (regenerate with
 * `npm run schema`; a test fails while it is stale). The format 1, 2 and 3 files stay published, frozen, for readers
 * of old files; import upgrades an older file (upgrade-export.ts) before checking it against this schema. Import checks files against it with
 * json-schema-check.ts, a small checker of exactly the keywords used here (no code compiled at run time, so a
 * strict Content-Security-Policy is fine, and 3 KB instead of an ajv bundle); the tests compare it with ajv.
 *
 * The ranges and choices are the field catalogue's (fields.ts), so a file is never refused for a value the
 * app would have stored. What a schema cannot say (an uncertainty no larger than its quantity, a dew point not
 * above the air temperature) validate.ts checks after the schema, on import; so does what the checker has no keyword
 * for (the most marks or key frames in a list, the size of a key frame, values rising through a list).
 */
import { ENUMS, LIMITS, LIST_LIMITS, SHAPE_DIMENSIONS, type Limit } from './fields';
import { RECORD_KINDS, type RecordKind } from './types';

export const LOG_FORMAT = 'plummet-log';
export const LOG_FORMAT_VERSION = 4;
/** Every format version this app reads (older ones are upgraded on import). */
export const LOG_FORMAT_VERSIONS_READ = [1, 2, 3, 4] as const;
/** Where the app serves the schema (the file lives in public/schema/). */
export const LOG_SCHEMA_PATH = `/schema/plummet-log-${LOG_FORMAT_VERSION}.schema.json`;
export const LOG_SCHEMA_ID = `https://plummet.invalid/schema/plummet-log-${LOG_FORMAT_VERSION}.schema.json`;

type Schema = Record<string, unknown>;

const range = (limit: Limit, description?: string): Schema => ({
  type: 'number',
  [limit.minIncluded ? 'minimum' : 'exclusiveMinimum']: limit.min,
  maximum: limit.max,
  ...(description ? { description } : {}),
});
const text: Schema = { type: 'string' };
const ref = (name: string): Schema => ({ $ref: `#/$defs/${name}` });
const nullable = (schema: Schema): Schema => ({ anyOf: [schema, { type: 'null' }] });
const oneOfStrings = (values: readonly string[]): Schema => ({ type: 'string', enum: [...values] });

function object(properties: Record<string, Schema>, description?: string, optional: readonly string[] = []): Schema {
  return {
    type: 'object',
    ...(description ? { description } : {}),
    required: Object.keys(properties).filter((key) => !optional.includes(key)),
    properties,
    additionalProperties: false,
  };
}

/** Fields a record may leave out (added in format 4; absent means what older records meant). */
const OPTIONAL_FIELDS: { readonly [K in RecordKind]?: readonly string[] } = {
  series: ['gate_distances_m'],
  drop: ['marks', 'release_time_known', 'clip'],
};

/** A tagged union on `kind`: if/then keeps ajv's error about the branch that was meant, not about every branch. */
function tagged(variants: Record<string, Record<string, Schema>>, description: string): Schema {
  return {
    type: 'object',
    description,
    required: ['kind'],
    properties: { kind: oneOfStrings(Object.keys(variants)) },
    allOf: Object.entries(variants).map(([kind, properties]) => ({
      if: { properties: { kind: { const: kind } }, required: ['kind'] },
      then: object({ kind: { const: kind }, ...properties }),
    })),
  };
}

const nonNegative: Schema = { type: 'number', minimum: 0 };
const position = range(LIMITS.clip_position_px);
const clipTime = range(LIMITS.clip_time_s);
const listOf = (items: Schema, min: number, description: string): Schema => ({ type: 'array', minItems: min, items, description });

const CLIP_SCHEMA = object(
  {
    codec: text,
    container: text,
    width_px: range(LIMITS.clip_size_px),
    height_px: range(LIMITS.clip_size_px),
    frame_rate_hz: range(LIMITS.frame_rate_Hz),
    frame_times_s: listOf(clipTime, 2, `Every decoded frame's presentation timestamp, strictly increasing, at most ${LIST_LIMITS.clip_frames_max}.`),
    track_y_px: {
      type: 'array',
      items: nullable(position),
      description: "The body's centre row in each frame, one per timestamp; null where it was not found.",
    },
    release_s: clipTime,
    u_release_s: range(LIMITS.u_clip_time_s),
    impact_s: clipTime,
    u_impact_s: range(LIMITS.u_clip_time_s),
    fall_line: object({ x0_px: position, y0_px: position, x1_px: position, y1_px: position }, 'The line the body falls along.'),
    landing_y_px: position,
    scale: {
      type: 'array',
      items: object({ x_px: position, y_px: position, height_m: range(LIMITS.scale_height_m) }),
      description: 'Marks of known height above the landing surface: none, 2 or 3.',
    },
    key_frames: {
      type: 'array',
      items: object({ time_s: clipTime, image: { type: 'string', pattern: '^data:image/(png|jpeg|webp);base64,[A-Za-z0-9+/]*={0,2}$' } }),
      description: `At most ${LIST_LIMITS.key_frames_max} small grey frames, each at most ${LIST_LIMITS.key_frame_bytes_max} bytes.`,
    },
  },
  "What a clip gave, kept instead of the clip: positions in full-frame pixels, times on the clip's own timeline (s); time_s = impact_s − release_s.",
);
const length = range(LIMITS.length_m);
const uLength = range(LIMITS.u_length_m);

const BODY_PROPERTIES: { [K in RecordKind]: Record<string, Schema> } = {
  site: {
    name: text,
    latitude_deg: range(LIMITS.latitude_deg),
    longitude_deg: range(LIMITS.longitude_deg),
    elevation_m: range(LIMITS.elevation_m),
    elevation_source: oneOfStrings(ENUMS.elevation_source),
    notes: text,
  },
  specimen: {
    name: text,
    mass_kg: range(LIMITS.mass_kg),
    u_mass_kg: range(LIMITS.u_mass_kg),
    shape: tagged(
      {
        ...Object.fromEntries(
          Object.entries(SHAPE_DIMENSIONS).map(([kind, dims]) => [kind, Object.fromEntries(dims.flatMap((d) => [[d, length], [`u_${d}`, uLength]]))]),
        ),
        custom: {
          area_m2: range(LIMITS.area_m2),
          u_area_m2: range(LIMITS.u_area_m2),
          volume_m3: range(LIMITS.volume_m3),
          u_volume_m3: range(LIMITS.u_volume_m3),
        },
      },
      'The body: a sphere, an upright cylinder, a flat disc, a box (length × width face down), or custom area and volume.',
    ),
    reference_drag_coefficient: nullable(range(LIMITS.reference_drag_coefficient)),
    notes: text,
  },
  day: {
    site_id: ref('id'),
    date: ref('date'),
    crew: { type: 'array', items: text },
    notes: text,
  },
  reading: {
    day_id: ref('id'),
    taken_at: ref('instant'),
    temperature_C: range(LIMITS.temperature_C),
    u_temperature_C: range(LIMITS.u_temperature_C),
    pressure_Pa: { type: 'number', description: 'Station or sea-level pressure, as pressure_reference says.' },
    u_pressure_Pa: range(LIMITS.u_pressure_Pa),
    pressure_reference: oneOfStrings(ENUMS.pressure_reference),
    humidity: tagged(
      {
        relative: {
          relative_humidity_pct: range(LIMITS.relative_humidity_pct),
          u_relative_humidity_pct: range(LIMITS.u_relative_humidity_pct),
        },
        dew_point: { dew_point_C: range(LIMITS.dew_point_C), u_dew_point_C: range(LIMITS.u_dew_point_C) },
      },
      'Relative humidity or dew point.',
    ),
    wind_speed_m_s: nullable(range(LIMITS.wind_speed_m_s)),
    u_wind_speed_m_s: nullable(range(LIMITS.u_wind_speed_m_s, 'Standard uncertainty of the wind speed; null: derived from the wind by the analysis.')),
    vertical_wind_m_s: nullable(range(LIMITS.vertical_wind_m_s, 'Vertical air motion, positive upward; null: not measured (taken as still).')),
    u_vertical_wind_m_s: nullable(range(LIMITS.u_vertical_wind_m_s, 'Its standard uncertainty; null: derived from the recorded wind by the analysis.')),
    height_m: range(LIMITS.reading_height_m, 'Where the reading was taken, above the landing surface.'),
    instrument: text,
    notes: text,
  },
  series: {
    day_id: ref('id'),
    specimen_id: ref('id'),
    height_m: range(LIMITS.height_m, 'Release height above the landing surface.'),
    u_height_m: range(LIMITS.u_height_m),
    height_method: oneOfStrings(ENUMS.height_method),
    timing_method: oneOfStrings(ENUMS.timing_method),
    u_time_s: range(LIMITS.u_time_s, 'Standard uncertainty of one drop time from random causes.'),
    target_relative_uncertainty: range(LIMITS.target_relative_uncertainty),
    reading_id: nullable(ref('id')),
    reading_aloft_id: nullable(ref('id')),
    timing_offset: oneOfStrings(ENUMS.timing_offset),
    gate_distances_m: listOf(
      range(LIMITS.mark_distance_m),
      LIST_LIMITS.gates_min,
      `A gates series: each gate's distance fallen from the release point, strictly increasing, at most ${LIST_LIMITS.gates_max}.`,
    ),
    timing_delay_s: nullable(range(LIMITS.timing_delay_s, 'Constant start/stop delay, measured minus true; null: the timing method default.')),
    u_timing_delay_s: nullable(range(LIMITS.u_timing_delay_s, 'Its standard uncertainty; null: the timing method default.')),
    started_at: ref('instant'),
    notes: text,
  },
  drop: {
    series_id: ref('id'),
    seq: { type: 'integer', minimum: 1 },
    raw: tagged(
      {
        typed: { text },
        taps: { timestamps_ms: { type: 'array', minItems: 2, items: nonNegative } },
        sound: {
          onsets_s: { type: 'array', minItems: 2, items: nonNegative },
          sample_rate_Hz: range(LIMITS.sample_rate_Hz),
          sound_travel: nullable(
            object(
              {
                distance_to_release_m: range(LIMITS.sound_distance_m),
                distance_to_landing_m: range(LIMITS.sound_distance_m),
                speed_of_sound_m_s: range(LIMITS.speed_of_sound_m_s),
                temperature_C: nullable(range(LIMITS.temperature_C, 'The air temperature the speed of sound came from; null if assumed.')),
                correction_s: range(
                  LIMITS.sound_travel_correction_s,
                  'Seconds added to the heard interval: (distance_to_release_m − distance_to_landing_m) / speed_of_sound_m_s.',
                ),
              },
              'The sound-travel correction applied to the heard interval; null when none was.',
            ),
          ),
        },
        frames: {
          frames: { type: 'array', minItems: 2, items: { type: 'integer', minimum: 0 } },
          frame_rate_Hz: range(LIMITS.frame_rate_Hz),
        },
      },
      'The capture exactly as it came from the phone or the keyboard.',
    ),
    time_s: range(LIMITS.time_s),
    height_m: nullable(range(LIMITS.height_m)),
    excluded: { type: 'boolean' },
    exclusion_reason: nullable(text),
    note: text,
    captured_at: ref('instant'),
    marks: listOf(
      object({ distance_m: range(LIMITS.mark_distance_m), time_s: range(LIMITS.mark_time_s) }),
      LIST_LIMITS.marks_min,
      `Points along the fall, distance from the release point against time from the release, strictly increasing in both, at most ${LIST_LIMITS.marks_max}; time_s and height_m are then the landing.`,
    ),
    release_time_known: { type: 'boolean', description: 'false: the zero of the times is itself an estimate (a clip). Absent: true.' },
    clip: CLIP_SCHEMA,
  },
};

/** Pressure ranges differ for station and sea-level values. */
function pressureRule(): Schema {
  return {
    if: { properties: { pressure_reference: { const: 'sea_level' } }, required: ['pressure_reference'] },
    then: { properties: { pressure_Pa: range(LIMITS.sea_level_pressure_Pa) } },
    else: { properties: { pressure_Pa: range(LIMITS.station_pressure_Pa) } },
  };
}

function recordSchema(kind: RecordKind): Schema {
  const schema = object({
    id: ref('id'),
    kind: { const: kind },
    created_at: ref('instant'),
    updated_at: ref('instant'),
    rev: ref('rev'),
    device: ref('device'),
    deleted: { type: 'boolean', description: 'A deleted record stays as a tombstone so the deletion travels.' },
    history: { type: 'array', items: ref('revision'), description: 'Earlier versions, oldest first.' },
    ...BODY_PROPERTIES[kind],
  }, undefined, OPTIONAL_FIELDS[kind]);
  return kind === 'reading' ? { ...schema, ...pressureRule() } : schema;
}

export const LOG_SCHEMA = {
  $schema: 'https://json-schema.org/draft/2020-12/schema',
  $id: LOG_SCHEMA_ID,
  title: `Plummet log file, format ${LOG_FORMAT_VERSION}`,
  description:
    'A whole test log or a chosen part of it, written as canonical JSON (RFC 8785). SI units, the unit in each ' +
    'field name; a standard uncertainty of x_unit is u_x_unit. Records are never replaced on import: each is ' +
    'merged by its revision (a hybrid logical clock stamp; the higher is the newer).',
  type: 'object',
  required: ['format', 'format_version', 'app_version', 'device', 'selection', 'records'],
  properties: {
    format: { const: LOG_FORMAT },
    format_version: { const: LOG_FORMAT_VERSION },
    app_version: text,
    device: ref('device'),
    selection: nullable(
      object(
        {
          day_ids: { type: 'array', items: ref('id') },
          specimen_ids: { type: 'array', items: ref('id') },
          site_ids: { type: 'array', items: ref('id') },
          kinds: { type: 'array', items: oneOfStrings(RECORD_KINDS) },
        },
        'What part of the log was chosen; null for the whole log. Records the chosen ones refer to are included.',
      ),
    ),
    records: { type: 'array', items: ref('record') },
  },
  additionalProperties: false,
  $defs: {
    id: {
      type: 'string',
      pattern: '^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$',
      description: 'A record id: a UUID (RFC 9562).',
    },
    instant: {
      type: 'string',
      pattern: '^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$',
      description: 'ISO 8601 instant in UTC, e.g. 2026-06-14T09:12:03.412Z.',
    },
    date: { type: 'string', pattern: '^\\d{4}-\\d{2}-\\d{2}$', description: 'A calendar date, YYYY-MM-DD.' },
    device: { type: 'string', pattern: '^[A-Za-z0-9_.:]+$', description: 'The id of the phone that made it.' },
    rev: {
      type: 'string',
      pattern: '^\\d{15}-\\d{6}-[A-Za-z0-9_.:]+$',
      description: 'Hybrid logical clock stamp "<ms, 15 digits>-<counter, 6 digits>-<device>"; sorts as text.',
    },
    revision: object(
      {
        rev: ref('rev'),
        device: ref('device'),
        updated_at: ref('instant'),
        reason: nullable(text),
        deleted: { type: 'boolean' },
        body: { type: 'object', description: "The record's own fields as they were in this version." },
      },
      'An earlier version of a record.',
    ),
    record: {
      type: 'object',
      required: ['kind'],
      properties: { kind: oneOfStrings(RECORD_KINDS) },
      allOf: RECORD_KINDS.map((kind) => ({
        if: { properties: { kind: { const: kind } }, required: ['kind'] },
        then: ref(`${kind}_record`),
      })),
    },
    ...Object.fromEntries(RECORD_KINDS.map((kind) => [`${kind}_record`, recordSchema(kind)])),
  },
} as const;
