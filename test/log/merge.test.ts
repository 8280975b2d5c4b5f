import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { addConflicts, conflictBetween, mergeLogs, mergeRecord, openConflicts, previewMerge } from '../../src/log/merge';
import { canonicalJson } from '../../src/log/canonical';
import { exportLog } from '../../src/log/export';
import { readLogFile } from '../../src/log/export-parse';
import { byKind, revise, sampleLog, tombstone } from '../sync/sample-log';
import type { DropRecord, LogRecord } from '../../src/log/types';

const T = Date.UTC(2026, 6, 1, 10, 0, 0);
const log = sampleLog({ days: 1, seriesPerDay: 2, dropsPerSeries: 3 });
const drop = byKind(log, 'drop')[0]!;
const text = (records: readonly LogRecord[]) => canonicalJson([...records].sort((a, b) => (a.id < b.id ? -1 : 1)));

describe('merging one record', () => {
  it('takes the newer revision by its clock stamp, whichever side it is on', () => {
    const newer = revise(drop, { time_s: 1.7 }, T, 'phoneB', 'misread');
    expect(mergeRecord(drop, newer)).toEqual(newer);
    expect(mergeRecord(newer, drop)).toEqual(newer);
  });

  it('lets a deletion (tombstone) win over the older live version', () => {
    const gone = tombstone(drop, T, 'phoneB');
    expect(mergeRecord(drop, gone).deleted).toBe(true);
    expect(mergeRecord(gone, drop).deleted).toBe(true);
  });

  it('lets a later edit win over an earlier deletion it has seen', () => {
    const gone = tombstone(drop, T, 'phoneB');
    const restored = revise(gone, { deleted: false } as Partial<DropRecord>, T + 5000, 'phoneA', 'deleted by mistake');
    expect(mergeRecord(gone, restored).deleted).toBe(false);
  });

  it('keeps the losing side of two edits from a common earlier revision in the history', () => {
    const onA = revise(drop, { time_s: 1.7 }, T, 'phoneA', 'retimed from video');
    const onB = revise(drop, { time_s: 1.71 }, T + 1, 'phoneB', 'retyped');
    const merged = mergeRecord(onA, onB);
    expect(merged.rev).toBe(onB.rev);
    expect(merged.time_s).toBe(1.71);
    expect(merged.history.map((h) => h.rev)).toEqual([drop.rev, onA.rev]);
    expect(merged.history[1]!.body).toMatchObject({ time_s: 1.7 });
  });

  it('unions the histories, oldest first, without repeating a version', () => {
    const v1 = revise(drop, { note: 'gusty' }, T, 'phoneA', null);
    const v2 = revise(v1, { note: 'gusty, paused' }, T + 1000, 'phoneA', null);
    const merged = mergeRecord(v1, v2);
    expect(merged.history.map((h) => h.rev)).toEqual([drop.rev, v1.rev]);
  });

  it('prefers the copy of an old version that carries the reason it was replaced', () => {
    const onA = revise(drop, { time_s: 1.7 }, T, 'phoneA', 'retimed');
    const later = revise(onA, { time_s: 1.69 }, T + 2000, 'phoneA', 'checked the video again');
    const onB = revise(drop, { note: 'wet' }, T + 1000, 'phoneB', null);
    // onB holds onA only as a losing concurrent version (reason null); `later` holds it with its reason.
    const viaB = mergeRecord(onA, onB);
    const merged = mergeRecord(viaB, later);
    expect(merged.history.find((h) => h.rev === onA.rev)!.reason).toBe('checked the video again');
  });
});

