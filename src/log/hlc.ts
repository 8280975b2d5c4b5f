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
const STAMP_PATTERN = /^(\d{15})-(\d{6})-(.+)$/;

export class HlcError extends PlummetError<'hlc-malformed' | 'hlc-counter-overflow' | 'hlc-device-invalid'> {
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
    this.last = last ? parseHlc(last) : { ms: 0, counter: 0, device };
  }

  /** A stamp for a local event at wall time `nowMs`, newer than every stamp seen so far. */
  tick(nowMs: number): string {
    const ms = Math.max(this.last.ms, Math.floor(nowMs));
    const counter = ms === this.last.ms ? this.last.counter + 1 : 0;
    return this.commit(ms, counter);
  }

  /** Take in a stamp received from elsewhere, so that later local stamps sort after it. */
  receive(remote: string, nowMs: number): string {
    const r = parseHlc(remote);
    const ms = Math.max(this.last.ms, r.ms, Math.floor(nowMs));
    let counter: number;
    if (ms === this.last.ms && ms === r.ms) counter = Math.max(this.last.counter, r.counter) + 1;
    else if (ms === this.last.ms) counter = this.last.counter + 1;
    else if (ms === r.ms) counter = r.counter + 1;
    else counter = 0;
    return this.commit(ms, counter);
  }

  /** The newest stamp this clock has issued or seen. */
  get latest(): string {
    return formatHlc(this.last);
  }

  private commit(ms: number, counter: number): string {
    if (counter > MAX_COUNTER) {
      throw new HlcError({ code: 'hlc-counter-overflow', field: 'counter', value: counter, allowed: `≤ ${MAX_COUNTER} events in one millisecond`, message: `more than ${MAX_COUNTER} events in one millisecond` });
    }
    this.last = { ms, counter, device: this.device };
    return formatHlc(this.last);
  }
}
