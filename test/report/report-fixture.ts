// The report tests' log: the invented analysis test day (test/analysis/day-records.ts, demo data, not
// measurements) plus an excluded drop with its reason and a corrected reading, so every section has content.
import type { LogRecord } from '../../src/log/types';
import { excludedCopy, revise, testDay, DEVICE } from '../analysis/day-records';

export function reportLog(): { records: LogRecord[]; day: ReturnType<typeof testDay> } {
  const day = testDay();
  const extra = excludedCopy(day.drops[2]!, 7, 'd0000000-0000-4000-8000-000000000077');
  const reading = revise(day.reading, { temperature_C: 17.5, u_temperature_C: 0.3, instrument: 'meter <b>&</b> "probe"' }, Date.UTC(2026, 6, 3, 12, 0, 0), DEVICE, 'instrument name completed');
  const records = day.records.map((r) => (r.id === reading.id ? reading : r));
  return { records: [...records, extra], day: { ...day, reading } };
}
