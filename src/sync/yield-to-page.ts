/**
 * Gives the page a turn between two steps of a long transfer, so the progress bar is drawn and a tap on Cancel is
 * seen. A timer, not scheduler.yield or a message: both of those run before a waiting timer in Chromium, so the
 * half-second timer that shows the bar (ui/use-transfer.ts) would not fire until the work was done. A nested timer
 * waits at least 4 ms (HTML's timer nesting rule): at one step per 2 500 records, 0.16 s over 100 000.
 */
export function yieldToPage(): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, 0));
}
