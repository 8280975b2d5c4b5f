// The per-day counts the store keeps (so the list of days never reads every drop) must always equal a count
// made afresh from the records. Random sequences of what crews and merges do to a log, on both backends;
// after every step the stored counts are compared with a recount of allRecords() done here, independently.
import 'fake-indexeddb/auto';
import { deleteDB } from 'idb';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  HybridLogicalClock,
  LogError,
  createRecord,
  deleteRecord,
  previewMerge,
  recordHistory,
  reviseRecord,
  type LogRecord,
} from '../../src/log';
import { createMemoryStore, MemoryDatabase, openLogDatabase, openLogStore, StoreError, type DaySummary, type LogAction, type LogStore } from '../../src/store';
import * as demo from '../log/demo-bodies';
import { fakeEnvironment, type FakeEnvironment } from './fake-environment';

/** Another phone writing to the same log; its records come in through merges. */
const REMOTE = 'a1b2c3d4e5f60718';

type Op =
  | { op: 'add-day' }
  | { op: 'remove-day'; pick: number }
  | { op: 'add-reading'; day: number }
  | { op: 'remove-reading'; pick: number }
  | { op: 'add-series'; day: number; drops: number }
  | { op: 'add-drop'; series: number }
  | { op: 'retime-drop'; pick: number }
  | { op: 'exclude-drop'; pick: number }
  | { op: 'remove-drop'; pick: number }
  | { op: 'remove-series'; pick: number }
  | { op: 'move-series'; pick: number; day: number }
  /** The other phone saves a series; its drops may arrive in one merge and the series in a later one. */
  | { op: 'remote-series'; day: number; drops: number; holdSeries: boolean; skewMs: number }
  | { op: 'deliver-held' }
  /** The other phone edits some version it has of a record (maybe an old one), and the edit is merged in. */
  | { op: 'remote-edit'; pick: number; edit: 'move' | 'delete' | 'restore' | 'retime'; target: number; skewMs: number }
  /** Versions seen earlier (older or newer than what is stored) written as they are, as putRecords allows. */
  | { op: 'put-versions'; picks: number[] };

const pick = fc.nat({ max: 1000 });
const skewMs = fc.integer({ min: -120_000, max: 120_000 });
const opArb: fc.Arbitrary<Op> = fc.oneof(
  fc.constant({ op: 'add-day' as const }),
  fc.record({ op: fc.constant('remove-day' as const), pick }),
  fc.record({ op: fc.constant('add-reading' as const), day: pick }),
  fc.record({ op: fc.constant('remove-reading' as const), pick }),
  fc.record({ op: fc.constant('add-series' as const), day: pick, drops: fc.nat({ max: 4 }) }),
  fc.record({ op: fc.constant('add-drop' as const), series: pick }),
  fc.record({ op: fc.constant('retime-drop' as const), pick }),
  fc.record({ op: fc.constant('exclude-drop' as const), pick }),
  fc.record({ op: fc.constant('remove-drop' as const), pick }),
  fc.record({ op: fc.constant('remove-series' as const), pick }),
  fc.record({ op: fc.constant('move-series' as const), pick, day: pick }),
  fc.record({ op: fc.constant('remote-series' as const), day: pick, drops: fc.nat({ max: 4 }), holdSeries: fc.boolean(), skewMs }),
  fc.constant({ op: 'deliver-held' as const }),
  fc.record({
    op: fc.constant('remote-edit' as const),
    pick,
    edit: fc.constantFrom('move' as const, 'delete' as const, 'restore' as const, 'retime' as const),
    target: pick,
    skewMs,
  }),
  fc.record({ op: fc.constant('put-versions' as const), picks: fc.array(pick, { minLength: 1, maxLength: 6 }) }),
);

/** The counts of every live day, made from the records alone. */
function recount(records: readonly LogRecord[]): DaySummary[] {
  const counts = new Map<string, DaySummary>();
  for (const r of records) if (r.kind === 'day' && !r.deleted) counts.set(r.id, { day_id: r.id, reading_count: 0, series_count: 0, drop_count: 0 });
  const seriesDay = new Map<string, string>();
  for (const r of records) {
    if (r.deleted) continue;
    if (r.kind === 'reading' && counts.has(r.day_id)) counts.get(r.day_id)!.reading_count++;
    if (r.kind === 'series') {
      seriesDay.set(r.id, r.day_id);
      if (counts.has(r.day_id)) counts.get(r.day_id)!.series_count++;
    }
  }
  for (const r of records) {
    if (r.deleted || r.kind !== 'drop') continue;
    const day = seriesDay.get(r.series_id);
    if (day !== undefined && counts.has(day)) counts.get(day)!.drop_count++;
  }
  return [...counts.values()];
}

const byDay = (list: DaySummary[]) => [...list].sort((a, b) => (a.day_id < b.day_id ? -1 : a.day_id > b.day_id ? 1 : 0));

