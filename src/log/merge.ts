/**
 * Merging logs from several phones and from the office. Pure: values in, values out.
 *
 * Each record is the set of its versions (the current one and those in its history). Merging two copies of a
 * record takes the union of their versions; the version with the highest clock stamp (hlc.ts) is current, all
 * others form the history, oldest first. A union of sets with a fixed rule for the current one is commutative,
 * associative and idempotent, so phones can merge in any order, any number of times, and agree. A deletion is
 * just a version with `deleted: true` (a tombstone), so it travels and wins or loses like any other edit.
 *
 * Two versions are concurrent when neither holds the other in its history: two phones edited the same record
 * from a common earlier version without seeing each other's edit. The newer stamp still becomes current (so
 * every phone agrees), the other stays in the history (so nothing is lost), and the pair is reported as a
 * conflict for a person to look at. Conflicts are a phone's own notices, kept beside the log (see
 * src/sync/import-log.ts); the records themselves carry everything needed to resolve one.
 *
 * A version is its stamp together with what it says (version-order.ts). Two copies under one stamp that say
 * different things (a file changed by hand: 2.511 s typed over as 2511 s) are two versions: both are kept,
 * the one first in a fixed order is current, and the pair is a conflict (same_stamp). Nothing is chosen in
 * silence. The union is still a union of sets with a fixed rule for the current one, so the merge stays
 * commutative, associative and idempotent (test/log/merge.test.ts, test/log/same-stamp.test.ts), given the
 * gate's rule that no history entry of a record sorts after its current version.
 */
import { canonicalJson } from './canonical';
import { compareHlc } from './hlc';
import { compareVersions, versionDigest, versionIdentity } from './version-order';
import { bodyOf, REASON_REQUIRED_FIELDS, sameValue } from './records';
import { sortRecords } from './export';
import type { LogRecord, RecordKind, Revision } from './types';

type AnyRevision = Revision<Record<string, unknown>>;

export interface Conflict {
  id: string;
  kind: RecordKind;
  /** The version that is current after the merge (the newer stamp). */
  kept_rev: string;
  kept_device: string;
  /** The concurrent version that lost; it is in the record's history. */
  other_rev: string;
  other_device: string;
  /** Body fields (and "deleted") whose values differ between the two, sorted. */
  fields: string[];
  /** True when a measured value, an exclusion or the deletion itself differs (not only names or notes). */
  measured: boolean;
  /**
   * Present when both versions carry the same stamp but say different things (a file changed by hand, a
   * broken tool): kept_* is the version this phone held, other_* the one that came in; both are kept.
   */
  same_stamp?: true;
  /** For a same-stamp conflict: which of the bodies under other_rev came in (versionDigest). */
  other_version?: string;
}

export interface MergePreview {
  /** Records the local log does not have. */
  added: LogRecord[];
  /** Records that would change, with the local version before and the merged one after. */
  updated: { before: LogRecord; after: LogRecord }[];
  /** How many incoming records change nothing. */
  unchanged: number;
  conflicts: Conflict[];
  /** What to write: the added and the updated records, in one transaction. */
  changes: LogRecord[];
}

function revisionOf(record: LogRecord): AnyRevision {
  return {
    rev: record.rev,
    device: record.device,
    updated_at: record.updated_at,
    reason: null,
    deleted: record.deleted,
    body: bodyOf(record) as unknown as Record<string, unknown>,
  };
}

/**
 * Of two copies of the same version (same identity, see version-order.ts), the one to keep: the one with the
 * reason it was replaced (a copy made when it lost a conflict has none), else the greater canonical text. A
 * total order, so the choice does not depend on which copy came first.
 */
function preferred(a: AnyRevision, b: AnyRevision): AnyRevision {
  if (sameValue(a, b)) return a;
  if ((a.reason === null) !== (b.reason === null)) return a.reason !== null ? a : b;
  return canonicalJson(a) >= canonicalJson(b) ? a : b;
}

function addVersion(versions: Map<string, AnyRevision>, revision: AnyRevision): void {
  const key = versionIdentity(revision);
  const seen = versions.get(key);
  versions.set(key, seen ? preferred(seen, revision) : revision);
}

