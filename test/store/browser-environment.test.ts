import { afterEach, describe, expect, it, vi } from 'vitest';
import { browserEnvironment } from '../../src/store/page';

afterEach(() => {
  vi.unstubAllGlobals();
});

const media = (matching: string[]) => (query: string) => ({ matches: matching.includes(query) }) as MediaQueryList;

describe('browserEnvironment', () => {
  it('says installed when the page runs in a standalone window', () => {
    vi.stubGlobal('matchMedia', media(['(display-mode: standalone)']));
    expect(browserEnvironment().isInstalled()).toBe(true);
  });

  it('says not installed in a browser tab', () => {
    vi.stubGlobal('matchMedia', media(['(display-mode: browser)']));
    expect(browserEnvironment().isInstalled()).toBe(false);
  });

  it('says installed for a home-screen app on older iOS Safari', () => {
    vi.stubGlobal('navigator', { standalone: true });
    vi.stubGlobal('matchMedia', media([]));
    expect(browserEnvironment().isInstalled()).toBe(true);
  });

  it('cannot tell without matchMedia', () => {
    vi.stubGlobal('matchMedia', undefined);
    expect(browserEnvironment().isInstalled()).toBeNull();
  });

  it('hands over navigator.storage and a working random source', () => {
    const storage = { persist: async () => true };
    vi.stubGlobal('navigator', { storage });
    const env = browserEnvironment();
    expect(env.storage).toBe(storage);
    const bytes = env.random(new Uint8Array(32));
    expect(bytes.some((b) => b !== 0)).toBe(true);
  });
});
