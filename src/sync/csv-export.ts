/**
 * The CSV tables as files to share. The tables' numbers come from src/analysis (physicsSeriesComputer): this
 * file only wraps them as files.
 */
import { logCsv, logCsvSteps, throwIfCancelled, type ComputeSeries, type LogCsv, type TransferOptions } from '../log';
import type { LogRecord } from '../log';
import { physicsSeriesComputer } from '../analysis';
import type { ShareableFile } from './shareable-file';
import { yieldToPage } from './yield-to-page';

/** The tables as files to share: "<stem>-drops.csv", "<stem>-series.csv" and, when a drop has marks, "<stem>-marks.csv". */
export function logCsvFiles(records: readonly LogRecord[], stem: string, compute: ComputeSeries = physicsSeriesComputer()): ShareableFile[] {
  return tableFiles(records, stem, logCsv(records, compute));
}

/**
 * The same files, computed one series at a time: progress is reported as "computing n of m series" and the page
 * gets a turn between two series (sync/yield-to-page.ts), so a long export shows its bar and a tap on Cancel is
 * seen. A raised signal stops it between two series with TransferCancelled; nothing is written anywhere, so there
 * is nothing to undo. Without a listener or a signal it runs straight through, as logCsvFiles.
 */
export async function logCsvFilesInSteps(
  records: readonly LogRecord[],
  stem: string,
  options: TransferOptions & { compute?: ComputeSeries } = {},
): Promise<ShareableFile[]> {
  const { onProgress, signal } = options;
  const watched = onProgress !== undefined || signal !== undefined;
  const steps = logCsvSteps(records, options.compute ?? physicsSeriesComputer());
  for (;;) {
    throwIfCancelled(signal, 'computing');
    const step = steps.next();
    if (step.done) return tableFiles(records, stem, step.value);
    onProgress?.(step.value);
    if (watched) await yieldToPage();
  }
}

function tableFiles(records: readonly LogRecord[], stem: string, tables: LogCsv): ShareableFile[] {
  return [
    { name: `${stem}-drops.csv`, text: tables.drops, type: 'text/csv;charset=utf-8' },
    { name: `${stem}-series.csv`, text: tables.series, type: 'text/csv;charset=utf-8' },
    ...(records.some((r) => r.kind === 'drop' && !r.deleted && r.marks !== undefined)
      ? [{ name: `${stem}-marks.csv`, text: tables.marks, type: 'text/csv;charset=utf-8' }]
      : []),
  ];
}
