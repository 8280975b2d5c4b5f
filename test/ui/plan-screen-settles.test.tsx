// @vitest-environment happy-dom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { act, cleanup, render, waitFor } from '@testing-library/preact';
import * as analysis from '../../src/analysis';
import { createMemoryStore } from '../../src/store';
import { AppProvider, DEFAULT_SETTINGS } from '../../src/ui/app-context';
import { PlanScreen } from '../../src/ui/screens/PlanScreen';
import { SETTLE_MS } from '../../src/ui/use-settled';
import { testDay } from '../analysis/day-records';

// A counting spy on the plan the screen asks for (the real one underneath).
vi.mock(import('../../src/analysis'), async (importOriginal) => {
  const real = await importOriginal();
  return { ...real, planFor: vi.fn(real.planFor) };
});
const planned = vi.mocked(analysis.planFor);

afterEach(() => {
  cleanup();
  vi.useRealTimers();
  planned.mockClear();
});

describe('the Planner screen', () => {
  it('plans once when typing rests, not at every keystroke', async () => {
    const store = await createMemoryStore();
    await store.putRecords([testDay().specimen]);
    const { container, findByText } = render(
      <AppProvider store={store} initialSettings={DEFAULT_SETTINGS}>
        <PlanScreen />
      </AppProvider>,
    );
    await findByText('What to expect');
    await waitFor(() => expect(planned).toHaveBeenCalled());
    vi.useFakeTimers();
    planned.mockClear();
    const height = [...container.querySelectorAll('pl-quantity')].find((el) => (el as HTMLElement & { label?: string }).label === 'Release height')!;
    for (const text of ['1', '12', '12.', '12.5']) {
      act(() => {
        height.dispatchEvent(new CustomEvent('quantity-change', { detail: { text, value: Number(text), error: null } }));
      });
      act(() => void vi.advanceTimersByTime(SETTLE_MS / 3));
    }
    expect(planned).not.toHaveBeenCalled();
    act(() => void vi.advanceTimersByTime(SETTLE_MS));
    expect(planned).toHaveBeenCalledTimes(1);
    expect(planned.mock.calls[0]![0].height_m).toBe(12.5);
  });
});
