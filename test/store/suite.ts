// The one test suite every LogStore must pass: the IndexedDB adapter (on fake-indexeddb) and the memory twin.
import { beforeEach, afterEach, describe, expect, it } from 'vitest';
import { HybridLogicalClock, compareHlc } from '../../src/log/hlc';
import { createRecord, deleteRecord, reviseRecord } from '../../src/log/records';
import type { DropBody, LogRecord, SeriesBody } from '../../src/log/types';
import { StoreError, type LogAction, type LogStore } from '../../src/store';
import { LogError } from '../../src/log/errors';
import * as demo from '../log/demo-bodies';
import { fakeEnvironment, T0, type FakeEnvironment } from './fake-environment';

export interface StoreUnderTest {
  store: LogStore;
  /** Close the store and open the same data again, as a reload of the page does. */
  reopen(): Promise<LogStore>;
  /** A second store on the same data, as a second tab of the app opens it. */
  openAnother(): Promise<LogStore>;
  /** The browser deletes the database (as Chromium does after a disk-full error), then the app opens again. */
  eraseAndReopen(): Promise<LogStore>;
  /** From now on the engine refuses to store more (QuotaExceededError), until restoreQuota(). */
  exhaustQuota(): Promise<void>;
  restoreQuota(): Promise<void>;
  dispose(): Promise<void>;
}

export type MakeStore = (fake: FakeEnvironment) => Promise<StoreUnderTest>;

async function codeOf(promise: Promise<unknown>): Promise<string> {
  try {
    await promise;
  } catch (error) {
    if (error instanceof StoreError || error instanceof LogError) return error.code;
    throw error;
  }
  throw new Error('expected the call to fail, it succeeded');
}

/** A site, a specimen and a day, saved as three separate actions. */
async function seedDay(store: LogStore, date = '2026-06-14') {
  const site = await store.create('site', demo.site());
  const specimen = await store.create('specimen', demo.steelBall());
  const day = await store.create('day', { ...demo.day(), site_id: site.id, date });
  return { site, specimen, day };
}

/** The actions that save a series and its drops: what the series screen sends when a series is done. */
function seriesActions(store: LogStore, dayId: string, specimenId: string, times: number[], extra: Partial<SeriesBody> = {}) {
  const seriesId = store.newId();
  const actions: LogAction[] = [
    { op: 'create', kind: 'series', id: seriesId, body: { ...demo.series(), day_id: dayId, specimen_id: specimenId, ...extra } },
    ...times.map(
      (time_s, i): LogAction => ({ op: 'create', kind: 'drop', body: { ...demo.drop(i + 1), series_id: seriesId, time_s } }),
    ),
  ];
  return { seriesId, actions };
}