describe('the preview of an import', () => {
  it('says what would be added, updated and left as it is, before anything is written', () => {
    const local = log.slice(0, log.length - 2);
    const changed = revise(byKind(local, 'drop')[0]!, { note: 'gusty' }, T, 'phoneB', null);
    const incoming = log.map((r) => (r.id === changed.id ? changed : r));
    const preview = previewMerge(local, incoming);
    expect(preview.added.map((r) => r.id)).toEqual(log.slice(-2).map((r) => r.id));
    expect(preview.updated.map((u) => u.after.id)).toEqual([changed.id]);
    expect(preview.updated[0]!.before).toBe(local.find((r) => r.id === changed.id));
    expect(preview.unchanged).toBe(local.length - 1);
    expect(preview.conflicts).toEqual([]);
    expect(preview.changes).toHaveLength(3);
  });

  it('shows a real conflict: the same measured value edited on two phones', () => {
    const onA = revise(drop, { time_s: 1.7 }, T, 'phoneA', 'retimed from video');
    const onB = revise(drop, { time_s: 1.71 }, T + 1, 'phoneB', 'retyped');
    const preview = previewMerge([onA], [onB]);
    expect(preview.conflicts).toEqual([
      {
        id: drop.id,
        kind: 'drop',
        kept_rev: onB.rev,
        kept_device: 'phoneB',
        other_rev: onA.rev,
        other_device: 'phoneA',
        fields: ['time_s'],
        measured: true,
      },
    ]);
    expect(preview.updated).toHaveLength(1);
  });

  it('shows a conflict when the local side wins too, and keeps the other side in the history', () => {
    const onA = revise(drop, { time_s: 1.7 }, T + 9, 'phoneA', 'retimed');
    const onB = revise(drop, { time_s: 1.71 }, T, 'phoneB', 'retyped');
    const preview = previewMerge([onA], [onB]);
    expect(preview.conflicts[0]).toMatchObject({ kept_rev: onA.rev, other_rev: onB.rev });
    expect((preview.updated[0]!.after as DropRecord).time_s).toBe(1.7);
    expect(preview.updated[0]!.after.history.map((h) => h.rev)).toContain(onB.rev);
  });

  it('calls concurrent edits of notes a conflict that is not about a measured value', () => {
    const onA = revise(drop, { note: 'windy' }, T, 'phoneA', null);
    const onB = revise(drop, { note: 'calm' }, T + 1, 'phoneB', null);
    expect(conflictBetween(onA, onB)).toMatchObject({ fields: ['note'], measured: false });
  });

  it('counts a deletion on one phone against an edit on another as a conflict', () => {
    const onA = revise(drop, { time_s: 1.7 }, T, 'phoneA', 'retimed');
    const onB = tombstone(drop, T + 1, 'phoneB');
    expect(conflictBetween(onA, onB)).toMatchObject({ fields: ['deleted', 'time_s'], measured: true });
  });

  it('sees no conflict when one version was made from the other', () => {
    const v1 = revise(drop, { time_s: 1.7 }, T, 'phoneA', 'retimed');
    const v2 = revise(v1, { time_s: 1.69 }, T + 1, 'phoneB', 'again');
    expect(conflictBetween(v1, v2)).toBeNull();
    expect(conflictBetween(v2, v1)).toBeNull();
    expect(conflictBetween(v1, v1)).toBeNull();
  });

  it('sees no conflict when both phones made the very same change', () => {
    const onA = revise(drop, { time_s: 1.7 }, T, 'phoneA', 'retimed');
    const onB = revise(drop, { time_s: 1.7 }, T + 1, 'phoneB', 'retimed');
    expect(conflictBetween(onA, onB)).toBeNull();
  });
});

describe('the list of conflicts a phone shows', () => {
  const onA = revise(drop, { time_s: 1.7 }, T, 'phoneA', 'retimed');
  const onB = revise(drop, { time_s: 1.71 }, T + 1, 'phoneB', 'retyped');
  const found = conflictBetween(onA, onB)!;

  it('holds each conflict once however often it is found', () => {
    expect(addConflicts(addConflicts([], [found]), [found])).toEqual([found]);
  });

  it('stays open after the record moves on elsewhere, until this phone edits the record', () => {
    const merged = mergeRecord(onA, onB);
    const later = revise(merged, { note: 'x' }, T + 5000, 'phoneC', null);
    expect(openConflicts([found], [later], 'phoneA')).toEqual([found]);
    const resolved = revise(merged, { time_s: 1.705 }, T + 6000, 'phoneA', 'agreed with phone B');
    expect(openConflicts([found], [resolved], 'phoneA')).toEqual([]);
  });
});

// Property tests: a random history of edits, deletions and copies on three phones.
interface Op {
  record: number;
  from: number;
  device: number;
  kind: 'note' | 'time' | 'delete';
}
const opArb = fc.record({
  record: fc.nat({ max: 3 }),
  from: fc.nat(),
  device: fc.nat({ max: 2 }),
  kind: fc.constantFrom<'note' | 'time' | 'delete'>('note', 'time', 'delete'),
});

