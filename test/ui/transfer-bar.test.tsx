// @vitest-environment happy-dom
// A long transfer's progress on a screen: nothing for the first half second (a quick one never flickers a bar),
// then a progressbar that says what is happening, and a Cancel that raises the transfer's signal.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { act, cleanup, render } from '@testing-library/preact';
import type { TransferOptions } from '../../src/log';
import { progressText } from '../../src/ui/progress-text';
import { TransferBar } from '../../src/ui/TransferBar';
import { SHOW_AFTER_MS, useTransfer, type Transfer } from '../../src/ui/use-transfer';

afterEach(() => {
  cleanup();
  vi.useRealTimers();
});

let transfer: Transfer;
function Host() {
  transfer = useTransfer();
  return transfer.view ? <TransferBar view={transfer.view} /> : <p>idle</p>;
}

/** A transfer that reports what it is told to and ends when told to. */
function controlled() {
  let options!: Required<TransferOptions>;
  let finish!: () => void;
  const done = new Promise<void>((resolve) => (finish = resolve));
  const work = (o: Required<TransferOptions>) => {
    options = o;
    return done;
  };
  return { work, options: () => options, finish };
}

describe('the progress of a transfer', () => {
  it('words each phase with its count, numbers grouped by thousands', () => {
    expect(progressText({ phase: 'checking', done: 12_400, total: 100_000 })).toBe('Checking 12\u00a0400 of 100\u00a0000 records');
    expect(progressText({ phase: 'writing', done: 2500, total: 50_702 })).toBe('Saving 2\u00a0500 of 50\u00a0702 records');
    expect(progressText({ phase: 'reading', done: 0, total: 0 })).toBe('Reading the log on this phone');
  });

  it('shows nothing for a transfer shorter than half a second', async () => {
    vi.useFakeTimers({ toFake: ['setTimeout', 'clearTimeout', 'requestAnimationFrame', 'cancelAnimationFrame'] });
    const { container } = render(<Host />);
    const t = controlled();
    let run!: Promise<void>;
    act(() => {
      run = transfer.run('Importing', t.work);
    });
    t.options().onProgress({ phase: 'checking', done: 100, total: 1000 });
    await act(async () => {
      vi.advanceTimersByTime(SHOW_AFTER_MS - 50);
    });
    t.finish();
    await act(async () => {
      await run;
      vi.advanceTimersByTime(1000);
    });
    expect(container.querySelector('[role="progressbar"]')).toBeNull();
  });

  it('shows a progressbar after half a second, with the count, and Cancel raises the signal', async () => {
    vi.useFakeTimers({ toFake: ['setTimeout', 'clearTimeout', 'requestAnimationFrame', 'cancelAnimationFrame'] });
    const { container, getByRole } = render(<Host />);
    const t = controlled();
    act(() => {
      void transfer.run('Importing', t.work).catch(() => undefined);
    });
    t.options().onProgress({ phase: 'checking', done: 12_400, total: 100_000 });
    await act(async () => {
      vi.advanceTimersByTime(SHOW_AFTER_MS + 20);
    });
    const bar = container.querySelector('[role="progressbar"]')!;
    expect(bar.getAttribute('aria-valuenow')).toBe('12');
    expect(bar.getAttribute('aria-valuetext')).toBe('Checking 12\u00a0400 of 100\u00a0000 records');
    expect(t.options().signal.aborted).toBe(false);
    await act(async () => getByRole('button', { name: 'Cancel' }).click());
    expect(t.options().signal.aborted).toBe(true);
    expect(container.textContent).toContain('Cancelling');
    t.finish();
  });

  it('words a sync run and the CSV tables in the same way, phase by phase', () => {
    expect(progressText({ phase: 'listing', done: 0, total: 0 })).toBe('Looking at the office folder');
    expect(progressText({ phase: 'downloading', done: 5, total: 14 })).toBe('Reading 5 of 14 files from the office folder');
    expect(progressText({ phase: 'merging', done: 0, total: 1200 })).toBe('Merging 1\u00a0200 records with this log');
    expect(progressText({ phase: 'writing', done: 0, total: 63 })).toBe('Saving 0 of 63 records');
    expect(progressText({ phase: 'uploading', done: 3, total: 12 })).toBe('Uploading 3 of 12 parts to the office folder');
    expect(progressText({ phase: 'uploading', done: 0, total: 1 })).toBe('Uploading 0 of 1 part to the office folder');
    expect(progressText({ phase: 'indexing', done: 0, total: 1 })).toBe('Writing the list of this phone’s parts in the office folder');
    expect(progressText({ phase: 'computing', done: 3, total: 12 })).toBe('Computing 3 of 12 series');
    expect(progressText({ phase: 'computing', done: 0, total: 1 })).toBe('Computing 0 of 1 series');
  });

  it('says what a sync does once Cancel is tapped, and its button says Cancelling…', async () => {
    vi.useFakeTimers({ toFake: ['setTimeout', 'clearTimeout', 'requestAnimationFrame', 'cancelAnimationFrame'] });
    const { container, getByRole } = render(<Host />);
    const t = controlled();
    act(() => {
      void transfer.run('Syncing with the office folder', t.work, { cancelling: 'Cancelling… stopping at the next safe point' }).catch(() => undefined);
    });
    t.options().onProgress({ phase: 'uploading', done: 3, total: 12 });
    await act(async () => {
      vi.advanceTimersByTime(SHOW_AFTER_MS + 20);
    });
    const bar = container.querySelector('[role="progressbar"]')!;
    expect(bar.getAttribute('aria-valuetext')).toBe('Uploading 3 of 12 parts to the office folder');
    expect(bar.getAttribute('aria-valuenow')).toBe('25');
    expect(container.querySelector('[role="group"]')!.getAttribute('aria-label')).toBe('Syncing with the office folder');
    await act(async () => getByRole('button', { name: 'Cancel' }).click());
    expect(t.options().signal.aborted).toBe(true);
    expect(bar.getAttribute('aria-valuetext')).toBe('Cancelling… stopping at the next safe point');
    const button = getByRole('button', { name: 'Cancelling…' }) as HTMLButtonElement;
    expect(button.disabled).toBe(true);
    t.finish();
  });
});
