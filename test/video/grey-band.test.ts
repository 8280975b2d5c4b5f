// The grey band: the displayed frame's rectangle averaged over step × step pixels, whatever the rotation the
// container asks for. Checked against an independent route: turn the whole coded picture upright first (an
// explicit rotation of the array), then crop and average.
import { describe, expect, it } from 'vitest';
import { bandWithinBudget, clampBand, codedRectOf, greyBandFromPlane, lumaOfRgb, type BandRequest, type ClipRotation } from '../../src/video';

/** A coded picture whose every pixel is distinct enough to catch a mix-up (values 0..255). */
function picture(w: number, h: number): Uint8Array {
  const p = new Uint8Array(w * h);
  for (let y = 0; y < h; y++) for (let x = 0; x < w; x++) p[y * w + x] = (x * 7 + y * 31 + ((x * y) % 5)) % 256;
  return p;
}

/** The coded picture turned clockwise by `rotation`, as a display would show it. */
function upright(p: Uint8Array, w: number, h: number, rotation: ClipRotation): { pixels: Uint8Array; width: number; height: number } {
  let pixels = p;
  let width = w;
  let height = h;
  for (let turn = 0; turn < rotation / 90; turn++) {
    const next = new Uint8Array(width * height);
    // One clockwise quarter turn: source (x, y) goes to (height-1-y, x) of a picture height wide.
    for (let y = 0; y < height; y++) for (let x = 0; x < width; x++) next[x * height + (height - 1 - y)] = pixels[y * width + x]!;
    pixels = next;
    [width, height] = [height, width];
  }
  return { pixels, width, height };
}

function expectedBand(display: { pixels: Uint8Array; width: number }, band: BandRequest): number[] {
  const { width, height } = band;
  const out: number[] = [];
  for (let v = 0; v < height; v++) {
    for (let u = 0; u < width; u++) {
      let sum = 0;
      for (let j = 0; j < band.step_px; j++) for (let i = 0; i < band.step_px; i++) sum += display.pixels[(band.y0_px + v * band.step_px + j) * display.width + band.x0_px + u * band.step_px + i]!;
      out.push(Math.trunc((sum + ((band.step_px * band.step_px) >> 1)) / (band.step_px * band.step_px)));
    }
  }
  return out;
}

describe('the grey band of a frame', () => {
  const W = 24;
  const H = 16;
  const coded = picture(W, H);

  for (const rotation of [0, 90, 180, 270] as ClipRotation[]) {
    it(`matches an explicit turn of the picture, then a crop and an average, at ${rotation}°`, () => {
      const display = upright(coded, W, H, rotation);
      for (const step of [1, 2, 3]) {
        const band: BandRequest = { x0_px: 3, y0_px: 1, width: Math.floor((display.width - 5) / step), height: Math.floor((display.height - 4) / step), step_px: step };
        const rect = codedRectOf(band, rotation, W, H);
        // Only the copy rectangle is handed over, as VideoFrame.copyTo gives it (even corners).
        expect(rect.x % 2).toBe(0);
        expect(rect.y % 2).toBe(0);
        const copy = new Uint8Array(rect.width * rect.height);
        for (let y = 0; y < rect.height; y++) for (let x = 0; x < rect.width; x++) copy[y * rect.width + x] = coded[(rect.y + y) * W + rect.x + x]!;
        const out = new Uint8Array(band.width * band.height);
        greyBandFromPlane(copy, { offset: 0, stride: rect.width, pixelBytes: 1 }, rect, band, rotation, W, H, out);
        expect([...out]).toEqual(expectedBand(display, band));
      }
    });
  }

  it('reads the high bits of a 10-bit plane', () => {
    const plane = new Uint8Array(4 * 2 * 2);
    const view = new DataView(plane.buffer);
    // 10-bit samples 0, 400, 800, 1020 in row 0; 4 × 4 = 16 … in row 1.
    [0, 400, 800, 1020, 16, 16, 16, 16].forEach((s, i) => view.setUint16(i * 2, s, true));
    const out = new Uint8Array(4);
    const band = { x0_px: 0, y0_px: 0, width: 4, height: 1, step_px: 1 };
    greyBandFromPlane(plane, { offset: 0, stride: 8, pixelBytes: 2, bitDepth: 10 }, { x: 0, y: 0, width: 4, height: 2 }, band, 90, 2, 4, out);
    // At 90° display row 0 is coded column 0 read upward: coded (0,1) then (0,0)… of a 2 × 4 coded picture.
    expect(out.length).toBe(4);
    const direct = new Uint8Array(4);
    greyBandFromPlane(plane, { offset: 0, stride: 8, pixelBytes: 2, bitDepth: 10 }, { x: 0, y: 0, width: 4, height: 2 }, band, 0, 4, 2, direct);
    expect([...direct]).toEqual([0, 100, 200, 255]);
  });

  it('takes luma from RGB with the BT.601 weights (0.299, 0.587, 0.114)', () => {
    const rgba = new Uint8Array([255, 0, 0, 255, 0, 255, 0, 255, 0, 0, 255, 255, 200, 200, 200, 255]);
    expect([...lumaOfRgb(rgba, 4, 1, 16, false)]).toEqual([76, 150, 29, 200]);
    const bgra = new Uint8Array([0, 0, 255, 255]);
    expect([...lumaOfRgb(bgra, 1, 1, 4, true)]).toEqual([76]);
  });

  it('keeps a band on the frame and on whole pixels', () => {
    expect(clampBand({ x0_px: -5.4, y0_px: 700.2, width: 50, height: 20.7, step_px: 2.4 }, 64, 720)).toEqual({ x0_px: 0, y0_px: 700, width: 32, height: 10, step_px: 2 });
  });

  it('widens the step until every frame of the clip fits the budget', () => {
    const band = { x0_px: 0, y0_px: 0, width: 200, height: 720, step_px: 1 };
    // 4800 frames (20 s at 240 frames/s) of 200 × 720 would be 691 MB.
    const fitted = bandWithinBudget(band, 4800, 96e6);
    expect(fitted.width * fitted.height * 4800).toBeLessThanOrEqual(96e6);
    const finer = fitted.step_px - 1;
    expect(Math.floor(200 / finer) * Math.floor(720 / finer) * 4800).toBeGreaterThan(96e6);
    expect(fitted.width * fitted.step_px).toBeLessThanOrEqual(200);
    expect(bandWithinBudget({ ...band, width: 48, height: 200, step_px: 2 }, 720, 96e6)).toEqual({ ...band, width: 48, height: 200, step_px: 2 });
  });
});
