/**
 * A found instant moved by hand: the crew stepped through the frames and put the release or the impact on a
 * frame of their choosing. The drop record keeps the change as a correction with its reason (the record's
 * history); here the finding only changes. A hand placement on a frame is known to ± half a frame interval:
 * a rectangular distribution, u = Δt/√12 (JCGM 100 §4.3.7).
 */
import type { FallFinding } from './findFall';
import { nearestFrame } from './findFall';
import { MotionError } from './motionError';

export function moveInstant(finding: FallFinding, which: 'release' | 'impact', time_s: number): FallFinding {
  const times = finding.track.map((p) => p.time_s);
  const first = times[0]!;
  const last = times[times.length - 1]!;
  if (!(time_s >= first && time_s <= last)) {
    throw new MotionError({ code: 'bad-instant', field: `${which}.time_s`, value: time_s, allowed: `${first} s to ${last} s (the clip)`, reason: 'outside the clip' });
  }
  const other = which === 'release' ? finding.impact : finding.release;
  if (which === 'release' ? !(time_s < other.time_s) : !(time_s > other.time_s)) {
    throw new MotionError({
      code: 'bad-instant',
      field: `${which}.time_s`,
      value: time_s,
      allowed: which === 'release' ? `before the impact at ${other.time_s} s` : `after the release at ${other.time_s} s`,
      reason: which === 'release' ? 'the release must come before the impact' : 'the impact must come after the release',
    });
  }
  const frame = nearestFrame(times, time_s);
  const interval = (times[Math.min(frame + 1, times.length - 1)]! - times[Math.max(frame - 1, 0)]!) / (frame > 0 && frame < times.length - 1 ? 2 : 1);
  return { ...finding, [which]: { time_s, u_time_s: interval / Math.sqrt(12), frame, by: 'moved' } };
}
