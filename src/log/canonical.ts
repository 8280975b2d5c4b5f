/**
 * Canonical JSON text: RFC 8785, JSON Canonicalization Scheme (JCS).
 *
 * The same value always gives the same bytes, so two exports of the same log are identical files and a file's
 * hash says whether anything in it changed. JCS is: no whitespace; object properties sorted by their names as
 * UTF-16 code units; strings and numbers written exactly as ECMAScript's JSON.stringify writes them (RFC 8785
 * §3.2.2 defines them that way), over the I-JSON subset (RFC 7493: no lone surrogates, finite numbers only).
 */
import { PlummetError, type PlummetErrorOptions } from '../errors';

export type CanonicalJsonErrorCode = 'canonical-not-finite' | 'canonical-lone-surrogate' | 'canonical-not-json';

/** `field` is where in the value, e.g. "records[3].time_s" ("(root)" for the value itself). */
export class CanonicalJsonError extends PlummetError<CanonicalJsonErrorCode> {
  declare readonly field: string;
  constructor(options: PlummetErrorOptions<CanonicalJsonErrorCode> & { field: string }) {
    super(options);
    this.name = 'CanonicalJsonError';
  }

  /** The same as `field`. */
  get path(): string {
    return this.field;
  }
}

const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

const at = (path: string) => path || '(root)';

function writeString(text: string, path: string): string {
  const json = JSON.stringify(text);
  // JSON.stringify writes a lone surrogate as \udXXX; only then is the slower exact check needed.
  if (json.includes('\\ud') && LONE_SURROGATE.test(text)) {
    throw new CanonicalJsonError({
      code: 'canonical-lone-surrogate',
      field: at(path),
      value: text,
      allowed: 'text without lone UTF-16 surrogates (RFC 7493 §2.1)',
      message: `${at(path)}: text holds a lone UTF-16 surrogate, which JSON files may not carry (RFC 7493 §2.1)`,
    });
  }
  return json;
}

function write(value: unknown, path: string): string {
  switch (typeof value) {
    case 'string':
      return writeString(value, path);
    case 'number':
      if (!Number.isFinite(value)) {
        throw new CanonicalJsonError({
          code: 'canonical-not-finite',
          field: at(path),
          value: value,
          allowed: 'a finite number',
          message: `${at(path)}: ${String(value)} is not a finite number; JSON can only hold finite numbers`,
        });
      }
      // ECMAScript Number::toString, which RFC 8785 §3.2.2.3 adopts; it writes -0 as 0.
      return JSON.stringify(value);
    case 'boolean':
      return value ? 'true' : 'false';
    case 'object': {
      if (value === null) return 'null';
      if (Array.isArray(value)) {
        let out = '[';
        for (let i = 0; i < value.length; i++) {
          if (i > 0) out += ',';
          out += write(value[i], `${path}[${i}]`);
        }
        return out + ']';
      }
      const object = value as Record<string, unknown>;
      // Array.prototype.sort without a comparator orders strings by UTF-16 code units (RFC 8785 §3.2.3).
      const keys = Object.keys(object).sort();
      let out = '{';
      let first = true;
      for (const key of keys) {
        const item = object[key];
        if (item === undefined) continue;
        if (!first) out += ',';
        first = false;
        out += writeString(key, path) + ':' + write(item, path ? `${path}.${key}` : key);
      }
      return out + '}';
    }
    default:
      throw new CanonicalJsonError({
        code: 'canonical-not-json',
        field: at(path),
        value: value,
        allowed: 'null, a boolean, a finite number, text, an array or an object',
        message: `${at(path)}: a ${typeof value} has no JSON form`,
      });
  }
}

/** The canonical text written piece by piece: the reference the fast path below is tested against. */
export function canonicalJsonByParts(value: unknown): string {
  return write(value, '');
}

/** Thrown by the fast path for anything it leaves to the exact writer above. */
const SLOW = Symbol('slow path');

/**
 * A copy with every object's properties inserted in sorted order, for the engine's own JSON.stringify: V8
 * (and every engine) writes string keys in insertion order, and its stringify is several times faster than
 * writing the text piece by piece. Keys that look like array indices are the exception (engines put them
 * first, in numeric order) and "__proto__" (assigning it sets the prototype), as are values JSON cannot
 * hold: those go to the exact writer.
 */
function sortedCopy(value: unknown): unknown {
  switch (typeof value) {
    case 'string':
    case 'boolean':
      return value;
    case 'number':
      if (!Number.isFinite(value)) throw SLOW;
      return value;
    case 'object': {
      if (value === null) return null;
      if (Array.isArray(value)) {
        const out = new Array(value.length);
        for (let i = 0; i < value.length; i++) {
          const item = value[i];
          if (item === undefined) throw SLOW;
          out[i] = sortedCopy(item);
        }
        return out;
      }
      const object = value as Record<string, unknown>;
      const keys = Object.keys(object);
      for (let i = 1; i < keys.length; i++) {
        if (keys[i - 1]! > keys[i]!) {
          keys.sort();
          break;
        }
      }
      const out: Record<string, unknown> = {};
      for (const key of keys) {
        const first = key.charCodeAt(0);
        // Index-like keys would be reordered by the engine; "__proto__" would set the copy's prototype.
        if ((first >= 48 && first <= 57) || key === '__proto__') throw SLOW;
        const item = object[key];
        if (item !== undefined) out[key] = sortedCopy(item);
      }
      return out;
    }
    default:
      throw SLOW;
  }
}

/** The RFC 8785 canonical text of a JSON value. Throws CanonicalJsonError for anything JSON cannot hold. */
export function canonicalJson(value: unknown): string {
  let text: string;
  try {
    text = JSON.stringify(sortedCopy(value));
  } catch (error) {
    if (error !== SLOW) throw error;
    return write(value, '');
  }
  // A lone surrogate comes out as \udXXX: let the exact writer decide (it refuses one, with its path).
  return text.includes('\\ud') ? write(value, '') : text;
}
