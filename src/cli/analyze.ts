/**
 * Office command: analyse one series of drops from a JSON request and print the result as JSON, or every
 * series of an exported log and write its CSV tables.
 *
 *   npm run --silent analyze -- request.json
 *   npm run --silent analyze -- log.json --csv out/     (writes out/drops.csv and out/series.csv)
 *   npm run --silent analyze -- log.json                (prints every series' results as JSON)
 *
 * Exit status: 0 with the result on stdout; 1 for bad input (unreadable file, invalid JSON,
 * a field out of range: the message names the field, the value and the allowed range);
 * 2 for a fault of our own. The request format is described in src/physics/analysisTypes.ts and
 * examples/ holds worked requests.
 */
import { readFileSync } from 'node:fs';
import { PlummetError } from '../errors';
import { analyzeSeries, PhysicsInputError, validateAnalysisRequest } from '../physics/index';
import { LogFileError, readLogFile, seriesInputs } from '../log';
import { physicsSeriesComputer } from '../analysis';
import { isLogFile, writeLogCsv } from './log-to-csv';

const USAGE =
  'usage: npm run --silent analyze -- request.json        (one series analysis request; see examples/)\n' +
  '       npm run --silent analyze -- log.json [--csv DIR] (an exported log: every series, or its CSV tables in DIR)';

export interface CliOutcome {
  exitCode: 0 | 1 | 2;
  stdout: string;
  stderr: string;
}

/** The whole command as a function of its arguments and a file reader, so it can be tested without spawning. */
export function runAnalyze(args: string[], readText: (path: string) => string): CliOutcome {
  const rest = args.filter((a) => a !== '--');
  const csvAt = rest.indexOf('--csv');
  const csvDir = csvAt >= 0 ? rest[csvAt + 1] : undefined;
  if (csvAt >= 0 && (!csvDir || csvDir.startsWith('--'))) return { exitCode: 1, stdout: '', stderr: `--csv needs a folder to write to\n${USAGE}\n` };
  const files = csvAt >= 0 ? rest.filter((_, i) => i !== csvAt && i !== csvAt + 1) : rest;
  if (files.length !== 1 || files[0] === '--help' || files[0] === '-h') {
    return { exitCode: files[0] === '--help' || files[0] === '-h' ? 0 : 1, stdout: '', stderr: `${USAGE}\n` };
  }
  const path = files[0]!;
  let text: string;
  try {
    text = readText(path);
  } catch (error) {
    const reason = error instanceof Error ? error.message : String(error);
    return { exitCode: 1, stdout: '', stderr: `cannot read ${path}: ${reason}\n` };
  }
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (error) {
    const reason = error instanceof Error ? error.message : String(error);
    return { exitCode: 1, stdout: '', stderr: `${path} is not valid JSON: ${reason}\n` };
  }
  if (isLogFile(json)) return analyzeLog(path, text, csvDir);
  if (csvDir !== undefined) return { exitCode: 1, stdout: '', stderr: `${path} is a single-series request: --csv needs an exported log file\n` };
  try {
    const result = analyzeSeries(validateAnalysisRequest(json));
    return { exitCode: 0, stdout: `${JSON.stringify(result, null, 2)}\n`, stderr: '' };
  } catch (error) {
    if (error instanceof PhysicsInputError) {
      return {
        exitCode: 1,
        stdout: '',
        stderr: `${path}: ${error.message}\n  field: ${error.field}\n  value: ${JSON.stringify(error.value) ?? 'undefined'}\n  allowed: ${error.allowed}\n  code: ${error.code}\n`,
      };
    }
    const reason = error instanceof Error ? (error.stack ?? error.message) : String(error);
    return { exitCode: 2, stdout: '', stderr: `internal error while analysing ${path}: ${reason}\n` };
  }
}

/** An exported log: every series computed; with a folder, the two CSV tables written there. */
function analyzeLog(path: string, text: string, csvDir: string | undefined): CliOutcome {
  try {
    const compute = physicsSeriesComputer();
    if (csvDir !== undefined) {
      const summary = writeLogCsv(text, csvDir, compute);
      const failed = summary.failed.map((f) => `series ${f.series_id} not computed: ${f.code}: ${f.message}\n`).join('');
      return { exitCode: 0, stdout: `${JSON.stringify(summary, null, 2)}\n`, stderr: failed };
    }
    const file = readLogFile(text);
    const results = seriesInputs(file.records).map((input) => {
      try {
        return { series_id: input.series.id, ...compute(input) };
      } catch (error) {
        const e = error as { code?: string; message?: string };
        // A coded error keeps its field, value and allowed range in the report; anything else its code and message.
        return { series_id: input.series.id, error: error instanceof PlummetError ? error.toJSON() : { code: e.code ?? 'compute-failed', message: e.message ?? String(error) } };
      }
    });
    return { exitCode: 0, stdout: `${JSON.stringify({ device: file.device, series: results }, null, 2)}\n`, stderr: '' };
  } catch (error) {
    if (error instanceof LogFileError) {
      return {
        exitCode: 1,
        stdout: '',
        stderr: `${path}: ${error.message}\n  field: ${error.field}\n  value: ${JSON.stringify(error.value) ?? 'undefined'}\n  rule: ${error.rule}\n  code: ${error.code}\n`,
      };
    }
    const reason = error instanceof Error ? (error.stack ?? error.message) : String(error);
    return { exitCode: 2, stdout: '', stderr: `internal error while analysing ${path}: ${reason}\n` };
  }
}

const isMain = process.argv[1] !== undefined && /analyze\.ts$/.test(process.argv[1]);
if (isMain) {
  const outcome = runAnalyze(process.argv.slice(2), (path) => readFileSync(path, 'utf8'));
  if (outcome.stdout) process.stdout.write(outcome.stdout);
  if (outcome.stderr) process.stderr.write(outcome.stderr);
  process.exitCode = outcome.exitCode;
}
