import type { Command } from '../command';
import { writeText } from '../write-text';

const help = `plummet check - whether log files would be accepted, and if not, what is wrong

usage:
  plummet check [--json] PATH...

Each PATH is a log file, a folder (every .json file in it and in its sub-folders) or - for standard input. Each
file is read as a phone's import reads it: the text (UTF-8, or UTF-16 with a byte-order mark), then the published
JSON Schema of the log file (public/schema/plummet-log-2.schema.json; a format 1 file is upgraded first), then
the rules every record must keep (ranges, links between records, the history of edits). Reading stops at the
first of these steps that fails, as an import does; that step lists up to 50 problems, each with the record
(its place in the file, its kind and id), the field, the value and the rule it breaks.

options:
  --json       the findings as JSON for programs
  -h, --help   this text

exit status: 0 every file would be accepted; 1 at least one would not (or a path cannot be read, or an option
is wrong); 2 a fault of the command itself (PLUMMET_DEBUG=1 prints its stack).
`;

export const checkCommand: Command = {
  name: 'check',
  summary: 'check log files against the published schema and the record rules, naming record, field, value and rule',
  help,
  async run(args, io) {
    if (args.includes('--help') || args.includes('-h')) {
      await writeText(io.stdout, help);
      return 0;
    }
    const { runCheck } = await import('../check-run');
    return runCheck(args, io, 'plummet check --help says how');
  },
};
