/**
 * The one place where the office command turns the paths it was given into logs: files as named, folders (the
 * office's sync folder as it is, or a folder of mailed-in files) walked for every `.json` file, `-` for standard
 * input. Every command that reads logs goes through `readLogs`, so a new folder layout is taught here once.
 *
 * A folder is walked in name order (the same folder always gives the same order), into sub-folders too; entries
 * starting with a dot (temporary files, `.git`) are passed over, and so is anything that is not a regular file
 * or a folder (a symbolic link, a FIFO, a device: never followed, never opened), with a note saying so. Files are
 * read one at a time, each through read-input.ts (its size cap, its decoding), so a season of files never sits in
 * memory at once.
 */
import { readdirSync, statSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { PlummetError } from '../errors';
import { readLogFile, type LogFile } from '../log';
import type { CommandIo } from './command';
import { isStackOverflow } from './describe-problem';
import { MAX_NESTING, nestedTooDeeply, nestingBeyond } from './parse-json';
import { progressLine } from './progress';
import { readInputFile, readInputStream } from './read-input';

/** A file to read: `name` as the messages show it (the path as given, or a folder's path joined with the entry). */
export interface LogSource {
  name: string;
  /** Where to read it, or '-' for standard input. */
  path: string;
}

/** Something in a folder that was not read, and why. */
export interface PassedOver {
  name: string;
  why: string;
}

export interface LogSources {
  sources: LogSource[];
  passedOver: PassedOver[];
  /** Paths that could not be looked at (missing, no permission): each names the path and the reason. */
  refused: { name: string; error: PlummetError }[];
}

const cannotList = (name: string, error: unknown): PlummetError => {
  const e = error as { code?: unknown; message?: unknown };
  const why = e.code === 'ENOENT' ? 'no such file or folder' : e.code === 'EACCES' ? 'permission denied' : String(e.message ?? error);
  return new PlummetError({
    code: 'input-unreadable',
    field: name,
    value: typeof e.code === 'string' ? e.code : null,
    allowed: 'a readable log file or folder, or - for standard input',
    message: `cannot read ${name}: ${why}`,
    cause: error,
  });
};

/** Which files the paths name, folders walked; nothing is opened yet. */
export function findLogSources(paths: readonly string[], cwd: string): LogSources {
  const found: LogSources = { sources: [], passedOver: [], refused: [] };
  for (const given of paths) {
    if (given === '-') {
      found.sources.push({ name: '(standard input)', path: '-' });
      continue;
    }
    const at = resolve(cwd, given);
    let isFolder: boolean;
    try {
      isFolder = statSync(at).isDirectory();
    } catch (error) {
      found.refused.push({ name: given, error: cannotList(given, error) });
      continue;
    }
    // A file given by name is read whatever its name ends with (read-input.ts refuses what is not a regular file).
    if (isFolder) walkFolder(at, given, found);
    else found.sources.push({ name: given, path: at });
  }
  return found;
}

function walkFolder(at: string, name: string, found: LogSources): void {
  let entries;
  try {
    entries = readdirSync(at, { withFileTypes: true });
  } catch (error) {
    found.refused.push({ name, error: cannotList(name, error) });
    return;
  }
  entries.sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
  for (const entry of entries) {
    if (entry.name.startsWith('.')) continue;
    const entryName = join(name, entry.name);
    if (entry.isDirectory()) walkFolder(join(at, entry.name), entryName, found);
    else if (entry.isSymbolicLink()) found.passedOver.push({ name: entryName, why: 'a symbolic link (never followed inside a folder)' });
    else if (!entry.isFile()) found.passedOver.push({ name: entryName, why: 'not a regular file' });
    else if (entry.name.toLowerCase().endsWith('.json')) found.sources.push({ name: entryName, path: join(at, entry.name) });
  }
}

/** One file read: its text (null when it could not be read), and the log or why it is none. */
export interface ReadLog {
  name: string;
  text: string | null;
  /** The checked log (when parsing was asked for and it passed). */
  file?: LogFile;
  error?: PlummetError;
}

export interface ReadLogsOptions {
  /** Check and read each file as a log (readLogFile); false gives the text only (the check command looks itself). */
  parse?: boolean;
  /** The progress line's word: "reading" by default. */
  label?: string;
}

/**
 * Every log the paths name, one at a time, with a progress line on a terminal. Standard input is read once, when
 * its turn comes. Problems with a path or a file are yielded, never thrown: one bad file never stops a run.
 */
export async function* readLogs(sources: readonly LogSource[], io: Pick<CommandIo, 'stdin' | 'stderr' | 'stderrIsTerminal'>, options: ReadLogsOptions = {}): AsyncGenerator<ReadLog> {
  const progress = progressLine(io, options.label ?? 'reading');
  try {
    for (let i = 0; i < sources.length; i++) {
      progress.step(i, sources.length);
      yield await readOne(sources[i]!, io, options.parse ?? true);
    }
    progress.step(sources.length, sources.length);
  } finally {
    progress.clear();
  }
}

async function readOne(source: LogSource, io: Pick<CommandIo, 'stdin'>, parse: boolean): Promise<ReadLog> {
  const { name } = source;
  let text: string;
  try {
    text = source.path === '-' ? await readInputStream(io.stdin as AsyncIterable<Uint8Array>) : readInputFile(source.path);
  } catch (error) {
    if (error instanceof PlummetError) return { name, text: null, error: withName(name, error) };
    throw error;
  }
  if (!parse) return { name, text };
  try {
    // Nesting no log has is refused before anything recursive walks the value.
    const deep = nestingBeyond(text, MAX_NESTING);
    if (deep >= 0) return { name, text, error: nestedTooDeeply(name, deep) };
    return { name, text, file: readLogFile(text, { name }) };
  } catch (error) {
    if (error instanceof PlummetError) return { name, text, error };
    if (isStackOverflow(error)) return { name, text, error: nestedTooDeeply(name, null) };
    throw error;
  }
}

/** The reader's errors name the path they were given; a decoding error ('log-not-text') gets the file's name. */
function withName(name: string, error: PlummetError): PlummetError {
  if (error.message.includes(name)) return error;
  Object.defineProperty(error, 'message', { value: `${name}: ${error.message}` });
  return error;
}
