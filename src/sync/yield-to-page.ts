/**
 * Gives the page a turn between two steps of a long transfer, so the progress bar is drawn and a tap on Cancel is
 * seen. A timer, not scheduler.yield or a message: both of those run before a waiting timer in Chromium, so the
 * half-second timer that shows the bar (ui/use-transfer.ts) would not fire until the work was done. A nested timer
 * waits at least 4 ms (HTML's timer nesting rule), and the page then draws: about 6 ms a turn in Chromium.
 */
export function yieldToPage(): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, 0));
}

/**
 * How long a transfer may work between two turns of the page: a tap is answered within about a tenth of a second,
 * the time within which a response feels immediate (common practice, e.g. the RAIL model's 100 ms).
 */
export const PAGE_TURN_MS = 100;

/**
 * Turns for the page paced by time, not by step: the returned function gives the page a turn when `everyMs` have
 * passed since the last one, and returns at once otherwise. Checking a 100 000-record file takes 40 steps of about
 * 30 ms on a laptop's Chromium; a turn at every step cost 0.25 s of the import, one every 100 ms costs a third of
 * that. On a slower phone each step takes longer than `everyMs`, and every step gets its turn.
 */
export function pacedTurns(everyMs = PAGE_TURN_MS, now: () => number = () => performance.now()): () => Promise<void> {
  let last = now();
  return async () => {
    if (now() - last < everyMs) return;
    await yieldToPage();
    last = now();
  };
}
