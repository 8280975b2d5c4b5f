/**
 * Gives the page a turn between two steps of a long transfer, so the progress bar is drawn and a tap on Cancel is
 * seen. A message through a MessageChannel is a task of its own without the clamping of nested timers (≥ 4 ms
 * each in browsers); scheduler.yield, where it exists, also lets input go first.
 */
type Yielder = { yield?: () => Promise<void> };

let channel: MessageChannel | null = null;
const waiting: (() => void)[] = [];

export function yieldToPage(): Promise<void> {
  const scheduler = (globalThis as { scheduler?: Yielder }).scheduler;
  if (typeof scheduler?.yield === 'function') return scheduler.yield();
  if (typeof MessageChannel !== 'function') return new Promise((resolve) => setTimeout(resolve, 0));
  if (!channel) {
    channel = new MessageChannel();
    channel.port1.onmessage = () => waiting.shift()?.();
    // Node keeps the process alive while a port listens; a page has no such concern.
    (channel.port1 as { unref?: () => void }).unref?.();
  }
  return new Promise((resolve) => {
    waiting.push(resolve);
    channel!.port2.postMessage(null);
  });
}
