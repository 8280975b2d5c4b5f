/**
 * Reading and setting the store's meta values, typed by key (MetaValues in types.ts, which other parts of
 * the app extend by declaration merging). The device id and the clock are the store's own.
 */
import { LogError } from '../log';
import type { LogStore } from './log-store';
import { RELAXED, type StoreContext } from './store-context';
import type { MetaKey } from './types';

/** Kept by the store itself; setMeta refuses them. */
const OWN_KEYS: readonly MetaKey[] = ['device_id', 'clock'];

export function metaAccess(ctx: StoreContext): Pick<LogStore, 'getMeta' | 'setMeta' | 'deviceId'> {
  const { backend } = ctx;
  return {
    async getMeta(key) {
      ctx.ensureOpen();
      return backend.read((tx) => tx.getMeta(key));
    },

    async setMeta(key, value) {
      ctx.ensureOpen();
      if (OWN_KEYS.includes(key)) {
        throw new LogError({ code: 'record-invalid', field: key, value, allowed: 'a meta key the store does not keep itself', message: `meta "${key}" is kept by the store itself and cannot be set` });
      }
      await backend.write((tx) => tx.putMeta(key, value), RELAXED);
    },

    async deviceId() {
      return ctx.deviceId;
    },
  };
}
