import { describe, expect, it, vi } from 'vitest';
import { loadSyncStatus, startAutoSync } from '../../src/sync/auto-sync';
import { saveSyncSettings } from '../../src/sync/settings';
import { freePort } from '../servers/process';
import { MemoryRecordSource } from './memory-record-source';
import { sampleLog } from './sample-log';

async function phoneWithDeadFolder(enabled: boolean) {
  const phone = new MemoryRecordSource('phoneA', sampleLog());
  // A port nothing listens on: every request fails at once with a network error.
  const port = await freePort();
  await saveSyncSettings(phone, { folder_url: `http://127.0.0.1:${port}/dav/`, username: 'fieldteam', password: 'x', enabled, timeout_ms: 2000 });
  return phone;
}

describe('automatic sync for the screens', () => {
  it('syncs on start, and after a failure registers Background Sync and shows the error', async () => {
    const phone = await phoneWithDeadFolder(true);
    const register = vi.fn(async () => undefined);
    const reports: string[] = [];
    const auto = startAutoSync({
      source: phone,
      appVersion: '0.1.0',
      env: { serviceWorkerReady: Promise.resolve({ sync: { register } }) },
      locks: null,
      onReport: (r) => reports.push(r.error?.code ?? 'ok'),
    });
    await vi.waitFor(() => expect(reports).toEqual(['sync-network']));
    await vi.waitFor(() => expect(register).toHaveBeenCalledWith('plummet-office-folder'));
    expect(auto.scheduler.nextRetryMs).toBeGreaterThan(0);
    const status = await loadSyncStatus(phone);
    expect(status).toMatchObject({ configured: true, enabled: true, failures: 1, last_success_at: null, unsent_changes: null });
    expect(status.last_error).toMatchObject({ code: 'sync-network' });
    auto.stop();
  });

  it('does not sync by itself while switched off, but still when asked', async () => {
    const phone = await phoneWithDeadFolder(false);
    const reports: string[] = [];
    const auto = startAutoSync({ source: phone, appVersion: '0.1.0', env: {}, locks: null, onReport: (r) => reports.push(r.error?.code ?? 'ok') });
    await vi.waitFor(() => expect(reports).toEqual(['sync-disabled']));
    expect(auto.scheduler.nextRetryMs).toBeNull();
    expect((await auto.syncNow()).error?.code).toBe('sync-network');
    auto.stop();
  });

  it('shows a phone that has no folder set up as such', async () => {
    expect(await loadSyncStatus(new MemoryRecordSource('phoneA'))).toMatchObject({ configured: false, enabled: false, folder_url: null, failures: 0 });
  });
});
