import { describe, expect, it } from 'vitest';
import { bodyOf, createRecord, deleteRecord, recordHistory, reviseRecord } from '../../src/log/records';
import { HybridLogicalClock, compareHlc } from '../../src/log/hlc';
import { LogError, LogValidationError } from '../../src/log/errors';
import type { DropRecord } from '../../src/log/types';
import * as demo from './demo-bodies';

const DEVICE = 'a1b2c3d4e5f60718';
const T0 = Date.UTC(2026, 5, 14, 9, 10, 12);
const counterRandom = () => {
  let n = 0;
  return (bytes: Uint8Array) => bytes.fill(++n);
};
const ctx = (now = T0, clock = new HybridLogicalClock(DEVICE)) => ({ device: DEVICE, clock, now });

function errorOf(fn: () => unknown): LogError {
  try {
    fn();
  } catch (error) {
    if (error instanceof LogError) return error;
    throw error;
  }
  throw new Error('expected a LogError, nothing was thrown');
}

describe('createRecord', () => {
  it('wraps a valid body in an envelope with the id, times, clock stamp and device', () => {
    const clock = new HybridLogicalClock(DEVICE);
    const record = createRecord('drop', demo.drop(), { ...ctx(T0, clock), id: '7b0e4a2c-1d3f-4e5a-9b6c-8d7e6f5a4b3c' });
    expect(record).toEqual({
      ...demo.drop(),
      id: '7b0e4a2c-1d3f-4e5a-9b6c-8d7e6f5a4b3c',
      kind: 'drop',
      created_at: '2026-06-14T09:10:12.000Z',
      updated_at: '2026-06-14T09:10:12.000Z',
      rev: clock.latest,
      device: DEVICE,
      deleted: false,
      history: [],
    });
    expect(record.rev).toMatch(new RegExp(`^0*${T0}-000000-${DEVICE}$`));
  });

  it('makes a version 4 id from the random source when none is given', () => {
    const record = createRecord('site', demo.site(), { ...ctx(), random: counterRandom() });
    expect(record.id).toBe('01010101-0101-4101-8101-010101010101');
  });

  it('refuses to make a record without an id or a random source', () => {
    expect(errorOf(() => createRecord('site', demo.site(), ctx())).code).toBe('id-missing');
  });

  it('refuses an id from outside that is not a UUID', () => {
    const error = errorOf(() => createRecord('site', demo.site(), { ...ctx(), id: 'site-1' }));
    expect(error).toBeInstanceOf(LogValidationError);
    expect((error as LogValidationError).problems[0]?.path).toBe('id');
  });

  it('refuses an invalid body and names what is wrong', () => {
    const error = errorOf(() => createRecord('specimen', { ...demo.steelBall(), mass_kg: 0 }, { ...ctx(), random: counterRandom() }));
    expect(error.code).toBe('record-invalid');
    expect(error.message).toContain('mass_kg: 0 is out of range: must be > 0 and ≤ 20000 kg');
  });

  it('refuses a clock that belongs to another device', () => {
    const error = errorOf(() => createRecord('site', demo.site(), { ...ctx(T0, new HybridLogicalClock('other')), random: counterRandom() }));
    expect(error.code).toBe('device-mismatch');
  });

  it('copies the body so later changes to the caller’s object do not reach the record', () => {
    const body = demo.drop();
    const record = createRecord('drop', body, { ...ctx(), random: counterRandom() });
    (body.raw as { timestamps_ms: number[] }).timestamps_ms.push(99_999);
    expect(record.raw).toEqual({ kind: 'taps', timestamps_ms: [10_000, 11_121] });
  });
});