/** A restored copy of a tombstone made on the other phone (a newer live version, as a merge can bring). */
function restored<R extends LogRecord>(record: R, clock: HybridLogicalClock, now: number): R {
  const versions = recordHistory(record);
  const last = { ...versions[versions.length - 1]!, reason: 'removed by mistake' };
  const rev = clock.receive(record.rev, now);
  return { ...record, deleted: false, rev, device: clock.device, updated_at: new Date(now).toISOString(), history: [...record.history, last] };
}

/** A revision that changes no count: a note. */
function touched(record: LogRecord, ctx: Parameters<typeof reviseRecord>[2]): LogRecord {
  switch (record.kind) {
    case 'drop':
      return reviseRecord(record, { note: `${record.note}+` }, ctx);
    case 'site':
    case 'specimen':
    case 'day':
    case 'reading':
    case 'series':
      return reviseRecord<LogRecord>(record, { notes: `${record.notes}+` }, ctx);
  }
}

interface Backend {
  store: LogStore;
  /** The counts as stored, read past the store's own interface. */
  storedCounts(): Promise<DaySummary[]>;
}

/** Errors a step may meet because an earlier random step changed what it points at; anything else fails. */
const EXPECTED = new Set(['reference-missing', 'record-in-use', 'not-found', 'record-deleted']);

async function runSequence(backend: Backend, fake: FakeEnvironment, ops: Op[]): Promise<void> {
  const { store } = backend;
  const pool: LogRecord[] = [];
  const remember = (records: readonly LogRecord[]) => pool.push(...records);
  const held: LogRecord[] = [];
  const remoteClock = new HybridLogicalClock(REMOTE);
  const random = (b: Uint8Array) => globalThis.crypto.getRandomValues(b);

  const site = await store.create('site', demo.site());
  const specimen = await store.create('specimen', demo.steelBall());
  remember([site, specimen]);
  for (const date of ['2026-06-14', '2026-06-15']) remember([await store.create('day', { ...demo.day(), site_id: site.id, date })]);

  const liveOf = async <K extends LogRecord['kind']>(kind: K) =>
    (await store.allRecords({ includeDeleted: false })).filter((r): r is Extract<LogRecord, { kind: K }> => r.kind === kind);
  const choose = <T>(list: readonly T[], n: number): T | undefined => (list.length === 0 ? undefined : list[n % list.length]);
  const merge = async (incoming: LogRecord[]) => {
    remember(incoming);
    const { changes } = previewMerge(await store.allRecords({ includeDeleted: true }), incoming);
    if (changes.length > 0) await store.putRecords(changes);
  };
  const commit = async (actions: LogAction[]) => remember(await store.commit(actions));

  const check = async (after: string) => {
    const expected = byDay(recount(await store.allRecords({ includeDeleted: true })));
    expect(byDay(await backend.storedCounts()), `stored counts after ${after}`).toEqual(expected);
    const listed = (await store.listDays()).map(({ id, reading_count, series_count, drop_count }) => ({ day_id: id, reading_count, series_count, drop_count }));
    expect(byDay(listed), `listed counts after ${after}`).toEqual(expected);
  };
  await check('the start');

  for (const step of ops) {
    fake.advance(1000);
    const now = fake.environment.now();
    try {
      switch (step.op) {
        case 'add-day':
          await commit([{ op: 'create', kind: 'day', body: { ...demo.day(), site_id: site.id, date: '2026-06-16' } }]);
          break;
        case 'remove-day': {
          const day = choose(await liveOf('day'), step.pick);
          if (day) await commit([{ op: 'remove', kind: 'day', id: day.id, reason: 'wrong date' }]);
          break;
        }
        case 'add-reading': {
          const day = choose(await liveOf('day'), step.day);
          if (day) await commit([{ op: 'create', kind: 'reading', body: { ...demo.reading(), day_id: day.id } }]);
          break;
        }
        case 'remove-reading': {
          const reading = choose(await liveOf('reading'), step.pick);
          if (reading) await commit([{ op: 'remove', kind: 'reading', id: reading.id, reason: 'instrument not settled' }]);
          break;
        }
        case 'add-series': {
          const day = choose(await liveOf('day'), step.day);
          if (!day) break;
          const seriesId = store.newId();
          await commit([
            { op: 'create', kind: 'series', id: seriesId, body: { ...demo.series(), day_id: day.id, specimen_id: specimen.id } },
            ...Array.from({ length: step.drops }, (_, i): LogAction => ({ op: 'create', kind: 'drop', body: { ...demo.drop(i + 1), series_id: seriesId } })),
          ]);
          break;
        }
        case 'add-drop': {
          const series = choose(await liveOf('series'), step.series);
          if (series) await commit([{ op: 'create', kind: 'drop', body: { ...demo.drop(9), series_id: series.id } }]);
          break;
        }
        case 'retime-drop': {
          const drop = choose(await liveOf('drop'), step.pick);
          if (drop) remember([await store.revise('drop', drop.id, { time_s: drop.time_s + 0.001 }, 'misread')]);
          break;
        }
        case 'exclude-drop': {
          const drop = choose(await liveOf('drop'), step.pick);
          const patch = drop?.excluded ? { excluded: false, exclusion_reason: null } : { excluded: true, exclusion_reason: 'gust' };
          if (drop) remember([await store.revise('drop', drop.id, patch, 'judged again')]);
          break;
        }
        case 'remove-drop': {
          const drop = choose(await liveOf('drop'), step.pick);
          if (drop) await commit([{ op: 'remove', kind: 'drop', id: drop.id, reason: 'bad release' }]);
          break;
        }
        case 'remove-series': {
          const series = choose(await liveOf('series'), step.pick);
          if (series) await commit([{ op: 'remove', kind: 'series', id: series.id, reason: 'wrong specimen' }]);
          break;
        }
        case 'move-series': {
          const [series, day] = [choose(await liveOf('series'), step.pick), choose(await liveOf('day'), step.day)];
          if (series && day) await commit([{ op: 'revise', kind: 'series', id: series.id, patch: { day_id: day.id, reading_id: null } }]);
          break;
        }
        case 'remote-series': {
          const day = choose(pool.filter((r) => r.kind === 'day'), step.day);
          if (!day) break;
          const ctx = { device: REMOTE, clock: remoteClock, now: now + step.skewMs, random };
          const series = createRecord('series', { ...demo.series(), day_id: day.id, specimen_id: specimen.id }, ctx);
          const drops = Array.from({ length: step.drops }, (_, i) => createRecord('drop', { ...demo.drop(i + 1), series_id: series.id }, ctx));
          if (step.holdSeries) {
            held.push(series);
            if (drops.length > 0) await merge(drops);
          } else await merge([series, ...drops]);
          break;
        }
        case 'deliver-held':
          if (held.length > 0) await merge(held.splice(0));
          break;
        case 'remote-edit': {
          const version = choose(pool.filter((r) => r.kind !== 'site' && r.kind !== 'specimen'), step.pick);
          if (!version) break;
          const ctx = { device: REMOTE, clock: remoteClock, now: now + step.skewMs, random, reason: 'seen again on the other phone' };
          let edited: LogRecord;
          if (version.deleted) edited = restored(version, remoteClock, ctx.now);
          else if (step.edit === 'restore') edited = touched(version, ctx);
          else if (step.edit === 'delete') edited = deleteRecord(version, ctx);
          else if (step.edit === 'move' && version.kind === 'series') {
            const day = choose(pool.filter((r) => r.kind === 'day'), step.target)!;
            edited = reviseRecord(version, { day_id: day.id, reading_id: null }, ctx);
          } else if (step.edit === 'move' && version.kind === 'drop') {
            const series = choose(pool.filter((r) => r.kind === 'series'), step.target);
            edited = series ? reviseRecord(version, { series_id: series.id }, ctx) : version;
          } else if (step.edit === 'move' && version.kind === 'reading') {
            const day = choose(pool.filter((r) => r.kind === 'day'), step.target)!;
            edited = reviseRecord(version, { day_id: day.id }, ctx);
          } else if (version.kind === 'drop') edited = reviseRecord(version, { time_s: version.time_s + 0.002 }, ctx);
          else edited = deleteRecord(version, ctx);
          await merge([edited]);
          break;
        }
        case 'put-versions': {
          const batch = new Map<string, LogRecord>();
          for (const n of step.picks) {
            const version = choose(pool, n);
            if (version && !batch.has(version.id)) batch.set(version.id, version);
          }
          await store.putRecords([...batch.values()]);
          break;
        }
      }
    } catch (error) {
      if (!((error instanceof StoreError || error instanceof LogError) && EXPECTED.has(error.code))) throw error;
    }
    await check(JSON.stringify(step));
  }
}

