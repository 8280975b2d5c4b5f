/**
 * "Export, then mark what was sent", for the Send screen and the sync run alike. The count of unsent changes is
 * read before the records are, and only that many are marked sent afterwards: a change made while the file was
 * on its way stays unsent. The log counts as sent only when `send` says it went.
 */
import { exportLog, throwIfCancelled, type LogSelection, type TransferOptions } from '../log';
import type { RecordSource } from './record-source';

export interface ExportedLog {
  /** The log file's text (canonical JSON). */
  text: string;
  device: string;
  /** The log exported again (e.g. after merging a newer copy before a retry); the count read first still holds. */
  again(): Promise<string>;
}

export interface SendLogOptions {
  appVersion: string;
  /** This phone's id when the caller has read it already; else it is read from the source. */
  device?: string;
  /** A part of the log; whole when absent. */
  selection?: Partial<LogSelection> | null;
  /** When the log was sent; default the clock at the time of marking. */
  now?: () => Date | number;
  /** Progress while the log is read and written out, and a signal that stops it before it is handed to `send`. */
  transfer?: TransferOptions;
}

/** Exports the log, hands it to `send`, and marks it sent when `send` answers sent: true. Returns send's value. */
export async function sendLog<T>(
  source: RecordSource,
  options: SendLogOptions,
  send: (log: ExportedLog) => Promise<{ sent: boolean; value: T }>,
): Promise<T> {
  const unsentBefore = source.status ? (await source.status()).unsentChanges : undefined;
  const device = options.device ?? (await source.deviceId());
  const { onProgress, signal } = options.transfer ?? {};
  const write = async () => {
    onProgress?.({ phase: 'reading', done: 0, total: 0 });
    const records = await source.allRecords({ includeDeleted: true });
    throwIfCancelled(signal, 'exporting');
    onProgress?.({ phase: 'exporting', done: 0, total: records.length });
    const text = exportLog(records, { device, app_version: options.appVersion, ...(options.selection ? { selection: options.selection } : {}) });
    onProgress?.({ phase: 'exporting', done: records.length, total: records.length });
    return text;
  };
  const text = await write();
  // The last moment to stop: once handed to `send`, the file may already be on its way.
  throwIfCancelled(signal, 'exporting');
  const outcome = await send({ text, device, again: write });
  if (outcome.sent) await source.markSent?.(options.now?.() ?? Date.now(), unsentBefore);
  return outcome.value;
}
