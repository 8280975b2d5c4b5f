// @vitest-environment happy-dom
// The phone's import reads a picked file's bytes with the office command's decoding (decodeLogBytes): a log saved
// as UTF-16 or with a UTF-8 byte-order mark is previewed like the plain file; bytes that are not UTF-8 are refused
// by offset, and nothing is written.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, fireEvent, render } from '@testing-library/preact';
import { createMemoryStore } from '../../src/store';
import { AppProvider, DEFAULT_SETTINGS } from '../../src/ui/app-context';
import { SendScreen } from '../../src/ui/screens/SendScreen';
import { exportLog } from '../../src/log/export';
import { sampleLog } from '../sync/sample-log';

let picked: File | null = null;
vi.mock(import('../../src/sync/page'), async (importOriginal) => ({ ...(await importOriginal()), pickFile: async () => picked }));
afterEach(() => cleanup());

const text = exportLog(sampleLog({ days: 1, seriesPerDay: 1, dropsPerSeries: 2 }), { device: 'phoneB', app_version: '0.1.0' });

async function importBytes(bytes: Uint8Array<ArrayBuffer>) {
  picked = new File([bytes], 'log.json', { type: 'application/json' });
  const store = await createMemoryStore();
  const screen = render(
    <AppProvider store={store} initialSettings={DEFAULT_SETTINGS}>
      <SendScreen />
    </AppProvider>,
  );
  fireEvent.click(await screen.findByText('Import a log file'));
  return { store, screen };
}

describe('importing a log file on the phone', () => {
  const le = new Uint8Array(Buffer.from(`\ufeff${text}`, 'utf16le'));
  for (const [name, bytes] of [
    ['UTF-8 with a byte-order mark', new Uint8Array([0xef, 0xbb, 0xbf, ...Buffer.from(text)])],
    ['UTF-16 LE with its mark', le],
    ['UTF-16 BE with its mark', new Uint8Array(Buffer.from(le).swap16())],
  ] as const) {
    it(`previews a log saved as ${name}`, async () => {
      const { screen } = await importBytes(bytes);
      const preview = await screen.findByRole('group', { name: 'Import preview' });
      expect(preview.textContent).toContain('From device phoneB');
    });
  }

  it('refuses bytes that are not UTF-8, naming the byte, and writes nothing', async () => {
    const bad = new Uint8Array([...Buffer.from(text.slice(0, 20)), 0xe9, ...Buffer.from(text.slice(20))]);
    const { store, screen } = await importBytes(bad);
    await screen.findByText(/This file cannot be imported: .*not UTF-8 text: at byte 20/);
    expect(await store.allRecords()).toEqual([]);
  });
});
