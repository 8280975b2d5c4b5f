import { LIMITS } from '../../src/log';
import { describe, expect, it } from 'vitest';
import { FALL_TIME_LIMITS_S, TimingError, checkFallTime, fallTimeFromTapCapture, fallTimeFromTaps } from '../../src/timing';

function failure(fn: () => unknown): TimingError {
  try {
    fn();
  } catch (e) {
    if (e instanceof TimingError) return e;
    throw e;
  }
  throw new Error('expected a TimingError');
}

describe('fall time from two taps', () => {
  it('is the impact tap minus the release tap, in seconds', () => {
    // Event timestamps in ms on the page's monotonic clock: 1234.5 ms apart.
    expect(fallTimeFromTaps(10_000.25, 11_234.75)).toBeCloseTo(1.2345, 12);
    expect(fallTimeFromTapCapture({ kind: 'taps', timestamps_ms: [52.1, 2052.1] })).toBeCloseTo(2, 12);
  });

  it('accepts the limits themselves', () => {
    expect(fallTimeFromTaps(0, 50)).toBe(0.05);
    expect(fallTimeFromTaps(0, 3_600_000)).toBe(3600);
  });

  it('refuses taps out of order, naming the taps and their values', () => {
    const e = failure(() => fallTimeFromTaps(5000, 4200));
    expect(e.code).toBe('out-of-order');
    expect(e.field).toBe('timestamps_ms');
    expect(e.value).toEqual([5000, 4200]);
    expect(e.message).toBe(
      'timestamps_ms = [5000,4200]: the impact tap is 800 ms before the release tap; allowed: a fall time from 0.05 s to 3600 s, impact after release',
    );
    expect(failure(() => fallTimeFromTaps(5000, 5000)).code).toBe('out-of-order');
  });

  it('refuses a time under 0.05 s (a double tap) and over 3600 s, the log limit (a missed impact)', () => {
    const short = failure(() => fallTimeFromTaps(1000, 1030));
    expect([short.code, short.field, short.value, short.allowed]).toEqual(['too-short', 'time_s', 0.03, 'a fall time from 0.05 s to 3600 s, impact after release']);
    expect(short.message).toMatch(/0\.03 s is shorter than any fall/);
    const long = failure(() => fallTimeFromTaps(0, 3_600_500));
    expect([long.code, long.value]).toEqual(['too-long', 3600.5]);
    expect(FALL_TIME_LIMITS_S).toEqual({ min: 0.05, max: 3600 });
    expect(FALL_TIME_LIMITS_S.max).toBe(LIMITS.time_s.max);
  });

  it('refuses a tap that is not a finite number, naming which one', () => {
    const e = failure(() => fallTimeFromTaps(1000, Number.NaN));
    expect([e.code, e.field]).toEqual(['not-finite', 'timestamps_ms[1]']);
    expect(failure(() => fallTimeFromTaps(Infinity, 1)).field).toBe('timestamps_ms[0]');
  });

  it('refuses a capture without exactly two taps', () => {
    const e = failure(() => fallTimeFromTapCapture({ kind: 'taps', timestamps_ms: [1, 2, 3] }));
    expect([e.code, e.field, e.value]).toEqual(['wrong-count', 'timestamps_ms', [1, 2, 3]]);
  });

  it('checks a fall time from any capture against the same limits', () => {
    expect(checkFallTime(1.5, 'onsets')).toBe(1.5);
    expect(failure(() => checkFallTime(0.01, 'onsets')).field).toBe('onsets');
  });
});
