/**
 * The page's side of reading a clip: starts the decoding worker (decode-worker.ts, a module worker built and
 * precached with the app, fetched only when a clip is picked), opens the picked file in it and asks it for a still
 * frame to tap on and for the grey band of every frame.
 *
 * Cancelling (an AbortSignal) stops the worker at once, the decoder and the demuxer with it: nothing half-made
 * reaches the page. A reader whose worker was stopped refuses further requests; open the file again.
 */
import type { ClipProbe, GreyClip } from '../motion';
import type { FromWorker, ToWorker } from './decode-protocol';
import { bandWithinBudget, clampBand, type BandRequest, type ClipRotation } from './grey-band';
import { clipErrorWire, VideoClipError } from './video-clip-error';

/**
 * All grey frames of a clip together stay within this many bytes: with the decoder's own frames (a few at a
 * time) and the app, the page stays well under the 300 MB a mid-range phone gives a tab (common practice).
 */
export const GREY_BUDGET_BYTES = 96e6;

export interface BandProgress {
  frames_done: number;
  frames_total: number;
}

export interface ClipReader {
  readonly probe: ClipProbe;
  /** The clockwise rotation the container asks for; the probe's sizes and every coordinate are after it. */
  readonly rotation: ClipRotation;
  /** One frame near `time_s` (the clip's timeline), `width_px` wide, upright. */
  still(time_s: number, width_px: number, options?: { signal?: AbortSignal }): Promise<ImageBitmap>;
  /**
   * Every frame's grey band (its step widened when all frames would pass GREY_BUDGET_BYTES), with each frame's
   * own presentation timestamp.
   */
  greyBand(band: BandRequest, options?: { signal?: AbortSignal; onProgress?: (p: BandProgress) => void }): Promise<GreyClip>;
  /** Stops the worker. */
  close(): void;
}

type Listener = (message: FromWorker) => void;

function cancelled(): VideoClipError {
  return new VideoClipError({ code: 'decode-cancelled', field: 'clip', value: 'cancelled', allowed: null, message: 'Reading the clip was cancelled.' });
}

/** Opens a picked clip: resolves once the container has been read and the clip passes every limit. */
export async function openClip(file: Blob, options: { signal?: AbortSignal } = {}): Promise<ClipReader> {
  const worker = new Worker(new URL('./decode-worker.ts', import.meta.url), { type: 'module', name: 'plummet-decode' });
  const listeners = new Set<Listener>();
  let stopped: VideoClipError | null = null;
  const stop = (why: VideoClipError) => {
    if (stopped) return;
    stopped = why;
    worker.terminate();
    for (const listener of [...listeners]) listener({ type: 'error', id: null, error: clipErrorWire(why) });
  };
  worker.onmessage = (event: MessageEvent<FromWorker>) => {
    for (const listener of [...listeners]) listener(event.data);
  };
  worker.onerror = (event) => {
    event.preventDefault();
    stop(
      new VideoClipError({
        code: 'decode-failed',
        field: 'clip',
        value: event.message || 'worker error',
        allowed: null,
        message: `The clip reader stopped (${event.message || 'worker error'}). Reload the app and try again.`,
      }),
    );
  };
  const send = (message: ToWorker) => worker.postMessage(message);
  const onAbort = (signal: AbortSignal | undefined) => {
    if (!signal) return () => undefined;
    const abort = () => stop(cancelled());
    if (signal.aborted) abort();
    signal.addEventListener('abort', abort, { once: true });
    return () => signal.removeEventListener('abort', abort);
  };

  /** Runs one request: resolves with what `settle` returns for the first message it accepts. */
  function request<T>(signal: AbortSignal | undefined, message: ToWorker, settle: (m: FromWorker) => T | undefined, id: number | null): Promise<T> {
    return new Promise<T>((resolve, reject) => {
      if (stopped) {
        reject(stopped);
        return;
      }
      const detach = onAbort(signal);
      const listener: Listener = (m) => {
        if (m.type === 'error' && (m.id === id || m.id === null)) {
          listeners.delete(listener);
          detach();
          reject(VideoClipError.fromWire(m.error));
          return;
        }
        const result = settle(m);
        if (result !== undefined) {
          listeners.delete(listener);
          detach();
          resolve(result);
        }
      };
      listeners.add(listener);
      if (!stopped) send(message);
    });
  }

  let nextId = 1;
  const opened = await request(options.signal, { type: 'open', file, name: (file as File).name ?? '' }, (m) => (m.type === 'opened' ? m : undefined), null).catch(
    (error: unknown) => {
      worker.terminate();
      throw error;
    },
  );
  const { probe, rotation } = opened;

  return {
    probe,
    rotation,
    still(time_s, width_px, o = {}) {
      const id = nextId++;
      return request(o.signal, { type: 'still', id, time_s, width_px }, (m) => (m.type === 'still' && m.id === id ? m.bitmap : undefined), id);
    },
    async greyBand(band, o = {}) {
      const id = nextId++;
      const asked = bandWithinBudget(clampBand(band, probe.width_px, probe.height_px), probe.frame_count, GREY_BUDGET_BYTES);
      const { width, height, step_px } = asked;
      const times_s: number[] = [];
      const frames: Uint8Array[] = [];
      await request(
        o.signal,
        { type: 'band', id, band: asked },
        (m) => {
          if (m.type === 'frames' && m.id === id) {
            times_s.push(...m.times_s);
            for (const buffer of m.frames) frames.push(new Uint8Array(buffer));
          } else if (m.type === 'progress' && m.id === id) {
            o.onProgress?.({ frames_done: m.frames_done, frames_total: m.frames_total });
          } else if (m.type === 'band-done' && m.id === id) {
            return true;
          }
          return undefined;
        },
        id,
      );
      return { width, height, x0_px: asked.x0_px, y0_px: asked.y0_px, step_px, times_s, frames };
    },
    close() {
      stop(cancelled());
    },
  };
}