/** Every version of four drops that a sequence of edits makes, each made from an earlier version. */
function universe(ops: Op[]): DropRecord[][] {
  const drops = byKind(log, 'drop').slice(0, 4);
  const versions = drops.map((d) => [d]);
  ops.forEach((op, i) => {
    const chain = versions[op.record]!;
    const base = chain[op.from % chain.length]!;
    const ms = T + i * 1000;
    const device = ['phoneA', 'phoneB', 'phoneC'][op.device]!;
    const next =
      op.kind === 'delete'
        ? tombstone(base, ms, device)
        : op.kind === 'time'
          ? revise(base, { time_s: 1.6 + i / 1000 }, ms, device, `retimed ${i}`)
          : revise(base, { note: `note ${i}` }, ms, device, null);
    chain.push(next);
  });
  return versions;
}

/** A phone's log: for each drop, one of its versions (or none). */
const replicaArb = fc.array(fc.option(fc.nat(), { nil: undefined }), { minLength: 4, maxLength: 4 });

function replica(versions: DropRecord[][], picks: (number | undefined)[]): LogRecord[] {
  return picks.flatMap((p, i) => (p === undefined ? [] : [versions[i]![p % versions[i]!.length]!]));
}

describe('merging logs (fast-check properties)', () => {
  const world = fc.tuple(fc.array(opArb, { maxLength: 12 }), replicaArb, replicaArb, replicaArb);

  it('is commutative: A merged with B equals B merged with A', () => {
    fc.assert(
      fc.property(world, ([ops, pa, pb]) => {
        const u = universe(ops);
        const [a, b] = [replica(u, pa), replica(u, pb)];
        expect(text(mergeLogs(a, b))).toBe(text(mergeLogs(b, a)));
      }),
      { numRuns: 300 },
    );
  });

  it('is associative: (A with B) with C equals A with (B with C)', () => {
    fc.assert(
      fc.property(world, ([ops, pa, pb, pc]) => {
        const u = universe(ops);
        const [a, b, c] = [replica(u, pa), replica(u, pb), replica(u, pc)];
        expect(text(mergeLogs(mergeLogs(a, b), c))).toBe(text(mergeLogs(a, mergeLogs(b, c))));
      }),
      { numRuns: 300 },
    );
  });

  it('is idempotent: merging a log with itself, or again with what it already merged, changes nothing', () => {
    fc.assert(
      fc.property(world, ([ops, pa, pb]) => {
        const u = universe(ops);
        const [a, b] = [replica(u, pa), replica(u, pb)];
        expect(text(mergeLogs(a, a))).toBe(text(a));
        const ab = mergeLogs(a, b);
        expect(text(mergeLogs(ab, b))).toBe(text(ab));
        expect(previewMerge(ab, b).changes).toEqual([]);
      }),
      { numRuns: 300 },
    );
  });

  it('never loses a version: every version either side held is the current one or in the history', () => {
    fc.assert(
      fc.property(world, ([ops, pa, pb]) => {
        const u = universe(ops);
        const [a, b] = [replica(u, pa), replica(u, pb)];
        const merged = new Map(mergeLogs(a, b).map((r) => [r.id, r]));
        for (const r of [...a, ...b]) {
          const m = merged.get(r.id)!;
          const revs = new Set([m.rev, ...m.history.map((h) => h.rev)]);
          for (const rev of [r.rev, ...r.history.map((h) => h.rev)]) expect(revs.has(rev)).toBe(true);
        }
      }),
      { numRuns: 300 },
    );
  });

  it('gives back every record byte for byte after an export and an import into an empty log', () => {
    fc.assert(
      fc.property(world, ([ops, pa]) => {
        const u = universe(ops);
        const records = [...log.filter((r) => r.kind !== 'drop'), ...replica(u, pa)];
        const imported = readLogFile(exportLog(records, { device: 'phoneA', app_version: '0.1.0' })).records;
        const preview = previewMerge([], imported);
        expect(preview.added).toHaveLength(records.length);
        expect(text(preview.changes)).toBe(text(records));
        for (const r of records) {
          expect(canonicalJson(preview.changes.find((x) => x.id === r.id))).toBe(canonicalJson(r));
        }
      }),
      { numRuns: 100 },
    );
  });
});
