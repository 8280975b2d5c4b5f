// A deletion travels as a tombstone whose reason is kept with the version it replaced. A tombstone that
// arrives without any reason is refused at the gate, naming the record, the field and the rule.
import { describe, expect, it } from 'vitest';
import { exportLog } from '../../src/log/export';
import { readLogFile } from '../../src/log/export-parse';
import { validateRecord } from '../../src/log/validate';
import type { LogRecord } from '../../src/log/types';
import { byKind, revise, sampleLog, tombstone } from '../sync/sample-log';

const T = Date.UTC(2026, 6, 1, 10, 0, 0);
const drop = byKind(sampleLog({ days: 1, seriesPerDay: 1, dropsPerSeries: 1 }), 'drop')[0]!;
const file = (records: LogRecord[]) => exportLog(records, { device: 'phoneB', app_version: '0.1.0' });
const errorOf = (fn: () => unknown) => {
  try {
    fn();
  } catch (e) {
    return e as Error & { field: unknown; allowed: unknown };
  }
  throw new Error('expected a refusal');
};

describe('a deletion without a reason', () => {
  it('is refused when the tombstone has no earlier version at all', () => {
    const bare = { ...drop, deleted: true } as LogRecord;
    const error = errorOf(() => readLogFile(file([bare])));
    expect(error.field).toBe('records[0].deleted');
    expect(error.message).toContain(`drop ${drop.id}`);
    expect(error.message).toMatch(/deletion needs a reason/);
  });

  it('is refused when the version it replaced carries no reason', () => {
    const silent = revise(drop, { deleted: true } as never, T, 'phoneB', null);
    const error = errorOf(() => readLogFile(file([silent])));
    expect(error.field).toBe('records[0].deleted');
    expect(error.allowed).toMatch(/reason/);
    // A blank reason is no reason either.
    expect(validateRecord(revise(drop, { deleted: true } as never, T, 'phoneB', '   ')).map((p) => p.path)).toEqual(['deleted']);
  });

  it('is refused in the history too: a deleted earlier version needs its reason', () => {
    const silent = revise(drop, { deleted: true } as never, T, 'phoneB', null);
    const restored = revise(silent, { deleted: false } as never, T + 1000, 'phoneA', 'deleted by mistake');
    expect(validateRecord(restored).map((p) => p.path)).toEqual(['history[1].deleted']);
  });

  it('lets a deletion with its reason through, also after it was merged with a concurrent edit', () => {
    const gone = tombstone(drop, T, 'phoneB');
    expect(readLogFile(file([gone])).records).toHaveLength(1);
    const edited = revise(drop, { note: 'wet' }, T - 1000, 'phoneA', null);
    const both = { ...gone, history: [...gone.history, { rev: edited.rev, device: 'phoneA', updated_at: edited.updated_at, reason: null, deleted: false, body: { ...gone.history[0]!.body, note: 'wet' } }] } as LogRecord;
    expect(validateRecord(both)).toEqual([]);
  });
});
