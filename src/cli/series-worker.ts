// A worker thread of the series pool (series-pool.ts): batches of series inputs in, their summaries and table
// values out, in the same order. Built as dist-cli/series-worker.mjs beside the command's entry.
import { parentPort } from 'node:worker_threads';
import type { SeriesInput } from '../log';
import { summarize } from './series-summary';

parentPort?.on('message', (batch: { id: number; inputs: (SeriesInput & { allDrops: unknown[] })[] }) => {
  parentPort!.postMessage({ id: batch.id, done: batch.inputs.map(summarize) });
});
