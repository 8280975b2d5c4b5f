// A crew's fleet of phones on one office folder, for the sync cost benchmark (bench/sync.bench.ts) and its small
// correctness test (test/sync/sync-cost.test.ts): every phone holds the crew's whole log (each recorded its share
// of the days, and all have synced), then one drop is changed on one phone, and another phone syncs. Counts the
// requests and the bytes of their bodies each way. The log is the invented demo of bench/export-log.ts.
import { parseHlc } from '../../src/log/hlc';
import type { DropRecord, LogRecord } from '../../src/log/types';
import { syncFolder, type SyncReport } from '../../src/sync/sync-run';
import type { SyncSettings } from '../../src/sync/settings';
import { benchLog } from '../../bench/export-log';
import type { DavServer } from '../servers/dav-server';
import { MemoryRecordSource } from './memory-record-source';
import { revise } from './sample-log';

export interface Traffic {
  requests: number;
  /** Request bodies sent (UTF-8 bytes). */
  sent: number;
  /** Response bodies received (bytes). */
  received: number;
  byMethod: Record<string, number>;
  /** "METHOD path" of every request, in order. */
  log: string[];
}

export const emptyTraffic = (): Traffic => ({ requests: 0, sent: 0, received: 0, byMethod: {}, log: [] });

/**
 * Node's fetch, resending a request once when it failed on a kept-alive connection the server had closed while
 * idle (UND_ERR_SOCKET, EPIPE, ECONNRESET): a long merge keeps Node's event loop from seeing the close in time.
 * Browsers resend such a request themselves; Node's fetch does not.
 */
const STALE_CONNECTION = new Set(['UND_ERR_SOCKET', 'EPIPE', 'ECONNRESET']);
export const resendingFetch: typeof fetch = async (input, init) => {
  try {
    return await fetch(input, init);
  } catch (error) {
    if (!STALE_CONNECTION.has((error as { cause?: { code?: string } }).cause?.code ?? '')) throw error;
    return fetch(input, init);
  }
};

/** A fetch that counts what goes through it. */
export function countingFetch(traffic: Traffic): typeof fetch {
  return async (input, init) => {
    const method = init?.method ?? 'GET';
    traffic.requests++;
    traffic.byMethod[method] = (traffic.byMethod[method] ?? 0) + 1;
    traffic.log.push(`${method} ${decodeURIComponent(new URL(String(input)).pathname)}`);
    if (typeof init?.body === 'string') traffic.sent += Buffer.byteLength(init.body);
    const response = await resendingFetch(input, init);
    if (method === 'HEAD' || response.status === 204 || response.status === 304) return response;
    const body = await response.arrayBuffer();
    traffic.received += body.byteLength;
    return new Response(body, { status: response.status, statusText: response.statusText, headers: response.headers });
  };
}

export interface Fleet {
  phones: MemoryRecordSource[];
  settings: SyncSettings;
  /** The crew's whole log as every phone holds it at the start. */
  records: LogRecord[];
}

/** The crew's log: `drops` drops, recorded in equal shares by `phones` phones on days of their own. */
export function crewLog(phones: number, drops: number): LogRecord[] {
  const records: LogRecord[] = [];
  const share = Math.ceil(drops / phones);
  for (let i = 0; i < phones; i++) {
    const own = benchLog(share, `phone${i}`, i + 1);
    const daysBefore = Math.ceil(share / 500) * i;
    for (const r of own) {
      // benchLog starts every phone on 2026-04-01: give each phone days of its own after the others'.
      if (r.kind === 'day') records.push({ ...r, date: new Date(Date.parse(`${r.date}T00:00:00Z`) + daysBefore * 86_400_000).toISOString().slice(0, 10) });
      else records.push(r);
    }
  }
  return records;
}

export function fleet(server: DavServer, phones: number, drops: number): Fleet {
  const records = crewLog(phones, drops);
  const settings: SyncSettings = { folder_url: server.folderUrl, ...server.credentials, enabled: true, timeout_ms: 120_000 };
  return { phones: Array.from({ length: phones }, (_, i) => new MemoryRecordSource(`phone${i}`, records)), settings, records };
}

export function syncPhone(phone: MemoryRecordSource, settings: SyncSettings, traffic?: Traffic): Promise<SyncReport> {
  return syncFolder({ source: phone, settings, appVersion: 'bench', fetch: traffic ? countingFetch(traffic) : resendingFetch });
}

const pause = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/**
 * Every phone uploads its log at once (each lists the folder while it is still empty, so none reads another's
 * file), then the phones named in `readers` sync once more to read the others': the fleet in its steady state.
 * The pauses let every file settle (a version read at least a second after it was written is trusted by its
 * listing; see src/sync/sync-state.ts).
 */
export async function settleFleet(f: Fleet, readers: readonly number[]): Promise<void> {
  const first = await Promise.all(f.phones.map((p) => syncPhone(p, f.settings)));
  for (let i = 0; i < first.length; i++) if (!first[i]!.ok) await syncUntilOk(f.phones[i]!, f.settings);
  await pause(1100);
  for (const i of readers) await syncUntilOk(f.phones[i]!, f.settings);
  await pause(1100);
}

/** A sync tried again after a passing network failure (on a loaded machine a server may drop an idle
 *  keep-alive connection as it is reused), as the phone's own back-off would. */
async function syncUntilOk(phone: MemoryRecordSource, settings: SyncSettings): Promise<SyncReport> {
  for (let attempt = 1; ; attempt++) {
    const report = await syncPhone(phone, settings);
    if (report.ok) return report;
    if (!report.error?.retryable || attempt >= 3) throw new Error(`sync of ${phone.device} failed: ${JSON.stringify(report.error)}`);
  }
}

/** One drop of the log retimed on `phone`, as a new version stamped after everything it holds. */
export async function changeOneDrop(phone: MemoryRecordSource, pick = 0): Promise<DropRecord> {
  const all = await phone.allRecords();
  const drops = all.filter((r): r is DropRecord => r.kind === 'drop');
  const drop = drops[Math.floor(drops.length / 2) + pick]!;
  const ms = Math.max(...all.map((r) => parseHlc(r.rev).ms)) + 60_000;
  const revised = revise(drop, { time_s: Math.round((drop.time_s + 0.003) * 1000) / 1000 }, ms, phone.device, 'retimed from the video');
  await phone.putRecords([revised]);
  return revised;
}
