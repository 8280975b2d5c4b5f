import { describe, expect, it } from 'vitest';
import { placeDrops, type DropPack } from '../../src/store/drop-packs';
import type { DropRecord } from '../../src/log';

const drop = (id: string, series_id: string, time_s = 1.5) => ({ id, series_id, time_s }) as unknown as DropRecord;
const packsOf = (...packs: DropPack[]) => new Map(packs.map((p) => [p.series_id, structuredClone(p)]));

describe('placeDrops', () => {
  it('adds new drops to their series in id order and lists the ids that changed', () => {
    const packs = packsOf({ series_id: 's1', drops: [drop('b', 's1')] }, { series_id: 's2', drops: [] });
    const placed = placeDrops(packs, [drop('c', 's1'), drop('a', 's1'), drop('x', 's2')], new Map([['b', 's1']]));
    expect(placed.packs.map((p) => [p.series_id, p.drops.map((d) => d.id)])).toEqual([
      ['s1', ['a', 'b', 'c']],
      ['s2', ['x']],
    ]);
    expect(placed.wheres).toEqual([
      { series_id: 's1', drop_ids: ['a', 'b', 'c'] },
      { series_id: 's2', drop_ids: ['x'] },
    ]);
    expect(placed.gone).toEqual([]);
  });

  it('replaces the stored version in place, with no change to the id list', () => {
    const packs = packsOf({ series_id: 's1', drops: [drop('a', 's1'), drop('b', 's1')] });
    const placed = placeDrops(packs, [drop('b', 's1', 1.7)], new Map([['a', 's1'], ['b', 's1']]));
    expect(placed.packs[0]!.drops).toEqual([drop('a', 's1'), drop('b', 's1', 1.7)]);
    expect(placed.wheres).toEqual([]);
  });

  it('moves a drop whose series changed, and gives up a pack left empty', () => {
    const packs = packsOf({ series_id: 's1', drops: [drop('a', 's1')] }, { series_id: 's2', drops: [drop('b', 's2')] });
    const placed = placeDrops(packs, [drop('a', 's2')], new Map([['a', 's1'], ['b', 's2']]));
    expect(placed.gone).toEqual(['s1']);
    expect(placed.packs.map((p) => [p.series_id, p.drops.map((d) => d.id)])).toEqual([['s2', ['a', 'b']]]);
    expect(placed.wheres).toEqual([{ series_id: 's2', drop_ids: ['a', 'b'] }]);
    // The packs handed in are left as they were.
    expect(packs.get('s1')!.drops.map((d) => d.id)).toEqual(['a']);
  });
});
