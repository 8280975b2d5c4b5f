import { describe, expect, it } from 'vitest';
import { createRecord, deleteRecord, restoreRecord, reviseRecord, bodyOf, recordHistory } from '../../src/log/records';
import { undoSteps } from '../../src/log/undo-steps';
import { HybridLogicalClock } from '../../src/log/hlc';
import { LogError } from '../../src/log/errors';
import { validateRecord } from '../../src/log/validate';
import * as demo from './demo-bodies';

const DEVICE = 'a1b2c3d4e5f60718';
const T0 = Date.UTC(2026, 5, 14, 9, 10, 12);
const clock = new HybridLogicalClock(DEVICE);
let n = 0;
const ctx = (now = T0) => ({ device: DEVICE, clock, now, random: (bytes: Uint8Array) => bytes.fill(++n % 250) });

describe('restoreRecord', () => {
  it('brings a removed record back as a new live version, the tombstone kept in the history', () => {
    const drop = createRecord('drop', demo.drop(), ctx());
    const gone = deleteRecord(drop, { ...ctx(T0 + 1000), reason: 'wrong series' });
    const back = restoreRecord(gone, { ...ctx(T0 + 2000), reason: 'it was the right series' });
    expect(back.deleted).toBe(false);
    expect(bodyOf(back)).toEqual(bodyOf(drop));
    expect(recordHistory(back).map((v) => [v.deleted, v.reason])).toEqual([
      [false, 'wrong series'],
      [true, 'it was the right series'],
      [false, null],
    ]);
    expect(validateRecord(back)).toEqual([]);
    // Removed again after the restore: still a valid record, every version kept.
    const again = deleteRecord(back, { ...ctx(T0 + 3000), reason: 'checked the video: wrong series after all' });
    expect(validateRecord(again)).toEqual([]);
    expect(again.history).toHaveLength(3);
  });

  it('needs a reason', () => {
    const gone = deleteRecord(createRecord('site', demo.site(), ctx()), { ...ctx(), reason: 'test entry' });
    let error: unknown;
    try {
      restoreRecord(gone, { ...ctx(), reason: '  ' });
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(LogError);
    expect((error as LogError).code).toBe('reason-required');
  });

  it('leaves a live record as it is', () => {
    const site = createRecord('site', demo.site(), ctx());
    expect(restoreRecord(site, { ...ctx(), reason: 'x' })).toBe(site);
  });
});

describe('undoSteps', () => {
  it('removes what the action made', () => {
    const drop = createRecord('drop', demo.drop(), ctx());
    expect(undoSteps([drop], 'undone')).toEqual([{ op: 'remove', kind: 'drop', id: drop.id, reason: 'undone', expectedRev: drop.rev }]);
  });

  it('restores what the action removed, containers first', () => {
    const series = deleteRecord(createRecord('series', demo.series(), ctx()), { ...ctx(), reason: 'wrong specimen' });
    const drop = deleteRecord(createRecord('drop', demo.drop(), ctx()), { ...ctx(), reason: 'wrong specimen' });
    expect(undoSteps([drop, series], 'undone').map((s) => [s.op, s.kind])).toEqual([
      ['restore', 'series'],
      ['restore', 'drop'],
    ]);
  });

  it('puts the previous body back when the action revised a record', () => {
    const drop = createRecord('drop', demo.drop(), ctx());
    const fixed = reviseRecord(drop, { time_s: 1.219 }, { ...ctx(T0 + 1000), reason: 'typed 1.121 for 1.219' });
    const [step] = undoSteps([fixed], 'undone');
    expect(step).toMatchObject({ op: 'revise', id: drop.id, expectedRev: fixed.rev, reason: 'undone' });
    const back = reviseRecord(fixed, (step as { patch: object }).patch, { ...ctx(T0 + 2000), reason: 'undone' });
    expect(bodyOf(back)).toEqual(bodyOf(drop));
    expect(back.history).toHaveLength(2);
  });

  it('removes again what the action restored', () => {
    const gone = deleteRecord(createRecord('reading', demo.reading(), ctx()), { ...ctx(), reason: 'slip' });
    const back = restoreRecord(gone, { ...ctx(), reason: 'no slip' });
    expect(undoSteps([back], 'undone')).toEqual([{ op: 'remove', kind: 'reading', id: back.id, reason: 'undone', expectedRev: back.rev }]);
  });
});
