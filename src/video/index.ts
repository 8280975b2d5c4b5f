/**
 * Reading a clip on the phone: the container, every frame decoded in a worker with its own timestamp, handed to
 * motion/ as small grey frames. `openClip` starts the worker: import this folder lazily (a dynamic import), so
 * neither the worker nor the demuxer is in the first screen.
 */
export type { ClipProbe, GreyClip } from '../motion';
export { openClip, GREY_BUDGET_BYTES, type ClipReader, type BandProgress } from './clip-reader';
export { VideoClipError, clipErrorWire, type VideoClipErrorCode, type ClipErrorWire } from './video-clip-error';
export {
  MAX_CLIP_BYTES,
  MAX_CLIP_DURATION_S,
  MAX_CLIP_FRAMES,
  FRAME_INTERVAL_SPREAD_LIMIT,
  checkClipProbe,
  checkClipSize,
  codecFamily,
  codecRefusal,
  frameIntervals,
} from './clip-limits';
export { clampBand, bandWithinBudget, codedPixel, codedRectOf, greyBandFromPlane, lumaOfRgb, type BandRequest, type ClipRotation, type CodedRect } from './grey-band';
