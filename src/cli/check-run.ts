/**
 * `plummet check`: each log file read as the phone's import reads it (the published JSON Schema through
 * log/json-schema-check.ts, then the record gate), and every problem listed per file with the record, the field,
 * the value and the rule broken. Reading stops at the first stage that fails, as import does; that stage lists up
 * to PROBLEMS_PER_FILE problems. See commands/check.ts for the options and exit codes.
 */
import { PlummetError } from '../errors';
import { logFileProblems, type LogFileError } from '../log';
import { parseArguments } from './arguments';
import type { CommandIo } from './command';
import { describeFault, isStackOverflow, shownValue } from './describe-problem';
import { MAX_NESTING, nestedTooDeeply, nestingBeyond } from './parse-json';
import { findLogSources, readLogs } from './read-logs';
import { writeText } from './write-text';

export const PROBLEMS_PER_FILE = 50;

export interface CheckedProblem {
  /** The record the problem is in, by its place in the file and, as far as they are text, its kind and id. */
  record: { index: number; kind: string | null; id: string | null } | null;
  field: string | null;
  value: unknown;
  rule: string | null;
  code: string;
  message: string;
}

export interface CheckedFile {
  file: string;
  ok: boolean;
  /** The device named in the file's header, when it could be read. */
  device: string | null;
  records: number | null;
  problems: CheckedProblem[];
}

export async function runCheck(args: readonly string[], io: CommandIo, usage: string): Promise<0 | 1 | 2> {
  const parsed = parseArguments(args, { flags: ['--json'] });
  if ('usage' in parsed) return refuse(io, `plummet check: ${parsed.usage}\n${usage}`);
  if (parsed.rest.length === 0) return refuse(io, `plummet check: name at least one log file or folder (- for standard input)\n${usage}`);
  if (parsed.rest.filter((p) => p === '-').length > 1) return refuse(io, 'plummet check: standard input (-) can be read only once\n');
  const json = parsed.flags.has('--json');
  const found = findLogSources(parsed.rest, io.cwd);
  const checked: CheckedFile[] = found.refused.map((r) => unreadable(r.name, r.error));
  try {
    for await (const read of readLogs(found.sources, io, { parse: false, label: 'checking logs' })) {
      checked.push(read.text === null ? unreadable(read.name, read.error!) : checkText(read.name, read.text));
    }
  } catch (error) {
    io.stderr.write(describeFault('checking the logs', error));
    return 2;
  }
  const bad = checked.filter((c) => !c.ok).length;
  if (json) {
    await writeText(io.stdout, `${JSON.stringify({ checked: checked.length, accepted: checked.length - bad, refused: bad, passed_over: found.passedOver, files: checked }, null, 2)}\n`);
  } else {
    await writeText(io.stdout, checkReportText(checked, found.passedOver));
  }
  if (checked.length === 0) {
    io.stderr.write(`plummet check: no .json file found in ${parsed.rest.join(', ')}\n`);
    return 1;
  }
  return bad > 0 ? 1 : 0;
}

function unreadable(name: string, error: PlummetError): CheckedFile {
  return { file: name, ok: false, device: null, records: null, problems: [problemOf(error, null)] };
}

/** One file's text checked; everything it finds, never a throw for the file's own faults. */
export function checkText(name: string, text: string): CheckedFile {
  const deep = nestingBeyond(text, MAX_NESTING);
  if (deep >= 0) return unreadable(name, nestedTooDeeply(name, deep));
  let problems: LogFileError[];
  try {
    problems = logFileProblems(text, { limit: PROBLEMS_PER_FILE });
  } catch (error) {
    if (error instanceof PlummetError) return unreadable(name, error);
    if (isStackOverflow(error)) return unreadable(name, nestedTooDeeply(name, null));
    throw error;
  }
  // The file parsed (or the first problem says it did not): its header and records, to name them.
  type Head = { device?: unknown; records?: unknown };
  let data: Head | null = null;
  try {
    const value: unknown = JSON.parse(text);
    if (value !== null && typeof value === 'object' && !Array.isArray(value)) data = value as Head;
  } catch {
    // Not JSON: the problem says so.
  }
  const records = Array.isArray(data?.records) ? (data.records as unknown[]) : null;
  return {
    file: name,
    ok: problems.length === 0,
    device: typeof data?.device === 'string' ? data.device : null,
    records: records ? records.length : null,
    problems: problems.map((p) => problemOf(p, records)),
  };
}

function problemOf(error: PlummetError, records: readonly unknown[] | null): CheckedProblem {
  const at = /^records\[(\d+)\]/.exec(error.field ?? '');
  let record: CheckedProblem['record'] = null;
  if (at) {
    const index = Number(at[1]);
    const r = records?.[index] as { kind?: unknown; id?: unknown } | undefined;
    const text = (v: unknown) => (typeof v === 'string' ? (v.length > 80 ? `${v.slice(0, 77)}...` : v) : null);
    record = { index, kind: text(r?.kind), id: text(r?.id) };
  }
  return { record, field: error.field, value: error.value, rule: error.allowed, code: error.code, message: error.message };
}

function checkReportText(checked: readonly CheckedFile[], passedOver: readonly { name: string; why: string }[]): string {
  const lines: string[] = [];
  for (const c of checked) {
    if (c.ok) {
      lines.push(`ok      ${c.file} (${c.records} records from ${c.device})`);
      continue;
    }
    const more = c.problems.length >= PROBLEMS_PER_FILE ? ` (the first ${PROBLEMS_PER_FILE})` : '';
    lines.push(`refused ${c.file}: ${c.problems.length} problem${c.problems.length === 1 ? '' : 's'}${more}`);
    for (const p of c.problems) {
      const record = p.record ? `records[${p.record.index}]${p.record.kind ? ` ${p.record.kind}` : ''}${p.record.id ? ` ${p.record.id}` : ''}` : '(the file)';
      lines.push(`  record: ${record}`, `  field:  ${p.field ?? '(none)'}`, `  value:  ${shownValue(p.value)}`, `  rule:   ${p.rule ?? '(none)'}`, `  code:   ${p.code}`, '');
    }
  }
  for (const p of passedOver) lines.push(`passed over ${p.name}: ${p.why}`);
  const bad = checked.filter((c) => !c.ok).length;
  lines.push(`${checked.length} file${checked.length === 1 ? '' : 's'} checked: ${checked.length - bad} accepted, ${bad} refused`);
  return `${lines.join('\n')}\n`;
}

function refuse(io: CommandIo, text: string): 1 {
  io.stderr.write(text.endsWith('\n') ? text : `${text}\n`);
  return 1;
}
