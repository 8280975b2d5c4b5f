/**
 * What the office command reads: a regular file or its standard input, never more than INPUT_LIMIT_BYTES,
 * decoded the way the phone's import decodes a picked file (decodeLogBytes: UTF-8 with or without its
 * byte-order mark, UTF-16 with one).
 *
 * A path is looked at (stat) before it is opened and refused unless it is a regular file: a FIFO would block the
 * command until a writer came, /dev/zero or /dev/urandom never end. The file is then opened non-blocking (should
 * the path have been swapped for a FIFO in between, the open does not wait) and looked at again through its
 * descriptor, so what is read is what was checked.
 */
import { closeSync, constants, fstatSync, openSync, readSync, statSync, type Stats } from 'node:fs';
import { PlummetError } from '../errors';
import { decodeLogBytes } from '../log';

/**
 * 256 MiB. The largest log measured (100 000 drops, README "Figures") is a 47 MB file, so this leaves five times
 * that; above it, V8's longest string (2^29 − 24 UTF-16 units, about 512 M) and the several times the file's size
 * JSON.parse needs in memory come close, and a file that size is no Plummet log.
 */
/** Node's own strict UTF-8 decoder, for speed; decodeLogBytes names the byte when it refuses. */
const strictUtf8 = (bytes: Uint8Array) => new TextDecoder('utf-8', { fatal: true, ignoreBOM: true }).decode(bytes);

export const INPUT_LIMIT_BYTES = 256 * 1024 * 1024;

const mib = (n: number) => `${(n / (1024 * 1024)).toFixed(n < 1024 * 1024 ? 3 : 0)} MiB`;

export function tooLarge(path: string, size: number | string): PlummetError {
  return new PlummetError({
    code: 'input-too-large',
    field: path,
    value: typeof size === 'number' ? `${size} bytes` : size,
    allowed: `at most ${INPUT_LIMIT_BYTES} bytes (${mib(INPUT_LIMIT_BYTES)})`,
    message: `${path} is larger than the ${mib(INPUT_LIMIT_BYTES)} the office command reads (a log of 100 000 drops is about 47 MB): not read`,
  });
}

function kindOf(stats: Stats): string {
  if (stats.isDirectory()) return 'a folder';
  if (stats.isFIFO()) return 'a FIFO (named pipe)';
  if (stats.isCharacterDevice()) return 'a character device';
  if (stats.isBlockDevice()) return 'a block device';
  if (stats.isSocket()) return 'a socket';
  return 'not a regular file';
}

function notRegular(path: string, stats: Stats): PlummetError {
  const kind = kindOf(stats);
  return new PlummetError({
    code: 'input-not-a-file',
    field: path,
    value: kind,
    allowed: 'a regular file, or - for standard input',
    message: `${path} is ${kind}, not a regular file: not read (give a log file or a request file, or - to read standard input)`,
  });
}

function cannotRead(path: string, error: unknown): PlummetError {
  const e = error as { code?: unknown; message?: unknown };
  const why = e.code === 'ENOENT' ? 'no such file' : e.code === 'EACCES' ? 'permission denied' : e.code === 'ELOOP' ? 'too many symbolic links' : String(e.message ?? error);
  return new PlummetError({ code: 'input-unreadable', field: path, value: typeof e.code === 'string' ? e.code : null, allowed: 'a readable regular file', message: `cannot read ${path}: ${why}`, cause: error });
}

/** The text of a regular file at `path`, checked and capped before anything is read. Throws PlummetError. */
export function readInputFile(path: string): string {
  let stats: Stats;
  try {
    stats = statSync(path);
  } catch (error) {
    throw cannotRead(path, error);
  }
  if (!stats.isFile()) throw notRegular(path, stats);
  if (stats.size > INPUT_LIMIT_BYTES) throw tooLarge(path, stats.size);
  let fd: number;
  try {
    fd = openSync(path, constants.O_RDONLY | constants.O_NONBLOCK);
  } catch (error) {
    throw cannotRead(path, error);
  }
  try {
    const opened = fstatSync(fd);
    if (!opened.isFile()) throw notRegular(path, opened);
    if (opened.size > INPUT_LIMIT_BYTES) throw tooLarge(path, opened.size);
    // One byte more than the limit, so a file that grows while it is read is caught too.
    const buffer = Buffer.alloc(Math.min(opened.size + 1, INPUT_LIMIT_BYTES + 1));
    let length = 0;
    for (;;) {
      if (length === buffer.length) break;
      const n = readSync(fd, buffer, length, buffer.length - length, null);
      if (n === 0) break;
      length += n;
    }
    if (length > INPUT_LIMIT_BYTES) throw tooLarge(path, `more than ${INPUT_LIMIT_BYTES} bytes`);
    if (length > opened.size) {
      throw new PlummetError({ code: 'input-changed', field: path, value: `${length} bytes`, allowed: `${opened.size} bytes`, message: `${path} grew while it was read: read it again when nothing writes to it` });
    }
    return decodeLogBytes(new Uint8Array(buffer.buffer, buffer.byteOffset, length), strictUtf8);
  } catch (error) {
    if (error instanceof PlummetError) throw error;
    throw cannotRead(path, error);
  } finally {
    closeSync(fd);
  }
}

/** Standard input read to its end, refused as soon as it passes the limit (its size is not known before). */
export async function readInputStream(stream: AsyncIterable<Uint8Array>, name = 'standard input'): Promise<string> {
  const chunks: Uint8Array[] = [];
  let length = 0;
  for await (const chunk of stream) {
    length += chunk.length;
    if (length > INPUT_LIMIT_BYTES) throw tooLarge(name, `more than ${INPUT_LIMIT_BYTES} bytes`);
    chunks.push(chunk);
  }
  return decodeLogBytes(Buffer.concat(chunks, length), strictUtf8);
}
