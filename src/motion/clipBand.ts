/**
 * The band of each frame the decoder hands to motion/: a strip around the fall line, from above the release
 * point to below the landing line, downscaled by a whole step and grey, so memory stays bounded whatever the
 * clip's size: at most BAND_MAX_WIDTH × BAND_MAX_HEIGHT = 96 × 400 bytes a frame (38.4 kB; 720 frames of a
 * 3 s clip at 240 frames/s: 27.6 MB).
 *
 * The band is the fall line's columns plus a margin each side of max(24 px, 8 % of the frame's height) — room for
 * the body's width, a leaning fall and the side strips the detector uses to measure the camera's shake — and its
 * rows from the fall line's top (less the same margin) to the landing line plus the margin.
 */
import type { ClipProbe, ClipSetup } from './types';
import { MotionError } from './motionError';

export const BAND_MAX_WIDTH = 96;
export const BAND_MAX_HEIGHT = 400;

export interface ClipBand {
  x0_px: number;
  y0_px: number;
  /** Band pixels (each one step × step block of the full frame). */
  width: number;
  height: number;
  step_px: number;
}

export function clipBand(setup: ClipSetup, probe: Pick<ClipProbe, 'width_px' | 'height_px'>): ClipBand {
  const { fall_line: line, landing_y_px } = setup;
  const W = probe.width_px;
  const H = probe.height_px;
  for (const [field, v, max] of [
    ['setup.fall_line.x0_px', line.x0_px, W],
    ['setup.fall_line.x1_px', line.x1_px, W],
    ['setup.fall_line.y0_px', line.y0_px, H],
    ['setup.fall_line.y1_px', line.y1_px, H],
    ['setup.landing_y_px', landing_y_px, H],
  ] as const) {
    if (!(v >= 0 && v <= max)) {
      throw new MotionError({ code: 'bad-setup', field, value: v, allowed: `0 to ${max} px (inside the ${W} × ${H} frame)`, reason: 'outside the frame' });
    }
  }
  const top = Math.min(line.y0_px, line.y1_px);
  if (!(landing_y_px - top >= 16)) {
    throw new MotionError({ code: 'bad-setup', field: 'setup.landing_y_px', value: landing_y_px, allowed: `at least 16 px below the fall line's top (row ${top})`, reason: 'the landing line is not below the fall line' });
  }
  const margin = Math.max(24, 0.08 * H);
  const xLo = Math.max(0, Math.floor(Math.min(line.x0_px, line.x1_px) - margin));
  const xHi = Math.min(W, Math.ceil(Math.max(line.x0_px, line.x1_px) + margin));
  const yLo = Math.max(0, Math.floor(top - margin));
  const yHi = Math.min(H, Math.ceil(landing_y_px + margin));
  const step = Math.max(1, Math.ceil((xHi - xLo) / BAND_MAX_WIDTH), Math.ceil((yHi - yLo) / BAND_MAX_HEIGHT));
  const width = Math.min(BAND_MAX_WIDTH, Math.floor((xHi - xLo) / step));
  const height = Math.min(BAND_MAX_HEIGHT, Math.floor((yHi - yLo) / step));
  // Centre the whole-step band on the wanted span.
  const x0 = Math.max(0, Math.min(W - width * step, Math.round((xLo + xHi - width * step) / 2)));
  const y0 = Math.max(0, Math.min(H - height * step, Math.round((yLo + yHi - height * step) / 2)));
  return { x0_px: x0, y0_px: y0, width, height, step_px: step };
}
