import { formatValue, PlummetError, type PlummetErrorOptions } from '../errors';

/**
 * Stable codes for a clip the phone cannot time, each refused before anything is stored (and, but for
 * `decode-failed` and `decode-cancelled`, before the frames are decoded):
 * - `not-a-video`: no container we read (MP4, MOV, WebM, Matroska) or no video track in it;
 * - `codec-unsupported`: this browser's decoder refuses the track's codec (HEVC on most browsers);
 * - `clip-too-large`, `clip-too-long`, `too-many-frames`: past the limits of clip-limits.ts;
 * - `frame-timing-uneven`: frame intervals spread past FRAME_INTERVAL_SPREAD_LIMIT;
 * - `no-decoder`: the browser has no WebCodecs VideoDecoder at all;
 * - `decode-failed`: the decoder gave up part way (a damaged file);
 * - `decode-cancelled`: the crew cancelled.
 */
export type VideoClipErrorCode =
  | 'not-a-video'
  | 'codec-unsupported'
  | 'clip-too-large'
  | 'clip-too-long'
  | 'too-many-frames'
  | 'frame-timing-uneven'
  | 'no-decoder'
  | 'decode-failed'
  | 'decode-cancelled';

export class VideoClipError extends PlummetError<VideoClipErrorCode> {
  constructor(options: PlummetErrorOptions<VideoClipErrorCode>) {
    super(options);
    this.name = 'VideoClipError';
  }

  /** The error again on the page's side of the worker boundary (the worker posts `clipErrorWire(error)`). */
  static fromWire(wire: ClipErrorWire): VideoClipError {
    return new VideoClipError({
      code: wire.code as VideoClipErrorCode,
      field: wire.field,
      value: wire.value,
      allowed: wire.allowed,
      message: wire.message,
    });
  }
}

/** An error as it crosses the worker boundary: its value kept when it is a plain number or text. */
export interface ClipErrorWire {
  code: string;
  field: string | null;
  value: string | number | boolean | null;
  allowed: string | null;
  message: string;
}

export function clipErrorWire(error: PlummetError): ClipErrorWire {
  const v = error.value;
  const value = v === null || typeof v === 'string' || typeof v === 'number' || typeof v === 'boolean' ? v : formatValue(v);
  return { code: error.code, field: error.field, value, allowed: error.allowed, message: error.message };
}
