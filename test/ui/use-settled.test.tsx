// @vitest-environment happy-dom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { act, cleanup, render } from '@testing-library/preact';
import { SETTLE_MS, useSettled } from '../../src/ui/use-settled';

afterEach(() => {
  cleanup();
  vi.useRealTimers();
});

describe('a value that settles', () => {
  it('follows typing only once it rests, with each keystroke restarting the wait', () => {
    vi.useFakeTimers();
    const seen: string[] = [];
    function Probe({ text }: { text: string }) {
      const settled = useSettled(text);
      seen.push(settled);
      return <p>{settled}</p>;
    }
    const { rerender, container } = render(<Probe text="1" />);
    expect(container.textContent).toBe('1');
    for (const text of ['12', '12.', '12.5']) {
      rerender(<Probe text={text} />);
      act(() => void vi.advanceTimersByTime(SETTLE_MS - 50));
    }
    expect(container.textContent).toBe('1');
    act(() => void vi.advanceTimersByTime(50));
    expect(container.textContent).toBe('12.5');
    // The values in between were never handed on.
    expect(new Set(seen)).toEqual(new Set(['1', '12.5']));
  });
});
