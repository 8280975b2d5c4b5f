/**
 * The office command's entry: `plummet <command> [arguments]`. Parses nothing but the command's name, `--help`
 * and `--version`, and hands the rest to the command (commands/index.ts). Built into dist-cli/plummet.mjs
 * (vite.cli.config.ts), which bin/plummet.mjs runs.
 */
import type { Command, CommandIo } from './command';
import { COMMANDS } from './commands/index';
import { describeFault } from './describe-problem';

function overview(commands: readonly Command[]): string {
  const width = Math.max(...commands.map((c) => c.name.length));
  return (
    `plummet - the office side of the Plummet field log\n\n` +
    `usage: plummet <command> [arguments]\n       plummet <command> --help\n\ncommands:\n` +
    commands.map((c) => `  ${c.name.padEnd(width)}  ${c.summary}\n`).join('') +
    `\nFiles named - are standard input (or output, where a command writes a file). Results go to stdout (JSON with\n` +
    `--json), messages to stderr. Exit status: 0 done, 1 input refused (the message names the file, record, field,\n` +
    `value and what is allowed), 2 a fault of the command itself (PLUMMET_DEBUG=1 prints its stack).\n`
  );
}

/** Runs one command line; resolves to the exit code. */
export async function main(args: readonly string[], io: CommandIo, commands: readonly Command[] = COMMANDS): Promise<0 | 1 | 2> {
  const [name, ...rest] = args;
  if (name === undefined || name === '--help' || name === '-h' || name === 'help') {
    const topic = name === 'help' ? commands.find((c) => c.name === rest[0]) : undefined;
    (name === undefined ? io.stderr : io.stdout).write(topic ? topic.help : overview(commands));
    return name === undefined ? 1 : 0;
  }
  if (name === '--version') {
    io.stdout.write(`${__APP_VERSION__}\n`);
    return 0;
  }
  const command = commands.find((c) => c.name === name);
  if (!command) {
    io.stderr.write(`plummet: ${JSON.stringify(name)} is not a command; the commands are ${commands.map((c) => c.name).join(', ')} (plummet --help)\n`);
    return 1;
  }
  try {
    return await command.run(rest, io);
  } catch (error) {
    io.stderr.write(describeFault(`running plummet ${command.name}`, error));
    return 2;
  }
}

/** The io of this process. */
export function processIo(): CommandIo {
  return { stdin: process.stdin, stdout: process.stdout, stderr: process.stderr, stderrIsTerminal: Boolean(process.stderr.isTTY), cwd: process.cwd() };
}
