/**
 * Office command: analyse one series of drops from a JSON request and print the result as JSON.
 *
 *   npm run --silent analyze -- request.json
 *
 * Exit status: 0 with the result on stdout; 1 for bad input (unreadable file, invalid JSON,
 * a field out of range: the message names the field, the value and the allowed range);
 * 2 for a fault of our own. The request format is described in src/physics/analysisTypes.ts and
 * examples/ holds worked requests.
 */
import { readFileSync } from 'node:fs';
import { analyzeSeries, PhysicsInputError, validateAnalysisRequest } from '../physics/index';

const USAGE = 'usage: npm run --silent analyze -- request.json   (a series analysis request; see examples/)';

export interface CliOutcome {
  exitCode: 0 | 1 | 2;
  stdout: string;
  stderr: string;
}

/** The whole command as a function of its arguments and a file reader, so it can be tested without spawning. */
export function runAnalyze(args: string[], readText: (path: string) => string): CliOutcome {
  const files = args.filter((a) => a !== '--');
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

const isMain = process.argv[1] !== undefined && /analyze\.ts$/.test(process.argv[1]);
if (isMain) {
  const outcome = runAnalyze(process.argv.slice(2), (path) => readFileSync(path, 'utf8'));
  if (outcome.stdout) process.stdout.write(outcome.stdout);
  if (outcome.stderr) process.stderr.write(outcome.stderr);
  process.exitCode = outcome.exitCode;
}
