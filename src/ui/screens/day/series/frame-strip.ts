// Drawing grey band frames for the strip around the found instants and for the key frames a drop keeps.
import type { GreyClip } from '../../../../motion';

/** The square of the band shown around the body in one strip frame (band pixels a side). */
export const STRIP_SIDE_PX = 48;

/** The band's top-left corner of a STRIP_SIDE_PX square around a full-frame point, kept inside the band. */
export interface StripWindow {
  left: number;
  top: number;
}

export function stripWindow(clip: Pick<GreyClip, 'width' | 'height' | 'x0_px' | 'y0_px' | 'step_px'>, x_px: number, y_px: number): StripWindow {
  const half = STRIP_SIDE_PX >> 1;
  const u = Math.round((x_px - clip.x0_px) / clip.step_px);
  const v = Math.round((y_px - clip.y0_px) / clip.step_px);
  return {
    left: Math.max(0, Math.min(clip.width - STRIP_SIDE_PX, u - half)),
    top: Math.max(0, Math.min(clip.height - STRIP_SIDE_PX, v - half)),
  };
}

/** Paints a STRIP_SIDE_PX square of one grey frame (smaller where the band is) onto a canvas. */
export function paintGrey(canvas: HTMLCanvasElement, clip: Pick<GreyClip, 'width' | 'height' | 'frames'>, frame: number, at: StripWindow): void {
  const w = Math.min(STRIP_SIDE_PX, clip.width - at.left);
  const h = Math.min(STRIP_SIDE_PX, clip.height - at.top);
  canvas.width = w;
  canvas.height = h;
  const ctx = canvas.getContext('2d');
  if (!ctx) return;
  const image = ctx.createImageData(w, h);
  const grey = clip.frames[frame]!;
  for (let y = 0; y < h; y++) {
    for (let x = 0; x < w; x++) {
      const g = grey[(at.top + y) * clip.width + at.left + x]!;
      const i = (y * w + x) * 4;
      image.data[i] = g;
      image.data[i + 1] = g;
      image.data[i + 2] = g;
      image.data[i + 3] = 255;
    }
  }
  ctx.putImageData(image, 0, 0);
}

/** The log's limit on one key frame's data URL, with room to spare. */
const KEY_FRAME_MAX_CHARS = 15_000;

/**
 * A small grey JPEG of part of one frame, as a data URL for the drop's evidence. JPEG, not PNG: a textured,
 * noisy background does not compress losslessly (a 96 × 48 PNG of it is about 18 KB as base64).
 */
export function keyFrameImage(clip: GreyClip, frame: number, at: StripWindow): string {
  const canvas = document.createElement('canvas');
  paintGrey(canvas, clip, frame, at);
  for (const quality of [0.8, 0.6, 0.4, 0.2]) {
    const url = canvas.toDataURL('image/jpeg', quality);
    if (url.length <= KEY_FRAME_MAX_CHARS) return url;
  }
  return canvas.toDataURL('image/jpeg', 0.1);
}
