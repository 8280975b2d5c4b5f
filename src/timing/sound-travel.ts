import { LIMITS, type Limit, type RawCapture, type SoundTravelRecord } from '../log';
import { AIR_LIMITS, speedOfSound } from '../physics';
import { TimingError } from './timing-error';

/**
 * Correcting a heard interval for the time the sound takes to reach the phone.
 *
 * The release sound starts at the release point and reaches the phone d_r / c later; the impact sound starts
 * at the landing point and arrives d_i / c later. The phone hears
 *   heard = (t_impact + d_i / c) − (t_release + d_r / c),
 * so the fall time is
 *   t = heard + (d_r − d_i) / c.
 * A phone at the landing point (d_i ≈ 0) hears the release late by the whole drop height over c: about
 * 29 ms for a 10 m drop, ten times the timing uncertainty of sound onsets, so the correction matters.
 */

export interface SoundTravel {
  /** Straight-line distance from the phone's microphone to the release point. */
  distance_to_release_m: number;
  /** Straight-line distance from the phone's microphone to where the specimen lands. */
  distance_to_landing_m: number;
  /** Speed of sound in the air of the day (see speedOfSoundAt). */
  speed_of_sound_m_s: number;
  /** The air temperature the speed of sound came from; null or absent when a reference temperature was assumed. */
  temperature_C?: number | null;
}

const rangeOf = (limit: Limit) => ({ min: limit.min, max: limit.max, text: `${limit.min} to ${limit.max} ${limit.unit}` });

/** Distances the crew can type (the phone is somewhere near the drop) and speeds of sound: the log's own limits. */
export const SOUND_TRAVEL_LIMITS = {
  distance_m: rangeOf(LIMITS.sound_distance_m),
  speed_of_sound_m_s: rangeOf(LIMITS.speed_of_sound_m_s),
} as const;

/**
 * Speed of sound in m/s at an air temperature in °C, by the physics core's ISO 9613-1 formula
 * (which takes kelvin: T = temperature_C + 273.15).
 */
export function speedOfSoundAt(temperature_C: number): number {
  const { min, max, text } = AIR_LIMITS.temperature_C;
  if (typeof temperature_C !== 'number' || !Number.isFinite(temperature_C)) {
    throw new TimingError({ code: 'not-finite', field: 'temperature_C', value: temperature_C, allowed: text });
  }
  if (temperature_C < min || temperature_C > max) {
    throw new TimingError({ code: 'out-of-range', field: 'temperature_C', value: temperature_C, allowed: text });
  }
  return speedOfSound(temperature_C + 273.15);
}

/**
 * The seconds to add to a heard interval: (d_r − d_i) / c. Positive when the phone is nearer the landing.
 * With `height_m` (the straight distance between release and landing points) the distances are checked
 * against the triangle inequality: they can differ by at most the height.
 */
export function soundTravelCorrection(travel: SoundTravel, height_m?: number): number {
  const d_r = checkRange('distance_to_release_m', travel.distance_to_release_m, SOUND_TRAVEL_LIMITS.distance_m);
  const d_i = checkRange('distance_to_landing_m', travel.distance_to_landing_m, SOUND_TRAVEL_LIMITS.distance_m);
  const c = checkRange('speed_of_sound_m_s', travel.speed_of_sound_m_s, SOUND_TRAVEL_LIMITS.speed_of_sound_m_s);
  if (height_m !== undefined) {
    const h = checkRange('height_m', height_m, rangeOf(LIMITS.height_m));
    const difference = Math.abs(d_r - d_i);
    if (difference > h * (1 + 1e-9)) {
      throw new TimingError({
        code: 'impossible-geometry',
        field: 'distance_to_release_m',
        value: { distance_to_release_m: d_r, distance_to_landing_m: d_i, height_m: h },
        allowed: `distances that differ by at most the drop height, ${h} m`,
        reason: `the distances differ by ${Number(difference.toPrecision(4))} m, more than the ${h} m between release and landing: check them`,
      });
    }
  }
  return (d_r - d_i) / c;
}

/** The fall time from a heard interval: heard_s + (d_r − d_i) / c. */
export function correctForSoundTravel(heard_s: number, travel: SoundTravel, height_m?: number): number {
  if (typeof heard_s !== 'number' || !Number.isFinite(heard_s)) {
    throw new TimingError({ code: 'not-finite', field: 'heard_s', value: heard_s, allowed: 'a finite time in seconds' });
  }
  return heard_s + soundTravelCorrection(travel, height_m);
}

function checkRange(field: string, value: number, range: { min: number; max: number; text: string }): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new TimingError({ code: 'not-finite', field, value, allowed: range.text });
  }
  if (value < range.min || value > range.max) {
    throw new TimingError({ code: 'out-of-range', field, value, allowed: range.text });
  }
  return value;
}

/**
 * The correction as it is stored with a sound capture: its inputs and its value, computed here once, so a
 * screen never recomputes it and the drop's time can be recomputed from its record (fallTimeFromSoundCapture).
 */
export function soundTravelRecord(travel: SoundTravel, height_m?: number): SoundTravelRecord {
  const correction_s = soundTravelCorrection(travel, height_m);
  return {
    distance_to_release_m: travel.distance_to_release_m,
    distance_to_landing_m: travel.distance_to_landing_m,
    speed_of_sound_m_s: travel.speed_of_sound_m_s,
    temperature_C: travel.temperature_C ?? null,
    correction_s,
  };
}

/** The fall time of a stored sound capture: the heard interval plus the stored correction (none when null). */
export function fallTimeFromSoundCapture(raw: Extract<RawCapture, { kind: 'sound' }>): number {
  const [release, impact] = raw.onsets_s;
  if (raw.onsets_s.length !== 2 || release === undefined || impact === undefined) {
    throw new TimingError({ code: 'wrong-count', field: 'onsets_s', value: [...raw.onsets_s], allowed: 'two onsets: release, then impact' });
  }
  return impact - release + (raw.sound_travel?.correction_s ?? 0);
}
