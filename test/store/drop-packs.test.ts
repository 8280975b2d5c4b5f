import { describe, expect, it } from 'vitest';
import { placeDrops, whereBucket, WHERE_BUCKETS, type DropPack } from '../../src/store/drop-packs';
import { whereBucketV5 } from '../../src/store/upgrades';
import type { DropRecord } from '../../src/log';

const drop = (id: string, series_id: string, time_s = 1.5) => ({ id, series_id, time_s }) as unknown as DropRecord;
const packsOf = (...packs: DropPack[]) => new Map(packs.map((p) => [p.series_id, structuredClone(p)]));

describe('placeDrops', () => {
  it('adds new drops to their series in id order and lists the drops whose place changed', () => {
    const packs = packsOf({ series_id: 's1', drops: [drop('b', 's1')] }, { series_id: 's2', drops: [] });
    const placed = placeDrops(packs, [drop('c', 's1'), drop('a', 's1'), drop('x', 's2')], new Map([['b', 's1']]));
    expect(placed.packs.map((p) => [p.series_id, p.drops.map((d) => d.id)])).toEqual([
      ['s1', ['a', 'b', 'c']],
      ['s2', ['x']],
    ]);
    expect(placed.moved).toEqual(new Map([['c', 's1'], ['a', 's1'], ['x', 's2']]));
    expect(placed.gone).toEqual([]);
  });

  it('replaces the stored version in place, with no change of place', () => {
    const packs = packsOf({ series_id: 's1', drops: [drop('a', 's1'), drop('b', 's1')] });
    const placed = placeDrops(packs, [drop('b', 's1', 1.7)], new Map([['a', 's1'], ['b', 's1']]));
    expect(placed.packs[0]!.drops).toEqual([drop('a', 's1'), drop('b', 's1', 1.7)]);
    expect(placed.moved.size).toBe(0);
  });

  it('moves a drop whose series changed, and gives up a pack left empty', () => {
    const packs = packsOf({ series_id: 's1', drops: [drop('a', 's1')] }, { series_id: 's2', drops: [drop('b', 's2')] });
    const placed = placeDrops(packs, [drop('a', 's2')], new Map([['a', 's1'], ['b', 's2']]));
    expect(placed.gone).toEqual(['s1']);
    expect(placed.packs.map((p) => [p.series_id, p.drops.map((d) => d.id)])).toEqual([['s2', ['a', 'b']]]);
    expect(placed.moved).toEqual(new Map([['a', 's2']]));
    // The packs handed in are left as they were.
    expect(packs.get('s1')!.drops.map((d) => d.id)).toEqual(['a']);
  });
});

describe('whereBucket', () => {
  it('spreads random ids and ids made by hand over every bucket, as the upgrade to version 5 did', () => {
    const ids = Array.from({ length: 20_000 }, (_, i) => `00000000-0000-4000-8000-${String(i).padStart(12, '0')}`);
    const counts = new Array<number>(WHERE_BUCKETS).fill(0);
    for (const id of ids) {
      expect(whereBucket(id)).toBe(whereBucketV5(id));
      counts[whereBucket(id)]!++;
    }
    // 20 000 ids in 1024 buckets: about 19.5 each (a Poisson spread stays well inside 4 to 45).
    expect(Math.min(...counts)).toBeGreaterThanOrEqual(4);
    expect(Math.max(...counts)).toBeLessThanOrEqual(45);
    expect(whereBucket('0b7e2d4c-5f1a-4c3e-9d2b-8a6f4e1c7b90')).toBe(whereBucketV5('0b7e2d4c-5f1a-4c3e-9d2b-8a6f4e1c7b90'));
  });
});
