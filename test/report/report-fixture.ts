// The report tests' log: the invented analysis test day (test/analysis/day-records.ts, demo data, not
// measurements) plus an excluded drop with its reason and a corrected reading, so every section has content.
import type { LogRecord } from '../../src/log/types';
import { excludedCopy, revise, testDay, DEVICE } from '../analysis/day-records';

/** A typed drop holds the time as it was typed (the record rules refuse an empty text). */
function typedAsText(r: LogRecord): LogRecord {
  if (r.kind !== 'drop') return r;
  const raw = { kind: 'typed' as const, text: r.time_s.toFixed(4) };
  return { ...r, raw, history: r.history.map((h) => ({ ...h, body: { ...h.body, raw: { kind: 'typed' as const, text: h.body.time_s.toFixed(4) } } })) };
}

export function reportLog(): { records: LogRecord[]; day: ReturnType<typeof testDay> } {
  const day = testDay();
  const extra = excludedCopy(day.drops[2]!, 7, 'd0000000-0000-4000-8000-000000000077');
  const reading = revise(day.reading, { temperature_C: 17.5, u_temperature_C: 0.3, instrument: 'meter <b>&</b> "probe"' }, Date.UTC(2026, 6, 3, 12, 0, 0), DEVICE, 'instrument name completed');
  const records = [...day.records.map((r) => (r.id === reading.id ? reading : r)), extra].map(typedAsText);
  return { records, day: { ...day, reading } };
}

/** The app's sample day (an invented scenario of our own, three series) as the phone's records. */
export async function sampleDayRecords(): Promise<LogRecord[]> {
  const { createMemoryStore } = await import('../../src/store');
  const { loadSampleLog } = await import('../../src/ui/sample-log');
  const store = await createMemoryStore();
  await loadSampleLog(store, new Date(Date.UTC(2026, 6, 3, 9, 0, 0)));
  return store.allRecords({ includeDeleted: true });
}
