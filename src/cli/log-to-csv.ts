/**
 * The office command's log part: an exported log in, the two CSV tables out.
 *
 *   npm run --silent analyze -- log.json --csv out/      →  out/drops.csv, out/series.csv
 *
 * `writeLogCsv` reads and checks the log (the published schema and the record rules), computes every series
 * with the computation handed in, and writes both tables (RFC 4180, UTF-8 with a byte order mark, CRLF).
 * `physicsSeriesComputer` (src/analysis/series-computer.ts) is that computation built on the physics' analyzeSeries.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { LOG_FORMAT, logCsv, readLogFile, seriesInputs, type ComputeSeries, type LogFile, type SeriesResult } from '../log';

// The computation over the physics lives in src/analysis, so the screens and the office compute alike.
export { physicsSeriesComputer, seriesComputer, seriesRequest, seriesResultOf } from '../analysis';

export interface LogCsvSummary {
  drops_csv: string;
  series_csv: string;
  series: number;
  drops: number;
  /** Series that could not be computed: their rows carry error_code and error_message. */
  failed: { series_id: string; code: string; message: string }[];
}

/** True when parsed JSON is a Plummet log file (rather than a single-series analysis request). */
export function isLogFile(json: unknown): boolean {
  return typeof json === 'object' && json !== null && (json as { format?: unknown }).format === LOG_FORMAT;
}

/**
 * Writes out/drops.csv and out/series.csv for the log. `logJson` is the file's text (checked, throws
 * LogFileError naming the field, value and rule) or an already read LogFile.
 */
export function writeLogCsv(logJson: string | LogFile, outDir: string, computeSeries: ComputeSeries): LogCsvSummary {
  const file = typeof logJson === 'string' ? readLogFile(logJson) : logJson;
  const failed: LogCsvSummary['failed'] = [];
  const recording: ComputeSeries = (input) => {
    let result: SeriesResult;
    try {
      result = computeSeries(input);
    } catch (error) {
      const e = error as { code?: unknown; message?: unknown };
      result = { error: { code: typeof e.code === 'string' ? e.code : 'compute-failed', message: String(e.message ?? error) } };
    }
    if (result.error) failed.push({ series_id: input.series.id, ...result.error });
    return result;
  };
  const tables = logCsv(file.records, recording);
  mkdirSync(outDir, { recursive: true });
  const drops_csv = join(outDir, 'drops.csv');
  const series_csv = join(outDir, 'series.csv');
  writeFileSync(drops_csv, tables.drops);
  writeFileSync(series_csv, tables.series);
  const inputs = seriesInputs(file.records);
  return { drops_csv, series_csv, series: inputs.length, drops: inputs.reduce((n, i) => n + i.allDrops.length, 0), failed };
}
