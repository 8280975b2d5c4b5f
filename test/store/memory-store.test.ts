import { createMemoryStore, MemoryDatabase } from '../../src/store';
import { runLogStoreTests } from './suite';

runLogStoreTests('memory twin', async (fake) => {
  let database = new MemoryDatabase();
  let store = await createMemoryStore({ database, environment: fake.environment });
  return {
    store,
    async reopen() {
      store.close();
      store = await createMemoryStore({ database, environment: fake.environment });
      return store;
    },
    openAnother: () => createMemoryStore({ database, environment: fake.environment }),
    async eraseAndReopen() {
      store.close();
      database = new MemoryDatabase();
      store = await createMemoryStore({ database, environment: fake.environment });
      return store;
    },
    async exhaustQuota() {
      database.quotaBytes = database.sizeBytes();
    },
    async restoreQuota() {
      database.quotaBytes = null;
    },
    async dispose() {
      store.close();
    },
  };
});
