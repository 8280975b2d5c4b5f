// No silent change: two copies of a record under one revision stamp with different bodies (a hand-edited
// export, a broken phone) are a conflict, both kept, never a quiet choice of one of them.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { canonicalJson } from '../../src/log/canonical';
import { exportLog } from '../../src/log/export';
import { readLogFile } from '../../src/log/export-parse';
import { addConflicts, conflictBetween, mergeLogs, mergeRecord, openConflicts, previewMerge } from '../../src/log/merge';
import type { DropRecord, LogRecord } from '../../src/log/types';
import { byKind, revise, sampleLog, tombstone } from '../sync/sample-log';

const T = Date.UTC(2026, 6, 1, 10, 0, 0);
const log = sampleLog({ days: 1, seriesPerDay: 1, dropsPerSeries: 2 });
const drop = { ...byKind(log, 'drop')[0]!, time_s: 2.511 } as DropRecord;
const text = (records: readonly LogRecord[]) => canonicalJson([...records].sort((a, b) => (a.id < b.id ? -1 : 1)));
/** The same record with one body field changed and nothing else: its stamp, device and times as they were. */
const handEdited = <R extends LogRecord>(record: R, change: Partial<R>): R => ({ ...record, ...change });

describe('the same stamp with a different body', () => {
  const tampered = handEdited(drop, { time_s: 2511 });

  it('keeps both versions: 2.511 s does not become 2511 s without a trace', () => {
    for (const merged of [mergeRecord(drop, tampered), mergeRecord(tampered, drop)]) {
      const times = [merged.time_s, ...merged.history.map((h) => (h.body as { time_s: number }).time_s)];
      expect(times.sort()).toEqual([2.511, 2511].sort());
      expect(merged.history.filter((h) => h.rev === drop.rev)).toHaveLength(1);
    }
    // Which one is current is a fixed rule, the same on every phone.
    expect(canonicalJson(mergeRecord(drop, tampered))).toBe(canonicalJson(mergeRecord(tampered, drop)));
  });

  it('is listed as a conflict about a measured value, whichever side brings the changed copy', () => {
    for (const [local, incoming] of [
      [drop, tampered],
      [tampered, drop],
    ] as const) {
      const preview = previewMerge([local], [incoming]);
      expect(preview.conflicts).toHaveLength(1);
      expect(preview.conflicts[0]).toMatchObject({ id: drop.id, kind: 'drop', fields: ['time_s'], measured: true, kept_rev: drop.rev, other_rev: drop.rev, same_stamp: true });
      expect(preview.updated).toHaveLength(1);
    }
  });

  it('is reported once: merging the same file again finds nothing new, and the list holds it once', () => {
    const first = previewMerge([drop], [tampered]);
    const after = first.changes[0]!;
    expect(previewMerge([after], [tampered]).conflicts).toEqual([]);
    expect(previewMerge([after], [drop]).conflicts).toEqual([]);
    expect(previewMerge([after], [tampered]).changes).toEqual([]);
    expect(addConflicts(first.conflicts, first.conflicts)).toEqual(first.conflicts);
    // Two different changed copies are two conflicts.
    const other = previewMerge([after], [handEdited(drop, { time_s: 25.11 })]);
    expect(addConflicts(first.conflicts, other.conflicts)).toHaveLength(2);
  });

  it('stays open until this phone edits the record', () => {
    const found = previewMerge([drop], [tampered]);
    expect(found.conflicts).toHaveLength(1);
    const merged = found.changes[0] as DropRecord;
    expect(openConflicts(found.conflicts, [merged], 'phoneA')).toEqual(found.conflicts);
    const settled = revise(merged, { time_s: 2.511 }, T + 60_000, 'phoneA', 'the stopwatch read 2.511 s');
    expect(openConflicts(found.conflicts, [settled], 'phoneA')).toEqual([]);
  });

  it('survives an export and an import unchanged, both versions included', () => {
    const merged = mergeRecord(drop, tampered);
    expect(merged.history).toHaveLength(1);
    const back = readLogFile(exportLog([merged], { device: 'phoneA', app_version: '0.1.0' })).records[0]!;
    expect(canonicalJson(back)).toBe(canonicalJson(merged));
    expect(mergeRecord(back, drop)).toEqual(merged);
  });

  it('finds a changed earlier version too (a history entry edited under its stamp)', () => {
    const v2 = revise(drop, { note: 'wet' }, T, 'phoneA', null);
    const edited = handEdited(v2, { history: [{ ...v2.history[0]!, body: { ...v2.history[0]!.body, time_s: 2511 } }] } as Partial<DropRecord>);
    const preview = previewMerge([v2], [edited]);
    expect(preview.conflicts).toHaveLength(1);
    expect(preview.conflicts[0]).toMatchObject({ other_rev: drop.rev, fields: ['time_s'], same_stamp: true });
    const merged = preview.changes[0]!;
    expect(merged.history.filter((h) => h.rev === drop.rev)).toHaveLength(2);
  });
});

// The merge properties, with copies of versions whose body was changed under the same stamp mixed in.
interface Op {
  record: number;
  from: number;
  device: number;
  kind: 'note' | 'time' | 'delete' | 'tamper';
}
const opArb = fc.record({
  record: fc.nat({ max: 2 }),
  from: fc.nat(),
  device: fc.nat({ max: 2 }),
  kind: fc.constantFrom<Op['kind']>('note', 'time', 'delete', 'tamper'),
});

