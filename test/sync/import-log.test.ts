// Importing a file into a store: run against this folder's in-memory source and against the log store's own
// in-memory twin (src/store), which is what the app plugs in.
import { describe, expect, expectTypeOf, it } from 'vitest';
import { canonicalJson } from '../../src/log/canonical';
import { exportLog } from '../../src/log/export';
import { LogFileError } from '../../src/log/export-parse';
import type { DropRecord, LogRecord } from '../../src/log/types';
import type { PutRecordsOptions } from '../../src/log/transfer-progress';
import { applyImport, applyPreviewedImport, dismissConflict, loadConflicts, previewImport } from '../../src/sync/import-log';
import type { RecordSource } from '../../src/sync/record-source';
import { createMemoryStore, type LogStore } from '../../src/store';
import { MemoryRecordSource } from './memory-record-source';
import { byKind, revise, sampleLog } from './sample-log';

const T = Date.UTC(2026, 6, 1);
const META = { device: 'phoneB', app_version: '0.1.0' };
const sorted = (records: LogRecord[]) => [...records].sort((a, b) => (a.id < b.id ? -1 : 1));
const text = (records: LogRecord[]) => canonicalJson([...records].sort((a, b) => (a.id < b.id ? -1 : 1)));

it('the log store can be handed to sync and import as their RecordSource', () => {
  expectTypeOf<LogStore>().toMatchTypeOf<RecordSource>();
});

const sources: [string, (records: LogRecord[]) => Promise<RecordSource & { putCount(): number }>][] = [
  [
    'the in-memory record source',
    async (records) => {
      const s = new MemoryRecordSource('phoneA', records);
      return Object.assign(s, { putCount: () => s.putCalls });
    },
  ],
  [
    'the log store (memory twin)',
    async (records) => {
      const store = await createMemoryStore();
      if (records.length) await store.putRecords(records);
      let puts = 0;
      const putRecords = store.putRecords.bind(store);
      return Object.assign(store, {
        putRecords: async (r: LogRecord[], options?: PutRecordsOptions) => {
          puts++;
          await putRecords(r, options);
        },
        putCount: () => puts,
      }) as unknown as RecordSource & { putCount(): number };
    },
  ],
];

describe.each(sources)('importing a log file into %s', (_name, make) => {
  const log = sampleLog({ days: 1, seriesPerDay: 2, dropsPerSeries: 3 });

  it('gives back every record byte for byte after export and import into an empty store', async () => {
    const source = await make([]);
    const { file } = await previewImport(source, exportLog(log, META));
    await applyImport(source, file);
    const back = await source.allRecords({ includeDeleted: true });
    expect(text(back)).toBe(text(log));
  });

  it('previews without writing anything', async () => {
    const source = await make(log.slice(0, 5));
    const { preview } = await previewImport(source, exportLog(log, META));
    expect(preview.added).toHaveLength(log.length - 5);
    expect(preview.unchanged).toBe(5);
    expect(source.putCount()).toBe(0);
    expect(await source.allRecords({ includeDeleted: true })).toHaveLength(5);
  });

  it('writes all changes in one transaction, and nothing when nothing changes', async () => {
    const source = await make(log.slice(0, 5));
    const { file } = await previewImport(source, exportLog(log, META));
    await applyImport(source, file);
    expect(source.putCount()).toBe(1);
    await applyImport(source, file);
    expect(source.putCount()).toBe(1);
  });

  it('does not overwrite an edit made while the preview was shown', async () => {
    const source = await make(log);
    const drop = byKind(log, 'drop')[0]!;
    const incoming = log.map((r) => (r.id === drop.id ? revise(drop, { note: 'from B' }, T, 'phoneB', null) : r));
    const { file } = await previewImport(source, exportLog(incoming, META));
    const local = revise(drop, { time_s: 1.7 }, T + 5000, 'phoneA', 'retimed');
    await source.putRecords([local]);
    await applyImport(source, file);
    const after = (await source.allRecords({ includeDeleted: true })).find((r) => r.id === drop.id) as DropRecord;
    expect(after.time_s).toBe(1.7);
    expect(after.history.some((h) => (h.body as { note: string }).note === 'from B')).toBe(true);
  });

  it('keeps an edit made while the preview was shown when the preview itself is written', async () => {
    const source = await make(log);
    const drop = byKind(log, 'drop')[0]!;
    const incoming = log.map((r) => (r.id === drop.id ? revise(drop, { note: 'from B' }, T, 'phoneB', null) : r));
    const previewed = await previewImport(source, exportLog(incoming, META));
    await source.putRecords([revise(drop, { time_s: 1.7 }, T + 5000, 'phoneA', 'retimed')]);
    await applyPreviewedImport(source, previewed);
    const after = (await source.allRecords({ includeDeleted: true })).find((r) => r.id === drop.id) as DropRecord;
    expect(after.time_s).toBe(1.7);
    expect(after.history.some((h) => (h.body as { note: string }).note === 'from B')).toBe(true);
  });

  it('writes the same log through the preview as applyImport does', async () => {
    const a = await make(log.slice(0, 7));
    const b = await make(log.slice(0, 7));
    const text = exportLog(log, META);
    await applyPreviewedImport(a, await previewImport(a, text));
    await applyImport(b, (await previewImport(b, text)).file);
    expect(canonicalJson(sorted(await a.allRecords({ includeDeleted: true })))).toBe(canonicalJson(sorted(await b.allRecords({ includeDeleted: true }))));
  });

  it('stops with transfer-cancelled and writes nothing when cancelled, at any report', async () => {
    const text = exportLog(log, META);
    const reports: string[] = [];
    await previewImport(await make([]), text, 'all.json', { onProgress: (p) => reports.push(p.phase) });
    expect(reports).toContain('checking');
    for (let at = 0; at < reports.length; at++) {
      const source = await make(log.slice(0, 5));
      const signal = { aborted: false };
      let seen = 0;
      const onProgress = () => {
        if (seen++ === at) signal.aborted = true;
      };
      const run = async () => applyPreviewedImport(source, await previewImport(source, text, 'all.json', { onProgress, signal }), { onProgress, signal });
      await expect(run()).rejects.toMatchObject({ code: 'transfer-cancelled' });
      expect(source.putCount()).toBe(0);
    }
  });

  it('refuses a broken file before writing anything, naming the field', async () => {
    const source = await make(log);
    const broken = JSON.parse(exportLog(log, META));
    broken.records[3].mass_kg = -1;
    await expect(previewImport(source, JSON.stringify(broken))).rejects.toThrow(LogFileError);
    await expect(previewImport(source, JSON.stringify(broken))).rejects.toThrow(/records\[3\]\.mass_kg/);
    expect(source.putCount()).toBe(0);
  });

  it('keeps the conflicts it finds for the screens, until dismissed', async () => {
    const drop = byKind(log, 'drop')[0]!;
    const mine = revise(drop, { time_s: 1.7 }, T, 'phoneA', 'retimed');
    const theirs = revise(drop, { time_s: 1.71 }, T + 1, 'phoneB', 'retyped');
    const source = await make(log.map((r) => (r.id === drop.id ? mine : r)));
    const { file } = await previewImport(source, exportLog(log.map((r) => (r.id === drop.id ? theirs : r)), META));
    const done = await applyImport(source, file);
    expect(done.conflicts).toHaveLength(1);
    const shown = await loadConflicts(source);
    expect(shown).toEqual(done.conflicts);
    await dismissConflict(source, drop.id, mine.rev, 'the video shows the earlier value');
    expect(await loadConflicts(source)).toEqual([]);
  });
});
