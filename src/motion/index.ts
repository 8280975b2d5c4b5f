/** Finding a falling body in a clip's frames (pure: no DOM, no clock, no packages). See types.ts. */
export type {
  ClipProbe,
  PixelSegment,
  ScaleMark,
  ClipSetup,
  GreyClip,
  TrackPoint,
  FoundInstant,
  ClipBudgetRow,
  ClipDrop,
  ClipEvidence,
} from './types';
export { MotionError, type MotionErrorCode, type MotionErrorDetails } from './motionError';
export { clipBand, BAND_MAX_WIDTH, BAND_MAX_HEIGHT, type ClipBand } from './clipBand';
export { heightMapOf, heightOfRow, type HeightMap } from './heightOfRow';
export { findFall, type FallFinding } from './findFall';
export type { ReleaseFit, ImpactFit } from './trajectoryFit';
export { moveInstant } from './moveInstant';
export { clipDrop, type ClipDropOptions } from './clipDrop';
export { clipEvidence, keyFrameIndices, EVIDENCE_MAX_FRAMES, EVIDENCE_MAX_KEY_FRAMES, EVIDENCE_MAX_KEY_FRAME_BYTES } from './clipEvidence';
