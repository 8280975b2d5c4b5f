import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { createDraftSaver, createMemoryStore, MemoryDatabase, StoreError, type LogStore } from '../../src/store';

describe('createDraftSaver', () => {
  let store: LogStore;
  let database: MemoryDatabase;

  beforeEach(async () => {
    database = new MemoryDatabase();
    store = await createMemoryStore({ database });
    vi.useFakeTimers();
  });

  afterEach(() => {
    vi.useRealTimers();
    store.close();
  });

  const stored = async () => (await store.getDraft<string>('drop-form'))?.value;

  it('writes the input at most 300 ms after the first key, with what was typed by then', async () => {
    const saver = createDraftSaver<string>(store, 'drop-form');
    saver.save('1');
    await vi.advanceTimersByTimeAsync(150);
    saver.save('1.1');
    await vi.advanceTimersByTimeAsync(149);
    expect(await stored()).toBeUndefined();
    await vi.advanceTimersByTimeAsync(1);
    expect(await stored()).toBe('1.1');
  });

  it('keeps saving while someone types without a pause', async () => {
    const saver = createDraftSaver<string>(store, 'drop-form', 300);
    let text = '';
    for (let key = 0; key < 20; key++) {
      text += '1';
      saver.save(text);
      await vi.advanceTimersByTimeAsync(100);
    }
    // Twenty keys 100 ms apart: a restarting debounce would not have written anything yet.
    expect((await stored())?.length).toBeGreaterThanOrEqual(18);
  });

  it('writes the pending input at once on flush', async () => {
    const saver = createDraftSaver<string>(store, 'drop-form');
    saver.save('1.12');
    expect(saver.pending).toBe(true);
    await saver.flush();
    expect(saver.pending).toBe(false);
    expect(await stored()).toBe('1.12');
  });

  it('never lets an older input land after a newer one', async () => {
    const saver = createDraftSaver<string>(store, 'drop-form');
    saver.save('1.1');
    const first = saver.flush();
    saver.save('1.12');
    await Promise.all([first, saver.flush()]);
    expect(await stored()).toBe('1.12');
  });

  it('deletes the stored draft and drops pending input on clear', async () => {
    const saver = createDraftSaver<string>(store, 'drop-form');
    saver.save('1.1');
    await saver.flush();
    saver.save('1.12');
    await saver.clear();
    await vi.advanceTimersByTimeAsync(1000);
    expect(await stored()).toBeUndefined();
  });

  it('keeps the last stored draft and the newest input when the storage is full, and retries on flush', async () => {
    const saver = createDraftSaver<string>(store, 'drop-form');
    saver.save('1.1');
    await saver.flush();
    database.quotaBytes = database.sizeBytes();
    saver.save('1.1234');
    await vi.advanceTimersByTimeAsync(300);
    expect(saver.lastError).toBeInstanceOf(StoreError);
    expect((saver.lastError as StoreError).code).toBe('storage-full');
    expect(await stored()).toBe('1.1');
    expect(saver.pending).toBe(true);
    database.quotaBytes = null;
    await saver.flush();
    expect(saver.lastError).toBeNull();
    expect(await stored()).toBe('1.1234');
  });
});
