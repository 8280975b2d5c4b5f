// Two phones change one record without seeing each other's change (a crossing), then exchange copies: the
// first to send sends its bare version, the other sends back the merge of both. Each phone's clock is set by
// hand (a wall time per change), so which version wins is chosen by the test, never by the machine's timing.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { bodyOf, createRecord, deleteRecord, restoreRecord, reviseRecord, sameValue } from '../../src/log/records';
import { addConflicts, crossingsInMerge, mergeRecord, previewMerge, type Conflict } from '../../src/log/merge';
import { compareHlc, HybridLogicalClock } from '../../src/log/hlc';
import type { DropRecord } from '../../src/log/types';
import * as demo from './demo-bodies';

const ONE = 'aaaaaaaaaaaaaaa1';
const TWO = 'bbbbbbbbbbbbbbb2';
const T0 = Date.UTC(2026, 5, 14, 9);

interface Phone {
  device: string;
  clock: HybridLogicalClock;
  copy: DropRecord;
  conflicts: Conflict[];
}

const base = (): DropRecord => createRecord('drop', demo.drop(), { device: ONE, clock: new HybridLogicalClock(ONE), now: T0, random: (b: Uint8Array) => b.fill(7) });

/** Both phones hold the record as phone one created it; each clock has seen its stamp. */
function twoPhones(original = base()): [Phone, Phone] {
  const make = (device: string): Phone => {
    const clock = new HybridLogicalClock(device);
    clock.receive(original.rev, T0);
    return { device, clock, copy: original, conflicts: [] };
  };
  return [make(ONE), make(TWO)];
}

/** What a phone does to its copy, at the wall time given. */
type Change = (phone: Phone, now: number) => DropRecord;
const remove: Change = (p, now) => deleteRecord(p.copy, { device: p.device, clock: p.clock, now, reason: 'wrong series' });
const correct: Change = (p, now) => reviseRecord(p.copy, { time_s: 1.221 }, { device: p.device, clock: p.clock, now, reason: 'typed 1.121 for 1.221' });
const correctOtherwise: Change = (p, now) => reviseRecord(p.copy, { time_s: 1.131 }, { device: p.device, clock: p.clock, now, reason: 'the video says 1.131 s' });
const exclude: Change = (p, now) => reviseRecord(p.copy, { excluded: true, exclusion_reason: 'ball hit the railing' }, { device: p.device, clock: p.clock, now, reason: 'ball hit the railing' });
const noteEdit: Change = (p, now) => reviseRecord(p.copy, { note: 'gusty' }, { device: p.device, clock: p.clock, now });
const otherNoteEdit: Change = (p, now) => reviseRecord(p.copy, { note: 'sun in the eyes' }, { device: p.device, clock: p.clock, now });

/** A copy arrives as the sync and the Send screen take it in: preview, conflicts kept, merged copy stored. */
function receive(phone: Phone, incoming: DropRecord): void {
  const preview = previewMerge([phone.copy], [incoming]);
  phone.conflicts = addConflicts(phone.conflicts, preview.conflicts);
  phone.copy = (preview.changes[0] as DropRecord | undefined) ?? phone.copy;
  phone.clock.receive(phone.copy.rev, T0);
}

/**
 * Phone one makes `first` at T0 + `oneAt` ms, phone two makes `second` at T0 + `twoAt` ms, neither knowing the
 * other's; then `sender` sends its bare version and the other phone answers with its merged copy.
 */
function cross(first: Change, second: Change, oneAt: number, twoAt: number, sender: 'one' | 'two') {
  const [one, two] = twoPhones();
  one.copy = first(one, T0 + oneAt);
  two.copy = second(two, T0 + twoAt);
  const made = { one: one.copy, two: two.copy };
  const [from, to] = sender === 'one' ? [one, two] : [two, one];
  receive(to, from.copy);
  receive(from, to.copy);
  const [newer, older] = compareHlc(made.one.rev, made.two.rev) > 0 ? [made.one, made.two] : [made.two, made.one];
  return { one, two, newer, older, direct: to, back: from };
}

