// @vitest-environment happy-dom
// The Send screen names each file the last syncs skipped, from the sync state: file, phone, record, field, why.
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, render, within } from '@testing-library/preact';
import { createMemoryStore } from '../../src/store';
import { emptySyncState, remoteState } from '../../src/sync/sync-state';
import { AppProvider, DEFAULT_SETTINGS } from '../../src/ui/app-context';
import { SendScreen } from '../../src/ui/screens/SendScreen';

afterEach(() => cleanup());

describe('the Send screen', () => {
  it('lists the files sync skipped with the phone, record, field and reason', async () => {
    const store = await createMemoryStore();
    const state = emptySyncState('https://office.example/dav/');
    const version = { etag: null, lastModified: 'Wed, 01 Jul 2026 09:00:00 GMT', contentLength: 10, date: 'Wed, 01 Jul 2026 09:00:05 GMT' };
    state.files['plummet-log-phoneB.json'] = remoteState(version, 'h1', {
      code: 'record-invalid',
      message: 'series_id: missing: must be a UUID',
      device: 'phoneB',
      record: 'b505bbc8-a549-43a6-9b30-bbf9a11d94f2',
      field: 'series_id',
    });
    state.files['notes.json'] = remoteState(version, 'h2', { code: 'log-not-a-log', message: 'this is not a Plummet log' });
    state.files['plummet-log-phoneC.json'] = remoteState(version, 'h3');
    await store.setMeta('sync_state', state);
    const { findByRole, getByRole } = render(
      <AppProvider store={store} initialSettings={DEFAULT_SETTINGS}>
        <SendScreen />
      </AppProvider>,
    );
    const list = await findByRole('list', { name: 'Files skipped' });
    expect(getByRole('heading', { name: 'Files skipped (2)' })).toBeTruthy();
    // The file merged without trouble is not listed.
    const rows = within(list).getAllByRole('listitem');
    expect(rows.map((r) => r.textContent)).toEqual([
      'notes.jsonthis is not a Plummet log',
      'plummet-log-phoneB.json · from phone phoneBrecord b505bbc8-a549-43a6-9b30-bbf9a11d94f2, field series_id · series_id: missing: must be a UUID',
    ]);
  });
});
