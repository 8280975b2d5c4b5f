/**
 * The office command's log part: an exported log in, the two CSV tables out.
 *
 *   npm run --silent analyze -- log.json --csv out/      →  out/drops.csv, out/series.csv
 *
 * `writeLogCsv` reads and checks the log (the published schema and the record rules), computes every series
 * with the computation handed in, and writes both tables (RFC 4180, UTF-8 with a byte order mark, CRLF).
 * `physicsSeriesComputer` (src/analysis/series-computer.ts) is that computation built on the physics' analyzeSeries.
 */
import { LOG_FORMAT, logCsv, readLogFile, seriesInputs, type ComputeSeries, type LogFile, type SeriesResult } from '../log';
import { writeOutputFiles } from './write-output';

// The computation over the physics lives in src/analysis, so the screens and the office compute alike.
export { physicsSeriesComputer, seriesComputer, seriesRequest, seriesResultOf } from '../analysis';

export interface LogCsvSummary {
  drops_csv: string;
  series_csv: string;
  /** One row per mark of each drop with marks (only its header when none has marks). */
  marks_csv: string;
  series: number;
  drops: number;
  /** Series that could not be computed: their rows carry error_code and error_message. */
  failed: { series_id: string; code: string; message: string }[];
}

/** True when parsed JSON is a Plummet log file (rather than a single-series analysis request). */
export function isLogFile(json: unknown): boolean {
  return typeof json === 'object' && json !== null && (json as { format?: unknown }).format === LOG_FORMAT;
}

/** The keys every single-series analysis request has (src/physics/analysisTypes.ts). */
export const REQUEST_KEYS = ['site', 'air', 'specimen', 'drops', 'timing'] as const;

/**
 * What a parsed JSON file is meant to be: a log (it has a "format" field: readLogFile then says whether it is
 * ours and which version), a series request (it has a request's keys), or neither, with why.
 */
export function inputKind(json: unknown): { kind: 'log' } | { kind: 'request' } | { kind: 'neither'; why: string } {
  if (typeof json !== 'object' || json === null || Array.isArray(json)) {
    const what = json === null ? 'null' : Array.isArray(json) ? 'an array' : `a ${typeof json}`;
    return { kind: 'neither', why: `it is ${what}, and both are JSON objects` };
  }
  if (Object.hasOwn(json, 'format')) return { kind: 'log' };
  const has = REQUEST_KEYS.filter((k) => Object.hasOwn(json, k));
  if (has.length === REQUEST_KEYS.length) return { kind: 'request' };
  const keys = Object.keys(json);
  const shown = keys.slice(0, 8).map((k) => JSON.stringify(k.length > 30 ? `${k.slice(0, 27)}...` : k)).join(', ') + (keys.length > 8 ? `, and ${keys.length - 8} more` : '');
  return {
    kind: 'neither',
    why:
      `a log has "format": "${LOG_FORMAT}", a request has ${REQUEST_KEYS.join(', ')}; ` +
      (keys.length === 0 ? 'this object is empty' : `this one has ${shown}`) +
      (has.length > 0 ? ` (a request would also need ${REQUEST_KEYS.filter((k) => !has.includes(k)).join(', ')})` : ''),
  };
}

/**
 * Writes out/drops.csv, out/series.csv and out/marks.csv for the log. `logJson` is the file's text (checked, throws
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
  // Never through a symbolic link planted in the folder, and both tables or neither (see write-output.ts).
  const [drops_csv, series_csv, marks_csv] = writeOutputFiles(outDir, [
    { name: 'drops.csv', content: tables.drops },
    { name: 'series.csv', content: tables.series },
    { name: 'marks.csv', content: tables.marks },
  ]) as [string, string, string];
  const inputs = seriesInputs(file.records);
  return { drops_csv, series_csv, marks_csv, series: inputs.length, drops: inputs.reduce((n, i) => n + i.allDrops.length, 0), failed };
}
