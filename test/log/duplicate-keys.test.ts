import { describe, expect, it } from 'vitest';
import { findDuplicateKey } from '../../src/log/duplicate-keys';

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