/** Every version of a record, the current one included (with reason null), by identity. */
function versionsOf(record: LogRecord): Map<string, AnyRevision> {
  const versions = new Map<string, AnyRevision>();
  for (const h of record.history as unknown as AnyRevision[]) addVersion(versions, h);
  addVersion(versions, revisionOf(record));
  return versions;
}

/**
 * The union of two copies of one record. Returns `a` itself when the copies are the same.
 * Versions are told apart by what they say, not by their stamp alone: two bodies under one stamp are both
 * kept, the one first in merge order (version-order.ts) current, the other in the history.
 */
export function mergeRecord<R extends LogRecord>(a: R, b: R): R {
  if (a === b || sameValue(a, b)) return a;
  const versions = new Map<string, AnyRevision>();
  for (const h of a.history as unknown as AnyRevision[]) addVersion(versions, h);
  for (const h of b.history as unknown as AnyRevision[]) addVersion(versions, h);
  // The current versions go in last; a copy of the same version in a history keeps its reason.
  addVersion(versions, revisionOf(a));
  addVersion(versions, revisionOf(b));
  let current: AnyRevision | undefined;
  for (const v of versions.values()) if (!current || compareVersions(v, current) > 0) current = v;
  versions.delete(versionIdentity(current!));
  const history = [...versions.values()].sort(compareVersions);
  return {
    ...current!.body,
    id: a.id,
    kind: a.kind,
    created_at: a.created_at <= b.created_at ? a.created_at : b.created_at,
    updated_at: current!.updated_at,
    rev: current!.rev,
    device: current!.device,
    deleted: current!.deleted,
    history,
  } as unknown as R;
}

/** Both logs merged, record by record; records only one side has are taken as they are. Sorted (export order). */
export function mergeLogs(a: readonly LogRecord[], b: readonly LogRecord[]): LogRecord[] {
  const byId = new Map<string, LogRecord>();
  for (const r of [...a, ...b]) {
    const seen = byId.get(r.id);
    byId.set(r.id, seen ? mergeRecord(seen, r) : r);
  }
  return sortRecords([...byId.values()]);
}


/** The conflict between two copies of a record, or null when one was made from the other or they agree. */
export function conflictBetween(a: LogRecord, b: LogRecord): Conflict | null {
  if (a.id !== b.id) return null;
  if (a.rev === b.rev) return sameStampConflict(a, revisionOf(a), revisionOf(b));
  if (b.history.some((h) => h.rev === a.rev) || a.history.some((h) => h.rev === b.rev)) return null;
  const fields = differingFields(revisionOf(a), revisionOf(b), false);
  if (fields.length === 0) return null;
  const [kept, other] = compareHlc(a.rev, b.rev) > 0 ? [a, b] : [b, a];
  return {
    id: a.id,
    kind: a.kind,
    kept_rev: kept.rev,
    kept_device: kept.device,
    other_rev: other.rev,
    other_device: other.device,
    fields,
    measured: isMeasured(a.kind, fields),
  };
}

/**
 * Crossings this phone learns of only inside a merged copy: another phone met this phone's version and the
 * one it crossed, listed the pair, and sent back the merge of both. conflictBetween() sees nothing then, since
 * each version is in the other's copy; this finds the pair from either side, so neither phone loses an action
 * in silence, whichever clock was ahead.
 *
 * - This phone's version was buried (`before` is no longer current): every change that needs a reason (a
 *   removal, a restore, a correction of a measured value) leaves that reason on the version it replaces, and a
 *   merge keeps a copy with a reason over one without. So when the version after ours in the merged history
 *   makes such a change and ours carries no reason, whoever made that change never saw ours.
 * - This phone's version stayed current: a version new to this phone with an older stamp was made without
 *   knowing ours (a version made knowing it has a newer stamp, hlc.ts), and ours was made without knowing it
 *   (a copy always travels with every version its maker held, and this phone held none of it). One conflict for
 *   each other phone, against its newest such version (a phone's own versions follow each other knowingly).
 *
 * An edit crossing an edit of fields that need no reason (names, notes) is listed on the phone that stays
 * current, and on the other only when it receives the bare version: nothing in the merged copy tells "replaced
 * by an edit with no reason" from "never seen".
 */
