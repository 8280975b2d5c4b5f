import { describe, expect, it } from 'vitest';
import { createRecord, deleteRecord, restoreRecord, reviseRecord } from '../../src/log/records';
import { mergeRecord, previewMerge, removalCrossing } from '../../src/log/merge';
import { HybridLogicalClock } from '../../src/log/hlc';
import * as demo from './demo-bodies';

const ONE = 'aaaaaaaaaaaaaaa1';
const TWO = 'bbbbbbbbbbbbbbb2';
const T0 = Date.UTC(2026, 5, 14, 9);
const phone = (device: string) => {
  const clock = new HybridLogicalClock(device);
  return (now: number) => ({ device, clock, now });
};
const one = phone(ONE);
const two = phone(TWO);
const original = createRecord('drop', demo.drop(), { ...one(T0), random: (b: Uint8Array) => b.fill(7) });

describe('a removal and an edit that crossed', () => {
  it('is a conflict on both phones when the edit is newer', () => {
    const removed = deleteRecord(original, { ...one(T0 + 1000), reason: 'wrong series' });
    const fixed = reviseRecord(original, { time_s: 1.221 }, { ...two(T0 + 2000), reason: 'typed 1.121 for 1.221' });
    // Phone two meets the removal directly.
    expect(previewMerge([fixed], [removed]).conflicts).toEqual([expect.objectContaining({ kept_rev: fixed.rev, other_rev: removed.rev, measured: true })]);
    // Phone one then receives phone two's merged copy, which holds its own removal in the history.
    const merged = mergeRecord(fixed, removed);
    expect(merged.deleted).toBe(false);
    const atOne = previewMerge([removed], [merged]);
    expect(atOne.conflicts).toEqual([expect.objectContaining({ id: original.id, kept_rev: fixed.rev, other_rev: removed.rev, fields: ['deleted', 'time_s'], measured: true })]);
  });

  it('is a conflict on both phones when the removal is newer', () => {
    const fixed = reviseRecord(original, { time_s: 1.221 }, { ...two(T0 + 10_000), reason: 'typed 1.121 for 1.221' });
    const removed = deleteRecord(original, { ...one(T0 + 20_000), reason: 'wrong series' });
    expect(previewMerge([removed], [fixed]).conflicts).toHaveLength(1);
    const merged = mergeRecord(removed, fixed);
    expect(merged.deleted).toBe(true);
    expect(previewMerge([fixed], [merged]).conflicts).toEqual([expect.objectContaining({ kept_rev: removed.rev, other_rev: fixed.rev, measured: true })]);
  });

  it('is no conflict when the other phone restored the record knowing of the removal, or edited it after', () => {
    const removed = deleteRecord(original, { ...one(T0 + 30_000), reason: 'wrong series' });
    const back = restoreRecord(removed, { ...two(T0 + 40_000), reason: 'right series after all' });
    expect(removalCrossing(removed, back)).toBeNull();
    expect(previewMerge([removed], [back]).conflicts).toEqual([]);
    const edited = reviseRecord(original, { note: 'gusty' }, one(T0 + 50_000));
    const removedAfter = deleteRecord(edited, { ...two(T0 + 60_000), reason: 'wrong series' });
    expect(previewMerge([edited], [removedAfter]).conflicts).toEqual([]);
  });
});
