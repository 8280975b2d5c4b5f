/**
 * Hybrid logical clock (Kulkarni, Demirbas et al., "Logical Physical Clocks", OPODIS 2014).
 *
 * A stamp is the wall-clock milliseconds, a counter for events within the same millisecond, and the device id
 * that breaks ties. Its text form sorts in the same order as the stamps themselves, so stored and exported
 * revisions compare as plain strings:  "<ms, 15 digits>-<counter, 6 digits>-<device>".
 */
import { PlummetError, type PlummetErrorOptions } from '../errors';

export interface HlcStamp {
  /** Milliseconds since 1970-01-01T00:00:00Z (physical part). */
  ms: number;
  /** Logical counter within one millisecond. */
  counter: number;
  device: string;
}

const MS_DIGITS = 15;
const COUNTER_DIGITS = 6;
const MAX_COUNTER = 10 ** COUNTER_DIGITS - 1;
/** The largest millisecond the text form can hold (15 digits, about the year 33658). */
const FORMAT_MAX_MS = 10 ** MS_DIGITS - 1;
const STAMP_PATTERN = /^(\d{15})-(\d{6})-(.+)$/;

/**
 * The stamps a record may carry when it enters the store: from 1970-01-01T00:00:00.000Z (ms 0) to the last
 * millisecond of the year 9999, the same range as the ISO instants of a record (four-digit years). Beyond it
 * a stamp can only come from a broken or hostile file. The text form goes much further (FORMAT_MAX_MS), so a
 * phone can always stamp a new version after any accepted one: saving never fails because of a received stamp.
 */
export const STAMP_MIN_MS = 0;
export const STAMP_MAX_MS = Date.UTC(9999, 11, 31, 23, 59, 59, 999);
export const STAMP_RANGE = `ms from ${STAMP_MIN_MS} (1970-01-01T00:00:00.000Z) to ${STAMP_MAX_MS} (9999-12-31T23:59:59.999Z)`;

/**
 * How far a received stamp may move this phone's clock ahead of its own wall time: one hour.
 *
 * Phones set their clocks from the network and agree within seconds; a clock set by hand drifts by minutes.
 * An hour leaves room for both (and for the minutes a phone spends offline), yet a stamp further ahead than
 * that is not drift but a wrong date (a phone set to the wrong day or year, a wrong time zone typed as local
 * time) or a forged file. Such a record is still merged, kept and exported like any other, and a new version
 * of it is still stamped after it; it just does not drag this phone's clock, so this phone's later stamps do
 * not leap ahead and win every merge against honest phones, and never run into the end of the clock's range.
 * The cost of a tight bound is only a flag on records from a clock more than an hour fast (clockAhead()).
 */
export const CLOCK_AHEAD_LIMIT_MS = 60 * 60 * 1000;

export class HlcError extends PlummetError<'hlc-malformed' | 'hlc-counter-overflow' | 'hlc-device-invalid' | 'hlc-out-of-range'> {
  constructor(options: PlummetErrorOptions<HlcError['code']>) {
    super(options);
    this.name = 'HlcError';
  }
}

export function formatHlc(stamp: HlcStamp): string {
  if (!/^[A-Za-z0-9_.:]+$/.test(stamp.device)) {
    throw new HlcError({ code: 'hlc-device-invalid', field: 'device', value: stamp.device, allowed: 'letters, digits, _ . :', message: `device id "${stamp.device}" may hold only letters, digits, _ . :` });
  }
  return `${String(stamp.ms).padStart(MS_DIGITS, '0')}-${String(stamp.counter).padStart(COUNTER_DIGITS, '0')}-${stamp.device}`;
}

export function parseHlc(text: string): HlcStamp {
  const m = STAMP_PATTERN.exec(text);
  if (!m) throw new HlcError({ code: 'hlc-malformed', field: 'rev', value: text, allowed: '"<ms, 15 digits>-<counter, 6 digits>-<device>"', message: `revision "${text}" is not a clock stamp (ms-counter-device)` });
  return { ms: Number(m[1]), counter: Number(m[2]), device: m[3]! };
}

/**
 * What is wrong with a stamp as the gate sees it (validate.ts): null when it may enter the store; otherwise the
 * rule with the allowed range, and what is wrong.
 */
export function stampProblem(value: unknown): { rule: string; what: string } | null {
  return readStamp(value).problem;
}

/** A value read as a stamp: its parts, or null with what is wrong (stampProblem's), in one match of the pattern. */
export function readStamp(value: unknown): { stamp: HlcStamp; problem: null } | { stamp: null; problem: { rule: string; what: string } } {
  const m = typeof value === 'string' ? STAMP_PATTERN.exec(value) : null;
  if (!m) return { stamp: null, problem: { rule: 'must be ms-counter-device', what: 'is not a clock stamp' } };
  const stamp = { ms: Number(m[1]), counter: Number(m[2]), device: m[3]! };
  if (stamp.ms < STAMP_MIN_MS || stamp.ms > STAMP_MAX_MS) {
    return { stamp: null, problem: { rule: `must be a clock stamp with ${STAMP_RANGE}`, what: "is beyond the clock's range" } };
  }
  return { stamp, problem: null };
}

