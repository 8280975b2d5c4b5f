/**
 * Records from a clock far ahead: their stamp stands more than CLOCK_AHEAD_LIMIT_MS ahead of this phone's
 * time. They are kept and merged like any other record but did not move this phone's clock (hlc.ts); the
 * crew is shown them, since their stamp wins every merge against edits made before it was seen.
 */
import { clockAhead, parseHlc } from './hlc';
import type { LogRecord, RecordKind } from './types';

export interface ClockAheadRecord {
  id: string;
  kind: RecordKind;
  rev: string;
  /** The device that wrote the current version. */
  device: string;
  /** How far the stamp stands ahead of the time given, in ms. */
  ahead_ms: number;
}

/** Whether a record's current stamp is from a clock far ahead of `nowMs`. */
export function isFromClockAhead(record: Pick<LogRecord, 'rev'>, nowMs: number): boolean {
  return clockAhead(record.rev, nowMs);
}

/** The records whose current stamp is from a clock far ahead of `nowMs`, furthest ahead first. */
export function recordsFromClockAhead(records: Iterable<LogRecord>, nowMs: number): ClockAheadRecord[] {
  const found: ClockAheadRecord[] = [];
  for (const r of records) {
    if (!clockAhead(r.rev, nowMs)) continue;
    found.push({ id: r.id, kind: r.kind, rev: r.rev, device: r.device, ahead_ms: parseHlc(r.rev).ms - Math.floor(nowMs) });
  }
  return found.sort((a, b) => b.ahead_ms - a.ahead_ms || (a.id < b.id ? -1 : 1));
}
