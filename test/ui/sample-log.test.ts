import { describe, expect, it } from 'vitest';
import { createMemoryStore } from '../../src/store';
import { loadSampleLog, removeSampleLog } from '../../src/ui/sample-log';

// The sample log is invented demo data of our own; these tests only check that it goes in and out whole.
describe('the sample log', () => {
  it('loads into an empty log and is removed again, whatever order its random ids give the records', async () => {
    // Ids are random, and the store lists records by id: several rounds meet several orders.
    for (let round = 0; round < 8; round++) {
      const store = await createMemoryStore();
      const ids = await loadSampleLog(store);
      expect(ids.length).toBeGreaterThan(3);
      expect((await store.listDays()).length).toBe(1);
      await removeSampleLog(store, ids);
      expect(await store.allRecords({ includeDeleted: false })).toEqual([]);
    }
  });
});
