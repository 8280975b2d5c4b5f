/**
 * Upgrading a log file written in an older format to the current one, before it is checked and merged.
 *
 * One function per format step, like the store's upgrades: each is history and never changes once shipped.
 * An upgrade only adds what the newer format requires and the older file could not say; it never changes a
 * value that was there.
 */

type Json = Record<string, unknown>;

const isObject = (v: unknown): v is Json => typeof v === 'object' && v !== null && !Array.isArray(v);

/** A sound capture of format 1 did not say whether a sound-travel correction was applied: it records none. */
function soundCaptureToV2(body: Json): Json {
  const raw = body['raw'];
  if (!isObject(raw) || raw['kind'] !== 'sound' || 'sound_travel' in raw) return body;
  return { ...body, raw: { ...raw, sound_travel: null } };
}

/**
 * Format 1 → 2: a sound capture carries `sound_travel` (the correction applied, or null). Format 1 kept any
 * correction only in the drop's note, as text: it stays there, and the capture says null (none recorded).
 */
function upgradeToV2(file: Json): Json {
  const records = Array.isArray(file['records'])
    ? file['records'].map((record: unknown) => {
        if (!isObject(record) || record['kind'] !== 'drop') return record;
        const history = Array.isArray(record['history'])
          ? record['history'].map((entry: unknown) =>
              isObject(entry) && isObject(entry['body']) ? { ...entry, body: soundCaptureToV2(entry['body']) } : entry,
            )
          : record['history'];
        return { ...soundCaptureToV2(record), history };
      })
    : file['records'];
  return { ...file, format_version: 2, records };
}

/**
 * What format 3 added to each kind, at the value that says what format 2 meant: a reading taken at the landing
 * surface, with no vertical air motion measured and the uncertainties left to the analysis' rules; a series with
 * no second reading and the timing method's own delay. Added only where absent, never over a value.
 */
const FORMAT_3_DEFAULTS: Readonly<Record<string, Json>> = {
  reading: { u_wind_speed_m_s: null, vertical_wind_m_s: null, u_vertical_wind_m_s: null, height_m: 0 },
  series: { reading_aloft_id: null, timing_delay_s: null, u_timing_delay_s: null },
};

function withDefaults(body: Json, defaults: Json): Json {
  const missing = Object.keys(defaults).filter((key) => !(key in body));
  return missing.length === 0 ? body : { ...body, ...Object.fromEntries(missing.map((key) => [key, defaults[key]])) };
}

/** Format 2 → 3: readings and series get the fields of air along the fall and declared delays (above), history too. */
function upgradeToV3(file: Json): Json {
  const records = Array.isArray(file['records'])
    ? file['records'].map((record: unknown) => {
        if (!isObject(record) || typeof record['kind'] !== 'string') return record;
        const defaults = FORMAT_3_DEFAULTS[record['kind']];
        if (!defaults) return record;
        const history = Array.isArray(record['history'])
          ? record['history'].map((entry: unknown) =>
              isObject(entry) && isObject(entry['body']) ? { ...entry, body: withDefaults(entry['body'], defaults) } : entry,
            )
          : record['history'];
        return { ...withDefaults(record, defaults), history };
      })
    : file['records'];
  return { ...file, format_version: 3, records };
}

/**
 * Format 3 → 4: drops may carry marks along the fall, whether their release time is known and a clip's evidence,
 * and series the distances of their gates. All four are optional and absent means what format 3 meant (one time
 * per drop, its release known, no clip, no gates), so a format 3 file's records are format 4 records as they are.
 */
function upgradeToV4(file: Json): Json {
  return { ...file, format_version: 4 };
}

/** LOG_FILE_UPGRADES[n − 1] takes a file from format n to n + 1. */
const LOG_FILE_UPGRADES: readonly ((file: Json) => Json)[] = [upgradeToV2, upgradeToV3, upgradeToV4];

/**
 * The file in the current format: older formats are upgraded step by step; anything else (the current format,
 * a newer one, or not a log at all) is returned as it is, for the checks that follow to judge.
 */
export function upgradeLogFile(data: unknown): unknown {
  if (!isObject(data)) return data;
  let file = data;
  for (;;) {
    const version = file['format_version'];
    if (typeof version !== 'number' || !Number.isInteger(version) || version < 1) return file;
    const step = LOG_FILE_UPGRADES[version - 1];
    if (!step) return file;
    file = step(file);
  }
}
