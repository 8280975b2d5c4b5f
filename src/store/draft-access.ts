/**
 * Unsaved form input, by form key: written with relaxed durability as the person types, deleted when the
 * form is saved (in the save's own transaction, see WriteOptions.clearDraft).
 */
import type { LogStore } from './log-store';
import { isoAt } from './live-records';
import { RELAXED, type StoreContext } from './store-context';
import type { DraftEntry } from './types';

export function draftAccess(ctx: StoreContext): Pick<LogStore, 'getDraft' | 'putDraft' | 'deleteDraft'> {
  const { backend, env } = ctx;
  return {
    async getDraft<T>(key: string) {
      ctx.ensureOpen();
      // A draft holds whatever its form put there; the form that reads it by its key names the type.
      return backend.read((tx) => tx.getDraft(key)) as Promise<DraftEntry<T> | undefined>;
    },

    async putDraft(key, value) {
      ctx.ensureOpen();
      await backend.write((tx) => tx.putDraft({ key, value, saved_at: isoAt(env.now()) }), RELAXED);
    },

    async deleteDraft(key) {
      ctx.ensureOpen();
      await backend.write((tx) => tx.deleteDraft(key), RELAXED);
    },
  };
}
