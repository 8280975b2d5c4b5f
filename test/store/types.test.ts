// The public types of the store carry meaning: each kind names its record and body types.
// These are checked by `tsc -p tsconfig.json` (test/ is in it): the calls sit in functions that never run,
// and a wrong type or a @ts-expect-error with nothing to expect fails the type check.
import { describe, expectTypeOf, it } from 'vitest';
import type { DayBody, DayRecord, DropRecord, Revision, SeriesBody, SeriesRecord } from '../../src/log/types';
import type { DayListItem, DayView, DraftEntry, ErasedLog, LogAction, LogStore, MetaValues, StoreStatus } from '../../src/store';
import type { StoreTx } from '../../src/store/backend';

describe('LogStore types', () => {
  it('returns the record type of the kind asked for', () => {
    expectTypeOf<LogStore['get']>().toBeFunction();
    const typesOnly = (store: LogStore) => {
      expectTypeOf(store.get('drop', 'x')).resolves.toEqualTypeOf<DropRecord | undefined>();
      expectTypeOf(store.list('series')).resolves.toEqualTypeOf<SeriesRecord[]>();
      expectTypeOf(store.create('day', {} as DayBody)).resolves.toEqualTypeOf<DayRecord>();
      expectTypeOf(store.history('series', 'x')).resolves.toEqualTypeOf<Revision<SeriesBody>[]>();
      expectTypeOf(store.listDays()).resolves.toEqualTypeOf<DayListItem[]>();
      expectTypeOf(store.loadDay('x')).resolves.toEqualTypeOf<DayView>();
      expectTypeOf(store.status()).resolves.toEqualTypeOf<StoreStatus>();
      expectTypeOf(store.getDraft<{ typed: string }>('k')).resolves.toEqualTypeOf<DraftEntry<{ typed: string }> | undefined>();
      expectTypeOf(store.getMeta('last_sent_at')).resolves.toEqualTypeOf<MetaValues['last_sent_at'] | undefined>();
    };
    expectTypeOf(typesOnly).toBeFunction();
  });

  it('refuses a body of another kind and a patch with a field the kind does not have', () => {
    const typesOnly = (store: LogStore) => {
      // @ts-expect-error a day body is not a series body
      void store.create('series', {} as DayBody);
      // @ts-expect-error drops have no mass
      void store.revise('drop', 'x', { mass_kg: 1 });
    };
    expectTypeOf(typesOnly).toBeFunction();
  });

  it('ties the body of an action to its kind', () => {
    expectTypeOf<Extract<LogAction, { op: 'create'; kind: 'series' }>['body']>().toEqualTypeOf<SeriesBody>();
    // @ts-expect-error a remove needs a reason
    const noReason: LogAction = { op: 'remove', kind: 'drop', id: 'x' };
    void noReason;
  });

  it('types each meta value by its key, in the store and in the engine under it', () => {
    const typesOnly = (store: LogStore, tx: StoreTx) => {
      expectTypeOf(store.getMeta('unsent_changes')).resolves.toEqualTypeOf<number | undefined>();
      expectTypeOf(tx.getMeta('unsent_changes')).resolves.toEqualTypeOf<number | undefined>();
      expectTypeOf(tx.getMeta('erased_log')).resolves.toEqualTypeOf<ErasedLog | null | undefined>();
      // @ts-expect-error the clock stamp is a string
      void tx.putMeta('clock', 5);
      // @ts-expect-error no such meta key
      void tx.getMeta('no_such_key');
      // @ts-expect-error the unsent count is a number
      void store.setMeta('unsent_changes', '3');
    };
    expectTypeOf(typesOnly).toBeFunction();
  });
});
