// The one decoding of a log file's bytes (src/log/export-parse.ts decodeLogBytes), used by the phone's import and
// the office command. Checked against the platform's own strict decoder (WHATWG Encoding, TextDecoder with
// fatal: true), which follows the Unicode Standard's table 3-7 of well-formed UTF-8.
import { describe, expect, it } from 'vitest';
import { decodeLogBytes, LogFileError } from '../../src/log/export-parse';

const strictUtf8 = new TextDecoder('utf-8', { fatal: true, ignoreBOM: false });
const strict = (bytes: Uint8Array): string | null => {
  try {
    return strictUtf8.decode(bytes);
  } catch {
    return null;
  }
};
const ours = (bytes: Uint8Array): string | null => {
  try {
    return decodeLogBytes(bytes);
  } catch (error) {
    if (error instanceof LogFileError && error.code === 'log-not-text') return null;
    throw error;
  }
};
const hex = (bytes: Uint8Array) => Array.from(bytes, (x) => x.toString(16)).join(' ');
const text = '{"note":"Ångström, 42 µm, ∅ 25 mm, 🪶 feather"}';

describe('decoding a log file', () => {
  it('reads UTF-8 with and without its byte-order mark', () => {
    const plain = new TextEncoder().encode(text);
    expect(decodeLogBytes(plain)).toBe(text);
    expect(decodeLogBytes(new Uint8Array([0xef, 0xbb, 0xbf, ...plain]))).toBe(text);
  });

  it('reads UTF-16 LE and BE after their byte-order mark, surrogate pairs included', () => {
    const le = new Uint8Array(Buffer.from(`\ufeff${text}`, 'utf16le'));
    const be = new Uint8Array(Buffer.from(le).swap16());
    expect(decodeLogBytes(le)).toBe(text);
    expect(decodeLogBytes(be)).toBe(text);
  });

  it('refuses UTF-16 without a mark, an odd length and an unpaired surrogate, naming the byte', () => {
    const noMark = new Uint8Array(Buffer.from(text, 'utf16le'));
    expect(() => decodeLogBytes(noMark)).toThrow(/at byte 0 .*UTF-16 or UTF-32 without a byte-order mark/);
    expect(() => decodeLogBytes(new Uint8Array([0xff, 0xfe, 0x7b, 0x00, 0x7d]))).toThrow(/UTF-16LE text: at byte 4/);
    expect(() => decodeLogBytes(new Uint8Array([0xff, 0xfe, 0x00, 0xd8, 0x41, 0x00]))).toThrow(/at byte 2 .*high surrogate without its low half/);
    expect(() => decodeLogBytes(new Uint8Array([0xfe, 0xff, 0xdc, 0x00]))).toThrow(/UTF-16BE text: at byte 2 .*low surrogate without its high half/);
  });

  it('agrees with a strict decoder on every two-byte input that starts outside ASCII', () => {
    const bytes = new Uint8Array(2);
    const differ: string[] = [];
    let compared = 0;
    for (let a = 0x80; a < 256; a++) {
      for (let b = 0; b < 256; b++) {
        bytes[0] = a;
        bytes[1] = b;
        // A NUL at the start is refused as UTF-16 without a mark, a UTF-16 mark is read as one: not UTF-8 there.
        if (b === 0 || (a === 0xff && b === 0xfe) || (a === 0xfe && b === 0xff)) continue;
        compared++;
        if (ours(bytes) !== strict(bytes)) differ.push(hex(bytes));
      }
    }
    expect(differ).toEqual([]);
    expect(compared).toBe(128 * 255 - 2);
  }, 60_000);

  it('agrees with a strict decoder on the edges of every three- and four-byte form', () => {
    const lead3 = [0xe0, 0xe1, 0xec, 0xed, 0xee, 0xef];
    const lead4 = [0xf0, 0xf1, 0xf3, 0xf4, 0xf5, 0xf7, 0xf8, 0xff, 0xc0, 0xc1, 0x80];
    const cont = [0x00, 0x41, 0x7f, 0x80, 0x8f, 0x90, 0x9f, 0xa0, 0xbf, 0xc0, 0xff];
    let compared = 0;
    const differ: string[] = [];
    for (const a of [...lead3, ...lead4]) {
      for (const b of cont) {
        for (const c of cont) {
          for (const d of [undefined, ...cont]) {
            const bytes = new Uint8Array([0x20, a, b, c, ...(d === undefined ? [] : [d])]);
            if (ours(bytes) !== strict(bytes)) differ.push(hex(bytes));
            compared++;
          }
        }
      }
    }
    expect(differ).toEqual([]);
    expect(compared).toBe(17 * 11 * 11 * 12);
  }, 60_000);

  it('names the offset and the bytes of a malformed sequence', () => {
    const bytes = new Uint8Array([...new TextEncoder().encode('{"a":"caf'), 0xe9, 0x22, 0x7d]);
    expect(() => decodeLogBytes(bytes)).toThrow('the file is not UTF-8 text: at byte 9 (0xE9 0x22 0x7D)');
    expect(() => decodeLogBytes(new Uint8Array([0x20, 0xed, 0xa0, 0x80]))).toThrow(/at byte 1 \(0xED 0xA0 0x80\) is not a well-formed UTF-8 sequence/);
    expect(() => decodeLogBytes(new Uint8Array([0x20, 0xf0, 0x9f]))).toThrow(/cut off by the end of the file/);
  });

  it('decodes text longer than one chunk of code units whole', () => {
    const long = `{"n":"${'é🪶a'.repeat(20_000)}"}`;
    expect(decodeLogBytes(new TextEncoder().encode(long))).toBe(long);
    const le = new Uint8Array(Buffer.from(`\ufeff${long}`, 'utf16le'));
    expect(decodeLogBytes(le)).toBe(long);
  });

  it('gives the same text and the same refusals with the platform strict decoder handed in', () => {
    const native = (bytes: Uint8Array) => new TextDecoder('utf-8', { fatal: true, ignoreBOM: true }).decode(bytes);
    const withBom = new Uint8Array([0xef, 0xbb, 0xbf, ...new TextEncoder().encode(text)]);
    expect(decodeLogBytes(withBom, native)).toBe(text);
    expect(decodeLogBytes(new Uint8Array(Buffer.from(`\ufeff${text}`, 'utf16le')), native)).toBe(text);
    const bad = new Uint8Array([...new TextEncoder().encode('{"a":"caf'), 0xe9, 0x22, 0x7d]);
    expect(() => decodeLogBytes(bad, native)).toThrow('the file is not UTF-8 text: at byte 9 (0xE9 0x22 0x7D)');
    let used = 0;
    expect(decodeLogBytes(withBom, (b) => (used++, native(b)))).toBe(text);
    expect(used).toBe(1);
  });
});
