/**
 * Drops as the IndexedDB store keeps them since version 5: the drops of one series in one value (a pack, sorted by
 * id), because IndexedDB's cost is mostly per value written (upgrades.ts, upgradeToV5). Beside the packs, the
 * series of each drop (drop_where) in WHERE_BUCKETS values by a hash of the drop id. Pure.
 */
import type { DropRecord } from '../log';
import type { DropPack, DropWhere } from './log-db';

export type { DropPack, DropWhere };

/** How many buckets hold the drops' series. Part of the stored format of version 5: never change it. */
export const WHERE_BUCKETS = 1024;

/** The bucket of a drop id: FNV-1a (32 bits) of its text, so ids made up by hand spread too. */
export function whereBucket(id: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < id.length; i++) h = Math.imul(h ^ id.charCodeAt(i), 0x01000193) >>> 0;
  return h % WHERE_BUCKETS;
}

/** Record order by id: IndexedDB orders string keys by UTF-16 code units, as `<` does. */
export const byId = (a: { id: string }, b: { id: string }): number => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0);

export interface PlacedDrops {
  /** The packs that changed, to put. */
  packs: DropPack[];
  /** Drops that are new or changed series: drop id → series id, for drop_where. */
  moved: Map<string, string>;
  /** Series whose pack is now empty: its pack is deleted. */
  gone: string[];
}

/**
 * Puts each drop in the pack of its series, in place of the version stored there, and takes it out of the pack
 * it was in when its series changed. `packs` holds the pack (empty if none is stored) of every series a drop joins
 * or leaves; `places` the series each stored drop is in now. The packs given are not changed.
 */
export function placeDrops(packs: ReadonlyMap<string, DropPack>, drops: readonly DropRecord[], places: ReadonlyMap<string, string>): PlacedDrops {
  // Each changed pack as a map by id while the batch is placed, sorted once at the end (a batch may bring
  // thousands of drops to one series).
  const open = new Map<string, Map<string, DropRecord>>();
  const moved = new Map<string, string>();
  const opened = (key: string) => {
    let byKey = open.get(key);
    if (!byKey) open.set(key, (byKey = new Map(packs.get(key)!.drops.map((d) => [d.id, d]))));
    return byKey;
  };
  for (const drop of drops) {
    const from = places.get(drop.id);
    if (from !== undefined && from !== drop.series_id) opened(from).delete(drop.id);
    if (from !== drop.series_id) moved.set(drop.id, drop.series_id);
    opened(drop.series_id).set(drop.id, drop);
  }
  const placed: PlacedDrops = { packs: [], moved, gone: [] };
  for (const [key, byKey] of open) {
    if (byKey.size === 0) {
      placed.gone.push(key);
      continue;
    }
    placed.packs.push({ series_id: key, drops: [...byKey.values()].sort(byId) });
  }
  return placed;
}
