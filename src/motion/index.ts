/** Finding a falling body in a clip's frames (pure: no DOM, no clock, no packages). See types.ts. */
export type { ClipProbe, PixelSegment, ScaleMark, ClipSetup, GreyClip, TrackPoint, FoundInstant, ClipBudgetRow, ClipDrop } from './types';