export function crossingsInMerge(before: LogRecord, after: LogRecord): Conflict[] {
  // Most records of an import change nothing or only move on: the cheap checks first.
  if (before.id !== after.id || after === before) return [];
  const held = revisionOf(before);
  const heldIdentity = versionIdentity(held);
  if (after.rev !== before.rev) {
    const buried = (after.history as unknown as AnyRevision[]).find((h) => h.rev === before.rev && versionIdentity(h) === heldIdentity);
    if (!buried || buried.reason !== null) return [];
    const next = successorOf(buried, after);
    if (next.rev === buried.rev || !needsReason(after.kind, differingFields(next, buried, false))) return [];
    const conflict = crossing(after, revisionOf(after), buried);
    return conflict ? [conflict] : [];
  }
  // Nothing came in that this phone lacks, or a body under our own stamp sorts after ours (a same-stamp conflict).
  if (after.history.length <= before.history.length) return [];
  const current = revisionOf(after);
  if (versionIdentity(current) !== heldIdentity) return [];
  // A new body under a stamp this phone holds is a same-stamp conflict (sameStampConflicts), not a crossing.
  const heldStamps = new Set([held.rev, ...before.history.map((h) => h.rev)]);
  const newestByDevice = new Map<string, AnyRevision>();
  for (const v of after.history as unknown as AnyRevision[]) {
    if (heldStamps.has(v.rev)) continue;
    const seen = newestByDevice.get(v.device);
    if (!seen || compareVersions(v, seen) > 0) newestByDevice.set(v.device, v);
  }
  return [...newestByDevice.values()]
    .sort(compareVersions)
    .map((v) => crossing(after, current, v))
    .filter((c): c is Conflict => c !== null);
}

/** The version that follows `version` in merge order among the record's versions (its current one at the latest). */
function successorOf(version: AnyRevision, record: LogRecord): AnyRevision {
  let next = revisionOf(record);
  for (const h of record.history as unknown as AnyRevision[]) {
    if (compareVersions(h, version) > 0 && compareVersions(h, next) < 0) next = h;
  }
  return next;
}

/** The conflict between the merged record's current version and a version that crossed, or null when they agree. */
function crossing(record: LogRecord, kept: AnyRevision, other: AnyRevision): Conflict | null {
  const fields = differingFields(kept, other, false);
  if (fields.length === 0) return null;
  return {
    id: record.id,
    kind: record.kind,
    kept_rev: kept.rev,
    kept_device: kept.device,
    other_rev: other.rev,
    other_device: other.device,
    fields,
    measured: isMeasured(record.kind, fields),
  };
}

/** The body fields (and "deleted"; with `envelope`, the device and time too) whose values differ, sorted. */
function differingFields(a: AnyRevision, b: AnyRevision, envelope: boolean): string[] {
  const fields = Object.keys({ ...a.body, ...b.body }).filter((k) => !sameValue(a.body[k], b.body[k]));
  if (a.deleted !== b.deleted) fields.push('deleted');
  if (envelope && a.device !== b.device) fields.push('device');
  if (envelope && a.updated_at !== b.updated_at) fields.push('updated_at');
  return fields.sort();
}

function isMeasured(kind: RecordKind, fields: readonly string[]): boolean {
  const measuredFields = new Set<string>([...(REASON_REQUIRED_FIELDS[kind] ?? []), 'raw', 'deleted']);
  return fields.some((f) => measuredFields.has(f));
}

/** Whether a change of these fields needs a reason (records.ts: a removal, a restore, a measured value). */
function needsReason(kind: RecordKind, fields: readonly string[]): boolean {
  const reasoned = new Set<string>([...(REASON_REQUIRED_FIELDS[kind] ?? []), 'deleted']);
  return fields.some((f) => reasoned.has(f));
}

/** Two versions under one stamp that say different things: `held` was on this phone, `came` arrived. */
function sameStampConflict(record: LogRecord, held: AnyRevision, came: AnyRevision): Conflict | null {
  if (versionIdentity(held) === versionIdentity(came)) return null;
  return {
    id: record.id,
    kind: record.kind,
    kept_rev: held.rev,
    kept_device: held.device,
    other_rev: came.rev,
    other_device: came.device,
    fields: differingFields(held, came, true),
    measured: isMeasured(record.kind, differingFields(held, came, false)),
    same_stamp: true,
    other_version: versionDigest(came),
  };
}