const ORDERS = [
  ['phone one ahead', 20_000, 10_000],
  ['phone two ahead', 10_000, 20_000],
  ['both clocks at the same millisecond', 15_000, 15_000],
] as const;
const SENDERS = ['one', 'two'] as const;

describe.each([
  ['a removal', 'a correction', remove, correct, ['deleted', 'time_s']],
  ['a removal', 'an edit of the note', remove, noteEdit, ['deleted', 'note']],
  ['a removal', 'an exclusion', remove, exclude, ['deleted', 'excluded', 'exclusion_reason']],
  ['a correction', 'an edit of the note', correct, noteEdit, ['note', 'time_s']],
  ['a correction', 'another correction', correct, correctOtherwise, ['time_s']],
] as const)('%s on one phone crossing %s on the other', (_a, _b, first, second, fields) => {
  for (const [clocks, oneAt, twoAt] of ORDERS) {
    for (const sender of SENDERS) {
      it(`is listed on both phones (${clocks}, phone ${sender} sends first)`, () => {
        const { one, two, newer, older } = cross(first, second, oneAt, twoAt, sender);
        expect(one.copy).toEqual(two.copy);
        expect(one.copy.rev).toBe(newer.rev);
        for (const phone of [one, two]) {
          expect(phone.conflicts, phone.device).toEqual([
            { id: newer.id, kind: 'drop', kept_rev: newer.rev, kept_device: newer.device, other_rev: older.rev, other_device: older.device, fields: [...fields], measured: true },
          ]);
        }
      });
    }
  }

  it('is listed once however often the copies go back and forth', () => {
    const { one, two } = cross(first, second, 20_000, 10_000, 'two');
    const listed = [one.conflicts, two.conflicts];
    receive(one, two.copy);
    receive(two, one.copy);
    receive(one, two.copy);
    expect([one.conflicts, two.conflicts]).toEqual(listed);
  });
});

describe('the crossing found inside a merged copy (crossingsInMerge)', () => {
  it('on the phone whose removal stayed current: the correction that came only inside the copy', () => {
    // The case that used to go unlisted: phone one's clock ahead, phone two merges first and sends the merge back.
    const [one, two] = twoPhones();
    const fixed = correct(two, T0 + 1000);
    const removed = remove(one, T0 + 2000);
    const merged = mergeRecord(fixed, removed);
    expect(merged.rev).toBe(removed.rev);
    expect(crossingsInMerge(removed, merged)).toEqual([expect.objectContaining({ kept_rev: removed.rev, other_rev: fixed.rev, other_device: TWO, fields: ['deleted', 'time_s'] })]);
  });

  it('on the phone whose correction was buried by a removal it never saw', () => {
    const [one, two] = twoPhones();
    const fixed = correct(two, T0 + 1000);
    const removed = remove(one, T0 + 2000);
    expect(crossingsInMerge(fixed, mergeRecord(removed, fixed))).toEqual([expect.objectContaining({ kept_rev: removed.rev, other_rev: fixed.rev })]);
  });

  it('lists one crossing for each other phone, against its newest version', () => {
    const original = base();
    const [one, two] = twoPhones(original);
    const three: Phone = { device: 'ccccccccccccccc3', clock: new HybridLogicalClock('ccccccccccccccc3'), copy: original, conflicts: [] };
    const noted = noteEdit(two, T0 + 1000);
    two.copy = noted;
    const fixedAfter = correct(two, T0 + 2000);
    const excluded = exclude(three, T0 + 3000);
    const removed = remove(one, T0 + 9000);
    const fromOthers = mergeRecord(mergeRecord(fixedAfter, excluded), removed);
    const found = crossingsInMerge(removed, fromOthers);
    expect(found.map((c) => [c.other_device, c.other_rev])).toEqual([
      [TWO, fixedAfter.rev],
      ['ccccccccccccccc3', excluded.rev],
    ]);
    expect(found.every((c) => c.kept_rev === removed.rev)).toBe(true);
  });

  it('lists nothing when the versions agree', () => {
    const [one, two] = twoPhones();
    const a = correct(one, T0 + 2000);
    const b = correct(two, T0 + 1000);
    expect(previewMerge([a], [b]).conflicts).toEqual([]);
    expect(crossingsInMerge(a, mergeRecord(a, b))).toEqual([]);
    expect(crossingsInMerge(b, mergeRecord(a, b))).toEqual([]);
  });
});

