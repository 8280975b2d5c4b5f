/**
 * The log store's logic, written once over a StoreBackend: validation before any write, one transaction per
 * user action, references checked, removal cascading into what a day or a series holds, per-day counts kept
 * up to date, the clock stamp and the count of unsent changes kept with the records they describe.
 */
import {
  HybridLogicalClock,
  LogError,
  LogValidationError,
  RECORD_KINDS,
  compareHlc,
  createRecord,
  deleteRecord,
  randomDeviceId,
  recordHistory,
  reviseRecord,
  uuidV4,
  validateRecord,
  type LogRecord,
  type Problem,
  type ReadingRecord,
  type RecordContext,
  type RecordKind,
  type RecordOf,
  type SeriesRecord,
} from '../log';
import type { StoreBackend, StoreTx } from './backend';
import { StoreError } from './errors';
import type { LogStore } from './log-store';
import { assessRisk } from './storage-risk';
import type {
  DayListItem,
  DaySummary,
  DayView,
  LogAction,
  MetaKey,
  MetaValues,
  StorageEstimate,
  StoreEnvironment,
  StoreStatus,
  WriteOptions,
} from './types';

const keyOf = (kind: RecordKind, id: string) => `${kind}:${id}`;
const live = <R extends LogRecord>(r: R | undefined): r is R => r !== undefined && !r.deleted;
const iso = (ms: number) => new Date(ms).toISOString();
/** Code-unit order, as IndexedDB compares string keys (localeCompare would depend on the phone's language). */
const cmp = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);
const byCreated = (a: LogRecord, b: LogRecord) => cmp(a.created_at, b.created_at) || cmp(a.id, b.id);

/** Which record field points at which kind, for the checks made before a write. */
const REFERENCES: { [K in RecordKind]: { field: string; kind: RecordKind }[] } = {
  site: [],
  specimen: [],
  day: [{ field: 'site_id', kind: 'site' }],
  reading: [{ field: 'day_id', kind: 'day' }],
  series: [
    { field: 'day_id', kind: 'day' },
    { field: 'specimen_id', kind: 'specimen' },
    { field: 'reading_id', kind: 'reading' },
  ],
  drop: [{ field: 'series_id', kind: 'series' }],
};

/** Records written in one transaction, visible to the later steps of the same action. */
class Staging {
  readonly records = new Map<string, LogRecord>();
  /** The stored version before this action, for every staged record (undefined when new). */
  readonly previous = new Map<string, LogRecord | undefined>();
  /** Stored records already read in this transaction: each is read once per action. */
  private readonly read = new Map<string, Promise<LogRecord | undefined>>();

  constructor(private readonly tx: StoreTx) {}

  async lookup<K extends RecordKind>(kind: K, id: string): Promise<RecordOf[K] | undefined> {
    const key = keyOf(kind, id);
    const staged = this.records.get(key);
    if (staged) return staged as RecordOf[K];
    let pending = this.read.get(key);
    if (!pending) this.read.set(key, (pending = this.tx.get(kind, id)));
    return (await pending) as RecordOf[K] | undefined;
  }

  stage(record: LogRecord, previous: LogRecord | undefined): void {
    const key = keyOf(record.kind, record.id);
    if (!this.previous.has(key)) this.previous.set(key, previous);
    this.records.set(key, record);
  }

  /** Live records of `kind` whose `field` is `id`, as they stand after the steps staged so far. */
  async referrers<K extends 'day' | 'reading' | 'series' | 'drop'>(kind: K, field: string, id: string): Promise<RecordOf[K][]> {
    const index = { day: 'by_site', reading: 'by_day', series: field === 'specimen_id' ? 'by_specimen' : 'by_day', drop: 'by_series' }[kind];
    const found = new Map<string, LogRecord>();
    for (const r of await this.tx.getAllByIndex(kind, index as never, id)) found.set(r.id, r);
    for (const r of this.records.values()) if (r.kind === kind) found.set(r.id, r);
    const result: RecordOf[K][] = [];
    for (const r of found.values()) {
      const current = (this.records.get(keyOf(kind, r.id)) ?? r) as RecordOf[K];
      if (live(current) && (current as unknown as Record<string, unknown>)[field] === id) result.push(current);
    }
    return result;
  }
}

