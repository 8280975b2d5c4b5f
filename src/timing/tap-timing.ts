import { LIMITS } from '../log';
import { TimingError } from './timing-error';

/**
 * Fall times from two taps on the phone: one at the release, one at the impact.
 *
 * The taps are times on the page's monotonic clock in milliseconds (a pointer or key event's `timeStamp`,
 * which shares its origin with `performance.now()`), passed in by the caller: this module reads no clock.
 * Wall-clock time (`Date`) must not be used, since it can jump when the phone sets its clock.
 *
 * Human reaction adds a delay at both ends: the person sees (or hears) the release and the impact and taps
 * some time later, roughly 0.15–0.25 s each for a simple visual reaction (common practice). The two delays
 * partly cancel, because the same person makes both taps, but they are not equal: anticipating the release
 * (the person lets go or hears a count-down) shortens the first, and the impact comes as a surprise. What is
 * left is a random scatter of a few hundredths of a second per drop and a bias of either sign. The series'
 * timing uncertainty (`u_time_s`) should reflect it, and a series over several heights can fit the constant
 * part as a timing offset. The limits below refuse only what cannot be a fall at all.
 */

/**
 * The shortest and longest fall a capture may give, in seconds. The longest is the log's own (a time the log
 * would refuse is not offered); the shortest is stricter than the log's "above 0": a human or a microphone
 * cannot time a fall shorter than 50 ms, so such a capture is a double tap or one sound heard twice.
 */
export const FALL_TIME_LIMITS_S = { min: 0.05, max: LIMITS.time_s.max } as const;

const ALLOWED = `a fall time from ${FALL_TIME_LIMITS_S.min} s to ${FALL_TIME_LIMITS_S.max} s, impact after release`;

/**
 * The fall time in seconds between a release tap and an impact tap (milliseconds on the monotonic clock).
 * Throws a TimingError naming the tap and its value for taps that are not finite, out of order, or give a
 * time outside FALL_TIME_LIMITS_S.
 */
export function fallTimeFromTaps(release_ms: number, impact_ms: number): number {
  checkFinite('timestamps_ms[0]', release_ms);
  checkFinite('timestamps_ms[1]', impact_ms);
  const time_s = (impact_ms - release_ms) / 1000;
  if (impact_ms <= release_ms) {
    throw new TimingError({
      code: 'out-of-order',
      field: 'timestamps_ms',
      value: [release_ms, impact_ms],
      allowed: ALLOWED,
      reason: `the impact tap is ${formatMs(release_ms - impact_ms)} before the release tap`,
    });
  }
  return checkFallTime(time_s, 'time_s');
}

/** The fall time of a raw tap capture (`{ kind: 'taps', timestamps_ms: [release, impact] }`). */
export function fallTimeFromTapCapture(raw: { kind: 'taps'; timestamps_ms: readonly number[] }): number {
  const t = raw.timestamps_ms;
  if (t.length !== 2) {
    throw new TimingError({ code: 'wrong-count', field: 'timestamps_ms', value: [...t], allowed: 'two taps: release, then impact' });
  }
  return fallTimeFromTaps(t[0]!, t[1]!);
}

/**
 * Checks that a fall time (from any capture) is inside FALL_TIME_LIMITS_S and returns it.
 * `field` names where it came from in the error.
 */
export function checkFallTime(time_s: number, field = 'time_s'): number {
  checkFinite(field, time_s);
  if (time_s < FALL_TIME_LIMITS_S.min) {
    throw new TimingError({
      code: 'too-short',
      field,
      value: time_s,
      allowed: ALLOWED,
      reason: `${formatS(time_s)} is shorter than any fall this can time (a double tap?)`,
    });
  }
  if (time_s > FALL_TIME_LIMITS_S.max) {
    throw new TimingError({
      code: 'too-long',
      field,
      value: time_s,
      allowed: ALLOWED,
      reason: `${formatS(time_s)} is longer than any fall this can time (a missed impact tap?)`,
    });
  }
  return time_s;
}

function checkFinite(field: string, value: number): void {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new TimingError({ code: 'not-finite', field, value, allowed: 'a finite time in milliseconds' });
  }
}

function formatS(s: number): string {
  return `${Number(s.toPrecision(4))} s`;
}

function formatMs(ms: number): string {
  return `${Number(ms.toPrecision(4))} ms`;
}