describe('changes that saw each other are no crossing', () => {
  it('a restore made knowing the removal, and a removal made knowing the edit', () => {
    const [one, two] = twoPhones();
    const removed = remove(one, T0 + 30_000);
    receive(two, removed);
    const back = restoreRecord(two.copy, { device: TWO, clock: two.clock, now: T0 + 40_000, reason: 'right series after all' });
    expect(crossingsInMerge(removed, back)).toEqual([]);
    expect(previewMerge([removed], [back]).conflicts).toEqual([]);
    expect(two.conflicts).toEqual([]);
  });

  it('a removal made after the edit it received, even with its own clock behind', () => {
    const [one, two] = twoPhones();
    one.copy = noteEdit(one, T0 + 50_000);
    receive(two, one.copy);
    two.copy = remove(two, T0 + 1000);
    receive(one, two.copy);
    expect([one.conflicts, two.conflicts]).toEqual([[], []]);
    expect(one.copy.deleted).toBe(true);
  });

  it('a correction made after a note edit it received, sent back and forth', () => {
    const [one, two] = twoPhones();
    one.copy = noteEdit(one, T0 + 5000);
    receive(two, one.copy);
    two.copy = correct(two, T0 + 1000);
    receive(one, two.copy);
    receive(two, one.copy);
    expect([one.conflicts, two.conflicts]).toEqual([[], []]);
  });
});

describe('an edit crossing an edit of fields that need no reason', () => {
  for (const [clocks, oneAt, twoAt] of ORDERS) {
    for (const sender of SENDERS) {
      it(`is listed on the phone whose edit stays current and on the phone that received the other's own (${clocks}, phone ${sender} sends first)`, () => {
        const { one, two, newer, older, direct } = cross(noteEdit, otherNoteEdit, oneAt, twoAt, sender);
        const conflict = { id: newer.id, kind: 'drop', kept_rev: newer.rev, kept_device: newer.device, other_rev: older.rev, other_device: older.device, fields: ['note'], measured: false };
        expect(direct.conflicts).toEqual([conflict]);
        const winner = newer.device === ONE ? one : two;
        expect(winner.conflicts).toEqual([conflict]);
      });
    }
  }
});

// Any two crossing changes, any clocks, either phone first: after both have merged, both hold the same record,
// and the crossing is listed wherever the rule above promises it: on the phone that received the other's bare
// version, on the phone whose version stays current, and on both whenever the two differ in something that
// needs a reason.
describe('any two crossing changes', () => {
  const changes = { remove, correct, correctOtherwise, exclude, noteEdit, otherNoteEdit };
  const names = Object.keys(changes) as (keyof typeof changes)[];
  it('end equal on both phones, with the crossing listed where promised', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...names),
        fc.constantFrom(...names),
        fc.integer({ min: 0, max: 5000 }),
        fc.integer({ min: 0, max: 5000 }),
        fc.constantFrom(...SENDERS),
        (a, b, oneAt, twoAt, sender) => {
          const { one, two, newer, older, direct } = cross(changes[a], changes[b], oneAt, twoAt, sender);
          expect(one.copy).toEqual(two.copy);
          // Two phones that made the very same change have nothing to list.
          if (sameValue({ ...bodyOf(newer), deleted: newer.deleted }, { ...bodyOf(older), deleted: older.deleted })) {
            expect([one.conflicts, two.conflicts]).toEqual([[], []]);
            return;
          }
          const winner = newer.device === ONE ? one : two;
          const noReason = (name: string) => name === 'noteEdit' || name === 'otherNoteEdit';
          for (const p of [one, two]) {
            const promised = p === direct || p === winner || !(noReason(a) && noReason(b));
            const listed = p.conflicts.filter((c) => c.kept_rev === newer.rev && c.other_rev === older.rev);
            expect(listed, `phone ${p.device}`).toHaveLength(promised ? 1 : 0);
            expect(p.conflicts).toEqual(listed);
          }
        },
      ),
      { seed: 20260614, numRuns: 300 },
    );
  });
});

