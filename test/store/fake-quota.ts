// Makes fake-indexeddb refuse writes the way a full disk does: the put request fails with a
// QuotaExceededError and the transaction aborts with it. Deletes still pass, as they free space.
import 'fake-indexeddb/auto';

let full = false;
let patched = false;

async function patch(): Promise<void> {
  if (patched) return;
  patched = true;
  const name = `quota-probe-${Math.random()}`;
  const db = await new Promise<IDBDatabase>((resolve, reject) => {
    const request = indexedDB.open(name, 1);
    request.onupgradeneeded = () => request.result.createObjectStore('probe');
    request.onsuccess = () => resolve(request.result);
    request.onerror = () => reject(request.error);
  });
  // fake-indexeddb keeps its storage in an internal ObjectStore class; its storeRecord does every put and add.
  const raw = (db.transaction('probe').objectStore('probe') as unknown as { _rawObjectStore: object })._rawObjectStore;
  const proto = Object.getPrototypeOf(raw) as { storeRecord: (...args: unknown[]) => unknown };
  const original = proto.storeRecord;
  proto.storeRecord = function (this: unknown, ...args: unknown[]) {
    // Only puts and adds pass a rollback log; a rollback after an abort must still restore what was there.
    if (full && args[2] !== undefined) throw new DOMException('The quota has been exceeded.', 'QuotaExceededError');
    return original.apply(this, args);
  };
  db.close();
  indexedDB.deleteDatabase(name);
}

export async function setFakeQuotaFull(value: boolean): Promise<void> {
  await patch();
  full = value;
}