/**
 * The versions an incoming copy brings under stamps this phone already holds with something else said: one
 * conflict for each such incoming version (against the version held that comes last in merge order). Only
 * versions new to this phone count, so a file merged again reports nothing again.
 */
export function sameStampConflicts(local: LogRecord, incoming: LogRecord): Conflict[] {
  if (local.id !== incoming.id) return [];
  const mine = versionsOf(local);
  const byStamp = new Map<string, AnyRevision>();
  for (const v of mine.values()) {
    const seen = byStamp.get(v.rev);
    if (!seen || compareVersions(v, seen) > 0) byStamp.set(v.rev, v);
  }
  const found: Conflict[] = [];
  for (const [key, v] of versionsOf(incoming)) {
    const held = byStamp.get(v.rev);
    if (!held || mine.has(key)) continue;
    const conflict = sameStampConflict(local, held, v);
    if (conflict) found.push(conflict);
  }
  return found;
}

/** What merging `incoming` into `local` would do, without doing it. */
export function previewMerge(local: readonly LogRecord[], incoming: readonly LogRecord[]): MergePreview {
  const mine = new Map(local.map((r) => [r.id, r]));
  const theirs = new Map<string, LogRecord>();
  for (const r of incoming) {
    const seen = theirs.get(r.id);
    theirs.set(r.id, seen ? mergeRecord(seen, r) : r);
  }
  const preview: MergePreview = { added: [], updated: [], unchanged: 0, conflicts: [], changes: [] };
  for (const record of theirs.values()) {
    const before = mine.get(record.id);
    if (!before) {
      preview.added.push(record);
      continue;
    }
    // A copy equal to the one held (most of a file imported again): its versions are all held, so the merge
    // changes nothing and no version is new to this phone: no conflict of any kind can come of it.
    if (sameValue(before, record)) {
      preview.unchanged++;
      continue;
    }
    const after = mergeRecord(before, record);
    if (after === before || sameValue(after, before)) preview.unchanged++;
    else preview.updated.push({ before, after });
    const found = sameStampConflicts(before, record);
    const conflict = before.rev === record.rev ? null : conflictBetween(before, record);
    if (conflict) found.push(conflict);
    if (!conflict) found.push(...crossingsInMerge(before, after));
    preview.conflicts.push(...found);
  }
  preview.changes = [...preview.added, ...preview.updated.map((u) => u.after)];
  return preview;
}

const conflictKey = (c: Conflict) => `${c.id} ${c.other_rev}${c.other_version ? ` ${c.other_version}` : ''}`;

/** The list with the newly found conflicts added, each (record, losing version) once. */
export function addConflicts(existing: readonly Conflict[], found: readonly Conflict[]): Conflict[] {
  const byKey = new Map(existing.map((c) => [conflictKey(c), c]));
  for (const c of found) {
    const seen = byKey.get(conflictKey(c));
    // The same loser may be found again against a newer winner: the newer report replaces the older.
    if (!seen || compareHlc(c.kept_rev, seen.kept_rev) > 0) byKey.set(conflictKey(c), c);
  }
  return [...byKey.values()].sort((x, y) => (conflictKey(x) < conflictKey(y) ? -1 : 1));
}

/**
 * The conflicts still to show. One is settled when this phone has edited the record since (a person here has
 * looked at it and chosen); a newer version from elsewhere does not settle it, since that phone may never have
 * seen the losing edit.
 */
export function openConflicts(conflicts: readonly Conflict[], records: Iterable<LogRecord>, device: string): Conflict[] {
  const byId = new Map<string, LogRecord>();
  for (const r of records) byId.set(r.id, r);
  return conflicts.filter((c) => {
    const record = byId.get(c.id);
    if (!record) return true;
    const newest = compareHlc(c.kept_rev, c.other_rev) > 0 ? c.kept_rev : c.other_rev;
    return !(record.device === device && compareHlc(record.rev, newest) > 0);
  });
}
