/**
 * The progress line of a long run: "reading 120/1000 logs" rewritten in place on stderr, only when stderr is a
 * terminal (a log file or a pipe gets no carriage returns), at most every 100 ms, and wiped when the run ends.
 */
import type { CommandIo } from './command';

const EVERY_MS = 100;

export interface Progress {
  /** `done` of `total` finished. */
  step(done: number, total: number): void;
  /** Wipes the line (call before any other output to stderr, and at the end). */
  clear(): void;
}

export function progressLine(io: Pick<CommandIo, 'stderr' | 'stderrIsTerminal'>, label: string): Progress {
  if (!io.stderrIsTerminal) return { step() {}, clear() {} };
  let shown = false;
  let last = 0;
  return {
    step(done, total) {
      const now = Date.now();
      if (done < total && now - last < EVERY_MS) return;
      last = now;
      shown = true;
      io.stderr.write(`\r\x1b[K${label} ${done}/${total}`);
    },
    clear() {
      if (shown) io.stderr.write('\r\x1b[K');
      shown = false;
    },
  };
}
