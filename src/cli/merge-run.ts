/**
 * `plummet merge`: any number of log files and folders merged into one log, as the phone merges them, with the
 * merged log, the CSV tables and a summary of every series written where asked. See commands/merge.ts for the
 * options and the exit codes.
 */
import { dirname, basename, resolve } from 'node:path';
import { PlummetError } from '../errors';
import { buildLogFile, logCsv, writeLogFile, type Conflict } from '../log';
import { parseArguments } from './arguments';
import type { CommandIo } from './command';
import { describeFault, describeProblem } from './describe-problem';
import { LogMerger } from './log-merger';
import { progressLine } from './progress';
import { findLogSources, readLogs } from './read-logs';
import { computeSeriesPooled } from './series-pool';
import { summaryText, type SeriesSummary } from './series-summary';
import { writeOutputFiles } from './write-output';
import { writeText } from './write-text';

/** The device id the merged log is written under unless --device says otherwise. */
export const OFFICE_DEVICE = 'office';

interface FileReport {
  file: string;
  device: string;
  records: number;
  added: number;
  updated: number;
  unchanged: number;
  conflicts: number;
}

export async function runMerge(args: readonly string[], io: CommandIo, usage: string): Promise<0 | 1 | 2> {
  const parsed = parseArguments(args, { flags: ['--json'], options: ['--out', '--csv', '--device', '--jobs'] });
  if ('usage' in parsed) return refuse(io, `plummet merge: ${parsed.usage}\n${usage}`);
  const json = parsed.flags.has('--json');
  const out = parsed.options.get('--out');
  const csv = parsed.options.get('--csv');
  const device = parsed.options.get('--device') ?? OFFICE_DEVICE;
  if (parsed.rest.length === 0) return refuse(io, `plummet merge: name at least one log file or folder (- for standard input)\n${usage}`);
  if (parsed.rest.filter((p) => p === '-').length > 1) return refuse(io, 'plummet merge: standard input (-) can be read only once\n');
  if (out === '-' && json) return refuse(io, 'plummet merge: --out - and --json both want standard output: write the log to a file, or leave out --json\n');
  const jobsText = parsed.options.get('--jobs');
  const jobs = jobsText === undefined ? null : Number(jobsText);
  if (jobs !== null && !(Number.isInteger(jobs) && jobs >= 1 && jobs <= 256)) {
    return refuse(io, `plummet merge: --jobs ${JSON.stringify(jobsText)} is not a number of threads: a whole number from 1 to 256\n`);
  }
  if (!/^[A-Za-z0-9_.:]{1,64}$/.test(device)) {
    return refuse(io, `plummet merge: --device ${JSON.stringify(device)} is not a device id: letters, digits, _ . : only, at most 64\n`);
  }

  const found = findLogSources(parsed.rest, io.cwd);
  const refused: { name: string; error: PlummetError }[] = [...found.refused];
  const files: FileReport[] = [];
  const merger = new LogMerger();
  try {
    for await (const read of readLogs(found.sources, io, { label: 'merging logs' })) {
      if (!read.file) {
        refused.push({ name: read.name, error: read.error! });
        continue;
      }
      try {
        const preview = merger.add(read.file, read.name);
        files.push({
          file: read.name,
          device: read.file.device,
          records: read.file.records.length,
          added: preview.added.length,
          updated: preview.updated.length,
          unchanged: preview.unchanged,
          conflicts: preview.conflicts.length,
        });
      } catch (error) {
        if (!(error instanceof PlummetError)) throw error;
        refused.push({ name: read.name, error });
      }
    }
  } catch (error) {
    io.stderr.write(describeFault('merging the logs', error));
    return 2;
  }
  for (const r of refused) io.stderr.write(describeProblem(r.error, r.error.message.includes(r.name) ? '' : `${r.name}: `, 'rule'));
  for (const p of found.passedOver) io.stderr.write(`passed over ${p.name}: ${p.why}\n`);
  if (files.length === 0) {
    io.stderr.write(`plummet merge: no log could be read from ${parsed.rest.join(', ')}${found.sources.length === 0 ? ' (no .json file found)' : ''}\n`);
    return 1;
  }

  const records = merger.merged();
  const conflicts = merger.conflicts();
  const progress = progressLine(io, 'computing series');
  let summaries: SeriesSummary[];
  let outputs: { log: string | null; drops_csv: string | null; series_csv: string | null } = { log: null, drops_csv: null, series_csv: null };
  try {
    const computed = await computeSeriesPooled(records, jobs, (done, total) => progress.step(done, total));
    progress.clear();
    summaries = computed.summaries;
    if (csv !== undefined) {
      const tables = logCsv(records, computed.compute);
      const [drops_csv, series_csv] = writeOutputFiles(resolve(io.cwd, csv), [
        { name: 'drops.csv', content: tables.drops },
        { name: 'series.csv', content: tables.series },
        { name: 'marks.csv', content: tables.marks },
      ]);
      outputs = { ...outputs, drops_csv: drops_csv!, series_csv: series_csv! };
    }
    const logText = out === undefined ? null : writeLogFile(buildLogFile(records, { device, app_version: __APP_VERSION__ }));
    if (out !== undefined && out !== '-') {
      const at = resolve(io.cwd, out);
      outputs.log = writeOutputFiles(dirname(at), [{ name: basename(at), content: logText! }])[0]!;
    }
    if (out === '-') {
      await writeText(io.stdout, logText!);
      io.stderr.write(summaryText(summaries));
    } else if (json) {
      const report = { files, refused: refused.map((r) => ({ file: r.name, ...r.error.toJSON() })), passed_over: found.passedOver, records: records.length, conflicts: conflicts.map(conflictJson), series: summaries, outputs };
      await writeText(io.stdout, `${JSON.stringify(report, null, 2)}\n`);
    } else {
      await writeText(io.stdout, `${mergeText(files, refused.length, records.length, conflicts)}${summaryText(summaries)}`);
    }
  } catch (error) {
    progress.clear();
    // An output that cannot be written (a file in the way, no permission) names the path and the reason.
    if (error instanceof PlummetError) return refuse(io, describeProblem(error));
    io.stderr.write(describeFault('writing the merged log', error));
    return 2;
  }
  return refused.length > 0 ? 1 : 0;
}

const conflictJson = (c: Conflict) => ({ ...c });

function mergeText(files: readonly FileReport[], refused: number, records: number, conflicts: readonly Conflict[]): string {
  const devices = new Set(files.map((f) => f.device));
  const lines = [`merged ${files.length} log file${files.length === 1 ? '' : 's'} from ${devices.size} phone${devices.size === 1 ? '' : 's'}: ${records} records${refused ? ` (${refused} file${refused === 1 ? '' : 's'} refused, see above)` : ''}`];
  if (conflicts.length === 0) lines.push('no conflicts');
  else {
    lines.push(`${conflicts.length} conflict${conflicts.length === 1 ? '' : 's'} (both versions kept; the newer is current):`);
    for (const c of conflicts) {
      const how = c.same_stamp ? 'same stamp, different content' : 'edited on two phones';
      lines.push(`  ${c.kind} ${c.id}: ${how}; kept ${c.kept_device} ${c.kept_rev}, other ${c.other_device} ${c.other_rev}; fields ${c.fields.join(', ')}${c.measured ? ' (a measured value)' : ''}`);
    }
  }
  return `${lines.join('\n')}\n\n`;
}

function refuse(io: CommandIo, text: string): 1 {
  io.stderr.write(text.endsWith('\n') ? text : `${text}\n`);
  return 1;
}
