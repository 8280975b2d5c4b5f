/**
 * Which version of a record is which. A version is its stamp together with what it says (device, time,
 * deletion, body); the reason it was replaced is a note about it, not part of it. Two copies under one stamp
 * that say different things are two versions (a file edited by hand, a broken tool): the merge keeps both and
 * lists them as a conflict, instead of keeping whichever text sorts higher.
 */
import { canonicalJson } from './canonical';
import { compareHlc } from './hlc';
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
