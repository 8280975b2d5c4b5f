/**
 * Duplicate names in one JSON object. RFC 8259 §4 leaves their meaning open and JSON.parse keeps the last, so a
 * file hand-edited at the first of two "time_s" would be read with the other value, in silence; I-JSON
 * (RFC 7493 §2.3) forbids them, and the log file is I-JSON. Scans the text once, after JSON.parse accepted it.
 */

export interface DuplicateKey {
  /** The JSON Pointer of the object holding it, e.g. "/records/3" (RFC 6901). */
  pointer: string;
  key: string;
}

const QUOTE = 34;
const BACKSLASH = 92;

/** The first name that appears twice in one object of `text` (valid JSON), or null. */
export function findDuplicateKey(text: string): DuplicateKey | null {
  // One frame per open object or array: its names so far (objects), and its place for the pointer.
  const frames: { keys: Set<string> | null; at: string; next: number }[] = [];
  let pendingKey: string | null = null;
  const place = () => {
    const top = frames[frames.length - 1];
    if (!top) return '';
    if (top.keys) return `${top.at}/${(pendingKey ?? '').replace(/~/g, '~0').replace(/\//g, '~1')}`;
    return `${top.at}/${top.next}`;
  };
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === QUOTE) {
      let j = i + 1;
      let escaped = false;
      for (; j < text.length; j++) {
        const d = text.charCodeAt(j);
        if (escaped) escaped = false;
        else if (d === BACKSLASH) escaped = true;
        else if (d === QUOTE) break;
      }
      const top = frames[frames.length - 1];
      // A name is a string directly in an object that is followed by a colon.
      let k = j + 1;
      while (k < text.length && (text[k] === ' ' || text[k] === '\n' || text[k] === '\r' || text[k] === '\t')) k++;
      if (top?.keys && text[k] === ':') {
        const raw = text.slice(i, j + 1);
        const key = raw.includes('\\') ? (JSON.parse(raw) as string) : raw.slice(1, -1);
        if (top.keys.has(key)) return { pointer: top.at, key };
        top.keys.add(key);
        pendingKey = key;
      }
      i = j;
    } else if (c === 123 /* { */ || c === 91 /* [ */) {
      const at = place();
      frames.push({ keys: c === 123 ? new Set() : null, at, next: 0 });
    } else if (c === 125 /* } */ || c === 93 /* ] */) {
      frames.pop();
    } else if (c === 44 /* , */) {
      const top = frames[frames.length - 1];
      if (top && !top.keys) top.next++;
    }
  }
  return null;
}
