/**
 * The arguments of one subcommand: flags (`--json`), options with a value (`--out FILE` or `--out=FILE`), and
 * the rest in order. `--` ends the options; `-` is an ordinary argument (standard input or output). An unknown
 * option or a missing value is refused by name, so a typing slip never reads as a file name.
 */
export interface ArgumentSpec {
  /** Options that take no value, e.g. '--json'. */
  flags?: readonly string[];
  /** Options that take one value, e.g. '--out'. */
  options?: readonly string[];
}

export interface ParsedArguments {
  flags: Set<string>;
  options: Map<string, string>;
  rest: string[];
}

/** The arguments, or why they do not fit the spec (a usage slip, not a coded input error: nothing was read yet). */
export function parseArguments(args: readonly string[], spec: ArgumentSpec): ParsedArguments | { usage: string } {
  const flags = new Set<string>();
  const options = new Map<string, string>();
  const rest: string[] = [];
  const takesValue = new Set(spec.options ?? []);
  const isFlag = new Set([...(spec.flags ?? []), '--help', '-h']);
  for (let i = 0; i < args.length; i++) {
    const arg = args[i]!;
    if (arg === '--') {
      rest.push(...args.slice(i + 1));
      break;
    }
    if (arg === '-' || !arg.startsWith('-')) {
      rest.push(arg);
      continue;
    }
    const eq = arg.indexOf('=');
    const name = eq > 0 ? arg.slice(0, eq) : arg;
    if (isFlag.has(name)) {
      if (eq > 0) return { usage: `${name} takes no value (given ${JSON.stringify(arg.slice(eq + 1))})` };
      flags.add(name === '-h' ? '--help' : name);
    } else if (takesValue.has(name)) {
      const value = eq > 0 ? arg.slice(eq + 1) : args[++i];
      if (value === undefined || value === '' || (value.startsWith('--') && eq < 0)) return { usage: `${name} needs a value` };
      if (options.has(name)) return { usage: `${name} is given twice` };
      options.set(name, value);
    } else {
      const known = [...isFlag, ...takesValue].filter((o) => o.startsWith('--')).sort();
      return { usage: `unknown option ${JSON.stringify(name)} (this command knows ${known.join(', ')})` };
    }
  }
  return { flags, options, rest };
}
