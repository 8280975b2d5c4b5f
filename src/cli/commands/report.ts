/**
 * `plummet report`: the printable day report of one or more days, as one self-contained HTML file (inline CSS and
 * SVG charts, no script, nothing fetched) and, when a Chromium is on the machine, as PDF (A4 or Letter, each
 * series on a page of its own). The report itself is src/report (pure); this file reads the logs, picks the days
 * and writes the files.
 */
import { basename, dirname, resolve } from 'node:path';
import { PlummetError } from '../../errors';
import { LogFileError, mergeLogs, readLogFile, type DayRecord, type LogRecord } from '../../log';
import { dayReport, reportHtml } from '../../report';
import type { Command, CommandIo } from '../command';
import { nestedTooDeeply, parseJsonText } from '../parse-json';
import { readInputFile, readInputStream } from '../read-input';
import { writeOutputFiles } from '../write-output';
import { findChromium, printPdf, type Paper } from '../print-pdf';

const HELP = `usage: plummet report [options] LOG [LOG ...]

Writes the day report: for each day the site, crew, air readings and specimens, and for
each series its verdict, C_d with its interval, the chart of height against time with the
fitted and predicted curves, the residuals, the drops (left-out ones with their reason),
the uncertainty budget, the flags and the history of edits, then the methods and their
sources. One HTML file with everything inside (no script, nothing fetched), ready to print.

  LOG             an exported log file, or - for standard input; several logs are merged
                  record by record first, as the phone merges them
  --day DAY       a day to report, by its date (YYYY-MM-DD) or its id; repeat for more
                  days; every day in the logs when absent
  -o, --out FILE  where the HTML goes (default, or -: standard output)
  --pdf FILE      also print the report to FILE as PDF with the system Chromium
                  (CHROME_PATH, else /usr/bin/chromium)
  --paper SIZE    a4 (default) or letter, for --pdf
  --draws N       Monte Carlo draws per series, 200 to 1000000 (default 20000)
  --json          print what was written (files, days, each series' C_d) as JSON on stdout
  -h, --help      this text

Exit status: 0 written; 1 input refused (the message names the file, field, value and what
is allowed) or no Chromium for --pdf; 2 a fault of the command itself.`;

interface Options {
  logs: string[];
  days: string[];
  out: string;
  pdf: string | null;
  paper: Paper;
  draws: number | undefined;
  json: boolean;
}

/** A slip in the command's arguments (an unknown option, a missing value): refused before anything is read. */
export class ReportUsageError extends PlummetError<'usage'> {
  constructor(message: string) {
    super({ code: 'usage', field: 'arguments', value: null, allowed: 'the options plummet report --help lists', message });
    this.name = 'ReportUsageError';
  }
}

function parseArgs(args: readonly string[]): Options | 'help' {
  const o: Options = { logs: [], days: [], out: '-', pdf: null, paper: 'a4', draws: undefined, json: false };
  const value = (i: number, name: string) => {
    const v = args[i + 1];
    if (v === undefined || (v.startsWith('-') && v !== '-')) throw new ReportUsageError(`${name} needs a value`);
    return v;
  };
  for (let i = 0; i < args.length; i++) {
    const a = args[i]!;
    if (a === '-h' || a === '--help') return 'help';
    else if (a === '--day') o.days.push(value(i++, a));
    else if (a === '-o' || a === '--out') o.out = value(i++, a);
    else if (a === '--pdf') o.pdf = value(i++, a);
    else if (a === '--paper') {
      const p = value(i++, a).toLowerCase();
      if (p !== 'a4' && p !== 'letter') throw new ReportUsageError(`--paper is ${JSON.stringify(p)}: allowed are a4 and letter`);
      o.paper = p;
    } else if (a === '--draws') {
      const v = value(i++, a);
      const n = Number(v);
      if (!/^\d+$/.test(v) || n < 200 || n > 1_000_000) throw new ReportUsageError(`--draws is ${JSON.stringify(v)}: allowed is a whole number from 200 to 1000000`);
      o.draws = n;
    } else if (a === '--json') o.json = true;
    else if (a === '--') o.logs.push(...args.slice(i + 1)), (i = args.length);
    else if (a.startsWith('-') && a !== '-') throw new ReportUsageError(`unknown option ${a}`);
    else o.logs.push(a);
  }
  if (o.logs.length === 0) throw new ReportUsageError('name at least one log file (or - for standard input)');
  if (o.logs.filter((l) => l === '-').length > 1) throw new ReportUsageError('standard input (-) can be read only once');
  return o;
}

/** A coded error as the command prints it: the message, then where, what and what is allowed. */
function explain(error: PlummetError, prefix = ''): string {
  const value = JSON.stringify(error.value) ?? 'undefined';
  const shown = value.length > 80 ? `${value.slice(0, 77)}...` : value;
  return `${prefix}${error.message}\n  field: ${error.field ?? '(none)'}\n  value: ${shown}\n  allowed: ${error.allowed ?? '(none)'}\n  code: ${error.code}\n`;
}