/** allRecords() order: by kind as RECORD_KINDS lists them, then by id (IndexedDB key order). */
function inExportOrder(records: LogRecord[]): LogRecord[] {
  const kinds = ['site', 'specimen', 'day', 'reading', 'series', 'drop'];
  return [...records].sort((a, b) => kinds.indexOf(a.kind) - kinds.indexOf(b.kind) || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
}

export function runLogStoreTests(name: string, makeStore: MakeStore): void {
  describe(`${name}: the LogStore contract`, () => {
    let fake: FakeEnvironment;
    let subject: StoreUnderTest;
    let store: LogStore;

    beforeEach(async () => {
      fake = fakeEnvironment();
      subject = await makeStore(fake);
      store = subject.store;
    });

    afterEach(async () => {
      await subject.restoreQuota();
      await subject.dispose();
    });

    describe('records', () => {
      it('creates a record and reads back exactly what was stored', async () => {
        const site = await store.create('site', demo.site());
        expect(site).toMatchObject({ ...demo.site(), kind: 'site', deleted: false, history: [], created_at: new Date(T0).toISOString() });
        expect(site.device).toBe(await store.deviceId());
        expect(await store.get('site', site.id)).toEqual(site);
      });

      it('uses an id given from outside', async () => {
        const site = await store.create('site', demo.site(), { id: demo.SITE_ID });
        expect(site.id).toBe(demo.SITE_ID);
        expect(await codeOf(store.create('site', demo.site(), { id: demo.SITE_ID }))).toBe('already-exists');
      });

      it('refuses an invalid record, names the field, the value and the rule, and writes nothing', async () => {
        let error: unknown;
        try {
          await store.create('specimen', { ...demo.steelBall(), mass_kg: 0 });
        } catch (e) {
          error = e;
        }
        expect((error as LogError).code).toBe('record-invalid');
        expect((error as Error).message).toContain('mass_kg: 0 is out of range: must be > 0 and ≤ 20000 kg');
        expect(await store.list('specimen', { includeDeleted: true })).toEqual([]);
        expect((await store.status()).unsentChanges).toBe(0);
      });

      it('refuses a record that points at a record that does not exist', async () => {
        expect(await codeOf(store.create('day', demo.day()))).toBe('reference-missing');
        expect(await store.list('day')).toEqual([]);
      });

      it('refuses a series whose air reading belongs to another day', async () => {
        const { specimen, day } = await seedDay(store);
        const other = await store.create('day', { ...demo.day(), site_id: day.site_id, date: '2026-06-15' });
        const reading = await store.create('reading', { ...demo.reading(), day_id: other.id });
        const series = { ...demo.series(), day_id: day.id, specimen_id: specimen.id, reading_id: reading.id };
        expect(await codeOf(store.create('series', series))).toBe('reference-missing');
      });

      it('keeps every version when a record is revised and reads the history back in order', async () => {
        const { specimen } = await seedDay(store);
        fake.advance(60_000);
        await store.revise('specimen', specimen.id, { notes: 'scratched' });
        fake.advance(60_000);
        const latest = await store.revise('specimen', specimen.id, { mass_kg: 0.0636 }, 'weighed again on the lab scale');
        const versions = await store.history('specimen', specimen.id);
        expect(versions.map((v) => [v.body.mass_kg, v.body.notes, v.reason])).toEqual([
          [0.0637, '', null],
          [0.0637, 'scratched', 'weighed again on the lab scale'],
          [0.0636, 'scratched', null],
        ]);
        expect(versions.at(-1)?.rev).toBe(latest.rev);
        expect(versions.map((v) => v.updated_at)).toEqual(['2026-06-14T09:00:00.000Z', '2026-06-14T09:01:00.000Z', '2026-06-14T09:02:00.000Z']);
      });

      it('refuses to change a measured value without a reason and leaves the record as it was', async () => {
        const { specimen, day } = await seedDay(store);
        const { seriesId, actions } = seriesActions(store, day.id, specimen.id, [1.121]);
        const [, drop] = await store.commit(actions);
        expect(await codeOf(store.revise('drop', drop!.id, { time_s: 1.2 }))).toBe('reason-required');
        expect(await codeOf(store.revise('series', seriesId, { height_m: 6.5 }, ''))).toBe('reason-required');
        expect(await store.get('drop', drop!.id)).toEqual(drop);
      });

      it('never changes a raw capture', async () => {
        const { specimen, day } = await seedDay(store);
        const [, drop] = await store.commit(seriesActions(store, day.id, specimen.id, [1.121]).actions);
        const raw = { kind: 'taps' as const, timestamps_ms: [10_000, 11_200] };
        expect(await codeOf(store.revise('drop', drop!.id, { raw }, 'tapped late'))).toBe('raw-immutable');
        expect((await store.get('drop', drop!.id))?.raw).toEqual(demo.drop().raw);
      });

      it('excludes a drop with a reason and keeps the counted version in its history', async () => {
        const { specimen, day } = await seedDay(store);
        const [, drop] = await store.commit(seriesActions(store, day.id, specimen.id, [1.121]).actions);
        const excluded = await store.revise('drop', drop!.id, { excluded: true, exclusion_reason: 'bounced off the railing' }, 'bounced off the railing');
        expect(excluded.excluded).toBe(true);
        expect(excluded.history[0]?.body.excluded).toBe(false);
      });

      it('removes a record as a tombstone that keeps its history and hides it from lists', async () => {
        const site = await store.create('site', demo.site());
        const gone = await store.remove('site', site.id, 'entered by mistake');
        expect(gone.deleted).toBe(true);
        expect(await store.list('site')).toEqual([]);
        expect(await store.list('site', { includeDeleted: true })).toEqual([gone]);
        expect((await store.history('site', site.id)).map((v) => [v.deleted, v.reason])).toEqual([
          [false, 'entered by mistake'],
          [true, null],
        ]);
        expect(await store.remove('site', site.id, 'again')).toEqual(gone);
      });

      it('needs a reason to remove a record', async () => {
        const site = await store.create('site', demo.site());
        expect(await codeOf(store.remove('site', site.id, ' '))).toBe('reason-required');
        expect((await store.get('site', site.id))?.deleted).toBe(false);
      });

      it('removes a day together with its readings, series and drops in one action', async () => {
        const { specimen, day } = await seedDay(store);
        await store.create('reading', { ...demo.reading(), day_id: day.id });
        await store.commit(seriesActions(store, day.id, specimen.id, [1.12, 1.13]).actions);
        await store.remove('day', day.id, 'test day, not real drops');
        const all = await store.allRecords();
        expect(all.filter((r) => r.kind !== 'site' && r.kind !== 'specimen').map((r) => [r.kind, r.deleted])).toEqual([
          ['day', true],
          ['reading', true],
          ['series', true],
          ['drop', true],
          ['drop', true],
        ]);
        expect(await store.listDays()).toEqual([]);
      });

      it('refuses to remove a site or a specimen that a day or series still uses', async () => {
        const { site, specimen, day } = await seedDay(store);
        await store.commit(seriesActions(store, day.id, specimen.id, [1.12]).actions);
        expect(await codeOf(store.remove('site', site.id, 'moved'))).toBe('record-in-use');
        expect(await codeOf(store.remove('specimen', specimen.id, 'lost'))).toBe('record-in-use');
        // Named as the crew knows them: the site by its name, the day in the way by its date.
        const refusal = await store.remove('site', site.id, 'moved').then(() => null, (error: StoreError) => error);
        expect(refusal?.message).toBe(`The site “${site.name}” is still used by 1 day (${day.date}); change or remove it first`);
        expect(refusal?.field).toBe('site_id');
        await store.remove('day', day.id, 'wrong site');
        await store.remove('site', site.id, 'moved');
        expect((await store.get('site', site.id))?.deleted).toBe(true);
      });

      it('refuses to remove an air reading a series uses', async () => {
        const { specimen, day } = await seedDay(store);
        const reading = await store.create('reading', { ...demo.reading(), day_id: day.id });
        await store.commit(seriesActions(store, day.id, specimen.id, [1.12], { reading_id: reading.id }).actions);
        expect(await codeOf(store.remove('reading', reading.id, 'wrong instrument'))).toBe('record-in-use');
      });
    });

    describe('restoring and undoing', () => {
      it('restores a removed series with the drops removed together with it, not a drop removed on its own before', async () => {
        const { specimen, day } = await seedDay(store);
        const written = await store.commit(seriesActions(store, day.id, specimen.id, [1.12, 1.13, 1.14]).actions);
        const series = written[0]!;
        fake.advance(1000);
        await store.remove('drop', written[3]!.id, 'entered twice');
        fake.advance(1000);
        await store.remove('series', series.id, 'wrong specimen');
        expect((await store.loadDay(day.id)).series).toEqual([]);
        const removed = await store.loadRemoved(day.id);
        expect(removed.series.map((s) => s.id)).toEqual([series.id]);
        expect(removed.drops).toHaveLength(3);
        fake.advance(1000);
        const back = await store.restore('series', series.id, 'it was the right specimen');
        expect(back.deleted).toBe(false);
        const view = await store.loadDay(day.id);
        expect(view.series.map((s) => s.id)).toEqual([series.id]);
        expect(view.drops.map((d) => d.time_s)).toEqual([1.12, 1.13]);
        expect((await store.listDays())[0]).toMatchObject({ series_count: 1, drop_count: 2 });
        expect((await store.history('series', series.id)).map((v) => [v.deleted, v.reason])).toEqual([
          [false, 'wrong specimen'],
          [true, 'it was the right specimen'],
          [false, null],
        ]);
      });

      it('restores a removed series with a drop whose removal crossed a correction made on another phone', async () => {
        const { specimen, day } = await seedDay(store);
        const written = await store.commit(seriesActions(store, day.id, specimen.id, [1.12, 1.13]).actions);
        const [series, drop] = [written[0]!, written[1]!];
        // Another phone corrects the drop without knowing of the removal below; its clock is behind, so the
        // removal stays current and the correction goes into the history with no reason (log/merge.ts).
        const other = 'bbbbbbbbbbbbbbb2';
        const corrected = reviseRecord(drop, { time_s: 1.121 } as Partial<DropBody>, { device: other, clock: new HybridLogicalClock(other), now: T0 + 1500, reason: 'typed a wrong digit' });
        fake.advance(2000);
        await store.remove('series', series.id, 'wrong specimen');
        await store.putRecords([corrected], { mergeStored: true });
        const merged = (await store.get('drop', drop.id))!;
        expect([merged.deleted, merged.history.at(-1)?.rev, merged.history.at(-1)?.reason]).toEqual([true, corrected.rev, null]);
        fake.advance(1000);
        await store.restore('series', series.id, 'it was the right specimen');
        expect((await store.loadDay(day.id)).drops.map((d) => d.id).sort()).toEqual([drop.id, written[2]!.id].sort());
      });

      it('restores a removed day with everything removed with it', async () => {
        const { specimen, day } = await seedDay(store);
        await store.create('reading', { ...demo.reading(), day_id: day.id });
        await store.commit(seriesActions(store, day.id, specimen.id, [1.12, 1.13]).actions);
        fake.advance(1000);
        await store.remove('day', day.id, 'wrong site');
        fake.advance(1000);
        await store.restore('day', day.id, 'right site after all');
        const view = await store.loadDay(day.id);
        expect([view.readings.length, view.series.length, view.drops.length]).toEqual([1, 1, 2]);
        expect((await store.listDays())[0]).toMatchObject({ reading_count: 1, series_count: 1, drop_count: 2 });
      });

      it('refuses to restore a drop while its series is removed', async () => {
        const { specimen, day } = await seedDay(store);
        const [series, drop] = await store.commit(seriesActions(store, day.id, specimen.id, [1.12]).actions);
        await store.remove('series', series!.id, 'wrong specimen');
        expect(await codeOf(store.restore('drop', drop!.id, 'needed'))).toBe('reference-missing');
        expect(await codeOf(store.restore('series', series!.id, ' '))).toBe('reason-required');
      });

      it('undoes an added drop, a correction and a removal, each as a new version', async () => {
        const { specimen, day } = await seedDay(store);
        const [series] = await store.commit(seriesActions(store, day.id, specimen.id, [1.12]).actions);
        const added = await store.create('drop', { ...demo.drop(2), series_id: series!.id, time_s: 1.5031 });
        await store.undo([added], 'undone');
        expect((await store.loadDay(day.id)).drops.map((d) => d.time_s)).toEqual([1.12]);
        expect((await store.get('drop', added.id))?.deleted).toBe(true);

        const drop = (await store.loadDay(day.id)).drops[0]!;
        const fixed = await store.revise('drop', drop.id, { time_s: 1.21 }, 'typed 1.12 for 1.21');
        await store.undo([fixed], 'undone');
        const after = await store.get('drop', drop.id);
        expect(after?.time_s).toBe(1.12);
        expect(after?.history).toHaveLength(2);

        const gone = await store.remove('series', series!.id, 'wrong specimen');
        const restored = await store.undo([gone], 'undone');
        expect(restored.some((r) => r.kind === 'series' && !r.deleted)).toBe(true);
        expect((await store.loadDay(day.id)).drops.map((d) => d.time_s)).toEqual([1.12]);
      });

      it('refuses an undo once the record has changed since', async () => {
        const { specimen, day } = await seedDay(store);
        const [series] = await store.commit(seriesActions(store, day.id, specimen.id, [1.12]).actions);
        const added = await store.create('drop', { ...demo.drop(2), series_id: series!.id, time_s: 1.3 });
        await store.revise('drop', added.id, { note: 'gusty' });
        expect(await codeOf(store.undo([added], 'undone'))).toBe('changed-elsewhere');
        expect((await store.get('drop', added.id))?.deleted).toBe(false);
      });
    });

    describe('one transaction per user action', () => {
      it('writes a series and its drops together', async () => {
        const { specimen, day } = await seedDay(store);
        const { seriesId, actions } = seriesActions(store, day.id, specimen.id, [1.121, 1.118, 1.125]);
        const written = await store.commit(actions);
        expect(written.map((r) => r.kind)).toEqual(['series', 'drop', 'drop', 'drop']);
        const view = await store.loadDay(day.id);
        expect(view.series.map((s) => s.id)).toEqual([seriesId]);
        expect(view.drops.map((d) => d.time_s)).toEqual([1.121, 1.118, 1.125]);
      });

      it('writes nothing of an action whose last step is invalid', async () => {
        const { specimen, day } = await seedDay(store);
        const { actions } = seriesActions(store, day.id, specimen.id, [1.121, 1.118, -1]);
        expect(await codeOf(store.commit(actions))).toBe('record-invalid');
        expect(await store.list('series', { includeDeleted: true })).toEqual([]);
        expect(await store.list('drop', { includeDeleted: true })).toEqual([]);
        expect((await store.listDays())[0]?.series_count).toBe(0);
      });

      it('writes nothing of an action whose later step fails against what is stored', async () => {
        const { specimen, day } = await seedDay(store);
        const before = await store.allRecords();
        const unsent = (await store.status()).unsentChanges;
        const { actions } = seriesActions(store, day.id, specimen.id, [1.121]);
        actions.push({ op: 'revise', kind: 'specimen', id: specimen.id, patch: { mass_kg: 0.07 } });
        expect(await codeOf(store.commit(actions))).toBe('reason-required');
        expect(await store.allRecords()).toEqual(before);
        expect((await store.status()).unsentChanges).toBe(unsent);
      });

      it('lets later steps of an action see the earlier ones', async () => {
        const { specimen, day } = await seedDay(store);
        const { seriesId, actions } = seriesActions(store, day.id, specimen.id, [1.121]);
        actions.push({ op: 'revise', kind: 'series', id: seriesId, patch: { notes: 'calm air' } });
        const written = await store.commit(actions);
        expect(written).toHaveLength(2);
        const series = await store.get('series', seriesId);
        expect(series?.notes).toBe('calm air');
        expect(series?.history).toHaveLength(1);
      });

      it('keeps everything stored and the draft when the storage is full, and saves once there is room', async () => {
        const { specimen, day } = await seedDay(store);
        await store.putDraft('series-form', { height: '6.12', times: ['1.121'] });
        const before = await store.allRecords();
        const { actions } = seriesActions(store, day.id, specimen.id, [1.121]);
        await subject.exhaustQuota();
        let error: unknown;
        try {
          await store.commit(actions, { clearDraft: 'series-form' });
        } catch (e) {
          error = e;
        }
        expect(error).toBeInstanceOf(StoreError);
        expect((error as StoreError).code).toBe('storage-full');
        expect((error as StoreError).message).toMatch(/full.*Nothing from this action was saved/);
        expect(await store.allRecords()).toEqual(before);
        expect((await store.getDraft('series-form'))?.value).toEqual({ height: '6.12', times: ['1.121'] });
        expect(await codeOf(store.putDraft('series-form', { height: '6.12', times: ['1.121', '1.118'] }))).toBe('storage-full');
        expect((await store.getDraft('series-form'))?.value).toEqual({ height: '6.12', times: ['1.121'] });
        await subject.restoreQuota();
        await store.commit(actions, { clearDraft: 'series-form' });
        expect(await store.getDraft('series-form')).toBeUndefined();
        expect(await store.list('drop')).toHaveLength(1);
      });

      it('clears a draft in the same transaction as the save', async () => {
        const site = { ...demo.site(), name: 'Lower weir' };
        await store.putDraft('site-form', site);
        await store.create('site', site, { clearDraft: 'site-form' });
        expect(await store.getDraft('site-form')).toBeUndefined();
      });
    });

    describe('what the screens read', () => {
      it('lists the days newest first with the site name and the counts', async () => {
        const { specimen, day } = await seedDay(store, '2026-06-14');
        const later = await store.create('day', { ...demo.day(), site_id: day.site_id, date: '2026-07-02' });
        await store.create('reading', { ...demo.reading(), day_id: day.id });
        await store.commit(seriesActions(store, day.id, specimen.id, [1.12, 1.13, 1.11]).actions);
        const [, drop] = await store.commit(seriesActions(store, day.id, specimen.id, [1.2, 1.21]).actions);
        await store.remove('drop', drop!.id, 'dropped by hand, not released');
        const days = await store.listDays();
        expect(days.map((d) => [d.date, d.site_name, d.reading_count, d.series_count, d.drop_count])).toEqual([
          ['2026-07-02', 'Hollin pond footbridge', 0, 0, 0],
          ['2026-06-14', 'Hollin pond footbridge', 1, 2, 4],
        ]);
        expect(days[0]?.id).toBe(later.id);
      });

      it('updates the counts when a series moves to another day', async () => {
        const { specimen, day } = await seedDay(store, '2026-06-14');
        const other = await store.create('day', { ...demo.day(), site_id: day.site_id, date: '2026-06-15' });
        const { seriesId, actions } = seriesActions(store, day.id, specimen.id, [1.12, 1.13]);
        await store.commit(actions);
        await store.revise('series', seriesId, { day_id: other.id }, 'filed under the wrong day');
        const counts = Object.fromEntries((await store.listDays()).map((d) => [d.date, [d.series_count, d.drop_count]]));
        expect(counts).toEqual({ '2026-06-15': [1, 2], '2026-06-14': [0, 0] });
      });

      it('loads one day with its site, readings, series, drops and specimens', async () => {
        const { site, specimen, day } = await seedDay(store);
        const late = await store.create('reading', { ...demo.reading(), day_id: day.id, taken_at: '2026-06-14T11:00:00.000Z' });
        const early = await store.create('reading', { ...demo.reading(), day_id: day.id, taken_at: '2026-06-14T08:00:00.000Z' });
        const second = seriesActions(store, day.id, specimen.id, [1.5], { started_at: '2026-06-14T10:00:00.000Z' });
        const first = seriesActions(store, day.id, specimen.id, [1.12, 1.13]);
        await store.commit(second.actions);
        await store.commit(first.actions);
        const view = await store.loadDay(day.id);
        expect(view.day).toEqual(day);
        expect(view.site).toEqual(site);
        expect(view.readings.map((r) => r.id)).toEqual([early.id, late.id]);
        expect(view.series.map((s) => s.id)).toEqual([first.seriesId, second.seriesId]);
        expect(view.drops.map((d) => [d.series_id, d.seq])).toEqual([
          [first.seriesId, 1],
          [first.seriesId, 2],
          [second.seriesId, 1],
        ]);
        expect(view.specimens).toEqual([specimen]);
      });

      it('says not-found for a day that does not exist or was deleted', async () => {
        const { day } = await seedDay(store);
        expect(await codeOf(store.loadDay(demo.DAY_ID))).toBe('not-found');
        await store.remove('day', day.id, 'duplicate');
        expect(await codeOf(store.loadDay(day.id))).toBe('not-found');
      });
    });

    describe('surviving a reload', () => {
      it('finds records, drafts, meta and the device id again after reopening', async () => {
        const { day } = await seedDay(store);
        await store.putDraft('drop-form', { typed: '1.1' });
        await store.setMeta('settings', { units: 'SI' });
        const device = await store.deviceId();
        const records = await store.allRecords();
        store = await subject.reopen();
        expect(await store.allRecords()).toEqual(records);
        expect((await store.getDraft('drop-form'))?.value).toEqual({ typed: '1.1' });
        expect(await store.getMeta('settings')).toEqual({ units: 'SI' });
        expect(await store.deviceId()).toBe(device);
        expect((await store.listDays()).map((d) => d.id)).toEqual([day.id]);
      });

      it('keeps stamps rising after a reload even when the phone’s clock was set back', async () => {
        const site = await store.create('site', demo.site());
        store = await subject.reopen();
        fake.setNow(T0 - 86_400_000);
        const renamed = await store.revise('site', site.id, { name: 'Hollin bridge' });
        const other = await store.create('site', { ...demo.site(), name: 'Weir' });
        expect(compareHlc(renamed.rev, site.rev)).toBeGreaterThan(0);
        expect(compareHlc(other.rev, renamed.rev)).toBeGreaterThan(0);
      });
    });

    it('hands out a new stamp for every change when two tabs write with the same device id', async () => {
      const other = await subject.openAnother();
      expect(await other.deviceId()).toBe(await store.deviceId());
      const revs: string[] = [];
      for (let i = 0; i < 10; i++) {
        // The phone's clock stands still: only the stamps kept in the database keep the tabs apart.
        revs.push((await store.create('site', { ...demo.site(), name: `A${i}` })).rev);
        revs.push((await other.create('site', { ...demo.site(), name: `B${i}` })).rev);
      }
      expect(new Set(revs).size).toBe(20);
      expect([...revs].sort(compareHlc)).toEqual(revs);
      other.close();
    });

    describe('records merged from elsewhere', () => {
      const foreign = 'f0e1d2c3b4a59687';

      function foreignDay() {
        const clock = new HybridLogicalClock(foreign);
        const ctx = { device: foreign, clock, now: T0 + 3_600_000, random: (b: Uint8Array) => globalThis.crypto.getRandomValues(b) };
        const site = createRecord('site', demo.site(), { ...ctx, id: demo.SITE_ID });
        const specimen = createRecord('specimen', demo.steelBall(), { ...ctx, id: demo.SPECIMEN_ID });
        const day = createRecord('day', demo.day(), { ...ctx, id: demo.DAY_ID });
        const series = createRecord('series', demo.series(), { ...ctx, id: demo.SERIES_ID });
        const drops = [1, 2, 3].map((seq) => createRecord('drop', { ...demo.drop(seq), time_s: 1.12 + seq / 1000 } as DropBody, ctx));
        const revised = reviseRecord(drops[2]!, { excluded: true, exclusion_reason: 'gust' }, { ...ctx, reason: 'gust' });
        return { clock, records: [site, specimen, day, series, drops[0]!, drops[1]!, revised] as LogRecord[] };
      }

      it('writes merged records exactly as they are, with their own device and stamps', async () => {
        const { records } = foreignDay();
        await store.putRecords(records);
        const stored = await store.allRecords();
        expect(stored).toEqual(inExportOrder(records));
        expect((await store.listDays())[0]).toMatchObject({ id: demo.DAY_ID, series_count: 1, drop_count: 3 });
        expect((await store.status()).unsentChanges).toBe(0);
      });

      it('keeps the day counts exact when drops arrive before their series and the series is later removed alone', async () => {
        const { clock, records } = foreignDay();
        const ctx = { device: foreign, clock, now: T0 + 3_600_000, random: (b: Uint8Array) => globalThis.crypto.getRandomValues(b) };
        const [site, specimen, day, series] = records as [LogRecord, LogRecord, LogRecord, LogRecord];
        // 70 drops: more than a getMany makes single requests for, so the bulk path is taken too.
        const drops = Array.from({ length: 70 }, (_, i) => createRecord('drop', { ...demo.drop(i + 1), time_s: 1.12 + i / 1000 } as DropBody, ctx));
        await store.putRecords([site, specimen, day]);
        await store.putRecords(drops);
        expect((await store.listDays())[0]).toMatchObject({ series_count: 0, drop_count: 0 });
        // The series arrives last and brings the 70 drops already stored for it into its day's count.
        await store.putRecords([series, ...drops.slice(0, 5)]);
        expect((await store.listDays())[0]).toMatchObject({ series_count: 1, drop_count: 70 });
        // Ten drops removed, one revised: 60 live drops (counted by hand from the batch above).
        const removed = drops.slice(10, 20).map((d) => deleteRecord(d, { ...ctx, reason: 'bad release' }));
        const revised = reviseRecord(drops[0]!, { note: 'checked' }, { ...ctx, reason: null });
        await store.putRecords([...removed, revised]);
        expect((await store.listDays())[0]).toMatchObject({ series_count: 1, drop_count: 60 });
        // The series removed without its drops: they no longer count, though still live themselves.
        await store.putRecords([deleteRecord(series, { ...ctx, reason: 'wrong specimen' })]);
        expect((await store.listDays())[0]).toMatchObject({ series_count: 0, drop_count: 0 });
        // The day removed alone: its summary goes with it, and the drops stay as they were.
        await store.putRecords([deleteRecord(day, { ...ctx, reason: 'wrong date' })]);
        expect(await store.listDays()).toEqual([]);
        expect((await store.allRecords({ includeDeleted: false })).filter((r) => r.kind === 'drop')).toHaveLength(60);
      });

      it('refuses a batch with one invalid record and writes none of it', async () => {
        const { records } = foreignDay();
        const broken = { ...records[4]!, time_s: 0 } as LogRecord;
        let error: unknown;
        try {
          await store.putRecords([...records.slice(0, 4), broken]);
        } catch (e) {
          error = e;
        }
        expect((error as LogError).code).toBe('record-invalid');
        expect((error as Error).message).toContain(`[4] drop ${broken.id}: time_s: 0 is out of range`);
        expect(await store.allRecords()).toEqual([]);
      });

      it('refuses a batch that holds the same record twice', async () => {
        const { records } = foreignDay();
        expect(await codeOf(store.putRecords([records[0]!, records[0]!]))).toBe('record-invalid');
      });

      it('stamps a local edit after every stamp merged in, even one from a clock running ahead', async () => {
        const { records } = foreignDay();
        await store.putRecords(records);
        const edited = await store.revise('site', demo.SITE_ID, { notes: 'checked here' });
        const newestMerged = records.map((r) => r.rev).sort(compareHlc).at(-1)!;
        expect(compareHlc(edited.rev, newestMerged)).toBeGreaterThan(0);
      });

      it('hands out tombstones for export and sync unless asked not to', async () => {
        const site = await store.create('site', demo.site());
        await store.remove('site', site.id, 'test');
        expect((await store.allRecords()).map((r) => r.deleted)).toEqual([true]);
        expect(await store.allRecords({ includeDeleted: false })).toEqual([]);
      });
    });

    describe('two tabs on one log', () => {
      /** A day with one series of three drops (seq 1 to 3). */
      async function seriesWithThreeDrops() {
        const { day, specimen } = await seedDay(store);
        const { seriesId, actions } = seriesActions(store, day.id, specimen.id, [1.1, 1.2, 1.3]);
        await store.commit(actions);
        return seriesId;
      }
      const dropTo = (seriesId: string, seq: number): DropBody => ({ ...demo.drop(seq), series_id: seriesId, time_s: 1.25 });
      const seqsOf = async (s: LogStore, seriesId: string) =>
        (await s.list('drop')).filter((d) => d.series_id === seriesId).map((d) => d.seq).sort((a, b) => a - b);

      it('gives two tabs adding a drop to one series at once two numbers, whatever their forms showed', async () => {
        const seriesId = await seriesWithThreeDrops();
        const other = await subject.openAnother();
        // Both forms show "drop 4" (their view of the series), and both save at the same moment.
        const [a, b] = await Promise.all([store.create('drop', dropTo(seriesId, 4)), other.create('drop', dropTo(seriesId, 4))]);
        expect([a.seq, b.seq].sort()).toEqual([4, 5]);
        expect(await seqsOf(store, seriesId)).toEqual([1, 2, 3, 4, 5]);
        // A form opened before both saves, still showing "drop 4", gets the next number too.
        expect((await other.create('drop', dropTo(seriesId, 4))).seq).toBe(6);
        other.close();
      });

      it('keeps the number asked for when it is free, and numbers each series on its own', async () => {
        const seriesId = await seriesWithThreeDrops();
        expect((await store.create('drop', dropTo(seriesId, 9))).seq).toBe(9);
        expect((await store.create('drop', dropTo(seriesId, 2))).seq).toBe(10);
        const { day, specimen } = await seedDay(store, '2026-06-15');
        const { seriesId: otherSeries, actions } = seriesActions(store, day.id, specimen.id, [1.1]);
        await store.commit(actions);
        expect((await store.create('drop', dropTo(otherSeries, 2))).seq).toBe(2);
      });

      it('refuses an edit made from a form opened before the record changed in another tab, and writes nothing', async () => {
        const specimen = await store.create('specimen', demo.steelBall());
        const other = await subject.openAnother();
        const openedWith = specimen.rev;
        // The other tab renames it while this tab's form is open.
        const renamed = await other.revise('specimen', specimen.id, { name: 'Renamed elsewhere' }, null, { expectedRev: openedWith });
        const attempt = store.revise('specimen', specimen.id, { name: specimen.name, notes: 'typed here' }, null, { expectedRev: openedWith });
        await expect(attempt).rejects.toThrow(/^changed elsewhere: reload/);
        await expect(attempt.catch((e: StoreError) => ({ code: e.code, field: e.field, value: e.value }))).resolves.toEqual({
          code: 'changed-elsewhere',
          field: 'rev',
          value: renamed.rev,
        });
        expect(await store.get('specimen', specimen.id)).toEqual(renamed);
        // Reopened with the record as it now is, the same edit goes through.
        const saved = await store.revise('specimen', specimen.id, { notes: 'typed here' }, null, { expectedRev: renamed.rev });
        expect(saved).toMatchObject({ name: 'Renamed elsewhere', notes: 'typed here' });
        other.close();
      });

      it('refuses a whole action when one of its revisions is stale', async () => {
        const specimen = await store.create('specimen', demo.steelBall());
        const site = await store.create('site', demo.site());
        const stale = specimen.rev;
        await store.revise('specimen', specimen.id, { name: 'Changed' });
        const before = await store.allRecords();
        const attempt = store.commit([
          { op: 'revise', kind: 'site', id: site.id, patch: { name: 'New site name' }, expectedRev: site.rev },
          { op: 'revise', kind: 'specimen', id: specimen.id, patch: { notes: 'x' }, expectedRev: stale },
        ]);
        expect(await codeOf(attempt)).toBe('changed-elsewhere');
        expect(await store.allRecords()).toEqual(before);
      });
    });

    describe('drafts', () => {
      it('stores, returns and deletes a draft with the time it was saved', async () => {
        expect(await store.getDraft('reading-form')).toBeUndefined();
        await store.putDraft('reading-form', { temperature: '17.', pressure: '' });
        expect(await store.getDraft('reading-form')).toEqual({
          key: 'reading-form',
          value: { temperature: '17.', pressure: '' },
          saved_at: '2026-06-14T09:00:00.000Z',
        });
        await store.deleteDraft('reading-form');
        expect(await store.getDraft('reading-form')).toBeUndefined();
      });

      it('keeps a copy, not the caller’s object', async () => {
        const value = { times: ['1.1'] };
        await store.putDraft('f', value);
        value.times.push('1.2');
        expect((await store.getDraft<typeof value>('f'))?.value.times).toEqual(['1.1']);
      });
    });

    describe('storage status', () => {
      it('counts each record changed since the last export and resets on markSent', async () => {
        const { specimen, day } = await seedDay(store);
        await store.commit(seriesActions(store, day.id, specimen.id, [1.12, 1.13]).actions);
        expect((await store.status()).unsentChanges).toBe(6);
        fake.advance(1000);
        await store.markSent();
        const status = await store.status();
        expect(status.unsentChanges).toBe(0);
        expect(status.lastSentAt).toBe('2026-06-14T09:00:01.000Z');
      });

      it('keeps changes made while an export was running counted', async () => {
        await store.create('site', demo.site());
        const seen = (await store.status()).unsentChanges;
        await store.create('site', { ...demo.site(), name: 'Weir' });
        await store.markSent(T0 + 5000, seen);
        expect((await store.status()).unsentChanges).toBe(1);
      });

      it('asks for persistent storage at the first save only, and keeps the answer', async () => {
        expect(fake.storage.persistCalls).toBe(0);
        await store.create('site', demo.site());
        await store.create('site', { ...demo.site(), name: 'Weir' });
        const status = await store.status();
        expect(fake.storage.persistCalls).toBe(1);
        expect(status.persistent).toBe(true);
        expect(await store.getMeta('persistence')).toEqual({ persisted: true, asked_at: '2026-06-14T09:00:00.000Z' });
      });

      it('reports the log at risk with every reason while it is not installed, not persistent and unsent', async () => {
        fake.storage.grant = false;
        await store.create('site', demo.site());
        const status = await store.status();
        expect(status).toMatchObject({ persistent: false, installed: false, atRisk: true });
        expect(status.reasons).toEqual(['not-installed', 'not-persistent', 'unsent-changes']);
      });

      it('reports the log safe when installed, persistent and sent', async () => {
        fake.setInstalled(true);
        await store.create('site', demo.site());
        await store.markSent();
        const status = await store.status();
        expect(status).toMatchObject({ persistent: true, installed: true, unsentChanges: 0, atRisk: false, reasons: [] });
        expect(status.usage_bytes).toBe(120_000);
        expect(status.quota_bytes).toBe(2_000_000_000);
      });

      it('keeps the last storage estimate for the settings screen', async () => {
        fake.storage.usage = 1_900_000_000;
        const status = await store.status();
        expect(status.reasons).toContain('storage-nearly-full');
        expect(await store.getMeta('storage_estimate')).toEqual({
          usage_bytes: 1_900_000_000,
          quota_bytes: 2_000_000_000,
          measured_at: '2026-06-14T09:00:00.000Z',
        });
      });

      it('refuses to overwrite the device id through setMeta', async () => {
        expect(await codeOf(store.setMeta('device_id', 'abc'))).toBe('record-invalid');
      });
    });

    describe('a log the browser erased', () => {
      it('is noticed on the next start and reported until its records are imported again', async () => {
        const site = await store.create('site', demo.site());
        const exported = await store.allRecords();
        const device = await store.deviceId();
        store = await subject.eraseAndReopen();
        expect(await store.allRecords()).toEqual([]);
        const status = await store.status();
        expect(status.reasons[0]).toBe('log-erased');
        expect(status.erasedLog).toEqual({ device_id: device, noticed_at: '2026-06-14T09:00:00.000Z' });
        await store.putRecords(exported);
        expect(await store.get('site', site.id)).toEqual(site);
        const after = await store.status();
        expect(after.erasedLog).toBeNull();
        expect(after.reasons).not.toContain('log-erased');
      });

      it('raises no alarm when the log that disappeared never held a record', async () => {
        await store.putDraft('site-form', { name: 'W' });
        store = await subject.eraseAndReopen();
        expect((await store.status()).erasedLog).toBeNull();
      });

      it('raises no alarm after a plain reload', async () => {
        await store.create('site', demo.site());
        store = await subject.reopen();
        expect((await store.status()).erasedLog).toBeNull();
      });
    });

    it('refuses every call once closed', async () => {
      store.close();
      expect(await codeOf(store.list('site'))).toBe('store-closed');
      expect(await codeOf(store.create('site', demo.site()))).toBe('store-closed');
      expect(await codeOf(store.putDraft('x', 1))).toBe('store-closed');
    });
  });
}
