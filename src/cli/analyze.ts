/**
 * Office command: analyse one series of drops from a JSON request and print the result as JSON, or every
 * series of an exported log and write its CSV tables.
 *
 *   plummet analyze request.json
 *   plummet analyze log.json --csv out/     (writes out/drops.csv and out/series.csv)
 *   plummet analyze log.json                (prints every series' results as JSON)
 *
 * (commands/analyze.ts is the subcommand; `npm run --silent analyze -- …` runs the same through the bundle.)
 *
 * Exit status: 0 with the result on stdout; 1 for bad input or an output it cannot write (the message names the
 * path or field, the value and what is allowed: an unreadable or non-regular file, one over the size cap of
 * read-input.ts, text that is not UTF-8/UTF-16 or not JSON, nesting too deep, neither a log nor a request, a field
 * out of range, an output folder that is a file or cannot be written); 2 for a fault of our own (no stack trace
 * unless PLUMMET_DEBUG is set). The request format is described in src/physics/analysisTypes.ts and
 * examples/ holds worked requests.
 */
import { PlummetError } from '../errors';
import { analyzeSeries, PhysicsInputError, validateAnalysisRequest } from '../physics/index';
import { LogFileError, readLogFile, seriesInputs } from '../log';
import { physicsSeriesComputer } from '../analysis';
import { inputKind, writeLogCsv } from './log-to-csv';
import { nestedTooDeeply, parseJsonText } from './parse-json';
import { describeFault, describeProblem, isStackOverflow } from './describe-problem';

const USAGE =
  'usage: plummet analyze request.json        (one series analysis request; see examples/)\n' +
  '       plummet analyze log.json [--csv DIR] (an exported log: every series, or its CSV tables in DIR)\n' +
  '       a file name of - reads standard input; plummet analyze --help says more';

export interface CliOutcome {
  exitCode: 0 | 1 | 2;
  stdout: string;
  stderr: string;
}

const refused = (stderr: string): CliOutcome => ({ exitCode: 1, stdout: '', stderr });

/** A coded error as the command prints it: a log file's problems name their rule, a request's what is allowed. */
const report = (error: PlummetError, prefix = ''): string => describeProblem(error, prefix, error instanceof LogFileError ? 'rule' : 'allowed');

/** A fault of our own: exit 2 with its message; the stack only when PLUMMET_DEBUG is set. */
const internal = (path: string, error: unknown): CliOutcome => ({ exitCode: 2, stdout: '', stderr: describeFault(`analysing ${path}`, error) });

/** The whole command as a function of its arguments and a file reader, so it can be tested without spawning. */
export function runAnalyze(args: string[], readText: (path: string) => string): CliOutcome {
  const rest = args.filter((a) => a !== '--');
  const csvAt = rest.indexOf('--csv');
  const csvDir = csvAt >= 0 ? rest[csvAt + 1] : undefined;
  if (csvAt >= 0 && (!csvDir || csvDir.startsWith('--'))) return refused(`--csv needs a folder to write to\n${USAGE}\n`);
  const files = csvAt >= 0 ? rest.filter((_, i) => i !== csvAt && i !== csvAt + 1) : rest;
  if (files.length !== 1 || files[0] === '--help' || files[0] === '-h') {
    return { exitCode: files[0] === '--help' || files[0] === '-h' ? 0 : 1, stdout: '', stderr: `${USAGE}\n` };
  }
  const file = files[0]!;
  const path = file === '-' ? '(standard input)' : file;
  let text: string;
  try {
    text = readText(file);
  } catch (error) {
    if (error instanceof PlummetError) return refused(report(error, error.code.startsWith('log-') ? `${path}: ` : ''));
    const reason = error instanceof Error ? error.message : String(error);
    return refused(`cannot read ${path}: ${reason}\n`);
  }
  let json: unknown;
  try {
    json = parseJsonText(path, text);
  } catch (error) {
    if (error instanceof PlummetError) return refused(report(error));
    return internal(path, error);
  }
  const kind = inputKind(json);
  if (kind.kind === 'log') return analyzeLog(path, text, csvDir);
  if (kind.kind === 'neither') return refused(`${path} is not a Plummet log file nor a series request: ${kind.why}\n`);
  if (csvDir !== undefined) return refused(`${path} is a series request: --csv needs an exported log file\n`);
  try {
    const result = analyzeSeries(validateAnalysisRequest(json));
    return { exitCode: 0, stdout: `${JSON.stringify(result, null, 2)}\n`, stderr: '' };
  } catch (error) {
    if (error instanceof PhysicsInputError) {
      return refused(`${path}: ${error.message}\n  field: ${error.field}\n  value: ${JSON.stringify(error.value) ?? 'undefined'}\n  allowed: ${error.allowed}\n  code: ${error.code}\n`);
    }
    if (isStackOverflow(error)) return refused(report(nestedTooDeeply(path, null)));
    return internal(path, error);
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
    if (error instanceof LogFileError) return refused(report(error, `${path}: `));
    // The output folder refused (a file in the way, no permission, a read-only place).
    if (error instanceof PlummetError) return refused(report(error));
    if (isStackOverflow(error)) return refused(report(nestedTooDeeply(path, null)));
    return internal(path, error);
  }
}