async function readLogs(o: Options, io: CommandIo): Promise<LogRecord[]> {
  let records: LogRecord[] = [];
  for (const log of o.logs) {
    const name = log === '-' ? '(standard input)' : log;
    const text = log === '-' ? await readInputStream(io.stdin as AsyncIterable<Uint8Array>) : readInputFile(resolve(io.cwd, log));
    try {
      parseJsonText(name, text); // nesting and syntax, said with the file's name
      const file = readLogFile(text, { name });
      records = records.length ? mergeLogs(records, file.records) : file.records;
    } catch (error) {
      if (error instanceof RangeError && /call stack/i.test(error.message)) throw nestedTooDeeply(name, null);
      if (error instanceof LogFileError) throw new ReportInputError(explain(error, error.message.startsWith(name) ? '' : `${name}: `));
      throw error;
    }
  }
  return records;
}

/** A log or a --day the report cannot use; the message names the file or the day. */
export class ReportInputError extends PlummetError<'report-input'> {
  constructor(message: string) {
    super({ code: 'report-input', field: 'logs', value: null, allowed: 'readable log files and days they hold', message });
    this.name = 'ReportInputError';
  }
}

/** The ids of the chosen days; refuses a --day that names no day of the logs. */
function chosenDays(records: readonly LogRecord[], wanted: readonly string[]): string[] | undefined {
  if (wanted.length === 0) return undefined;
  const days = records.filter((r): r is DayRecord => r.kind === 'day' && !r.deleted);
  const ids: string[] = [];
  for (const w of wanted) {
    const found = days.filter((d) => d.id === w.toLowerCase() || d.date === w);
    if (found.length === 0) {
      const dates = [...new Set(days.map((d) => d.date))].sort();
      throw new ReportInputError(
        `--day ${JSON.stringify(w)} names no day of the logs\n  field: --day\n  value: ${JSON.stringify(w)}\n  allowed: ${dates.length ? `a date or id of a day in the logs: ${dates.slice(0, 12).join(', ')}${dates.length > 12 ? ', …' : ''}` : 'none: the logs hold no day'}\n`,
      );
    }
    ids.push(...found.map((d) => d.id));
  }
  return ids;
}

function write(io: CommandIo, target: string, content: string | Uint8Array): string {
  if (target === '-') {
    io.stdout.write(content);
    return '-';
  }
  const path = resolve(io.cwd, target);
  return writeOutputFiles(dirname(path), [{ name: basename(path), content }])[0]!;
}

async function run(args: readonly string[], io: CommandIo): Promise<0 | 1 | 2> {
  let o: Options | 'help';
  try {
    o = parseArgs(args);
  } catch (error) {
    if (!(error instanceof ReportUsageError)) throw error;
    io.stderr.write(`plummet report: ${error.message}\n(plummet report --help tells how)\n`);
    return 1;
  }
  if (o === 'help') {
    io.stdout.write(`${HELP}\n`);
    return 0;
  }
  const chromium = o.pdf ? findChromium() : null;
  if (o.pdf && !chromium) {
    io.stderr.write('plummet report: --pdf needs a Chromium: none at CHROME_PATH, /usr/bin/chromium or /usr/bin/chromium-browser (on Debian: apt-get install chromium); the HTML report needs none\n');
    return 1;
  }
  if (o.json && o.out === '-') {
    io.stderr.write('plummet report: --json prints a summary on standard output, so the HTML needs a file: add --out FILE\n');
    return 1;
  }
  try {
    const records = await readLogs(o, io);
    const dayIds = chosenDays(records, o.days);
    const report = dayReport(records, { generatedAt: new Date().toISOString(), ...(dayIds ? { dayIds } : {}), ...(o.draws ? { monteCarloDraws: o.draws } : {}) });
    if (io.stderrIsTerminal) io.stderr.write(`report: ${report.days.length} day(s), ${report.days.reduce((n, d) => n + d.series.length, 0)} series\n`);
    const html = reportHtml(report);
    const htmlAt = write(io, o.out, html);
    const pdfAt = o.pdf && chromium ? write(io, o.pdf, await printPdf(html, o.paper, chromium)) : null;
    if (o.json) {
      const summary = {
        html: htmlAt,
        pdf: pdfAt,
        paper: pdfAt ? o.paper : null,
        days: report.days.map((d) => ({
          day_id: d.id,
          date: d.date,
          series: d.series.map((s) => {
            const cell = (f: string) => s.figures.find((x) => x.cell.field === f)?.cell.value ?? null;
            return {
              series_id: s.id,
              state: s.state,
              drag_coefficient: cell('drag_coefficient'),
              drag_coefficient_standard_uncertainty: cell('drag_coefficient_standard_uncertainty'),
              drag_coefficient_interval_95: s.state === 'ready' ? [cell('drag_coefficient_interval_95_low'), cell('drag_coefficient_interval_95_high')] : null,
              target_met: s.targetMet,
              flags: s.flags.map((f) => f.code),
            };
          }),
        })),
      };
      io.stdout.write(`${JSON.stringify(summary, null, 2)}\n`);
    }
    return 0;
  } catch (error) {
    if (error instanceof ReportInputError) {
      io.stderr.write(error.message);
      return 1;
    }
    if (error instanceof PlummetError) {
      io.stderr.write(explain(error));
      return 1;
    }
    const debug = Boolean(process.env['PLUMMET_DEBUG']);
    const reason = error instanceof Error ? (debug ? (error.stack ?? error.message) : `${error.name}: ${error.message}`) : String(error);
    io.stderr.write(`plummet report: internal error: ${reason}\n(this is a fault of the office command; set PLUMMET_DEBUG=1 for its stack)\n`);
    return 2;
  }
}

export const report: Command = {
  name: 'report',
  summary: 'write the printable day report as one HTML file (and PDF with a Chromium)',
  help: HELP,
  run,
};
