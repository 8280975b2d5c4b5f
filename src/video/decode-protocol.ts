import type { ClipProbe } from '../motion';
import type { BandRequest, ClipRotation } from './grey-band';
import type { ClipErrorWire } from './video-clip-error';

/** The messages between the page (clip-reader.ts) and the decoding worker (decode-worker.ts). */
export type ToWorker =
  | { type: 'open'; file: Blob; name: string }
  | { type: 'still'; id: number; time_s: number; width_px: number }
  | { type: 'band'; id: number; band: BandRequest };

export type FromWorker =
  | { type: 'opened'; probe: ClipProbe; rotation: ClipRotation }
  | { type: 'still'; id: number; bitmap: ImageBitmap; time_s: number }
  | { type: 'progress'; id: number; frames_done: number; frames_total: number }
  /** A batch of grey frames, in presentation order; their buffers are transferred. */
  | { type: 'frames'; id: number; times_s: number[]; frames: ArrayBuffer[] }
  | { type: 'band-done'; id: number; band: BandRequest; width: number; height: number }
  | { type: 'error'; id: number | null; error: ClipErrorWire };
