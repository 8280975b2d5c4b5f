import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { canonicalJson, canonicalJsonByParts, CanonicalJsonError } from '../../src/log/canonical';

// Check values: the test vectors published with RFC 8785 (JSON Canonicalization Scheme) by its author,
// github.com/cyberphone/json-canonicalization, testdata/input and testdata/output.
describe('canonicalJson (RFC 8785, JSON Canonicalization Scheme)', () => {
  it('sorts property names by UTF-16 code units, as the RFC 8785 "weird" test vector requires', () => {
    const input = JSON.parse(
      '{"\\u20ac":"Euro Sign","1":"One","\\u0080":"Control\\u007f","\\ud83d\\ude02":"Smiley",' +
        '"\\u00f6":"Latin Small Letter O With Diaeresis","\\ufb33":"Hebrew Letter Dalet With Dagesh",' +
        '"</script>":"Browser Challenge"}',
    );
    expect(canonicalJson(input)).toBe(
      '{"1":"One","</script>":"Browser Challenge","\u0080":"Control\u007f","ö":"Latin Small Letter O With Diaeresis",' +
        '"€":"Euro Sign","😂":"Smiley","\ufb33":"Hebrew Letter Dalet With Dagesh"}',
    );
  });

  it('writes numbers and escapes strings as the RFC 8785 "values" test vector requires', () => {
    const input = JSON.parse(
      '{"numbers":[1E30,4.50,333333333.33333329,2e-3,0.000000000000000000000000001],' +
        '"escaping":"\\u20ac$\\u000F\\u000aA\'\\u0042\\u0022\\u005c\\\\\\"\\/","literals":[null,true,false]}',
    );
    expect(canonicalJson(input)).toBe(
      '{"escaping":"€$\\u000f\\nA\'B\\"\\\\\\\\\\"/","literals":[null,true,false],"numbers":[1e+30,4.5,333333333.3333333,0.002,1e-27]}',
    );
  });

  it('gives the same text whatever order the properties were inserted in', () => {
    fc.assert(
      fc.property(fc.dictionary(fc.string(), fc.jsonValue()), (dict) => {
        const reversed = Object.fromEntries(Object.entries(dict).reverse());
        expect(canonicalJson(reversed)).toBe(canonicalJson(dict));
      }),
    );
  });

  it('round-trips every JSON value through JSON.parse', () => {
    fc.assert(
      fc.property(fc.jsonValue({ noUnicodeString: false }), (value) => {
        const text = canonicalJson(value);
        expect(canonicalJson(JSON.parse(text))).toBe(text);
      }),
    );
  });

  it('orders keys that look like numbers as text too ("10" before "9"), unlike the engine\'s own property order', () => {
    expect(canonicalJson({ 9: 'b', 10: 'a', x: { 2: 0, 1: 0 } })).toBe('{"10":"a","9":"b","x":{"1":0,"2":0}}');
  });

  it('keeps a property named __proto__ as a property', () => {
    expect(canonicalJson(JSON.parse('{"__proto__":[1],"a":2}'))).toBe('{"__proto__":[1],"a":2}');
  });

  it('writes the same text by its fast path as by writing piece by piece', () => {
    fc.assert(
      fc.property(fc.jsonValue({ noUnicodeString: false }), (value) => {
        expect(canonicalJson(value)).toBe(canonicalJsonByParts(value));
      }),
      { numRuns: 500 },
    );
  });

  it('leaves out properties whose value is undefined, as JSON.stringify does', () => {
    expect(canonicalJson({ b: 1, a: undefined })).toBe('{"b":1}');
  });

  it('refuses numbers that JSON cannot hold, naming the path and the value', () => {
    try {
      canonicalJson({ records: [{ time_s: Number.NaN }] });
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(CanonicalJsonError);
      expect((error as CanonicalJsonError).code).toBe('canonical-not-finite');
      expect((error as CanonicalJsonError).path).toBe('records[0].time_s');
      expect(Number.isNaN((error as CanonicalJsonError).value)).toBe(true);
    }
    expect(() => canonicalJson([Infinity])).toThrow(/\[0\].*Infinity/);
  });

  it('refuses a lone surrogate, which I-JSON (RFC 7493) and RFC 8785 do not allow', () => {
    expect(() => canonicalJson({ name: 'a\ud800b' })).toThrow(CanonicalJsonError);
    expect(canonicalJson({ name: '\ud83d\ude02' })).toBe('{"name":"😂"}');
  });

  it('refuses values JSON has no form for', () => {
    expect(() => canonicalJson({ f: () => 1 })).toThrow(/f: .*function/);
    expect(() => canonicalJson([undefined])).toThrow(/\[0\]/);
    expect(() => canonicalJson({ n: 1n })).toThrow(/bigint/);
  });
});
