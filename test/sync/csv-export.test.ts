// The CSV tables as files, computed one series at a time: the same files as in one go, a count of series for the
// progress bar, and a Cancel that stops between two series with nothing made.
import { describe, expect, it, vi } from 'vitest';
import { TransferCancelled, type TransferProgress } from '../../src/log/transfer-progress';
import type { ComputeSeries } from '../../src/log/csv-tables';
import { logCsvFiles, logCsvFilesInSteps } from '../../src/sync/csv-export';
import { sampleLog } from './sample-log';

/** A stand-in computation (the tables' wiring, not the physics: that is tested in analysis/ and physics/). */
const echo: ComputeSeries = (input) => ({ air_density_kg_m3: 1.15, drag_coefficient: 0.5, drops: input.drops.map(() => ({ drag_coefficient: 0.5 })) });

describe('the CSV files computed in steps', () => {
  const log = sampleLog({ days: 2, seriesPerDay: 3, dropsPerSeries: 2 });

  it('are the same files as computed in one go', async () => {
    expect(await logCsvFilesInSteps(log, 'quarry-2026-06-14', { compute: echo, onProgress: () => undefined })).toEqual(logCsvFiles(log, 'quarry-2026-06-14', echo));
  });

  it('report the series computed, 0 to 6 of 6', async () => {
    const seen: TransferProgress[] = [];
    await logCsvFilesInSteps(log, 'x', { compute: echo, onProgress: (p) => seen.push(p) });
    expect(seen).toEqual([0, 1, 2, 3, 4, 5, 6].map((done) => ({ phase: 'computing', done, total: 6 })));
  });

  it('stop between two series when cancelled, with TransferCancelled and no files', async () => {
    const compute = vi.fn(echo);
    const signal = { aborted: false };
    const run = logCsvFilesInSteps(log, 'x', {
      compute,
      signal,
      onProgress: (p) => {
        if (p.done === 2) signal.aborted = true;
      },
    });
    await expect(run).rejects.toBeInstanceOf(TransferCancelled);
    await expect(run).rejects.toMatchObject({ code: 'transfer-cancelled', value: 'computing' });
    expect(compute).toHaveBeenCalledTimes(2);
  });
});