describe('reviseRecord', () => {
  const clock = new HybridLogicalClock(DEVICE);
  const original = (): DropRecord => createRecord('drop', demo.drop(), { ...ctx(T0, clock), random: counterRandom() });

  it('keeps the previous version in the history with the reason it was replaced', () => {
    const before = original();
    const after = reviseRecord(before, { time_s: 1.118 }, { ...ctx(T0 + 60_000, clock), reason: 'read the stopwatch again' });
    expect(after.time_s).toBe(1.118);
    expect(after.created_at).toBe(before.created_at);
    expect(after.updated_at).toBe('2026-06-14T09:11:12.000Z');
    expect(compareHlc(after.rev, before.rev)).toBeGreaterThan(0);
    expect(after.history).toEqual([
      { rev: before.rev, device: DEVICE, updated_at: before.updated_at, reason: 'read the stopwatch again', deleted: false, body: bodyOf(before) },
    ]);
  });

  it('needs a reason to change a measured value', () => {
    const error = errorOf(() => reviseRecord(original(), { time_s: 1.2 }, { ...ctx(T0, clock), reason: '  ' }));
    expect(error.code).toBe('reason-required');
    expect(error.field).toBe('time_s');
    expect(error.value).toBe(1.2);
  });

  it('needs a reason to exclude a drop or to take it back in', () => {
    const patch = { excluded: true, exclusion_reason: 'hit the railing' };
    expect(errorOf(() => reviseRecord(original(), patch, ctx(T0, clock))).code).toBe('reason-required');
    const excluded = reviseRecord(original(), patch, { ...ctx(T0, clock), reason: 'hit the railing' });
    expect(excluded.excluded).toBe(true);
    expect(errorOf(() => reviseRecord(excluded, { excluded: false, exclusion_reason: null }, ctx(T0, clock))).code).toBe(
      'reason-required',
    );
  });

  it('needs a reason for each kind of measured value', () => {
    const cases: [Parameters<typeof createRecord>[0], object, object][] = [
      ['reading', demo.reading(), { temperature_C: 18 }],
      ['reading', demo.reading(), { pressure_Pa: 100_900 }],
      ['reading', demo.reading(), { humidity: { kind: 'relative', relative_humidity_pct: 60, u_relative_humidity_pct: 3 } }],
      ['specimen', demo.steelBall(), { mass_kg: 0.064 }],
      ['specimen', demo.steelBall(), { shape: { kind: 'sphere', diameter_m: 0.0251, u_diameter_m: 0.00002 } }],
      ['series', demo.series(), { height_m: 6.2 }],
      ['drop', demo.drop(), { height_m: 6.0 }],
    ];
    for (const [kind, body, patch] of cases) {
      const record = createRecord(kind, body as never, { ...ctx(T0, clock), random: counterRandom() });
      expect(errorOf(() => reviseRecord(record, patch as never, ctx(T0, clock))).code, JSON.stringify(patch)).toBe('reason-required');
    }
  });

  it('lets a note or a name change without a reason', () => {
    const record = createRecord('site', demo.site(), { ...ctx(T0, clock), random: counterRandom() });
    const renamed = reviseRecord(record, { name: 'Hollin pond bridge', notes: 'east side' }, ctx(T0 + 1, clock));
    expect(renamed.name).toBe('Hollin pond bridge');
    expect(renamed.history[0]?.reason).toBeNull();
  });

  it('never changes a raw capture, even with a reason', () => {
    const error = errorOf(() =>
      reviseRecord(original(), { raw: { kind: 'taps', timestamps_ms: [10_000, 11_118] } }, { ...ctx(T0, clock), reason: 'mis-tap' }),
    );
    expect(error.code).toBe('raw-immutable');
    expect(error.field).toBe('raw');
  });

  it('accepts a patch that repeats the raw capture unchanged', () => {
    const before = original();
    const after = reviseRecord(before, { raw: demo.drop().raw, note: 'clean drop' }, ctx(T0, clock));
    expect(after.note).toBe('clean drop');
  });

  it('returns the record itself when the patch changes nothing', () => {
    const before = original();
    expect(reviseRecord(before, { time_s: before.time_s }, ctx(T0, clock))).toBe(before);
  });

  it('validates the revised body and names the field', () => {
    const error = errorOf(() => reviseRecord(original(), { time_s: -1 }, { ...ctx(T0, clock), reason: 'typo' }));
    expect(error.code).toBe('record-invalid');
    expect(error.message).toContain('time_s: -1 is out of range');
  });

  it('refuses a patch that tries to change the envelope', () => {
    const error = errorOf(() => reviseRecord(original(), { id: 'x' } as never, ctx(T0, clock)));
    expect(error.code).toBe('record-invalid');
    expect((error as LogValidationError).problems[0]?.message).toBe('id: "x" is not a field of a drop');
  });

  it('stamps the revision after the record even when this device’s clock is behind', () => {
    const ahead = createRecord('drop', demo.drop(), { ...ctx(T0 + 3_600_000, new HybridLogicalClock(DEVICE)), random: counterRandom() });
    const revised = reviseRecord(ahead, { note: 'seen on a phone with a late clock' }, ctx(T0, new HybridLogicalClock(DEVICE)));
    expect(compareHlc(revised.rev, ahead.rev)).toBeGreaterThan(0);
  });

  it('refuses to revise a deleted record', () => {
    const gone = deleteRecord(original(), { ...ctx(T0, clock), reason: 'duplicate' });
    expect(errorOf(() => reviseRecord(gone, { note: 'x' }, ctx(T0, clock))).code).toBe('record-deleted');
  });
});