async function checkReferences(record: LogRecord, previous: LogRecord | undefined, staging: Staging): Promise<void> {
  const fields = record as unknown as Record<string, unknown>;
  const before = previous as unknown as Record<string, unknown> | undefined;
  const checks = REFERENCES[record.kind].filter(({ field }) => fields[field] !== null && !(before && before[field] === fields[field]));
  const found = await Promise.all(checks.map(({ field, kind }) => staging.lookup(kind, fields[field] as string)));
  checks.forEach(({ field, kind }, i) => checkReference(record, field, kind, found[i]));
}

function checkReference(record: LogRecord, field: string, kind: RecordKind, found: LogRecord | undefined): void {
  const fields = record as unknown as Record<string, unknown>;
  const target = fields[field];
  if (!live(found)) {
    throw new StoreError({
      code: 'reference-missing',
      field: `${record.kind}.${field}`,
      value: target,
      allowed: `the id of a saved, live ${kind}`,
      message: `${record.kind}.${field}: no ${kind} ${String(target)}${found ? ' (it is deleted)' : ''}; allowed: the id of a saved, live ${kind}: save it first or in the same action`,
    });
  }
  if (field === 'reading_id' && (found as RecordOf['reading']).day_id !== fields.day_id) {
    throw new StoreError({ code: 'reference-missing', field: 'series.reading_id', value: target, allowed: 'a reading of the same day', message: `series.reading_id: reading ${String(target)} belongs to another day` });
  }
}

/** What removing `record` also removes, or why it may not be removed. */
async function removalSet(record: LogRecord, staging: Staging): Promise<LogRecord[]> {
  const inUse = (what: string, n: number) =>
    new StoreError({ code: 'record-in-use', field: null, value: record.id, allowed: null, message: `${record.kind} ${record.id} is used by ${n} ${what}; change or remove those first` });
  switch (record.kind) {
    case 'site': {
      const days = await staging.referrers('day', 'site_id', record.id);
      if (days.length > 0) throw inUse(days.length === 1 ? 'day' : 'days', days.length);
      return [record];
    }
    case 'specimen': {
      const series = await staging.referrers('series', 'specimen_id', record.id);
      if (series.length > 0) throw inUse('series', series.length);
      return [record];
    }
    case 'reading': {
      const series = (await staging.referrers('series', 'day_id', record.day_id)).filter((s) => s.reading_id === record.id);
      if (series.length > 0) throw inUse('series', series.length);
      return [record];
    }
    case 'series':
      return [record, ...(await staging.referrers('drop', 'series_id', record.id))];
    case 'day': {
      const [readings, series] = await Promise.all([
        staging.referrers('reading', 'day_id', record.id),
        staging.referrers('series', 'day_id', record.id),
      ]);
      const drops = await Promise.all(series.map((s) => staging.referrers('drop', 'series_id', s.id)));
      return [record, ...readings, ...series, ...drops.flat()];
    }
    case 'drop':
      return [record];
  }
}

/** The days whose counts change when these records are written (before and after the write). */
async function affectedDays(
  records: Iterable<LogRecord>,
  previous: (r: LogRecord) => LogRecord | undefined,
  seriesOf: (id: string) => Promise<SeriesRecord | undefined>,
): Promise<Set<string>> {
  const days = new Set<string>();
  const seriesDay = new Map<string, Promise<string | undefined>>();
  const dayOfSeries = (id: string) => {
    let found = seriesDay.get(id);
    if (!found) seriesDay.set(id, (found = seriesOf(id).then((s) => s?.day_id)));
    return found;
  };
  const pending: Promise<unknown>[] = [];
  for (const record of records) {
    for (const version of [record, previous(record)]) {
      if (!version) continue;
      if (version.kind === 'day') days.add(version.id);
      else if (version.kind === 'reading' || version.kind === 'series') days.add(version.day_id);
      else if (version.kind === 'drop') pending.push(dayOfSeries(version.series_id).then((d) => d && days.add(d)));
    }
  }
  await Promise.all(pending);
  return days;
}