/** Whether a stamp stands further ahead of the wall time `nowMs` than a received stamp may move the clock. */
export function clockAhead(stamp: string, nowMs: number): boolean {
  const m = STAMP_PATTERN.exec(stamp);
  return m !== null && Number(m[1]) > Math.floor(nowMs) + CLOCK_AHEAD_LIMIT_MS;
}

/** The stamp just after `s` (the counter carries into the next millisecond), for `device`. */
function successor(s: HlcStamp, device: string): HlcStamp {
  return s.counter < MAX_COUNTER ? { ms: s.ms, counter: s.counter + 1, device } : { ms: s.ms + 1, counter: 0, device };
}

/** Negative when a is older than b, zero when equal, positive when newer. */
export function compareHlc(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

/**
 * A clock for one device. `now` is passed in so the pure core never reads the wall clock itself.
 */
export class HybridLogicalClock {
  private last: HlcStamp;

  constructor(
    readonly device: string,
    last?: string,
  ) {
    const stored = last ? parseHlc(last) : undefined;
    // A stored stamp beyond the range can only have come from a poisoned clock (an earlier version took in any
    // received stamp): starting from it would stop every save, so the clock starts afresh from the wall time.
    this.last = stored && stored.ms <= STAMP_MAX_MS ? stored : { ms: 0, counter: 0, device };
  }

  /** A stamp for a local event at wall time `nowMs`, newer than every stamp seen so far. */
  tick(nowMs: number): string {
    const wall = Math.floor(nowMs);
    if (wall > this.last.ms) return this.commit(wall, 0);
    const next = successor(this.last, this.device);
    return this.commit(next.ms, next.counter);
  }

  /**
   * Take in a stamp received from elsewhere, so that later local stamps sort after it. A stamp more than
   * CLOCK_AHEAD_LIMIT_MS ahead of the wall time is not taken in (the clock only ticks): it came from a wrong
   * or forged clock, and following it would carry this phone's stamps along.
   */
  receive(remote: string, nowMs: number): string {
    const r = parseHlc(remote);
    if (clockAhead(remote, nowMs)) return this.tick(nowMs);
    const top = compareStamps(r, this.last) > 0 ? r : this.last;
    const wall = Math.floor(nowMs);
    if (wall > top.ms) return this.commit(wall, 0);
    const next = successor(top, this.device);
    return this.commit(next.ms, next.counter);
  }

  /**
   * The stamp of a new version of a record whose current stamp is `previous`: after it (so the new version wins
   * over the one it replaces on every phone) and after every stamp this clock issued. A `previous` far ahead of
   * the wall time does not move the clock: the new stamp is the one just after it, given out once.
   */
  stampAfter(previous: string, nowMs: number): string {
    if (!clockAhead(previous, nowMs)) return this.receive(previous, nowMs);
    const p = parseHlc(previous);
    if (compareStamps(this.last, p) >= 0) return this.tick(nowMs);
    const next = successor(p, this.device);
    this.check(next.ms, next.counter);
    return formatHlc(next);
  }

  /**
   * This device's own newest stamp, as another tab of the app wrote it: taken in whatever the wall time says,
   * since this device's stamps only ever rise. A stamp beyond the range is ignored (see the constructor).
   */
  catchUp(own: string): void {
    const s = parseHlc(own);
    if (s.ms <= STAMP_MAX_MS && compareStamps(s, this.last) > 0) this.last = { ms: s.ms, counter: s.counter, device: this.device };
  }

  /** The newest stamp this clock has issued or seen. */
  get latest(): string {
    return formatHlc(this.last);
  }

  private check(ms: number, counter: number): void {
    if (counter > MAX_COUNTER) {
      throw new HlcError({ code: 'hlc-counter-overflow', field: 'counter', value: counter, allowed: `≤ ${MAX_COUNTER} events in one millisecond`, message: `more than ${MAX_COUNTER} events in one millisecond` });
    }
    // Reached only by a wall clock beyond the year 9999 plus a thousand years of stamps given out one by one.
    if (ms > FORMAT_MAX_MS) {
      throw new HlcError({ code: 'hlc-out-of-range', field: 'rev', value: ms, allowed: `ms ≤ ${FORMAT_MAX_MS}`, message: `the clock stamp ${ms} ms is beyond what a stamp can hold` });
    }
  }

  private commit(ms: number, counter: number): string {
    this.check(ms, counter);
    this.last = { ms, counter, device: this.device };
    return formatHlc(this.last);
  }
}

/** Stamps in their order (the device breaks ties, as in the text form). */
function compareStamps(a: HlcStamp, b: HlcStamp): number {
  return a.ms !== b.ms ? a.ms - b.ms : a.counter !== b.counter ? a.counter - b.counter : a.device < b.device ? -1 : a.device > b.device ? 1 : 0;
}
