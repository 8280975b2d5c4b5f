/**
 * The grey band the decoder hands to motion/: a rectangle of the displayed frame around the fall line, averaged
 * over step × step pixels, one byte per pixel. Pure arithmetic on planes of bytes, so it is tested in Node; the
 * worker (decode-worker.ts) feeds it the luma plane of each decoded frame. Luma is the grey picture: the Y plane
 * of every YUV format a decoder outputs (I420, NV12, I422, I444, I420A), computed for the RGB ones.
 */

/**
 * The rectangle of the displayed frame to hand over: `width` × `height` grey pixels, each the average of a
 * step × step block, the first block's corner at full-frame display pixel (x0_px, y0_px). The same shape as
 * motion's `clipBand` and as a GreyClip's geometry.
 */
export interface BandRequest {
  x0_px: number;
  y0_px: number;
  width: number;
  height: number;
  step_px: number;
}

/** The clockwise rotation the container asks for on display (phones filming upright write 90). */
export type ClipRotation = 0 | 90 | 180 | 270;

/** A rectangle of the coded (stored) frame, in coded pixels. */
export interface CodedRect {
  x: number;
  y: number;
  width: number;
  height: number;
}

/** The band on whole pixels and inside the displayed frame (fewer grey pixels where it would run off). */
export function clampBand(band: BandRequest, displayWidth: number, displayHeight: number): BandRequest {
  const step_px = Math.max(1, Math.round(band.step_px));
  const x0_px = clamp(Math.round(band.x0_px), 0, displayWidth);
  const y0_px = clamp(Math.round(band.y0_px), 0, displayHeight);
  const width = clamp(Math.floor(band.width), 0, Math.floor((displayWidth - x0_px) / step_px));
  const height = clamp(Math.floor(band.height), 0, Math.floor((displayHeight - y0_px) / step_px));
  return { x0_px, y0_px, width, height, step_px };
}

/**
 * The band over the same span of the frame with a step wide enough that every frame's band together stays within
 * `budgetBytes`: a clip of 4800 frames and a band of 200 × 720 pixels would otherwise hold 690 MB on the phone.
 */
export function bandWithinBudget(band: BandRequest, frameCount: number, budgetBytes: number): BandRequest {
  const spanX = band.width * band.step_px;
  const spanY = band.height * band.step_px;
  let step = Math.max(1, Math.round(band.step_px));
  for (;;) {
    const width = Math.floor(spanX / step);
    const height = Math.floor(spanY / step);
    if (width * height * frameCount <= budgetBytes || (width <= 1 && height <= 1)) return { ...band, width, height, step_px: step };
    step++;
  }
}

/** Display pixel (dx, dy) → coded pixel, for a coded frame of codedWidth × codedHeight shown with `rotation`. */
export function codedPixel(dx: number, dy: number, rotation: ClipRotation, codedWidth: number, codedHeight: number): [number, number] {
  switch (rotation) {
    case 0:
      return [dx, dy];
    case 90:
      return [dy, codedHeight - 1 - dx];
    case 180:
      return [codedWidth - 1 - dx, codedHeight - 1 - dy];
    case 270:
      return [codedWidth - 1 - dy, dx];
  }
}

/**
 * The coded rectangle holding the band's display pixels, widened to even corners (WebCodecs refuses a copy
 * rectangle that cuts a 2 × 2 chroma block of a 4:2:0 frame).
 */
export function codedRectOf(band: BandRequest, rotation: ClipRotation, codedWidth: number, codedHeight: number): CodedRect {
  const dx1 = band.x0_px + band.width * band.step_px - 1;
  const dy1 = band.y0_px + band.height * band.step_px - 1;
  const a = codedPixel(band.x0_px, band.y0_px, rotation, codedWidth, codedHeight);
  const b = codedPixel(dx1, dy1, rotation, codedWidth, codedHeight);
  const x0 = Math.min(a[0], b[0]) & ~1;
  const y0 = Math.min(a[1], b[1]) & ~1;
  const x1 = Math.min(codedWidth, (Math.max(a[0], b[0]) + 2) & ~1);
  const y1 = Math.min(codedHeight, (Math.max(a[1], b[1]) + 2) & ~1);
  return { x: x0, y: y0, width: Math.max(0, x1 - x0), height: Math.max(0, y1 - y0) };
}

/**
 * Averages the band out of a plane of bytes holding `rect` of the coded frame (row `stride` bytes apart, the
 * pixel at column c of a row at byte `c * pixelBytes`; for 16-bit planes the high byte is read, little-endian).
 * `out` receives width × height grey bytes, row by row.
 */
export function greyBandFromPlane(
  plane: Uint8Array,
  layout: { offset: number; stride: number; pixelBytes: 1 | 2; bitDepth?: number },
  rect: CodedRect,
  band: BandRequest,
  rotation: ClipRotation,
  codedWidth: number,
  codedHeight: number,
  out: Uint8Array,
): void {
  const { width, height } = band;
  const step = band.step_px;
  const area = step * step;
  const { offset, stride, pixelBytes } = layout;
  // A 10- or 12-bit sample scaled to 8 bits.
  const shift = pixelBytes === 2 ? (layout.bitDepth ?? 10) - 8 : 0;
  if (rotation === 0 && pixelBytes === 1) {
    // The usual case, without the per-pixel mapping: a clip filmed with the phone held as it records.
    const left = band.x0_px - rect.x;
    for (let v = 0; v < height; v++) {
      const top = band.y0_px + v * step - rect.y;
      for (let u = 0; u < width; u++) {
        let sum = 0;
        const col = left + u * step;
        for (let j = 0; j < step; j++) {
          const row = offset + (top + j) * stride + col;
          for (let i = 0; i < step; i++) sum += plane[row + i]!;
        }
        out[v * width + u] = (sum + (area >> 1)) / area;
      }
    }
    return;
  }
  for (let v = 0; v < height; v++) {
    for (let u = 0; u < width; u++) {
      let sum = 0;
      for (let j = 0; j < step; j++) {
        const dy = band.y0_px + v * step + j;
        for (let i = 0; i < step; i++) {
          const [cx, cy] = codedPixel(band.x0_px + u * step + i, dy, rotation, codedWidth, codedHeight);
          const at = offset + (cy - rect.y) * stride + (cx - rect.x) * pixelBytes;
          sum += pixelBytes === 1 ? plane[at]! : (plane[at]! | (plane[at + 1]! << 8)) >> shift;
        }
      }
      out[v * width + u] = Math.min(255, (sum + (area >> 1)) / area);
    }
  }
}

/** Luma of packed RGB pixels (ITU-R BT.601 weights), for decoders that output RGBA/BGRA frames. */
export function lumaOfRgb(pixels: Uint8Array, width: number, height: number, stride: number, blueFirst: boolean): Uint8Array {
  const out = new Uint8Array(width * height);
  const r = blueFirst ? 2 : 0;
  const b = blueFirst ? 0 : 2;
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const at = y * stride + x * 4;
      out[y * width + x] = (299 * pixels[at + r]! + 587 * pixels[at + 1]! + 114 * pixels[at + b]! + 500) / 1000;
    }
  }
  return out;
}

function clamp(x: number, lo: number, hi: number): number {
  return Math.min(hi, Math.max(lo, x));
}