async function computeSummary(tx: StoreTx, dayId: string, fetched?: [ReadingRecord[], SeriesRecord[]]): Promise<DaySummary> {
  const [readings, series] =
    fetched ?? (await Promise.all([tx.getAllByIndex('reading', 'by_day', dayId), tx.getAllByIndex('series', 'by_day', dayId)]));
  const liveSeries = series.filter(live);
  const drops = await Promise.all(liveSeries.map((s) => tx.getAllByIndex('drop', 'by_series', s.id)));
  return {
    day_id: dayId,
    reading_count: readings.filter(live).length,
    series_count: liveSeries.length,
    drop_count: drops.reduce((n, list) => n + list.filter(live).length, 0),
  };
}

async function refreshSummaries(tx: StoreTx, dayIds: Iterable<string>): Promise<void> {
  await Promise.all(
    [...dayIds].map(async (dayId) => {
      // One round trip for the day and its contents; a deleted day's reads are simply unused.
      const [day, readings, series] = await Promise.all([
        tx.get('day', dayId),
        tx.getAllByIndex('reading', 'by_day', dayId),
        tx.getAllByIndex('series', 'by_day', dayId),
      ]);
      if (!live(day)) await tx.deleteSummary(dayId);
      else await tx.putSummary(await computeSummary(tx, dayId, [readings, series]));
    }),
  );
}

function problemsOfBatch(records: readonly LogRecord[]): Problem[] {
  const problems: Problem[] = [];
  const seen = new Set<string>();
  for (let i = 0; i < records.length; i++) {
    const record = records[i]!;
    const found = validateRecord(record);
    if (found.length > 0) {
      const where = `[${i}]`;
      for (const p of found) {
        problems.push({ ...p, path: `${where}.${p.path}`, message: `${where} ${String(record?.kind)} ${String(record?.id)}: ${p.message}` });
      }
    }
    const key = keyOf(record?.kind, record?.id);
    if (seen.has(key)) {
      const where = `[${i}]`;
      const rule = 'each record may appear once';
      problems.push({ path: `${where}.id`, value: record.id, rule, message: `${where}.id: ${record.id} appears twice: ${rule}` });
    }
    seen.add(key);
  }
  return problems;
}

/** The stored version of each record of a batch, in the batch's order (undefined for new ones). */
async function previousVersions(tx: StoreTx, records: readonly LogRecord[]): Promise<(LogRecord | undefined)[]> {
  const byKind = new Map<RecordKind, number[]>();
  records.forEach((r, i) => {
    let list = byKind.get(r.kind);
    if (!list) byKind.set(r.kind, (list = []));
    list.push(i);
  });
  const previous: (LogRecord | undefined)[] = new Array(records.length);
  await Promise.all(
    [...byKind].map(async ([kind, positions]) => {
      const found = await tx.getMany(kind, positions.map((i) => records[i]!.id));
      positions.forEach((at, j) => (previous[at] = found[j]));
    }),
  );
  return previous;
}

/**
 * The day summaries after a batch is written, from the summaries stored before it plus what the batch changes.
 * Reads only the state before the batch, so it must run before the batch's puts.
 *
 * A day's counts are its live readings, its live series and the live drops of those series, whatever order
 * the records arrived in (a drop may come before its series). So a series that becomes live, dies or moves to
 * another day carries the drops already stored for it; those are the only drops read. A day that was not live
 * before (new, revived) or whose summary is missing starts from a count of what was stored for it.
 */
