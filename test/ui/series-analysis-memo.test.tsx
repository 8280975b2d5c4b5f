// @vitest-environment happy-dom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, render } from '@testing-library/preact';
import * as analysis from '../../src/analysis';
import { createMemoryStore } from '../../src/store';
import type { DayView } from '../../src/store';
import { AppProvider, DEFAULT_SETTINGS } from '../../src/ui/app-context';
import { SeriesBody } from '../../src/ui/screens/day/SeriesScreen';
import { DEVICE, revise, testDay } from '../analysis/day-records';

// A counting spy on the series analysis the screen runs (the real one underneath).
vi.mock(import('../../src/analysis'), async (importOriginal) => {
  const real = await importOriginal();
  return { ...real, analyzeSeriesRecords: vi.fn(real.analyzeSeriesRecords) };
});
const analyzed = vi.mocked(analysis.analyzeSeriesRecords);

const day = testDay({ timingOffset: 'none' });

/** The day as the store hands it out after every write: new objects and arrays holding the same records. */
function loadedView(drops = day.drops): DayView {
  const copy = <T,>(x: T): T => structuredClone(x);
  return { day: copy(day.day), site: copy(day.site), readings: [copy(day.reading)], series: [copy(day.series)], drops: drops.map(copy), specimens: [copy(day.specimen)] };
}

async function screen() {
  const store = await createMemoryStore();
  const ui = (view: DayView) => (
    <AppProvider store={store} initialSettings={DEFAULT_SETTINGS}>
      <SeriesBody view={view} series={view.series[0]!} specimen={view.specimens[0]} drops={view.drops.filter((d) => d.series_id === day.series.id)} />
    </AppProvider>
  );
  return { ui, store };
}

afterEach(() => {
  cleanup();
  analyzed.mockClear();
});

describe('the Series screen', () => {
  it('analyses a series once when it renders again with the same records', async () => {
    const { ui } = await screen();
    const { rerender, getByTestId } = render(ui(loadedView()));
    expect(getByTestId('cd-value').textContent).toMatch(/^\d\.\d{3}/);
    rerender(ui(loadedView()));
    rerender(ui(loadedView()));
    expect(analyzed).toHaveBeenCalledTimes(1);
  });

  it('analyses it again when one of its records changes', async () => {
    const { ui } = await screen();
    const { rerender } = render(ui(loadedView()));
    const excluded = revise(day.drops[0]!, { excluded: true, exclusion_reason: 'wind' }, Date.UTC(2026, 6, 3, 12), DEVICE);
    rerender(ui(loadedView([excluded, ...day.drops.slice(1)])));
    expect(analyzed).toHaveBeenCalledTimes(2);
  });
});
