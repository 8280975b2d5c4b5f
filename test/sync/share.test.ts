// @vitest-environment happy-dom
import { describe, expect, it, vi } from 'vitest';
import { pickFile, shareFile, shareFiles, type ShareEnvironment } from '../../src/sync/page/share';
import { logCsvFiles } from '../../src/sync/csv-export';
import { sampleLog } from './sample-log';

const file = { name: 'plummet-log-phoneA-2026-06-14.json', text: '{"format":"plummet-log"}', type: 'application/json' };

function environment(nav: ShareEnvironment['navigator']) {
  const clicks: { href: string; download: string }[] = [];
  const revoked: string[] = [];
  const timers: (() => void)[] = [];
  const env: ShareEnvironment = {
    navigator: nav,
    makeFile: (text, name, type) => new File([text], name, { type }),
    createObjectURL: () => 'blob:http://127.0.0.1/1234',
    revokeObjectURL: (url) => revoked.push(url),
    document,
    setTimeout: (fn) => timers.push(fn),
  };
  document.addEventListener(
    'click',
    (e) => {
      const a = e.target as HTMLAnchorElement;
      if (a.tagName === 'A') {
        clicks.push({ href: a.href, download: a.download });
        e.preventDefault();
      }
    },
    { capture: true },
  );
  return { env, clicks, revoked, timers };
}

describe('sharing a file', () => {
  it('uses the Web Share API with the file where canShare allows it', async () => {
    const share = vi.fn(async (_data: { files: File[]; title?: string }) => undefined);
    const { env, clicks } = environment({ canShare: () => true, share });
    expect(await shareFile(file, env, 'Drop log')).toBe('shared');
    const data = share.mock.calls[0]![0];
    expect(data.files[0]!.name).toBe(file.name);
    expect(await data.files[0]!.text()).toBe(file.text);
    expect(data.title).toBe('Drop log');
    expect(clicks).toEqual([]);
  });

  it('downloads through a blob link where there is no navigator.share (as in headless Chromium)', async () => {
    const { env, clicks, revoked, timers } = environment({});
    expect(await shareFile(file, env)).toBe('downloaded');
    expect(clicks).toEqual([{ href: 'blob:http://127.0.0.1/1234', download: file.name }]);
    expect(document.querySelectorAll('a').length).toBe(0);
    expect(revoked).toEqual([]);
    timers.forEach((t) => t());
    expect(revoked).toEqual(['blob:http://127.0.0.1/1234']);
  });

  it('downloads when the phone cannot share files of this kind', async () => {
    const share = vi.fn();
    const { env, clicks } = environment({ canShare: () => false, share });
    expect(await shareFile(file, env)).toBe('downloaded');
    expect(share).not.toHaveBeenCalled();
    expect(clicks).toHaveLength(1);
  });

  it('takes closing the share sheet as an answer: no download follows', async () => {
    const share = vi.fn(async () => Promise.reject(Object.assign(new Error('cancelled'), { name: 'AbortError' })));
    const { env, clicks } = environment({ canShare: () => true, share });
    expect(await shareFile(file, env)).toBe('cancelled');
    expect(clicks).toEqual([]);
  });

  it('falls back to the download when sharing is refused', async () => {
    const share = vi.fn(async () => Promise.reject(Object.assign(new Error('no gesture'), { name: 'NotAllowedError' })));
    const { env, clicks } = environment({ canShare: () => true, share });
    expect(await shareFile(file, env)).toBe('downloaded');
    expect(clicks).toHaveLength(1);
  });
});

describe('sharing the CSV tables', () => {
  it('shares both tables together, or downloads each', async () => {
    const files = logCsvFiles(sampleLog(), 'plummet-2026-06-14');
    expect(files.map((f) => f.name)).toEqual(['plummet-2026-06-14-drops.csv', 'plummet-2026-06-14-series.csv']);
    expect(files[0]!.text.startsWith('\ufeffday_date,')).toBe(true);
    const share = vi.fn(async (_data: { files: File[] }) => undefined);
    expect(await shareFiles(files, environment({ canShare: () => true, share }).env)).toBe('shared');
    expect(share.mock.calls[0]![0].files.map((f) => f.name)).toEqual(files.map((f) => f.name));
    const fallback = environment({});
    expect(await shareFiles(files, fallback.env)).toBe('downloaded');
    expect(fallback.clicks.map((c) => c.download)).toEqual(files.map((f) => f.name));
  });
});

describe('picking a file to import', () => {
  it('gives the file picked', async () => {
    const picked = pickFile({ document });
    const input = document.querySelector('input[type=file]') as HTMLInputElement;
    expect(input.accept).toBe('.json,application/json');
    const chosen = new File([file.text], file.name, { type: file.type });
    Object.defineProperty(input, 'files', { value: [chosen] });
    input.dispatchEvent(new Event('change'));
    expect(await picked).toBe(chosen);
    expect(document.querySelector('input[type=file]')).toBeNull();
  });

  it('gives null when the person cancels', async () => {
    const picked = pickFile({ document });
    document.querySelector('input[type=file]')!.dispatchEvent(new Event('cancel'));
    expect(await picked).toBeNull();
  });
});
