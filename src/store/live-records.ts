/**
 * How the store names, filters and orders records: one key per record across kinds, tombstones left out,
 * and string order as IndexedDB compares keys.
 */
import type { LogRecord, RecordKind, RecordOf } from '../log';

/** One key for a record across all kinds (ids are unique per kind). */
export const keyOf = (kind: RecordKind, id: string): string => `${kind}:${id}`;

/** A record that exists and is not a tombstone. */
export const isLive = <R extends LogRecord>(record: R | undefined): record is R => record !== undefined && !record.deleted;

/** Narrows a record read from a map or a kind-agnostic request to the kind asked for. */
export const isKind = <K extends RecordKind>(record: LogRecord, kind: K): record is RecordOf[K] => record.kind === kind;

/** Code-unit order, as IndexedDB compares string keys (localeCompare would depend on the phone's language). */
export const compareKeys = (a: string, b: string): number => (a < b ? -1 : a > b ? 1 : 0);

/** Oldest first, then by id: the order of list(). */
export const byCreated = (a: LogRecord, b: LogRecord): number => compareKeys(a.created_at, b.created_at) || compareKeys(a.id, b.id);

export const isoAt = (ms: number): string => new Date(ms).toISOString();