async function summariesAfter(
  tx: StoreTx,
  records: readonly LogRecord[],
  previous: readonly (LogRecord | undefined)[],
): Promise<{ put: DaySummary[]; remove: string[] }> {
  const readingDelta = new Map<string, number>();
  const seriesDelta = new Map<string, number>();
  const dropDelta = new Map<string, number>();
  const add = (map: Map<string, number>, key: string | null, n: number) => {
    if (key !== null && n !== 0) map.set(key, (map.get(key) ?? 0) + n);
  };
  const dayBefore = new Map<string, LogRecord | undefined>();
  const dayAfter = new Map<string, LogRecord | undefined>();
  const seriesBefore = new Map<string, SeriesRecord | undefined>();
  const seriesAfter = new Map<string, SeriesRecord | undefined>();
  /** Live drops gained (or lost) by each series in this batch. */
  const dropsGained = new Map<string, number>();
  records.forEach((record, i) => {
    const prior = previous[i];
    switch (record.kind) {
      case 'day':
        dayBefore.set(record.id, prior);
        dayAfter.set(record.id, record);
        break;
      case 'reading': {
        const from = live(prior) ? (prior as ReadingRecord).day_id : null;
        const to = live(record) ? record.day_id : null;
        if (from !== to) {
          add(readingDelta, from, -1);
          add(readingDelta, to, 1);
        }
        break;
      }
      case 'series':
        seriesBefore.set(record.id, prior as SeriesRecord | undefined);
        seriesAfter.set(record.id, record);
        break;
      case 'drop':
        if (live(prior)) add(dropsGained, (prior as RecordOf['drop']).series_id, -1);
        if (live(record)) add(dropsGained, record.series_id, 1);
        break;
    }
  });
  // Series not in the batch whose drops changed: stored, and the same before and after.
  const otherSeries = [...dropsGained.keys()].filter((id) => !seriesAfter.has(id));
  (await tx.getMany('series', otherSeries)).forEach((s, i) => {
    seriesBefore.set(otherSeries[i]!, s);
    seriesAfter.set(otherSeries[i]!, s);
  });
  const dayOf = (s: SeriesRecord | undefined) => (live(s) ? s.day_id : null);
  const moved: { id: string; from: string | null; to: string | null }[] = [];
  for (const [id, after] of seriesAfter) {
    const from = dayOf(seriesBefore.get(id));
    const to = dayOf(after);
    const gained = dropsGained.get(id) ?? 0;
    if (from === to) add(dropDelta, to, gained);
    else {
      add(seriesDelta, from, -1);
      add(seriesDelta, to, 1);
      moved.push({ id, from, to });
    }
  }
  // The drops stored before the batch go with a series that changes day or liveness.
  const storedDrops = await Promise.all(moved.map(({ id }) => tx.getAllByIndex('drop', 'by_series', id)));
  moved.forEach(({ id, from, to }, i) => {
    const had = storedDrops[i]!.filter(live).length;
    add(dropDelta, from, -had);
    add(dropDelta, to, had + (dropsGained.get(id) ?? 0));
  });

  const days = new Set([...dayAfter.keys(), ...readingDelta.keys(), ...seriesDelta.keys(), ...dropDelta.keys()]);
  const otherDays = [...days].filter((id) => !dayAfter.has(id));
  (await tx.getMany('day', otherDays)).forEach((d, i) => {
    dayBefore.set(otherDays[i]!, d);
    dayAfter.set(otherDays[i]!, d);
  });
  const remove: string[] = [];
  const put = await Promise.all(
    [...days]
      .filter((id) => live(dayAfter.get(id)) || (remove.push(id), false))
      .map(async (dayId): Promise<DaySummary> => {
        const stored = live(dayBefore.get(dayId)) ? await tx.getSummary(dayId) : undefined;
        const base = stored ?? (await computeSummary(tx, dayId));
        return {
          day_id: dayId,
          reading_count: base.reading_count + (readingDelta.get(dayId) ?? 0),
          series_count: base.series_count + (seriesDelta.get(dayId) ?? 0),
          drop_count: base.drop_count + (dropDelta.get(dayId) ?? 0),
        };
      }),
  );
  return { put, remove };
}

export interface CreateLogStoreOptions {
  /** Durability of transactions that write records (see WriteTxOptions). */
  durability?: 'strict' | 'relaxed';
  /** The database name, which also names the loss witness's note. */
  name?: string;
}

