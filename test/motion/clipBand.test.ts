// The band handed to motion/ stays within 96 × 400 bytes a frame for any clip size, and holds the fall line and
// the landing line with a margin.
import { describe, expect, it } from 'vitest';
import { BAND_MAX_HEIGHT, BAND_MAX_WIDTH, clipBand, MotionError, type ClipSetup } from '../../src/motion';

const setup = (W: number, H: number): ClipSetup => ({
  fall_line: { x0_px: 0.5 * W, y0_px: 0.1 * H, x1_px: 0.52 * W, y1_px: 0.85 * H },
  landing_y_px: 0.85 * H,
  scale: [],
  release_height_m: 1,
});

describe('clipBand', () => {
  for (const [W, H] of [[1280, 720], [720, 1280], [1920, 1080], [3840, 2160], [320, 240]] as const) {
    it(`keeps a ${W} × ${H} clip's band within ${BAND_MAX_WIDTH} × ${BAND_MAX_HEIGHT} and around the fall`, () => {
      const s = setup(W, H);
      const b = clipBand(s, { width_px: W, height_px: H });
      expect(b.width).toBeLessThanOrEqual(BAND_MAX_WIDTH);
      expect(b.height).toBeLessThanOrEqual(BAND_MAX_HEIGHT);
      expect(b.width * b.height).toBeLessThanOrEqual(96 * 400);
      expect(b.x0_px).toBeGreaterThanOrEqual(0);
      expect(b.y0_px).toBeGreaterThanOrEqual(0);
      expect(b.x0_px + b.width * b.step_px).toBeLessThanOrEqual(W);
      expect(b.y0_px + b.height * b.step_px).toBeLessThanOrEqual(H);
      const right = b.x0_px + b.width * b.step_px;
      const bottom = b.y0_px + b.height * b.step_px;
      expect(b.x0_px).toBeLessThan(s.fall_line.x0_px - 20);
      expect(right).toBeGreaterThan(s.fall_line.x1_px + 20);
      expect(b.y0_px).toBeLessThanOrEqual(s.fall_line.y0_px);
      expect(bottom).toBeGreaterThan(s.landing_y_px + 10);
    });
  }

  it('refuses a fall line outside the frame and a landing line above the fall', () => {
    expect(() => clipBand({ ...setup(640, 480), landing_y_px: 900 }, { width_px: 640, height_px: 480 })).toThrow(MotionError);
    expect(() => clipBand({ ...setup(640, 480), landing_y_px: 40 }, { width_px: 640, height_px: 480 })).toThrow(expect.objectContaining({ code: 'bad-setup', field: 'setup.landing_y_px' }));
  });
});
