/**
 * JSON for the office command, with a bound on nesting checked on the text before it is parsed: the checks and
 * messages downstream walk the value recursively, so 100 000 nested arrays would overflow the stack there (and
 * could in JSON.parse itself on another engine). The deepest a log nests is 7 levels (file, records, a record,
 * its history, a revision, its body, a shape), a request 3; 64 leaves room and stays far from any stack.
 */
import { PlummetError } from '../errors';

export const MAX_NESTING = 64;

/** The first place where arrays/objects nest deeper than `limit`, as a character offset, or -1. Strings are skipped. */
export function nestingBeyond(text: string, limit: number): number {
  let depth = 0;
  let inString = false;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (inString) {
      if (c === 0x5c) i++;
      else if (c === 0x22) inString = false;
    } else if (c === 0x22) inString = true;
    else if (c === 0x5b || c === 0x7b) {
      if (++depth > limit) return i;
    } else if (c === 0x5d || c === 0x7d) depth--;
  }
  return -1;
}

export function nestedTooDeeply(path: string, at: number | null): PlummetError {
  return new PlummetError({
    code: 'input-nested-too-deeply',
    field: path,
    value: at === null ? 'deeper than the stack allows' : `more than ${MAX_NESTING} levels at character ${at}`,
    allowed: `at most ${MAX_NESTING} levels of nested arrays and objects (a log needs 7, a request 3)`,
    message: `${path} is nested too deeply: arrays and objects more than ${MAX_NESTING} levels deep${at === null ? '' : ` (at character ${at})`}; no log or request nests like that`,
  });
}

/** Parses the text; a PlummetError names the file and the reason when it is not JSON or nests too deeply. */
export function parseJsonText(path: string, text: string): unknown {
  const at = nestingBeyond(text, MAX_NESTING);
  if (at >= 0) throw nestedTooDeeply(path, at);
  try {
    return JSON.parse(text);
  } catch (error) {
    if (error instanceof RangeError) throw nestedTooDeeply(path, null);
    const reason = error instanceof Error ? error.message : String(error);
    throw new PlummetError({ code: 'input-not-json', field: path, value: text.slice(0, 40), allowed: 'JSON text (RFC 8259)', message: `${path} is not valid JSON: ${reason}` });
  }
}
