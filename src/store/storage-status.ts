/**
 * How safe the log is on this phone (persistent storage, installed, unsent changes, room left, a log the
 * browser erased), the record of what was sent, and the request for persistent storage.
 */
import type { LogStore } from './log-store';
import { isoAt } from './live-records';
import { RELAXED, type StoreContext } from './store-context';
import { assessRisk } from './storage-risk';
import type { StorageEstimate, StoreStatus } from './types';

export interface StorageStatusAccess extends Pick<LogStore, 'status' | 'markSent' | 'requestPersistence'> {
  /** At the first save: ask for persistent storage, without making the save wait for the answer. */
  askPersistenceOnce(): void;
}

export function storageStatus(ctx: StoreContext): StorageStatusAccess {
  const { backend, env } = ctx;
  let persistenceAsked = false;
  let pendingPersistence: Promise<unknown> = Promise.resolve();

  async function requestPersistence(): Promise<boolean | null> {
    ctx.ensureOpen();
    const persist = env.storage?.persist;
    const persisted = persist ? await persist.call(env.storage) : null;
    await backend.write((tx) => tx.putMeta('persistence', { persisted, asked_at: isoAt(env.now()) }), RELAXED);
    return persisted;
  }

  return {
    requestPersistence,

    askPersistenceOnce() {
      if (persistenceAsked) return;
      persistenceAsked = true;
      // Not awaited: Firefox shows a prompt, and a save must not wait for a person to answer it.
      pendingPersistence = requestPersistence().catch(() => null);
    },

    async status(): Promise<StoreStatus> {
      ctx.ensureOpen();
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
      const erasedLog = erased ?? null;
      let persistent: boolean | null = answer?.persisted ?? null;
      if (env.storage?.persisted) persistent = await env.storage.persisted().catch(() => persistent);
      let estimate: StorageEstimate | null = stored ?? null;
      if (env.storage?.estimate) {
        const measured = await env.storage.estimate().catch(() => null);
        if (measured) {
          const fresh: StorageEstimate = { usage_bytes: measured.usage ?? null, quota_bytes: measured.quota ?? null, measured_at: isoAt(env.now()) };
          estimate = fresh;
          // Kept for the settings screen; a full disk must not make the status itself fail.
          await backend.write((tx) => tx.putMeta('storage_estimate', fresh), RELAXED).catch(() => undefined);
        }
      }
      const facts = {
        erased: erasedLog !== null,
        persistent,
        installed: env.isInstalled(),
        unsentChanges: unsent ?? 0,
        usage_bytes: estimate?.usage_bytes ?? null,
        quota_bytes: estimate?.quota_bytes ?? null,
      };
      const reasons = assessRisk(facts);
      const { erased: _erased, ...shown } = facts;
      return { ...shown, lastSentAt: lastSentAt ?? null, erasedLog, atRisk: reasons.length > 0, reasons };
    },

    async markSent(now, sentChanges) {
      ctx.ensureOpen();
      const at = isoAt(now === undefined ? env.now() : typeof now === 'number' ? now : now.getTime());
      await backend.write(async (tx) => {
        const unsent = (await tx.getMeta('unsent_changes')) ?? 0;
        await tx.putMeta('unsent_changes', sentChanges === undefined ? 0 : Math.max(0, unsent - sentChanges));
        await tx.putMeta('last_sent_at', at);
      }, ctx.recordDurability);
    },
  };
}
