/**
 * Getting a file off the phone and one onto it.
 *
 * Out: the Web Share API with files (navigator.share({ files })) where navigator.canShare says the file can go,
 * so the crew can send it by mail or a messenger; otherwise a download through a link to a blob URL. Headless
 * Chromium and most desktop browsers have no navigator.share: they take the download. A person closing the
 * share sheet (AbortError) is an answer, not a failure, so no download follows it.
 * In: a file picker (<input type="file">); its text then goes to previewImport (../import-log.ts).
 *
 * The browser pieces are handed in, so the tests can stand in for them.
 */
import type { ShareableFile } from '../shareable-file';

export interface ShareEnvironment {
  navigator: { canShare?: (data: { files: File[] }) => boolean; share?: (data: { files: File[]; title?: string }) => Promise<void> };
  makeFile(text: string, name: string, type: string): File;
  createObjectURL(blob: Blob): string;
  revokeObjectURL(url: string): void;
  document: Pick<Document, 'createElement' | 'body'>;
  setTimeout(fn: () => void, ms: number): unknown;
}

export function browserShareEnvironment(): ShareEnvironment {
  return {
    navigator,
    makeFile: (text, name, type) => new File([text], name, { type }),
    createObjectURL: (blob) => URL.createObjectURL(blob),
    revokeObjectURL: (url) => URL.revokeObjectURL(url),
    document,
    setTimeout: (fn, ms) => setTimeout(fn, ms),
  };
}

export type ShareOutcome = 'shared' | 'downloaded' | 'cancelled';

/** Saves the file through a download link. */
export function downloadFile(file: ShareableFile, env: ShareEnvironment = browserShareEnvironment()): void {
  const blob = env.makeFile(file.text, file.name, file.type);
  const url = env.createObjectURL(blob);
  const link = env.document.createElement('a');
  link.href = url;
  link.download = file.name;
  link.rel = 'noopener';
  link.style.display = 'none';
  env.document.body.append(link);
  link.click();
  link.remove();
  // Revoking at once can cancel the download in some browsers; a minute is plenty.
  env.setTimeout(() => env.revokeObjectURL(url), 60_000);
}

/** Shares the files together where the phone can, downloads each otherwise. */
export async function shareFiles(files: readonly ShareableFile[], env: ShareEnvironment = browserShareEnvironment(), title?: string): Promise<ShareOutcome> {
  const nav = env.navigator;
  if (typeof nav.share === 'function' && typeof nav.canShare === 'function') {
    const made = files.map((f) => env.makeFile(f.text, f.name, f.type));
    if (nav.canShare({ files: made })) {
      try {
        await nav.share(title ? { files: made, title } : { files: made });
        return 'shared';
      } catch (error) {
        if ((error as { name?: string }).name === 'AbortError') return 'cancelled';
        // NotAllowedError (no user gesture) and the like: fall back to the download.
      }
    }
  }
  for (const file of files) downloadFile(file, env);
  return 'downloaded';
}

/** Shares the file where the phone can, downloads it otherwise. */
export function shareFile(file: ShareableFile, env: ShareEnvironment = browserShareEnvironment(), title?: string): Promise<ShareOutcome> {
  return shareFiles([file], env, title);
}

/** Lets the person pick a file; null when they cancel. */
export function pickFile(env: Pick<ShareEnvironment, 'document'> = browserShareEnvironment(), accept = '.json,application/json'): Promise<File | null> {
  return new Promise((resolve) => {
    const input = env.document.createElement('input');
    input.type = 'file';
    input.accept = accept;
    input.style.display = 'none';
    const done = (file: File | null) => {
      input.remove();
      resolve(file);
    };
    input.addEventListener('change', () => done(input.files?.[0] ?? null), { once: true });
    input.addEventListener('cancel', () => done(null), { once: true });
    env.document.body.append(input);
    input.click();
  });
}