// Three phones changing one record and passing copies around in any order, with clocks up to a minute apart: every
// conflict a phone lists names as the other version one that really crossed another (neither maker held the
// other's version when making its own; the kept version is the current one, which may have come later, knowing
// both), and all phones agree once everyone has everyone's copy.
describe('any history of changes and exchanges between three phones', () => {
  type Op = { phone: number; to: number; change: 'note' | 'correct' | 'exclude' | 'remove' | 'restore' | 'send'; step: number };
  const op = fc.record({
    phone: fc.nat({ max: 2 }),
    to: fc.nat({ max: 2 }),
    change: fc.constantFrom<Op['change']>('note', 'correct', 'exclude', 'remove', 'restore', 'send', 'send'),
    step: fc.integer({ min: 0, max: 60_000 }),
  });
  it('lists only crossings that happened', () => {
    fc.assert(
      fc.property(fc.array(op, { minLength: 1, maxLength: 25 }), fc.array(fc.integer({ min: -60_000, max: 60_000 }), { minLength: 3, maxLength: 3 }), (ops, skews) => {
        const original = base();
        const devices = [ONE, TWO, 'ccccccccccccccc3'];
        const phones: Phone[] = devices.map((device) => {
          const clock = new HybridLogicalClock(device);
          clock.receive(original.rev, T0);
          return { device, clock, copy: original, conflicts: [] };
        });
        // For each version, the versions its maker held when making it.
        const held = new Map<string, Set<string>>([[original.rev, new Set()]]);
        const revsOf = (r: DropRecord) => new Set([r.rev, ...r.history.map((h) => h.rev)]);
        const crossedOne = (rev: string) => [...held.keys()].some((other) => other !== rev && !held.get(other)!.has(rev) && !held.get(rev)!.has(other));
        let now = T0;
        let n = 0;
        for (const o of ops) {
          now += o.step;
          const p = phones[o.phone]!;
          const at = now + skews[o.phone]!;
          const ctx = { device: p.device, clock: p.clock, now: at };
          if (o.change === 'send') {
            const before = p === phones[o.to] ? [] : phones[o.to]!.conflicts;
            receive(phones[o.to]!, p.copy);
            for (const c of phones[o.to]!.conflicts.filter((c) => !before.includes(c))) {
              expect(crossedOne(c.other_rev), `listed ${c.other_rev} (kept ${c.kept_rev}) on ${phones[o.to]!.device}`).toBe(true);
            }
            continue;
          }
          let next: DropRecord;
          if (o.change === 'restore') {
            if (!p.copy.deleted) continue;
            next = restoreRecord(p.copy, { ...ctx, reason: 'right series after all' });
          } else {
            if (p.copy.deleted) continue;
            n++;
            if (o.change === 'remove') next = deleteRecord(p.copy, { ...ctx, reason: `removed ${n}` });
            else if (o.change === 'note') next = reviseRecord(p.copy, { note: `note ${n}` }, ctx);
            else if (o.change === 'correct') next = reviseRecord(p.copy, { time_s: 1 + n / 1000 }, { ...ctx, reason: `correction ${n}` });
            else next = reviseRecord(p.copy, { excluded: !p.copy.excluded, exclusion_reason: p.copy.excluded ? null : `excluded ${n}` }, { ...ctx, reason: `exclusion ${n}` });
          }
          held.set(next.rev, revsOf(p.copy));
          p.copy = next;
        }
        // Everyone's copy to everyone: all phones hold the same record.
        for (const from of phones) for (const to of phones) if (from !== to) receive(to, from.copy);
        for (const from of phones) for (const to of phones) if (from !== to) receive(to, from.copy);
        expect(phones[1]!.copy).toEqual(phones[0]!.copy);
        expect(phones[2]!.copy).toEqual(phones[0]!.copy);
        for (const p of phones) {
          for (const c of p.conflicts) expect(crossedOne(c.other_rev), `${c.other_rev} (kept ${c.kept_rev}) on ${p.device}`).toBe(true);
        }
      }),
      { seed: 20261203, numRuns: 400 },
    );
  });
});
