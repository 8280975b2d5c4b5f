// Rows to heights against a pinhole camera's own geometry: y(h) = c_y − f·tan(atan((h − h_c)/D) − θ), the exact
// perspective of a tilted camera looking at a vertical line (any optics text's pinhole model, (from memory)).
import { describe, expect, it } from 'vitest';
import { heightMapOf, heightOfRow, MotionError, type ScaleMark } from '../../src/motion';

function pinhole(tilt_deg: number) {
  const theta = (tilt_deg * Math.PI) / 180;
  const D = 3;
  const hc = 1.1;
  const f = 900;
  const cy = 360;
  const rowOf = (h: number) => cy - f * Math.tan(Math.atan((h - hc) / D) - theta);
  return { rowOf, mark: (h: number): ScaleMark => ({ x_px: 200, y_px: rowOf(h), height_m: h }) };
}

describe('heightOfRow', () => {
  it('recovers every height of a tilted camera exactly from three marks (the projective map is the pinhole geometry)', () => {
    for (const tilt of [-12, -3, 0, 5, 15]) {
      const cam = pinhole(tilt);
      const map = heightMapOf([cam.mark(0.2), cam.mark(1.0), cam.mark(1.9)]);
      expect(map.kind).toBe('projective');
      for (let h = -0.1; h <= 2.2; h += 0.05) expect(map.heightOf(cam.rowOf(h)), `tilt ${tilt}°, h ${h}`).toBeCloseTo(h, 9);
    }
  });

  it('is exact with two marks only for a camera square to the fall, and off by millimetres to centimetres when tilted', () => {
    const square = pinhole(0);
    // Square on: still a tangent map, nearly linear near the axis; two marks are exact at the marks.
    const lin = heightMapOf([square.mark(0.2), square.mark(1.9)]);
    expect(lin.kind).toBe('linear');
    expect(lin.heightOf(square.rowOf(0.2))).toBeCloseTo(0.2, 12);
    const tilted = pinhole(15);
    const two = heightMapOf([tilted.mark(0.2), tilted.mark(1.9)]);
    const three = heightMapOf([tilted.mark(0.2), tilted.mark(1.0), tilted.mark(1.9)]);
    const mid = tilted.rowOf(0.6);
    expect(Math.abs(two.heightOf(mid) - 0.6)).toBeGreaterThan(0.005);
    expect(Math.abs(three.heightOf(mid) - 0.6)).toBeLessThan(1e-9);
  });

  it("gives the map's slope (m per px) as its derivative", () => {
    const cam = pinhole(8);
    const map = heightMapOf([cam.mark(0.2), cam.mark(1.0), cam.mark(1.9)]);
    const y = cam.rowOf(0.7);
    expect(map.slopeAt(y)).toBeCloseTo((map.heightOf(y + 1e-3) - map.heightOf(y - 1e-3)) / 2e-3, 8);
    expect(map.slopeAt(y)).toBeLessThan(0);
    expect(heightOfRow([cam.mark(0.2), cam.mark(1.9)], cam.rowOf(0.2))).toBeCloseTo(0.2, 12);
  });

  it('refuses one mark, four marks, two marks on one row, and marks out of the order of their heights', () => {
    const cam = pinhole(0);
    const code = (marks: ScaleMark[]) => {
      try {
        heightMapOf(marks);
        return 'none';
      } catch (e) {
        expect(e).toBeInstanceOf(MotionError);
        return `${(e as MotionError).code} ${(e as MotionError).field}`;
      }
    };
    expect(code([cam.mark(1)])).toBe('bad-scale setup.scale');
    expect(code([cam.mark(0.1), cam.mark(0.5), cam.mark(1), cam.mark(1.5)])).toBe('bad-scale setup.scale');
    expect(code([cam.mark(0.5), { ...cam.mark(1), y_px: cam.rowOf(0.5) + 1 }])).toBe('bad-scale setup.scale[1]');
    expect(code([cam.mark(0.2), { ...cam.mark(1.0), height_m: 2.5 }, cam.mark(1.9)])).toBe('bad-scale setup.scale');
  });
});
