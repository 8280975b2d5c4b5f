/**
 * Which version of a record is which. A version is its stamp together with what it says (device, time,
 * deletion, body); the reason it was replaced is a note about it, not part of it. Two copies under one stamp
 * that say different things are two versions (a file edited by hand, a broken tool): the merge keeps both and
 * lists them as a conflict, instead of keeping whichever text sorts higher.
 */
import { canonicalJson } from './canonical';
import { compareHlc, stampProblem } from './hlc';
import type { Problem } from './errors';
import type { Revision } from './types';

type AnyRevision = Revision<Record<string, unknown>>;

/** The canonical text of what a version says, without its reason: equal exactly for copies of one version. */
export function versionIdentity(v: AnyRevision): string {
  return canonicalJson({ rev: v.rev, device: v.device, updated_at: v.updated_at, deleted: v.deleted, body: v.body });
}

/** Versions in merge order: by stamp, and under one stamp by their identity text (a fixed, arbitrary rule). */
export function compareVersions(a: AnyRevision, b: AnyRevision): number {
  const byStamp = compareHlc(a.rev, b.rev);
  if (byStamp !== 0) return byStamp;
  const [x, y] = [versionIdentity(a), versionIdentity(b)];
  return x < y ? -1 : x > y ? 1 : 0;
}

/** A short name for a version (16 hex digits of two FNV-1a hashes of its identity), to tell apart bodies under one stamp. */
export function versionDigest(v: AnyRevision): string {
  const text = versionIdentity(v);
  let h1 = 0x811c9dc5;
  let h2 = 0x01000193 ^ text.length;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    h1 = Math.imul(h1 ^ c, 0x01000193) >>> 0;
    h2 = Math.imul(h2 ^ c, 0x5bd1e995) >>> 0;
  }
  return h1.toString(16).padStart(8, '0') + h2.toString(16).padStart(8, '0');
}

/** Whether `a` sorts before `b`; a value canonical JSON cannot write is left to the field checks (true). */
function sortsBefore(a: AnyRevision, b: AnyRevision): boolean {
  try {
    return compareVersions(a, b) < 0;
  } catch {
    return true;
  }
}

/**
 * Every earlier version must sort before the current one: a history entry after it would become the current
 * version in a merge (taking the place of the record's own body), and the merge's order would then depend on
 * which copies met first. Under the same stamp an entry may differ from the current one (a same-stamp
 * conflict kept by the merge) as long as it sorts before it.
 */
export function historyOrderProblems(record: { rev?: unknown; device?: unknown; updated_at?: unknown; deleted?: unknown; history?: unknown; [key: string]: unknown }, body: () => Record<string, unknown>): Problem[] {
  if (!Array.isArray(record.history) || record.history.length === 0 || stampProblem(record.rev) !== null) return [];
  let current: AnyRevision | null = null;
  /** The current version, its body made only when a history entry shares its stamp. */
  const currentVersion = () => (current ??= { rev: record.rev, device: record.device, updated_at: record.updated_at, reason: null, deleted: record.deleted, body: body() } as AnyRevision);
  const rule = 'every earlier version must be older than the current one (under the same stamp: sort before it)';
  const problems: Problem[] = [];
  (record.history as unknown[]).forEach((h, i) => {
    const entry = h as AnyRevision | null;
    // A stamp that is no stamp at all is reported by the envelope checks.
    if (entry === null || typeof entry !== 'object' || stampProblem(entry.rev) !== null) return;
    const rev = record.rev as string;
    if (compareHlc(entry.rev, rev) < 0) return;
    if (entry.rev === rev && sortsBefore(entry, currentVersion())) return;
    const path = `history[${i}].rev`;
    problems.push({ path, value: entry.rev, rule, message: `${path}: ${JSON.stringify(entry.rev)} is not older than the current version (rev ${JSON.stringify(rev)}): ${rule}` });
  });
  return problems;
}
