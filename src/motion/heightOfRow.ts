/**
 * From a row of the frame to a height above the landing surface, fixed by the scale marks the crew tapped.
 *
 * Two marks: a straight line h = a·y + b (a camera square to the wall, or marks close together).
 * Three marks: the 1-D projective map h = (a·y + b)/(c·y + 1). Why: the fall is a straight line in space; a pinhole
 * camera maps the points of any straight line to the image by a projective map of the line (a ratio of two linear
 * functions of the position, with three free constants), so heights and rows are related by one exactly when the
 * camera is tilted — rows are squeezed towards the far end — and three points fix its three constants. The straight
 * line is the special case c = 0. Lens distortion is not modelled (phones correct most of it in the picture).
 *
 * Rows are centred and scaled inside, so the 3 × 3 solve is well conditioned whatever the frame size.
 */
import type { ScaleMark } from './types';
import { MotionError } from './motionError';

export interface HeightMap {
  /** Height above the landing surface at a row (at the fall line), m. */
  heightOf(y_px: number): number;
  /** dh/dy at a row, m per pixel (negative: rows grow downward). */
  slopeAt(y_px: number): number;
  kind: 'linear' | 'projective';
}

/** The map from rows to heights given by 2 or 3 scale marks. Throws MotionError 'bad-scale'. */
export function heightMapOf(scale: readonly ScaleMark[]): HeightMap {
  if (scale.length !== 2 && scale.length !== 3) {
    throw new MotionError({ code: 'bad-scale', field: 'setup.scale', value: scale.length, allowed: '2 or 3 marks of known height', reason: 'heights need 2 or 3 scale marks' });
  }
  scale.forEach((m, i) => {
    if (!Number.isFinite(m.y_px) || !Number.isFinite(m.height_m)) {
      throw new MotionError({ code: 'bad-scale', field: `setup.scale[${i}]`, value: m, allowed: 'a finite row and height', reason: 'not a number' });
    }
  });
  for (let i = 0; i < scale.length; i++) {
    for (let j = i + 1; j < scale.length; j++) {
      if (Math.abs(scale[i]!.y_px - scale[j]!.y_px) < 2 || Math.abs(scale[i]!.height_m - scale[j]!.height_m) < 1e-3) {
        throw new MotionError({
          code: 'bad-scale',
          field: `setup.scale[${j}]`,
          value: scale[j],
          allowed: 'marks at least 2 px and 1 mm apart from each other',
          reason: `too close to mark ${i + 1}`,
        });
      }
    }
  }
  const ys = scale.map((m) => m.y_px);
  const centre = ys.reduce((s, y) => s + y, 0) / ys.length;
  const spread = Math.max(...ys) - Math.min(...ys);
  const n = (y: number) => (y - centre) / spread;
  let a: number;
  let b: number;
  let c = 0;
  if (scale.length === 2) {
    const [p, q] = scale as [ScaleMark, ScaleMark];
    a = (q.height_m - p.height_m) / (n(q.y_px) - n(p.y_px));
    b = p.height_m - a * n(p.y_px);
  } else {
    // a·y + b − c·y·h = h at each mark.
    const rows = scale.map((m) => [n(m.y_px), 1, -n(m.y_px) * m.height_m, m.height_m]);
    const sol = solve3(rows);
    if (!sol) throw new MotionError({ code: 'bad-scale', field: 'setup.scale', value: scale, allowed: 'three marks not in one degenerate place', reason: 'the marks give no map' });
    [a, b, c] = sol;
  }
  // Heights must change one way across the marks and a margin beyond them: the denominator must not reach zero.
  const lo = n(Math.min(...ys)) - 1.5;
  const hi = n(Math.max(...ys)) + 1.5;
  // A Möbius map through the marks is monotonic wherever it has no pole, so marks out of the order of their
  // heights show up as a pole between them.
  if ((c * lo + 1) <= 0 || (c * hi + 1) <= 0 || a - b * c === 0) {
    throw new MotionError({
      code: 'bad-scale',
      field: 'setup.scale',
      value: scale.map((m) => `${m.height_m} m at row ${m.y_px}`).join(', '),
      allowed: 'heights that change one way down the frame',
      reason: 'the marks are not in the order of their heights',
    });
  }
  const heightOf = (y: number) => {
    const u = n(y);
    return (a * u + b) / (c * u + 1);
  };
  // d/du (a u + b)/(c u + 1) = (a − b c)/(c u + 1)².
  const slopeAt = (y: number) => {
    const d = c * n(y) + 1;
    return (a - b * c) / (d * d) / spread;
  };
  return { heightOf, slopeAt, kind: scale.length === 3 ? 'projective' : 'linear' };
}

/** Height above the landing surface at a row, from 2 or 3 scale marks. */
export function heightOfRow(scale: readonly ScaleMark[], y_px: number): number {
  return heightMapOf(scale).heightOf(y_px);
}

/** Gaussian elimination with partial pivoting on a 3 × 4 augmented matrix; null when singular. */
function solve3(m: number[][]): [number, number, number] | null {
  const a = m.map((r) => [...r]);
  for (let col = 0; col < 3; col++) {
    let p = col;
    for (let r = col + 1; r < 3; r++) if (Math.abs(a[r]![col]!) > Math.abs(a[p]![col]!)) p = r;
    if (Math.abs(a[p]![col]!) < 1e-12) return null;
    [a[col], a[p]] = [a[p]!, a[col]!];
    for (let r = 0; r < 3; r++) {
      if (r === col) continue;
      const f = a[r]![col]! / a[col]![col]!;
      for (let k = col; k < 4; k++) a[r]![k] = a[r]![k]! - f * a[col]![k]!;
    }
  }
  return [a[0]![3]! / a[0]![0]!, a[1]![3]! / a[1]![1]!, a[2]![3]! / a[2]![2]!];
}
