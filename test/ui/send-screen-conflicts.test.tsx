// @vitest-environment happy-dom
// The Send screen: a conflict is settled only with a reason, and records from a clock far ahead are listed.
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, fireEvent, render, waitFor } from '@testing-library/preact';
import { exportLog } from '../../src/log/export';
import { formatHlc } from '../../src/log/hlc';
import type { DropRecord, SiteRecord } from '../../src/log/types';
import { createMemoryStore } from '../../src/store';
import { applyImport, loadConflicts, previewImport } from '../../src/sync/import-log';
import { AppProvider, DEFAULT_SETTINGS } from '../../src/ui/app-context';
import { SendScreen } from '../../src/ui/screens/SendScreen';
import { byKind, sampleLog } from '../sync/sample-log';

afterEach(cleanup);

describe('the Send screen', () => {
  it('asks why before a conflict is settled, and lists records from a clock far ahead', async () => {
    const log = sampleLog({ days: 1, seriesPerDay: 1, dropsPerSeries: 1 });
    const drop = { ...byKind(log, 'drop')[0]!, time_s: 2.511 } as DropRecord;
    const far = { ...byKind(log, 'site')[0]!, rev: formatHlc({ ms: Date.UTC(2070, 0, 1), counter: 0, device: 'farphone' }), device: 'farphone' } as SiteRecord;
    const store = await createMemoryStore();
    await store.putRecords([...log.filter((r) => r.id !== drop.id && r.id !== far.id), drop, far]);
    const { file } = await previewImport(store, exportLog([{ ...drop, time_s: 2511 } as DropRecord], { device: 'phoneB', app_version: '0.1.0' }));
    await applyImport(store, file);
    const view = render(
      <AppProvider store={store} initialSettings={DEFAULT_SETTINGS}>
        <SendScreen />
      </AppProvider>,
    );
    await view.findByText('Conflicts to look at (1)');
    expect(view.getByText(/two versions under the same stamp/)).toBeTruthy();
    const checked = view.getByRole('button', { name: 'Checked' }) as HTMLButtonElement;
    expect(checked.disabled).toBe(true);
    await view.findByText('From a clock far ahead (1)');
    expect(view.getByText(/stamped 2070-01-01/)).toBeTruthy();
    const field = view.getByLabelText('Why the record is right as it is') as HTMLInputElement;
    fireEvent.input(field, { target: { value: 'the stopwatch showed 2.511 s' } });
    await waitFor(() => expect(checked.disabled).toBe(false));
    fireEvent.click(checked);
    await waitFor(async () => expect(await loadConflicts(store)).toEqual([]));
    expect((await store.getMeta('log_conflicts_settled'))?.[0]?.reason).toBe('the stopwatch showed 2.511 s');
  });
});
