/**
 * The kind each of some ids has in the store, whatever kind it is stored under: what the gate (log/record-gate.ts)
 * asks to refuse an id reused with another kind and a link naming a record of the wrong kind.
 */
import { RECORD_KINDS, type RecordKind } from '../log';
import type { StoreTx } from './backend';

export async function knownKinds(tx: StoreTx, ids: readonly string[]): Promise<Map<string, RecordKind>> {
  const known = new Map<string, RecordKind>();
  if (ids.length === 0) return known;
  const found = await Promise.all(RECORD_KINDS.map((kind) => tx.getMany(kind, ids)));
  RECORD_KINDS.forEach((kind, k) => {
    found[k]!.forEach((record, i) => {
      if (record && !known.has(ids[i]!)) known.set(ids[i]!, kind);
    });
  });
  return known;
}
