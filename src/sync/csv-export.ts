/**
 * The CSV tables as files to share. The tables' numbers come from src/analysis (physicsSeriesComputer): this
 * file only wraps them as files.
 */
import { logCsv, type ComputeSeries } from '../log';
import type { LogRecord } from '../log';
import { physicsSeriesComputer } from '../analysis';
import type { ShareableFile } from './shareable-file';

/** The tables as files to share: "<stem>-drops.csv", "<stem>-series.csv" and, when a drop has marks, "<stem>-marks.csv". */
export function logCsvFiles(records: readonly LogRecord[], stem: string, compute: ComputeSeries = physicsSeriesComputer()): ShareableFile[] {
  const tables = logCsv(records, compute);
  return [
    { name: `${stem}-drops.csv`, text: tables.drops, type: 'text/csv;charset=utf-8' },
    { name: `${stem}-series.csv`, text: tables.series, type: 'text/csv;charset=utf-8' },
    ...(records.some((r) => r.kind === 'drop' && !r.deleted && r.marks !== undefined)
      ? [{ name: `${stem}-marks.csv`, text: tables.marks, type: 'text/csv;charset=utf-8' }]
      : []),
  ];
}
