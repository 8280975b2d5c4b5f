import { describe, expect, it } from 'vitest';
import { formatValue } from '../../src/errors';

describe('a refused value shown to people', () => {
  it('says what a value nested too deep for the engine was, instead of overflowing the stack again', () => {
    // 200 000 nested lists: JSON.stringify and String() both recurse and overflow on them.
    let deep: unknown[] = [];
    for (let i = 0; i < 200_000; i++) deep = [deep];
    expect(() => JSON.stringify(deep)).toThrow(RangeError);
    expect(formatValue(deep)).toBe('a list of 1');
  });

  it('shortens long text and keeps numbers exact', () => {
    expect(formatValue('x'.repeat(100))).toMatch(/\.\.\. \(100 characters\)$/);
    expect(formatValue(2.511)).toBe('2.511');
  });
});