describe('deleteRecord', () => {
  const clock = new HybridLogicalClock(DEVICE);

  it('leaves a tombstone that keeps the body and the history', () => {
    const record = createRecord('drop', demo.drop(), { ...ctx(T0, clock), random: counterRandom() });
    const gone = deleteRecord(record, { ...ctx(T0 + 5, clock), reason: 'entered twice' });
    expect(gone.deleted).toBe(true);
    expect(bodyOf(gone)).toEqual(bodyOf(record));
    expect(gone.history).toEqual([
      { rev: record.rev, device: DEVICE, updated_at: record.updated_at, reason: 'entered twice', deleted: false, body: bodyOf(record) },
    ]);
  });

  it('needs a reason', () => {
    const record = createRecord('site', demo.site(), { ...ctx(T0, clock), random: counterRandom() });
    expect(errorOf(() => deleteRecord(record, { ...ctx(T0, clock), reason: '' })).code).toBe('reason-required');
  });

  it('leaves a tombstone as it is when deleted again', () => {
    const record = createRecord('site', demo.site(), { ...ctx(T0, clock), random: counterRandom() });
    const gone = deleteRecord(record, { ...ctx(T0, clock), reason: 'test entry' });
    expect(deleteRecord(gone, { ...ctx(T0, clock), reason: 'again' })).toBe(gone);
  });
});

describe('recordHistory', () => {
  it('lists every version oldest first, ending with the current one', () => {
    const clock = new HybridLogicalClock(DEVICE);
    const v1 = createRecord('drop', demo.drop(), { ...ctx(T0, clock), random: counterRandom() });
    const v2 = reviseRecord(v1, { note: 'gusty' }, ctx(T0 + 1000, clock));
    const v3 = reviseRecord(v2, { time_s: 1.119 }, { ...ctx(T0 + 2000, clock), reason: 'video check' });
    const v4 = deleteRecord(v3, { ...ctx(T0 + 3000, clock), reason: 'wrong series' });
    const versions = recordHistory(v4);
    expect(versions.map((v) => [v.body.note, v.body.time_s, v.deleted, v.reason])).toEqual([
      ['', 1.121, false, null],
      ['gusty', 1.121, false, 'video check'],
      ['gusty', 1.119, false, 'wrong series'],
      ['gusty', 1.119, true, null],
    ]);
    const revs = versions.map((v) => v.rev);
    expect([...revs].sort(compareHlc)).toEqual(revs);
    expect(new Set(revs).size).toBe(4);
  });
});
