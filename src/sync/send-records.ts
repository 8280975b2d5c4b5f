/**
 * "Hand over the records, then mark what was sent", for a sync that writes the log in parts: as sendLog
 * (send-log.ts), the count of unsent changes is read before the records are, and only that many are marked
 * sent afterwards, so a change made while the parts were on their way stays unsent.
 */
import type { LogRecord } from '../log';
import type { RecordSource } from './record-source';

export async function sendRecords<T>(
  source: RecordSource,
  options: { now?: () => Date | number },
  send: (records: LogRecord[]) => Promise<{ sent: boolean; value: T }>,
): Promise<T> {
  const unsentBefore = source.status ? (await source.status()).unsentChanges : undefined;
  const outcome = await send(await source.allRecords({ includeDeleted: true }));
  if (outcome.sent) await source.markSent?.(options.now?.() ?? Date.now(), unsentBefore);
  return outcome.value;
}
