import { describe, expect, it } from 'vitest';
import { exportLog } from '../../src/log/export';
import { sendLog } from '../../src/sync/send-log';
import { MemoryRecordSource } from './memory-record-source';
import { sampleLog } from './sample-log';

/** A record source that counts unsent changes and remembers how it was marked. */
class CountingSource extends MemoryRecordSource {
  unsent = 5;
  marked: { now: Date | number | undefined; sent: number | undefined }[] = [];
  async status() {
    return { unsentChanges: this.unsent };
  }
  async markSent(now?: Date | number, sentChanges?: number) {
    this.marked.push({ now, sent: sentChanges });
  }
}

describe('exporting the log, then marking what was sent', () => {
  it('hands over the whole log and marks the changes counted before the export as sent', async () => {
    const source = new CountingSource('phoneA', sampleLog());
    const value = await sendLog(source, { appVersion: '9.9.9', now: () => 1234 }, async (log) => {
      // A change made while the file is on its way stays unsent.
      source.unsent = 6;
      expect(log.device).toBe('phoneA');
      expect(log.text).toBe(exportLog(await source.allRecords(), { device: 'phoneA', app_version: '9.9.9' }));
      return { sent: true, value: 'went' };
    });
    expect(value).toBe('went');
    expect(source.marked).toEqual([{ now: 1234, sent: 5 }]);
  });

  it('marks nothing when the log did not go', async () => {
    const source = new CountingSource('phoneA', sampleLog());
    await sendLog(source, { appVersion: '9.9.9' }, async () => ({ sent: false, value: null }));
    expect(source.marked).toEqual([]);
  });

  it('exports only the chosen part when asked', async () => {
    const records = sampleLog({ days: 2 });
    const source = new CountingSource('phoneA', records);
    const dayId = records.find((r) => r.kind === 'day')!.id;
    const text = await sendLog(source, { appVersion: '9.9.9', selection: { day_ids: [dayId] } }, async (log) => ({ sent: false, value: log.text }));
    expect(text).toBe(exportLog(records, { device: 'phoneA', app_version: '9.9.9', selection: { day_ids: [dayId] } }));
  });

  it('exports again for a retry, with the count read first still the one marked', async () => {
    const source = new CountingSource('phoneA', sampleLog());
    await sendLog(source, { appVersion: '9.9.9', now: () => 1 }, async (log) => {
      source.unsent = 9;
      const again = await log.again();
      expect(again).toBe(log.text);
      return { sent: true, value: undefined };
    });
    expect(source.marked).toEqual([{ now: 1, sent: 5 }]);
  });
});
