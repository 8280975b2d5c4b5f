// The detector of motion/, loaded with the video panel's first run. Typed here by what the panel uses, so the
// panel and motion/ can grow apart from each other without the panel reaching past motion's public face.
import type { ClipProbe, ClipSetup, FoundInstant, GreyClip, TrackPoint } from '../../../../motion';

export interface MotionFinding {
  track: TrackPoint[];
  release: FoundInstant;
  impact: FoundInstant;
}

export interface MotionFinder {
  clipBand(setup: ClipSetup, probe: Pick<ClipProbe, 'width_px' | 'height_px'>): { x0_px: number; y0_px: number; width: number; height: number; step_px: number };
  findFall(clip: GreyClip, setup: ClipSetup): MotionFinding;
}

export async function loadMotionFinder(): Promise<MotionFinder> {
  const motion = (await import('../../../../motion')) as unknown as Partial<MotionFinder>;
  // A caller's bug, not the crew's input: this build has no detector.
  if (typeof motion.clipBand !== 'function' || typeof motion.findFall !== 'function') throw new Error('this build has no clip detector (motion/ findFall)');
  return motion as MotionFinder;
}