interface WitnessNote {
  device_id: string;
  since: string;
}

function readWitness(env: StoreEnvironment, key: string): WitnessNote | null {
  try {
    const text = env.witness?.read(key);
    const note = text ? (JSON.parse(text) as Partial<WitnessNote>) : null;
    return typeof note?.device_id === 'string' ? (note as WitnessNote) : null;
  } catch {
    return null;
  }
}

export async function createLogStore(backend: StoreBackend, env: StoreEnvironment, options: CreateLogStoreOptions = {}): Promise<LogStore> {
  const recordDurability = { durability: options.durability ?? 'strict' } as const;
  const relaxed = { durability: 'relaxed' } as const;

  // The device id is made once. Read first (the common case costs no write); make it in a write transaction
  // that looks again, so two tabs opening a new database together agree on one id.
  let { device, stamp } = await backend.read(async (tx) => ({
    device: (await tx.getMeta('device_id')) as string | undefined,
    stamp: (await tx.getMeta('clock')) as string | undefined,
  }));
  const witnessKey = `plummet-log-witness:${options.name ?? 'default'}`;
  const witnessed = readWitness(env, witnessKey);
  if (!device) {
    device = await backend.write(async (tx) => {
      const existing = (await tx.getMeta('device_id')) as string | undefined;
      if (existing) return existing;
      const made = randomDeviceId(env.random);
      await tx.putMeta('device_id', made);
      // A new database where the witness remembers a log with records: the browser erased it.
      if (witnessed) await tx.putMeta('erased_log', { device_id: witnessed.device_id, noticed_at: iso(env.now()) });
      return made;
    }, relaxed);
  }
  const deviceId = device;
  let witnessCurrent = witnessed?.device_id === deviceId;
  /** Noted once records exist, so an empty log that disappears raises no alarm. */
  function noteWitness(): void {
    if (witnessCurrent || !env.witness) return;
    env.witness.write(witnessKey, JSON.stringify({ device_id: deviceId, since: iso(env.now()) } satisfies WitnessNote));
    witnessCurrent = true;
  }
  const clock = new HybridLogicalClock(deviceId, stamp && stamp.endsWith(`-${deviceId}`) ? stamp : undefined);
  let persistenceAsked = false;
  let pendingPersistence: Promise<unknown> = Promise.resolve();

  const ensureOpen = () => {
    if (backend.closed) throw new StoreError({ code: 'store-closed', field: null, value: null, allowed: null, message: 'the log store is closed; reload the app to open it again' });
  };

  /** Another tab of this app writes with the same device id: take in its newest stamp so ours sort after it. */
  function catchUpClock(stored: unknown, now: number): void {
    if (typeof stored === 'string' && compareHlc(stored, clock.latest) > 0) clock.receive(stored, now);
  }

  function askPersistenceOnce(): void {
    if (persistenceAsked) return;
    persistenceAsked = true;
    // Not awaited: Firefox shows a prompt, and a save must not wait for a person to answer it.
    pendingPersistence = store.requestPersistence().catch(() => null);
  }

  async function runActions(actions: readonly LogAction[], writeOptions: WriteOptions = {}): Promise<LogRecord[]> {
    ensureOpen();
    const now = env.now();
    const written = await backend.write(async (tx) => {
      const [storedClock, unsentBefore] = await Promise.all([tx.getMeta('clock'), tx.getMeta('unsent_changes')]);
      catchUpClock(storedClock, now);
      const ctx: RecordContext = { device: deviceId, clock, now, random: env.random };
      const staging = new Staging(tx);
      for (const action of actions) {
        if (action.op === 'create') {
          const record = createRecord(action.kind, action.body as never, { ...ctx, id: action.id }) as LogRecord;
          const [existing, referenceError] = await Promise.all([
            staging.lookup(record.kind, record.id),
            checkReferences(record, undefined, staging).then(
              () => null,
              (error: unknown) => error,
            ),
          ]);
          if (existing) throw new StoreError({ code: 'already-exists', field: null, value: record.id, allowed: null, message: `${record.kind} ${record.id} already exists` });
          if (referenceError) throw referenceError;
          staging.stage(record, undefined);
          continue;
        }
        const current = await staging.lookup(action.kind, action.id);
        if (!current) throw new StoreError({ code: 'not-found', field: null, value: action.id, allowed: null, message: `no ${action.kind} ${action.id}` });
        const stored = staging.previous.has(keyOf(current.kind, current.id)) ? staging.previous.get(keyOf(current.kind, current.id)) : current;
        if (action.op === 'revise') {
          const next = reviseRecord(current, action.patch as never, { ...ctx, reason: action.reason ?? null }) as LogRecord;
          if (next === current) continue;
          await checkReferences(next, current, staging);
          staging.stage(next, stored);
        } else {
          if (current.deleted) continue;
          for (const record of await removalSet(current, staging)) {
            const prior = staging.previous.has(keyOf(record.kind, record.id)) ? staging.previous.get(keyOf(record.kind, record.id)) : record;
            staging.stage(deleteRecord(record, { ...ctx, reason: action.reason }), prior);
          }
        }
      }
      const records = [...staging.records.values()];
      const writes: Promise<unknown>[] = [];
      if (records.length > 0) {
        // Requests of one transaction run in the order they are made, so the counts read below already see
        // these puts; awaiting them first would only add a round trip.
        const putting = tx.putRecords(records);
        // Handled at once: if the put fails while the counts are still being read, the rejection must not
        // count as unhandled. It is awaited (and reported) with the rest below.
        putting.catch(() => undefined);
        writes.push(putting);
        const days = await affectedDays(records, (r) => staging.previous.get(keyOf(r.kind, r.id)), (id) => staging.lookup('series', id));
        writes.push(
          refreshSummaries(tx, days),
          tx.putMeta('unsent_changes', ((unsentBefore as number | undefined) ?? 0) + records.length),
          tx.putMeta('clock', clock.latest),
        );
      }
      if (writeOptions.clearDraft !== undefined) writes.push(tx.deleteDraft(writeOptions.clearDraft));
      await Promise.all(writes);
      return records;
    }, recordDurability);
    if (written.length > 0) {
      noteWitness();
      askPersistenceOnce();
    }
    return written;
  }

  const notFound = (kind: RecordKind, id: string) => new StoreError({ code: 'not-found', field: null, value: id, allowed: null, message: `no ${kind} ${id}` });

  const store: LogStore = {
    async get(kind, id) {
      ensureOpen();
      return backend.read((tx) => tx.get(kind, id));
    },

    async list(kind, listOptions = {}) {
      ensureOpen();
      const all = await backend.read((tx) => tx.getAll(kind));
      return (listOptions.includeDeleted ? all : all.filter(live)).sort(byCreated);
    },

    async listDays() {
      ensureOpen();
      return backend.read(async (tx) => {
        const [days, sites, summaries] = await Promise.all([tx.getAllByIndex('day', 'by_date'), tx.getAll('site'), tx.getAllSummaries()]);
        const siteName = new Map(sites.map((s) => [s.id, s.name]));
        const counts = new Map(summaries.map((s) => [s.day_id, s]));
        const liveDays = days.filter(live);
        // A missing summary would be a fault; count that day the slow way rather than show zeros.
        for (const day of liveDays) if (!counts.has(day.id)) counts.set(day.id, await computeSummary(tx, day.id));
        return liveDays
          .map((day): DayListItem => {
            const c = counts.get(day.id)!;
            return {
              id: day.id,
              date: day.date,
              site_id: day.site_id,
              site_name: siteName.get(day.site_id) ?? null,
              crew: day.crew,
              notes: day.notes,
              reading_count: c.reading_count,
              series_count: c.series_count,
              drop_count: c.drop_count,
              updated_at: day.updated_at,
            };
          })
          .sort((a, b) => cmp(b.date, a.date) || cmp(b.updated_at, a.updated_at) || cmp(a.id, b.id));
      });
    },

    async loadDay(dayId) {
      ensureOpen();
      return backend.read(async (tx): Promise<DayView> => {
        const day = await tx.get('day', dayId);
        if (!day) throw notFound('day', dayId);
        if (day.deleted) throw new StoreError({ code: 'not-found', field: null, value: dayId, allowed: null, message: `day ${dayId} is deleted` });
        const [site, readings, series] = await Promise.all([
          tx.get('site', day.site_id),
          tx.getAllByIndex('reading', 'by_day', dayId),
          tx.getAllByIndex('series', 'by_day', dayId),
        ]);
        const liveSeries = series.filter(live).sort((a, b) => cmp(a.started_at, b.started_at) || byCreated(a, b));
        const specimenIds = [...new Set(liveSeries.map((s) => s.specimen_id))];
        const [dropLists, specimens] = await Promise.all([
          Promise.all(liveSeries.map((s) => tx.getAllByIndex('drop', 'by_series', s.id))),
          Promise.all(specimenIds.map((id) => tx.get('specimen', id))),
        ]);
        return {
          day,
          site: site ?? null,
          readings: readings.filter(live).sort((a, b) => cmp(a.taken_at, b.taken_at) || byCreated(a, b)),
          series: liveSeries,
          drops: dropLists.flatMap((list) => list.filter(live).sort((a, b) => a.seq - b.seq || cmp(a.captured_at, b.captured_at))),
          specimens: specimens.filter((s): s is RecordOf['specimen'] => s !== undefined),
        };
      });
    },

    async create(kind, body, createOptions = {}) {
      const [record] = await runActions([{ op: 'create', kind, body, id: createOptions.id } as LogAction], createOptions);
      return record as RecordOf[typeof kind];
    },

    async revise(kind, id, patch, reason = null, writeOptions = {}) {
      const written = await runActions([{ op: 'revise', kind, id, patch, reason } as LogAction], writeOptions);
      return (written[0] ?? (await store.get(kind, id))) as RecordOf[typeof kind];
    },

    async remove(kind, id, reason, writeOptions = {}) {
      const written = await runActions([{ op: 'remove', kind, id, reason } as LogAction], writeOptions);
      return (written.find((r) => r.kind === kind && r.id === id) ?? (await store.get(kind, id))) as RecordOf[typeof kind];
    },

    commit: runActions,

    async history(kind, id) {
      const record = await store.get(kind, id);
      if (!record) throw notFound(kind, id);
      return recordHistory(record) as never;
    },

    async allRecords(allOptions = {}) {
      ensureOpen();
      const lists = await backend.read((tx) => Promise.all(RECORD_KINDS.map((kind) => tx.getAll(kind))));
      const all = lists.flat() as LogRecord[];
      return allOptions.includeDeleted === false ? all.filter(live) : all;
    },

    async putRecords(records) {
      ensureOpen();
      const problems = problemsOfBatch(records);
      if (problems.length > 0) throw new LogValidationError(problems, 'record');
      if (records.length === 0) return;
      const now = env.now();
      await backend.write(async (tx) => {
        const [storedClock, erased, previous] = await Promise.all([tx.getMeta('clock'), tx.getMeta('erased_log'), previousVersions(tx, records)]);
        catchUpClock(storedClock, now);
        // Counted from the state before the batch, so every read happens before the first put.
        const summaries = await summariesAfter(tx, records, previous);
        // Local edits made after a merge must sort after everything merged in.
        const newest = records.reduce((max, r) => (compareHlc(r.rev, max) > 0 ? r.rev : max), records[0]!.rev);
        if (compareHlc(newest, clock.latest) > 0) clock.receive(newest, now);
        const writes: Promise<unknown>[] = [
          tx.putRecords(records),
          ...summaries.put.map((summary) => tx.putSummary(summary)),
          ...summaries.remove.map((dayId) => tx.deleteSummary(dayId)),
          tx.putMeta('clock', clock.latest),
        ];
        // The erased log's records are back once an import brings records that its device wrote.
        const erasedLog = erased as MetaValues['erased_log'] | undefined;
        if (erasedLog && records.some((r) => r.device === erasedLog.device_id || r.history.some((h) => h.device === erasedLog.device_id))) {
          writes.push(tx.putMeta('erased_log', null));
        }
        await Promise.all(writes);
      }, recordDurability);
      noteWitness();
    },

    async getDraft(key) {
      ensureOpen();
      return backend.read((tx) => tx.getDraft(key)) as never;
    },

    async putDraft(key, value) {
      ensureOpen();
      await backend.write((tx) => tx.putDraft({ key, value, saved_at: iso(env.now()) }), relaxed);
    },

    async deleteDraft(key) {
      ensureOpen();
      await backend.write((tx) => tx.deleteDraft(key), relaxed);
    },

    async getMeta<K extends MetaKey>(key: K) {
      ensureOpen();
      return backend.read((tx) => tx.getMeta(key)) as Promise<MetaValues[K] | undefined>;
    },

    async setMeta(key, value) {
      ensureOpen();
      if (key === 'device_id' || key === 'clock') {
        throw new LogError({ code: 'record-invalid', field: key, value, allowed: 'a meta key the store does not keep itself', message: `meta "${key}" is kept by the store itself and cannot be set` });
      }
      await backend.write((tx) => tx.putMeta(key, value), relaxed);
    },

    async deviceId() {
      return deviceId;
    },

    newId() {
      return uuidV4(env.random);
    },

    async status(): Promise<StoreStatus> {
      ensureOpen();
      await pendingPersistence;
      const [answer, stored, lastSentAt, unsent, erased] = await backend.read((tx) =>
        Promise.all([
          tx.getMeta('persistence'),
          tx.getMeta('storage_estimate'),
          tx.getMeta('last_sent_at'),
          tx.getMeta('unsent_changes'),
          tx.getMeta('erased_log'),
        ]),
      );
      const erasedLog = (erased as MetaValues['erased_log'] | undefined) ?? null;
      let persistent: boolean | null = (answer as MetaValues['persistence'] | undefined)?.persisted ?? null;
      if (env.storage?.persisted) persistent = await env.storage.persisted().catch(() => persistent);
      let estimate = (stored as StorageEstimate | undefined) ?? null;
      if (env.storage?.estimate) {
        const measured = await env.storage.estimate().catch(() => null);
        if (measured) {
          estimate = { usage_bytes: measured.usage ?? null, quota_bytes: measured.quota ?? null, measured_at: iso(env.now()) };
          // Kept for the settings screen; a full disk must not make the status itself fail.
          await backend.write((tx) => tx.putMeta('storage_estimate', estimate), relaxed).catch(() => undefined);
        }
      }
      const facts = {
        erased: erasedLog !== null,
        persistent,
        installed: env.isInstalled(),
        unsentChanges: (unsent as number | undefined) ?? 0,
        usage_bytes: estimate?.usage_bytes ?? null,
        quota_bytes: estimate?.quota_bytes ?? null,
      };
      const reasons = assessRisk(facts);
      const { erased: _erased, ...shown } = facts;
      return { ...shown, lastSentAt: (lastSentAt as string | undefined) ?? null, erasedLog, atRisk: reasons.length > 0, reasons };
    },

    async markSent(now, sentChanges) {
      ensureOpen();
      const at = iso(now === undefined ? env.now() : typeof now === 'number' ? now : now.getTime());
      await backend.write(async (tx) => {
        const unsent = ((await tx.getMeta('unsent_changes')) as number | undefined) ?? 0;
        await tx.putMeta('unsent_changes', sentChanges === undefined ? 0 : Math.max(0, unsent - sentChanges));
        await tx.putMeta('last_sent_at', at);
      }, recordDurability);
    },

    async requestPersistence() {
      ensureOpen();
      const persist = env.storage?.persist;
      const persisted = persist ? await persist.call(env.storage) : null;
      await backend.write((tx) => tx.putMeta('persistence', { persisted, asked_at: iso(env.now()) }), relaxed);
      return persisted;
    },

    close() {
      backend.close();
    },
  };
  return store;
}
