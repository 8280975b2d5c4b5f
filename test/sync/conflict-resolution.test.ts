// A conflict is settled by a person who says why: the reason is kept with the record's id and the versions.
import { describe, expect, it } from 'vitest';
import { exportLog } from '../../src/log/export';
import type { DropRecord } from '../../src/log/types';
import { applyImport, dismissConflict, loadConflicts, previewImport } from '../../src/sync/import-log';
import { MemoryRecordSource } from './memory-record-source';
import { byKind, sampleLog } from './sample-log';

const drop = { ...byKind(sampleLog({ days: 1, seriesPerDay: 1, dropsPerSeries: 1 }), 'drop')[0]!, time_s: 2.511 } as DropRecord;

describe('settling a conflict', () => {
  it('needs a reason, and keeps it', async () => {
    const source = new MemoryRecordSource('phoneA', [drop]);
    const tampered = { ...drop, time_s: 2511 } as DropRecord;
    const { file } = await previewImport(source, exportLog([tampered], { device: 'phoneB', app_version: '0.1.0' }));
    const done = await applyImport(source, file);
    expect(done.conflicts).toHaveLength(1);
    const [c] = await loadConflicts(source);
    const settle = (reason: string) => dismissConflict(source, c!.id, c!.other_rev, reason, Date.UTC(2026, 6, 2), c!.other_version);
    await expect(settle('  ')).rejects.toMatchObject({ field: 'reason' });
    expect(await loadConflicts(source)).toHaveLength(1);
    await settle('2.511 s is what the stopwatch showed; 2511 was a typing slip in the office');
    expect(await loadConflicts(source)).toEqual([]);
    expect(await source.getMeta('log_conflicts_settled')).toEqual([
      { conflict: c, reason: '2.511 s is what the stopwatch showed; 2511 was a typing slip in the office', settled_at: '2026-07-02T00:00:00.000Z', device: 'phoneA' },
    ]);
  });
});
