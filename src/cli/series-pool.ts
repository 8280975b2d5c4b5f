/**
 * Every series of a large log computed on several cores: worker threads (series-worker.ts) each take batches
 * of series and run the same `summarize` as the command's own thread, so the figures are the same to the bit
 * whichever thread computed them (each series' analysis is a pure function of its input, its Monte Carlo draws
 * from a fixed seed). A season of 5000 series costs about 14 ms of CPU each here, so one thread would need over a
 * minute; a small log is computed in this thread, where starting workers would cost more than it saves.
 *
 * The worker is the built dist-cli/series-worker.mjs; when the command runs from its sources (the unit tests),
 * there is none and everything is computed in this thread.
 */
import { existsSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import { seriesInputs, type LogRecord } from '../log';
import { computedFrom, computeSeries, type ComputedSeries, type SummarizedSeries } from './series-summary';

/** Below this many series one thread is quicker than starting workers. */
export const POOL_THRESHOLD = 64;
const BATCH = 16;

/** The built worker beside this chunk or one folder up (the bundler may place this code in either). */
function workerFile(): URL | null {
  for (const relative of ['./series-worker.mjs', '../series-worker.mjs']) {
    const url = new URL(relative, import.meta.url);
    if (url.protocol === 'file:' && existsSync(fileURLToPath(url))) return url;
  }
  return null;
}

/** `jobs` threads at most (default: the cores available); `onStep` after each series or batch. */
export async function computeSeriesPooled(records: readonly LogRecord[], jobs: number | null, onStep?: (done: number, total: number) => void): Promise<ComputedSeries> {
  const inputs = seriesInputs(records);
  const threads = Math.min(jobs ?? availableParallelism(), Math.ceil(inputs.length / BATCH));
  const file = workerFile();
  if (threads <= 1 || inputs.length < POOL_THRESHOLD || file === null) return computeSeries(records, onStep);
  const done: SummarizedSeries[] = new Array(inputs.length);
  let next = 0;
  let finished = 0;
  const workers = Array.from({ length: threads }, () => new Worker(file));
  try {
    await Promise.all(
      workers.map(
        (worker) =>
          new Promise<void>((resolve, reject) => {
            const send = () => {
              if (next >= inputs.length) {
                resolve();
                return;
              }
              const id = next;
              next += BATCH;
              worker.postMessage({ id, inputs: inputs.slice(id, id + BATCH) });
            };
            worker.on('message', (reply: { id: number; done: SummarizedSeries[] }) => {
              reply.done.forEach((d, k) => (done[reply.id + k] = d));
              finished += reply.done.length;
              onStep?.(finished, inputs.length);
              send();
            });
            worker.on('error', reject);
            worker.on('exit', (code) => (next < inputs.length || code !== 0 ? reject(new Error(`a series worker stopped (exit ${code})`)) : resolve()));
            send();
          }),
      ),
    );
  } finally {
    await Promise.all(workers.map((w) => w.terminate()));
  }
  return computedFrom(inputs, done);
}
