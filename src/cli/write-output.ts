/**
 * Writing the office command's output files without following what someone else put in the folder.
 *
 * Each file is written to a new temporary name opened with O_CREAT | O_EXCL | O_NOFOLLOW (it cannot be an
 * existing file or a symbolic link planted there), then renamed over the final name: rename(2) replaces a
 * symbolic link itself, never its target. The folder is made one level at a time (mkdirSync's recursive mode
 * loops forever on some paths under /proc in Node 20), and every refusal names the path and the reason.
 */
import { closeSync, constants, lstatSync, mkdirSync, openSync, renameSync, statSync, unlinkSync, writeSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { PlummetError } from '../errors';

function reasonOf(error: unknown): string {
  const e = error as { code?: unknown; message?: unknown };
  switch (e.code) {
    case 'EACCES':
    case 'EPERM':
      return 'permission denied';
    case 'EROFS':
      return 'the file system is read-only';
    case 'ENOSPC':
      return 'the disk is full';
    case 'EDQUOT':
      return 'the disk quota is used up';
    case 'ENOTDIR':
      return 'a part of the path is a file, not a folder';
    case 'EISDIR':
      return 'a folder of that name is in the way';
    case 'ENOENT':
      return 'the file system does not allow it there';
    default:
      return String(e.message ?? error);
  }
}

function cannotWrite(path: string, why: string, cause?: unknown): PlummetError {
  const code = (cause as { code?: unknown } | undefined)?.code;
  return new PlummetError({
    code: 'output-not-writable',
    field: path,
    value: typeof code === 'string' ? code : why,
    allowed: 'a folder this user can write to (it is made if missing)',
    message: `cannot write ${path}: ${why}; nothing was written there`,
    cause,
  });
}

/** Makes `dir` and any missing parents, one level at a time; refuses a path that exists and is not a folder. */
export function ensureFolder(dir: string): void {
  const missing: string[] = [];
  let here = resolve(dir);
  for (;;) {
    let stats;
    try {
      stats = statSync(here);
    } catch (error) {
      const code = (error as { code?: unknown }).code;
      if (code !== 'ENOENT') throw cannotWrite(dir, reasonOf(error), error);
      const parent = dirname(here);
      if (parent === here) throw cannotWrite(dir, 'no part of the path exists', error);
      missing.push(here);
      here = parent;
      continue;
    }
    if (!stats.isDirectory()) throw cannotWrite(dir, `${here} is a file, not a folder`);
    break;
  }
  for (const path of missing.reverse()) {
    try {
      mkdirSync(path);
    } catch (error) {
      throw cannotWrite(dir, `${path} cannot be made (${reasonOf(error)})`, error);
    }
  }
}

let serial = 0;

/**
 * Writes each file into `dir` (made if missing) under its name, replacing a file of that name but never writing
 * through a symbolic link; all are written to temporary names first, then renamed, so a refusal leaves no
 * half-written table behind. Throws PlummetError 'output-not-writable' naming the path and the reason.
 */
export function writeOutputFiles(dir: string, files: readonly { name: string; content: string | Uint8Array }[]): string[] {
  ensureFolder(dir);
  const staged: { temp: string; final: string }[] = [];
  try {
    for (const file of files) {
      const final = join(dir, file.name);
      const existing = lstatOrNull(final);
      if (existing?.isDirectory()) throw cannotWrite(final, 'a folder of that name is in the way');
      const temp = join(dir, `.${file.name}.${process.pid}.${++serial}.tmp`);
      let fd: number;
      try {
        fd = openSync(temp, constants.O_WRONLY | constants.O_CREAT | constants.O_EXCL | constants.O_NOFOLLOW, 0o644);
      } catch (error) {
        throw cannotWrite(final, reasonOf(error), error);
      }
      staged.push({ temp, final });
      try {
        const bytes = typeof file.content === 'string' ? Buffer.from(file.content, 'utf8') : Buffer.from(file.content.buffer, file.content.byteOffset, file.content.byteLength);
        let at = 0;
        while (at < bytes.length) at += writeSync(fd, bytes, at, bytes.length - at);
      } catch (error) {
        throw cannotWrite(final, reasonOf(error), error);
      } finally {
        closeSync(fd);
      }
    }
    for (const { temp, final } of staged) {
      try {
        renameSync(temp, final);
      } catch (error) {
        throw cannotWrite(final, reasonOf(error), error);
      }
    }
    return staged.map((s) => s.final);
  } finally {
    for (const { temp } of staged) {
      try {
        unlinkSync(temp);
      } catch {
        // Renamed already, or never made: nothing to clean.
      }
    }
  }
}

function lstatOrNull(path: string) {
  try {
    return lstatSync(path);
  } catch {
    return null;
  }
}
