/**
 * Reading records as they are stored: one by id, all of a kind, one record's versions, and the whole log
 * for export and sync.
 */
import { RECORD_KINDS, type BodyOf, type Revision } from '../log';
import { loadWriteChecks } from './load-write-checks';
import { StoreError } from './errors';
import { byCreated, isLive } from './live-records';
import type { LogStore } from './log-store';
import type { StoreContext } from './store-context';

export function recordQueries(ctx: StoreContext): Pick<LogStore, 'get' | 'list' | 'history' | 'allRecords'> {
  const { backend } = ctx;
  const get: LogStore['get'] = async (kind, id) => {
    ctx.ensureOpen();
    return backend.read((tx) => tx.get(kind, id));
  };
  return {
    get,

    async list(kind, options = {}) {
      ctx.ensureOpen();
      const all = await backend.read((tx) => tx.getAll(kind));
      return (options.includeDeleted ? all : all.filter(isLive)).sort(byCreated);
    },

    async history(kind, id) {
      const [record, { recordHistory }] = await Promise.all([get(kind, id), loadWriteChecks()]);
      if (!record) throw new StoreError({ code: 'not-found', field: null, value: id, allowed: null, message: `no ${kind} ${id}` });
      // recordHistory is typed by the record's own `kind` field, which for a RecordOf[K] is K.
      return recordHistory(record) as Revision<BodyOf[typeof kind]>[];
    },

    async allRecords(options = {}) {
      ctx.ensureOpen();
      const lists = await backend.read((tx) => Promise.all(RECORD_KINDS.map((kind) => tx.getAll(kind))));
      const all = lists.flat();
      return options.includeDeleted === false ? all.filter(isLive) : all;
    },
  };
}
