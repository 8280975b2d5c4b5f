// The office command's table: one entry per subcommand, in the order `plummet --help` lists them. Each file
// holds its help text and loads its work only when it runs, so listing the commands stays cheap.
import type { Command } from '../command';
import { analyzeCommand } from './analyze';
import { checkCommand } from './check';
import { mergeCommand } from './merge';
import { report as reportCommand } from './report';

export const COMMANDS: readonly Command[] = [
  analyzeCommand,
  mergeCommand,
  checkCommand,
  reportCommand,
];
