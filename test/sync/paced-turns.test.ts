import { describe, expect, it, vi } from 'vitest';
import { pacedTurns } from '../../src/sync/yield-to-page';

describe('pacedTurns', () => {
  it('gives the page a turn (a timer) only once the given time has passed since the last turn', async () => {
    let now = 1000;
    const timer = vi.spyOn(globalThis, 'setTimeout');
    try {
      const turn = pacedTurns(100, () => now);
      const turnsAfter = async (ms: number) => {
        now += ms;
        const before = timer.mock.calls.length;
        await turn();
        return timer.mock.calls.length - before;
      };
      expect(await turnsAfter(30)).toBe(0);
      expect(await turnsAfter(30)).toBe(0);
      expect(await turnsAfter(40)).toBe(1); // 100 ms since the start
      expect(await turnsAfter(99)).toBe(0);
      expect(await turnsAfter(1)).toBe(1);
      // A step longer than the pace (a slow phone): a turn after every one.
      expect(await turnsAfter(250)).toBe(1);
      expect(await turnsAfter(250)).toBe(1);
    } finally {
      timer.mockRestore();
    }
  });
});
