// The hybrid logical clock's bound on received stamps and its behaviour at the edges of its range.
import { describe, expect, it } from 'vitest';
import { CLOCK_AHEAD_LIMIT_MS, HybridLogicalClock, STAMP_MAX_MS, clockAhead, compareHlc, formatHlc, parseHlc, stampProblem } from '../../src/log/hlc';

const T = Date.UTC(2026, 5, 14, 9, 0, 0);
const from = (ms: number, counter = 0, device = 'other') => formatHlc({ ms, counter, device });

describe('the clock and received stamps', () => {
  it('follows a stamp up to an hour ahead of its wall time', () => {
    const clock = new HybridLogicalClock('me');
    clock.receive(from(T + CLOCK_AHEAD_LIMIT_MS), T);
    expect(parseHlc(clock.tick(T)).ms).toBe(T + CLOCK_AHEAD_LIMIT_MS);
  });

  it('does not follow a stamp further ahead: its next stamp is at its own time', () => {
    const clock = new HybridLogicalClock('me');
    clock.receive(from(T + CLOCK_AHEAD_LIMIT_MS + 1), T);
    clock.receive(from(Date.UTC(2070, 0, 1)), T);
    expect(parseHlc(clock.tick(T)).ms).toBe(T);
    expect(clockAhead(from(T + CLOCK_AHEAD_LIMIT_MS + 1), T)).toBe(true);
    expect(clockAhead(from(T + CLOCK_AHEAD_LIMIT_MS), T)).toBe(false);
  });

  it('carries a full counter into the next millisecond instead of failing', () => {
    const clock = new HybridLogicalClock('me');
    const after = clock.receive(from(T, 999_999), T);
    expect(parseHlc(after)).toEqual({ ms: T + 1, counter: 0, device: 'me' });
    expect(compareHlc(after, from(T, 999_999))).toBeGreaterThan(0);
    const own = new HybridLogicalClock('me', from(T, 999_999, 'me'));
    expect(parseHlc(own.tick(T))).toEqual({ ms: T + 1, counter: 0, device: 'me' });
  });

  it('stamps a new version after a record far ahead without moving the clock', () => {
    const clock = new HybridLogicalClock('me');
    const far = from(Date.UTC(2070, 0, 1), 999_999);
    const next = clock.stampAfter(far, T);
    expect(compareHlc(next, far)).toBeGreaterThan(0);
    expect(parseHlc(next)).toEqual({ ms: Date.UTC(2070, 0, 1) + 1, counter: 0, device: 'me' });
    expect(parseHlc(clock.tick(T)).ms).toBe(T);
    // A stamp at the top of the accepted range can still be followed by a new version.
    expect(compareHlc(clock.stampAfter(from(STAMP_MAX_MS, 999_999), T), from(STAMP_MAX_MS, 999_999))).toBeGreaterThan(0);
  });

  it('takes in its own stamps from another tab at any distance, but not one beyond the range', () => {
    const clock = new HybridLogicalClock('me');
    clock.catchUp(from(Date.UTC(2030, 0, 1), 5, 'me'));
    expect(parseHlc(clock.tick(T))).toEqual({ ms: Date.UTC(2030, 0, 1), counter: 6, device: 'me' });
    const poisoned = new HybridLogicalClock('me', from(999_999_999_999_999, 999_999, 'me'));
    expect(parseHlc(poisoned.tick(T)).ms).toBe(T);
    poisoned.catchUp(from(999_999_999_999_999, 999_999, 'me'));
    expect(parseHlc(poisoned.tick(T)).ms).toBe(T);
  });
});

describe('the range a stamp entering the store must be in', () => {
  it('is 1970 to the end of the year 9999', () => {
    expect(STAMP_MAX_MS).toBe(253_402_300_799_999); // Date.UTC(9999, 11, 31, 23, 59, 59, 999)
    expect(stampProblem(from(STAMP_MAX_MS, 999_999))).toBeNull();
    expect(stampProblem(from(0))).toBeNull();
    expect(stampProblem(from(STAMP_MAX_MS + 1))?.rule).toContain('9999-12-31T23:59:59.999Z');
    expect(stampProblem(from(999_999_999_999_999, 999_999))?.what).toBe("is beyond the clock's range");
    expect(stampProblem('-00000000001000-000000-x')?.what).toBe('is not a clock stamp');
  });
});
