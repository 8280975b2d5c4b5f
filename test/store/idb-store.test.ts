import 'fake-indexeddb/auto';
import { deleteDB } from 'idb';
import { openLogStore } from '../../src/store';
import { setFakeQuotaFull } from './fake-quota';
import { runLogStoreTests } from './suite';

let n = 0;

runLogStoreTests('IndexedDB adapter on fake-indexeddb', async (fake) => {
  const name = `plummet-test-${++n}`;
  let store = await openLogStore({ name, environment: fake.environment });
  return {
    store,
    async reopen() {
      store.close();
      store = await openLogStore({ name, environment: fake.environment });
      return store;
    },
    openAnother: () => openLogStore({ name, environment: fake.environment }),
    async eraseAndReopen() {
      store.close();
      await deleteDB(name);
      store = await openLogStore({ name, environment: fake.environment });
      return store;
    },
    exhaustQuota: () => setFakeQuotaFull(true),
    restoreQuota: () => setFakeQuotaFull(false),
    async dispose() {
      store.close();
      await deleteDB(name);
    },
  };
});
