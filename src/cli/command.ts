/**
 * One subcommand of the office command (`plummet <name> …`). Each lives in src/cli/commands/<name>.ts and is
 * listed once in the command table; the entry point parses nothing but the name and `--help`.
 *
 * Conventions every subcommand keeps: the result on stdout (JSON when `--json` is given or the output is for
 * programs), messages on stderr, `-` for standard input or output, and the exit code: 0 done, 1 refused input
 * (the message names the file, record, field, value and what is allowed), 2 a fault of our own.
 */
export interface CommandIo {
  stdin: NodeJS.ReadableStream;
  stdout: NodeJS.WritableStream;
  stderr: NodeJS.WritableStream;
  /** True when stderr is a terminal: progress lines are written only then. */
  stderrIsTerminal: boolean;
  /** The folder relative paths are read against. */
  cwd: string;
}

export interface Command {
  /** The word after `plummet`, lower case. */
  name: string;
  /** One line for the command list. */
  summary: string;
  /** The whole `plummet <name> --help` text, in our own words. */
  help: string;
  /** Runs with the arguments after the name; resolves to the exit code. */
  run(args: readonly string[], io: CommandIo): Promise<0 | 1 | 2>;
}
