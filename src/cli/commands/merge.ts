import type { Command } from '../command';
import { writeText } from '../write-text';

const help = `plummet merge - many phones' logs made into one, with every series summed up

usage:
  plummet merge [options] PATH...

Each PATH is a log file, a folder (the office's sync folder as it is, or a folder of files mailed in: every .json
file in it and in its sub-folders is read), or - for standard input. The logs are merged one after another exactly
as a phone merges an imported file: every version of every record is kept, the newest is current, and two edits
made on two phones without seeing each other are listed as conflicts. A file that cannot be read or merged is
named with its record, field, value and rule, and the others are merged all the same.

options:
  --out FILE     write the merged log there (- for standard output; the summary then goes to stderr)
  --csv DIR      write the CSV tables of the merged log: DIR/drops.csv, DIR/series.csv, DIR/marks.csv
  --device ID    the device id the merged log is written under (default: office)
  --jobs N       compute the series on at most N threads (default: one per core; the figures are the same)
  --json         the summary as JSON for programs: files, refusals, conflicts, and for every series its C_d,
                 95 % interval, verdict and flags
  -h, --help     this text

verdicts: enough (C_d within the series' target uncertainty), short (not yet), unresolved (drag below what the
timing can see: only an upper bound), incomplete (a part is missing), refused (the physics refused a value).
flags are the physics' warnings by code (info: a routine note).

On a terminal a progress line is shown on stderr while the logs are read and the series computed.

exit status: 0 done; 1 a file or path was refused (the rest are merged and written), an option is wrong, or no
log could be read; 2 a fault of the command itself (PLUMMET_DEBUG=1 prints its stack).
`;

export const mergeCommand: Command = {
  name: 'merge',
  summary: 'merge log files and folders into one log, with the CSV tables and a summary of every series',
  help,
  async run(args, io) {
    if (args.includes('--help') || args.includes('-h')) {
      await writeText(io.stdout, help);
      return 0;
    }
    const { runMerge } = await import('../merge-run');
    return runMerge(args, io, 'plummet merge --help says how');
  },
};
