import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { countMemberNames, findDuplicateKey } from '../../src/log/duplicate-keys';

// Pointers as RFC 6901 writes them: "~" as "~0", "/" as "~1", array places as numbers.
describe('findDuplicateKey', () => {
  it('finds nothing in JSON whose objects name each field once', () => {
    expect(findDuplicateKey('{"a":1,"b":[{"a":1},{"a":2,"b":{"a":3}}],"c":"{\\"a\\":1,\\"a\\":2}"}')).toBeNull();
    expect(findDuplicateKey('[1, 2, {"x": [ ]}, "a"]')).toBeNull();
  });

  it('names the object holding the duplicate by its JSON Pointer, through objects and arrays', () => {
    expect(findDuplicateKey('{"a":1,"a":2}')).toEqual({ pointer: '', key: 'a' });
    expect(findDuplicateKey('{"records":[{"id":"x"},{"id":"y","raw":{"k":1},"time_s":1,"time_s":2}]}')).toEqual({ pointer: '/records/1', key: 'time_s' });
    expect(findDuplicateKey('{"r":[[0,1],[2,{"q":[{},{"z":0,"z":1}]}]]}')).toEqual({ pointer: '/r/1/1/q/1', key: 'z' });
    expect(findDuplicateKey('{"a/b":{"c~d":{"e":1 , "e" :2}}}')).toEqual({ pointer: '/a~1b/c~0d', key: 'e' });
  });

  it('reads escaped names as the names they stand for, and strings that look like names as strings', () => {
    expect(findDuplicateKey('{"a":1,"\\u0061":2}')).toEqual({ pointer: '', key: 'a' });
    expect(findDuplicateKey('{"x":["a","a"],"y":"a","z":{"\\"":1,"\\\\":2}}')).toBeNull();
    expect(findDuplicateKey('{"x":{"\\"":1},"w":{"\\"" : 1,"\\"":2}}')).toEqual({ pointer: '/w', key: '"' });
  });
});

/** The keys of every object in a parsed value, added up. */
function keysIn(value: unknown): number {
  if (Array.isArray(value)) return value.reduce((n: number, v) => n + keysIn(v), 0);
  if (value === null || typeof value !== 'object') return 0;
  return Object.keys(value).length + Object.values(value).reduce((n: number, v) => n + keysIn(v), 0);
}

describe('countMemberNames', () => {
  it('counts the names of every object, and no string that is a value, whatever it holds', () => {
    expect(countMemberNames('{}')).toBe(0);
    expect(countMemberNames('"a"')).toBe(0);
    expect(countMemberNames('{"a":1,"b":[{"a":1},{"a":2,"b":{"a":3}}],"c":"{\\"a\\":1,\\"a\\":2}"}')).toBe(7);
    expect(countMemberNames('{"x":["a:","a" , ":"],"y" :"a\\\\","z":{"\\"":1,"\\\\":2}}')).toBe(5);
    expect(countMemberNames('{ "t" :\n 1, "u"\t:"2026-06-14T09:12:03Z" }')).toBe(2);
  });

  it('counts two names where JSON.parse keeps one key: the reader then looks for the duplicate', () => {
    const text = '{"a":1,"\\u0061":2,"b":{"c":1,"c":2}}';
    expect(countMemberNames(text)).toBe(5);
    expect(keysIn(JSON.parse(text))).toBe(3);
  });

  // The reader's shortcut rests on this: the count equals the parsed keys exactly when no object names a field twice.
  it('equals the keys JSON.parse keeps for any JSON without duplicates, spaced or not, and exceeds them with one', () => {
    const value = fc.oneof(fc.jsonValue({ maxDepth: 4 }), fc.dictionary(fc.string(), fc.jsonValue({ maxDepth: 3 }), { minKeys: 1 }));
    fc.assert(
      fc.property(value, fc.boolean(), (v, spaced) => {
        const text = JSON.stringify(v, null, spaced ? 2 : undefined) ?? 'null';
        expect(countMemberNames(text)).toBe(keysIn(JSON.parse(text)));
        const first = v !== null && typeof v === 'object' && !Array.isArray(v) ? Object.keys(v)[0] : undefined;
        if (first !== undefined) {
          // The object's first name written a second time, before the first: one more name, the same keys.
          const twice = `{${JSON.stringify(first)}:0,${text.slice(1)}`;
          expect(countMemberNames(twice)).toBe(keysIn(JSON.parse(twice)) + 1);
          expect(findDuplicateKey(twice)).toEqual({ pointer: '', key: first });
        }
      }),
      { numRuns: 500 },
    );
  });
});