const ops = fc.array(opArb, { minLength: 1, maxLength: 30 });

describe('per-day counts: kept step by step, always equal to a recount', () => {
  it('on the memory twin', async () => {
    await fc.assert(
      fc.asyncProperty(ops, async (sequence) => {
        const fake = fakeEnvironment();
        const database = new MemoryDatabase();
        const store = await createMemoryStore({ database, environment: fake.environment });
        const storedCounts = async () => [...database.stores.get('day_summary')!.values()] as DaySummary[];
        try {
          await runSequence({ store, storedCounts }, fake, sequence);
        } finally {
          store.close();
        }
      }),
      { numRuns: 150 },
    );
  });

  let n = 0;
  it('on the IndexedDB adapter (fake-indexeddb)', async () => {
    await fc.assert(
      fc.asyncProperty(ops, async (sequence) => {
        const fake = fakeEnvironment();
        const name = `plummet-counts-${++n}`;
        const store = await openLogStore({ name, environment: fake.environment });
        const storedCounts = async () => {
          const db = await openLogDatabase(name);
          try {
            return await db.getAll('day_summary');
          } finally {
            db.close();
          }
        };
        try {
          await runSequence({ store, storedCounts }, fake, sequence);
        } finally {
          store.close();
          await deleteDB(name);
        }
      }),
      { numRuns: 40 },
    );
  });
});
