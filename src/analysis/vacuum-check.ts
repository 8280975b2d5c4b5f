/**
 * The door check of a fall time: no falling body beats a fall in vacuum, so a time shorter than √(2h/g) from its
 * release height is a mistake (a dropped digit, the wrong height, a timer started late). Gravity is the site's
 * normal gravity; buoyancy and drag only ever lengthen the fall, so this bound refuses nothing that could be real.
 */
import { localGravity } from '../physics';
import type { DropRecord, SeriesRecord, SiteRecord } from '../log';
import { dropHeight, siteInput } from './series-request';

/** The time of a fall from rest through `height_m` in vacuum, s: h = ½·g·t² (any mechanics text). */
export function vacuumFallTime(height_m: number, gravity_m_s2: number): number {
  return Math.sqrt((2 * height_m) / gravity_m_s2);
}

/** A fall time refused because it is shorter than the vacuum fall from its height. */
export interface TooFastTime {
  /** The crew's drop number. */
  seq: number;
  time_s: number;
  height_m: number;
  vacuum_time_s: number;
}

/** The site's gravity, or null when the site cannot give one (the series screen says why elsewhere). */
export function siteGravity(site: SiteRecord | null | undefined): number | null {
  if (!site) return null;
  try {
    return localGravity(siteInput(site)).gravity_m_s2;
  } catch {
    return null;
  }
}

/** The check at entry: null when the time can be real, otherwise what the crew needs to see. */
export function tooFastTime(entry: { seq: number; time_s: number; height_m: number }, gravity_m_s2: number): TooFastTime | null {
  const vacuum = vacuumFallTime(entry.height_m, gravity_m_s2);
  return entry.time_s < vacuum ? { ...entry, vacuum_time_s: vacuum } : null;
}

/** The same check on a stored drop (from an import or an older record). */
export function tooFastDrop(drop: DropRecord, series: SeriesRecord, gravity_m_s2: number): TooFastTime | null {
  return tooFastTime({ seq: drop.seq, time_s: drop.time_s, height_m: dropHeight(drop, series) }, gravity_m_s2);
}
