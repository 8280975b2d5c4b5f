/**
 * Drops as the IndexedDB store keeps them since version 5: the drops of one series in one value (a pack, sorted by
 * id), because IndexedDB's cost is mostly per value written (upgrades.ts, upgradeToV5). Beside each pack, the ids
 * it holds (drop_where), whose index finds a drop's pack by the drop's id. Pure: the packs in, the packs to write out.
 */
import type { DropRecord } from '../log';
import type { DropPack, DropWhere } from './log-db';

export type { DropPack, DropWhere };

/** Record order by id: IndexedDB orders string keys by UTF-16 code units, as `<` does. */
export const byId = (a: { id: string }, b: { id: string }): number => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0);

export interface PlacedDrops {
  /** The packs that changed, to put. */
  packs: DropPack[];
  /** The id lists that changed, to put. */
  wheres: DropWhere[];
  /** Series whose pack is now empty: its pack and id list are deleted. */
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
  const idsChanged = new Set<string>();
  const opened = (key: string) => {
    let byKey = open.get(key);
    if (!byKey) open.set(key, (byKey = new Map(packs.get(key)!.drops.map((d) => [d.id, d]))));
    return byKey;
  };
  for (const drop of drops) {
    const from = places.get(drop.id);
    if (from !== undefined && from !== drop.series_id) {
      opened(from).delete(drop.id);
      idsChanged.add(from);
    }
    const into = opened(drop.series_id);
    if (!into.has(drop.id)) idsChanged.add(drop.series_id);
    into.set(drop.id, drop);
  }
  const placed: PlacedDrops = { packs: [], wheres: [], gone: [] };
  for (const [key, byKey] of open) {
    if (byKey.size === 0) {
      placed.gone.push(key);
      continue;
    }
    const pack: DropPack = { series_id: key, drops: [...byKey.values()].sort(byId) };
    placed.packs.push(pack);
    if (idsChanged.has(key)) placed.wheres.push({ series_id: key, drop_ids: pack.drops.map((d) => d.id) });
  }
  return placed;
}