function universe(ops: Op[]): DropRecord[][] {
  const versions = byKind(log, 'drop')
    .slice(0, 2)
    .concat(byKind(sampleLog({ seed: 5, days: 1, seriesPerDay: 1, dropsPerSeries: 1 }), 'drop'))
    .map((d) => [d]);
  ops.forEach((op, i) => {
    const chain = versions[op.record]!;
    const base = chain[op.from % chain.length]!;
    const ms = T + i * 1000;
    const device = ['phoneA', 'phoneB', 'phoneC'][op.device]!;
    const next =
      op.kind === 'tamper'
        ? handEdited(base, { time_s: base.time_s * 1000 })
        : op.kind === 'delete'
          ? tombstone(base, ms, device)
          : op.kind === 'time'
            ? revise(base, { time_s: 1.6 + i / 1000 }, ms, device, `retimed ${i}`)
            : revise(base, { note: `note ${i}` }, ms, device, null);
    chain.push(next);
  });
  return versions;
}
const replicaArb = fc.array(fc.option(fc.nat(), { nil: undefined }), { minLength: 3, maxLength: 3 });
const replica = (versions: DropRecord[][], picks: (number | undefined)[]): LogRecord[] =>
  picks.flatMap((p, i) => (p === undefined ? [] : [versions[i]![p % versions[i]!.length]!]));
const world = fc.tuple(fc.array(opArb, { maxLength: 12 }), replicaArb, replicaArb, replicaArb);

describe('merging with bodies that differ under one stamp (fast-check properties)', () => {
  it('is commutative, associative and idempotent', () => {
    fc.assert(
      fc.property(world, ([ops, pa, pb, pc]) => {
        const u = universe(ops);
        const [a, b, c] = [replica(u, pa), replica(u, pb), replica(u, pc)];
        expect(text(mergeLogs(a, b))).toBe(text(mergeLogs(b, a)));
        expect(text(mergeLogs(mergeLogs(a, b), c))).toBe(text(mergeLogs(a, mergeLogs(b, c))));
        expect(text(mergeLogs(a, a))).toBe(text(mergeLogs(a, [])));
        const ab = mergeLogs(a, b);
        expect(text(mergeLogs(ab, b))).toBe(text(ab));
        expect(previewMerge(ab, b).changes).toEqual([]);
      }),
      { numRuns: 300, seed: 1313 },
    );
  });

  it('never loses a body: every (stamp, body) either side held is in the merged record', () => {
    fc.assert(
      fc.property(world, ([ops, pa, pb]) => {
        const u = universe(ops);
        const [a, b] = [replica(u, pa), replica(u, pb)];
        const merged = new Map(mergeLogs(a, b).map((r) => [r.id, r]));
        const versionsOf = (r: LogRecord) => {
          const { history, ...rest } = r as LogRecord & Record<string, unknown>;
          const current = canonicalJson({ rev: rest.rev, t: (rest as { time_s: number }).time_s, d: rest.deleted });
          return [current, ...history.map((h) => canonicalJson({ rev: h.rev, t: (h.body as { time_s: number }).time_s, d: h.deleted }))];
        };
        for (const r of [...a, ...b]) {
          const held = new Set(versionsOf(merged.get(r.id)!));
          for (const v of versionsOf(r)) expect(held.has(v)).toBe(true);
        }
      }),
      { numRuns: 300, seed: 1313 },
    );
  });

  it('reports a conflict whenever an import brings a body the phone did not hold under a stamp it did', () => {
    fc.assert(
      fc.property(world, ([ops, pa, pb]) => {
        const u = universe(ops);
        const [a, b] = [replica(u, pa), replica(u, pb)];
        const preview = previewMerge(a, b);
        for (const incoming of b) {
          const local = a.find((r) => r.id === incoming.id);
          if (!local) continue;
          const bodies = (r: LogRecord) => new Map([[r.rev, canonicalJson((r as DropRecord).time_s)], ...r.history.map((h) => [h.rev, canonicalJson((h.body as DropRecord).time_s)] as const)]);
          const mine = bodies(local);
          const clash = [...bodies(incoming)].some(([rev, body]) => mine.has(rev) && mine.get(rev) !== body);
          if (clash) expect(preview.conflicts.some((c) => c.id === incoming.id)).toBe(true);
        }
        expect(conflictBetween(a[0] ?? (log[0] as LogRecord), a[0] ?? (log[0] as LogRecord))).toBeNull();
      }),
      { numRuns: 300, seed: 1313 },
    );
  });
});

describe('the order of a record’s versions at the gate', () => {
  it('refuses a history entry newer than the current version, or one that would win under the same stamp', async () => {
    const { validateRecord } = await import('../../src/log/validate');
    const v2 = revise(drop, { note: 'wet' }, T, 'phoneA', null);
    expect(validateRecord(v2)).toEqual([]);
    expect(validateRecord(mergeRecord(drop, handEdited(drop, { time_s: 2511 })))).toEqual([]);
    const future = handEdited(v2, { history: [{ ...v2.history[0]!, rev: `002000000000000-000000-${v2.history[0]!.device}` }] } as Partial<DropRecord>);
    expect(validateRecord(future).map((p) => p.path)).toEqual(['history[0].rev']);
    // The merge puts the body that sorts first under the stamp current; the same pair the other way round is refused.
    const merged = mergeRecord(drop, handEdited(drop, { time_s: 2511 })) as DropRecord;
    const loser = merged.history[0]!;
    const swapped = {
      ...merged,
      ...loser.body,
      history: [{ ...loser, body: { ...loser.body, time_s: merged.time_s } }],
    } as LogRecord;
    expect(validateRecord(swapped).map((p) => p.path)).toEqual(['history[0].rev']);
  });
});
