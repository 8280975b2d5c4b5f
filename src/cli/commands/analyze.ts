import { isAbsolute, resolve } from 'node:path';
import type { Command } from '../command';
import { writeText } from '../write-text';
// Small and already in the start-up chunk (report.ts reads input the same way).
import { readInputFile, readInputStream } from '../read-input';

const help = `plummet analyze - the figures of one series, or of every series in one log

usage:
  plummet analyze REQUEST.json          one series request (the shape of examples/*.json): its analysis as JSON
  plummet analyze LOG.json              an exported log: every series' results as JSON
  plummet analyze LOG.json --csv DIR    an exported log: its CSV tables written to DIR/drops.csv,
                                        DIR/series.csv and DIR/marks.csv (one row per mark of a drop with
                                        marks), and what was written as JSON on stdout

A file name of - reads standard input. The output is JSON already (--json is accepted and changes nothing).
For many logs at once, and a summary people can read, use plummet merge.

exit status: 0 done; 1 the input or the output folder was refused (the message names the field, the value and
what is allowed); 2 a fault of the command itself (PLUMMET_DEBUG=1 prints its stack).
`;

export const analyzeCommand: Command = {
  name: 'analyze',
  summary: 'the figures of one series request, or of every series in one exported log (JSON or CSV)',
  help,
  async run(args, io) {
    if (args.includes('--help') || args.includes('-h')) {
      await writeText(io.stdout, help);
      return 0;
    }
    const { runAnalyze } = await import('../analyze');
    const rest = args.filter((a) => a !== '--json');
    // Standard input is read before the command runs (its size is known only while reading: capped as it comes).
    let piped: { text: string } | { error: unknown } | null = null;
    if (rest.includes('-')) piped = await readInputStream(io.stdin as AsyncIterable<Uint8Array>).then((text) => ({ text }), (error: unknown) => ({ error }));
    const outcome = runAnalyze(rest, (path) => {
      // Named as given in messages; read against the command's folder.
      if (path !== '-') return readInputFile(isAbsolute(path) || io.cwd === process.cwd() ? path : resolve(io.cwd, path));
      if (piped && 'error' in piped) throw piped.error;
      return piped?.text ?? '';
    });
    if (outcome.stdout) await writeText(io.stdout, outcome.stdout);
    if (outcome.stderr) io.stderr.write(outcome.stderr);
    return outcome.exitCode;
  },
};
