/**
 * Synthetic frames of a computed fall, for the tests of video timing (pure: no file, no clock; seeded).
 *
 * A ball hangs at rest, is let go at `release_s` (which falls between two frames), falls by the project's own
 * closed-form fall model (src/physics fallModel: quadratic drag, buoyancy, exact) and stops with its bottom on the
 * landing surface (no bounce). The scene around it: a textured, slightly noisy wall, a floor below a dark landing
 * line, tape bands at known heights beside the fall line, an optional shadow of the ball on the wall, optional motion
 * blur (the frame integrates the scene over its exposure, centred on the frame's timestamp), a little camera shake
 * (a sub-pixel translation of the whole picture per frame; frame 0 is not shaken, so the truth's rows are frame 0's)
 * and a camera with a slight tilt.
 *
 * The camera: a pinhole at height `camera_height` in front of the wall of the fall, pitched by `tilt_deg` (positive:
 * looking up). A point at height h on the wall is seen at the angle atan((h − h_c)/D) above the horizon, so its row is
 * y(h) = c_y − f·tan(atan((h − h_c)/D) − θ) = c_y − f·((h − h_c)/D − tan θ)/(1 + (h − h_c)·tan θ/D):
 * a ratio of two linear functions of h (a 1-D projective map), which is what motion/ fits with three scale marks.
 * f and c_y are chosen so the release point and the floor sit inside the frame with a margin.
 */
import { fallDistance, fallParameters, fallTime, type FallParameters } from '../../src/physics';
import type { ClipSetup, GreyClip, ScaleMark } from '../../src/motion';

export interface FallSceneOptions {
  frame_rate_hz: number;
  width_px: number;
  height_px: number;
  /** Length of the clip, s (frames at k / frame_rate_hz, k = 0, 1, …). */
  duration_s: number;
  /** The instant the ball is let go, on the clip's timeline, s. */
  release_s: number;
  /** The ball's bottom above the landing surface at release, m. */
  release_height_m: number;
  ball?: { diameter_m: number; mass_kg: number; drag_coefficient: number };
  air_density_kg_m3?: number;
  gravity_m_s2?: number;
  /** Camera pitch, degrees (positive: looking up); 0 gives an affine height-to-row map. */
  tilt_deg?: number;
  /** Exposure of each frame, s (0: a sharp instant). */
  exposure_s?: number;
  /** Standard deviation of the per-frame camera translation, px (each axis). */
  shake_px?: number;
  /** Standard deviation of the per-pixel noise, grey levels. */
  noise_grey?: number;
  /** Draw the ball's shadow on the wall. */
  shadow?: boolean;
  /** Heights of tape bands beside the fall line, m above the landing surface. */
  scale_heights_m?: number[];
  /** false: the ball hangs still for the whole clip (a clip with nothing falling). */
  falls?: boolean;
  seed?: number;
}

export interface FallSceneTruth {
  release_s: number;
  impact_s: number;
  fall_time_s: number;
  drag_coefficient: number;
  fall: FallParameters;
  /** The ball's centre row in each frame at its timestamp (frame 0's pixel grid, no shake), px. */
  rows_px: number[];
  /** The camera's translation in each frame, px (frame 0: zero). */
  shake_px: { x: number; y: number }[];
  column_px: number;
  radius_px: number;
  landing_y_px: number;
  /** Row of a point of the wall at height h above the landing surface. */
  rowOfHeight(h_m: number): number;
  /** Distance the ball has fallen at a time after release, m. */
  distanceAt(time_from_release_s: number): number;
}

export interface FallScene {
  width: number;
  height: number;
  times_s: number[];
  /** One byte a pixel, row by row. */
  frames: Uint8Array[];
  truth: FallSceneTruth;
  /** What a careful crew taps on a still frame: the fall line, the landing line, the tape bands (if any). */
  setup: ClipSetup;
}

/** A small, fast seeded generator (mulberry32), with a normal draw by Box–Muller. */
export function seededRandom(seed: number): { uniform(): number; normal(): number } {
  let s = seed >>> 0;
  const uniform = () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const normal = () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
  return { uniform, normal };
}

const DEFAULT_BALL = { diameter_m: 0.06, mass_kg: 0.045, drag_coefficient: 0.47 };
const PAD = 8;

export function renderFallScene(o: FallSceneOptions): FallScene {
  const W = o.width_px;
  const H = o.height_px;
  const ball = o.ball ?? DEFAULT_BALL;
  const rho = o.air_density_kg_m3 ?? 1.2;
  const g = o.gravity_m_s2 ?? 9.81;
  const r_m = ball.diameter_m / 2;
  const fall = fallParameters({
    mass_kg: ball.mass_kg,
    area_m2: Math.PI * r_m * r_m,
    volume_m3: (4 / 3) * Math.PI * r_m ** 3,
    drag_coefficient: ball.drag_coefficient,
    density_kg_m3: rho,
    gravity_m_s2: g,
  });
  const fallTime_s = fallTime(o.release_height_m, fall);
  const falls = o.falls ?? true;
  const impact_s = o.release_s + fallTime_s;
  const rng = seededRandom(o.seed ?? 1);

  // The camera: heights from just below the floor to above the ball at release fill 8 %…92 % of the rows.
  const theta = ((o.tilt_deg ?? 0) * Math.PI) / 180;
  const top_m = o.release_height_m + ball.diameter_m + 0.1 * o.release_height_m;
  const bottom_m = -0.08 * o.release_height_m;
  const D = 1.4 * (top_m - bottom_m);
  const hc = (top_m + bottom_m) / 2;
  const unit = (h: number) => Math.tan(Math.atan((h - hc) / D) - theta);
  const f = (0.84 * H) / (unit(top_m) - unit(bottom_m));
  const cy = 0.08 * H + f * unit(top_m);
  const rowOfHeight = (h: number) => cy - f * unit(h);
  const pxPerM = (h: number) => Math.abs(rowOfHeight(h + 1e-4) - rowOfHeight(h - 1e-4)) / 2e-4;
  const column = Math.round(W * 0.5) + 0.3;
  const landing = rowOfHeight(0);

  const centreHeight = (t: number): number => {
    if (!falls || t <= o.release_s) return o.release_height_m + r_m;
    if (t >= impact_s) return r_m;
    return o.release_height_m + r_m - fallDistance(t - o.release_s, fall);
  };

  // The still scene, with a margin for the shake: textured wall, floor, landing line, tape bands.
  const SW = W + 2 * PAD;
  const SH = H + 2 * PAD;
  const still = new Float32Array(SW * SH);
  const grid = 12;
  const gw = Math.ceil(SW / grid) + 2;
  const gh = Math.ceil(SH / grid) + 2;
  const coarse = Float32Array.from({ length: gw * gh }, () => rng.uniform());
  const bands = (o.scale_heights_m ?? []).map((h) => rowOfHeight(h));
  const bandHalf = Math.max(1.5, 0.006 * H);
  for (let y = 0; y < SH; y++) {
    const fy = y - PAD;
    for (let x = 0; x < SW; x++) {
      const fx = x - PAD;
      const gx = x / grid;
      const gy = y / grid;
      const ix = Math.floor(gx);
      const iy = Math.floor(gy);
      const ax = gx - ix;
      const ay = gy - iy;
      const c = (i: number, j: number) => coarse[j * gw + i]!;
      const smooth = (1 - ay) * ((1 - ax) * c(ix, iy) + ax * c(ix + 1, iy)) + ay * ((1 - ax) * c(ix, iy + 1) + ax * c(ix + 1, iy + 1));
      // Wall: blotches plus a fine weave (a textured background the detector must not take for motion).
      let v = 95 + 55 * smooth + 14 * Math.sin(fx * 0.9 + 2 * Math.sin(fy * 0.21)) * Math.cos(fy * 0.7);
      if (fy > landing) v = 150 + 30 * smooth; // the floor
      if (Math.abs(fy - landing) < 1.2) v = 40; // the landing line
      for (const b of bands) {
        if (Math.abs(fy - b) < bandHalf && fx > column - 0.22 * W && fx < column - 0.1 * W) v = 245;
      }
      still[y * SW + x] = v;
    }
  }

  const exposure = o.exposure_s ?? 0;
  const subSamples = exposure > 0 ? 9 : 1;
  const times_s: number[] = [];
  const frames: Uint8Array[] = [];
  const rows_px: number[] = [];
  const shake_px: { x: number; y: number }[] = [];
  const frameCount = Math.floor(o.duration_s * o.frame_rate_hz + 1e-9);
  const sigmaShake = o.shake_px ?? 0;
  const noise = o.noise_grey ?? 0;
  // Noise from a table of normal draws read at a random start and odd stride per frame: as white as the tests
  // need, and far cheaper than a Box–Muller pair per pixel.
  const NOISE_TABLE = 1 << 16;
  const noiseTable = Float32Array.from({ length: noise > 0 ? NOISE_TABLE : 0 }, () => noise * rng.normal());
  const cover = new Float32Array(W * H);
  const shade = new Float32Array(W * H);
  for (let k = 0; k < frameCount; k++) {
    const t = k / o.frame_rate_hz;
    times_s.push(t);
    const sx = k === 0 ? 0 : Math.max(-PAD + 1, Math.min(PAD - 1, sigmaShake * rng.normal()));
    const sy = k === 0 ? 0 : Math.max(-PAD + 1, Math.min(PAD - 1, sigmaShake * rng.normal()));
    shake_px.push({ x: sx, y: sy });
    rows_px.push(rowOfHeight(centreHeight(t)));
    // The ball's coverage of each pixel and the shadow's, averaged over the exposure.
    cover.fill(0);
    shade.fill(0);
    for (let s = 0; s < subSamples; s++) {
      const ts = subSamples === 1 ? t : t + exposure * ((s + 0.5) / subSamples - 0.5);
      const h = centreHeight(ts);
      const yc = rowOfHeight(h) + sy;
      const xc = column + sx;
      const rp = r_m * pxPerM(h);
      drawDisc(cover, W, H, xc, yc, rp, 1 / subSamples);
      if (o.shadow) {
        // Light from the upper left: the shadow sits right of and below the ball, meeting it on the floor.
        const lift = h - r_m;
        drawDisc(shade, W, H, xc + 1.3 * rp + 0.25 * lift * pxPerM(h), yc + 0.15 * lift * pxPerM(h), rp * 1.1, 1 / subSamples);
      }
    }
    const frame = new Uint8Array(W * H);
    let nAt = Math.floor(rng.uniform() * NOISE_TABLE);
    const nStride = 2 * Math.floor(rng.uniform() * 1000) + 7919;
    const ix = Math.floor(sx);
    const iy = Math.floor(sy);
    const ax = sx - ix;
    const ay = sy - iy;
    for (let y = 0; y < H; y++) {
      // Frame pixel (x, y) shows scene point (x − sx, y − sy): the camera moved by (sx, sy).
      const r0 = (y - iy - 1 + PAD) * SW;
      const r1 = r0 + SW;
      for (let x = 0; x < W; x++) {
        const c0 = x - ix - 1 + PAD;
        const bg =
          ay * (ax * still[r0 + c0]! + (1 - ax) * still[r0 + c0 + 1]!) + (1 - ay) * (ax * still[r1 + c0]! + (1 - ax) * still[r1 + c0 + 1]!);
        const i = y * W + x;
        const shaded = bg * (1 - 0.3 * Math.min(1, shade[i]!));
        let v = shaded + (232 - shaded) * Math.min(1, cover[i]!);
        if (noise > 0) {
          v += noiseTable[nAt]!;
          nAt = (nAt + nStride) & (NOISE_TABLE - 1);
        }
        frame[i] = v < 0 ? 0 : v > 255 ? 255 : Math.round(v);
      }
    }
    frames.push(frame);
  }

  const scale: ScaleMark[] = (o.scale_heights_m ?? []).map((h) => ({ x_px: column - 0.16 * W, y_px: rowOfHeight(h), height_m: h }));
  return {
    width: W,
    height: H,
    times_s,
    frames,
    truth: {
      release_s: o.release_s,
      impact_s,
      fall_time_s: fallTime_s,
      drag_coefficient: ball.drag_coefficient,
      fall,
      rows_px,
      shake_px,
      column_px: column,
      radius_px: r_m * pxPerM(o.release_height_m),
      landing_y_px: landing,
      rowOfHeight,
      distanceAt: (dt) => (dt <= 0 ? 0 : Math.min(o.release_height_m, fallDistance(dt, fall))),
    },
    setup: {
      fall_line: { x0_px: column, y0_px: rowOfHeight(top_m), x1_px: column, y1_px: landing },
      landing_y_px: landing,
      scale,
      release_height_m: o.release_height_m,
    },
  };
}

/** Adds `weight` × the area of each pixel the disc covers (a one-pixel soft edge stands for the pixel's area). */
function drawDisc(into: Float32Array, W: number, H: number, xc: number, yc: number, r: number, weight: number): void {
  const x0 = Math.max(0, Math.floor(xc - r - 1));
  const x1 = Math.min(W - 1, Math.ceil(xc + r + 1));
  const y0 = Math.max(0, Math.floor(yc - r - 1));
  const y1 = Math.min(H - 1, Math.ceil(yc + r + 1));
  for (let y = y0; y <= y1; y++) {
    for (let x = x0; x <= x1; x++) {
      const c = r + 0.5 - Math.sqrt((x - xc) * (x - xc) + (y - yc) * (y - yc));
      if (c > 0) into[y * W + x] = into[y * W + x]! + weight * (c > 1 ? 1 : c);
    }
  }
}

/**
 * The band of frames a decoder would hand to motion/: full-frame pixels (x0 + u·step, y0 + v·step), each the
 * mean of a step × step block, one byte a pixel.
 */
export function greyBand(
  frames: readonly Uint8Array[],
  times_s: readonly number[],
  frameWidth: number,
  band: { x0_px: number; y0_px: number; width: number; height: number; step_px: number },
): GreyClip {
  const { x0_px, y0_px, width, height, step_px } = band;
  const out = frames.map((f) => {
    const b = new Uint8Array(width * height);
    for (let v = 0; v < height; v++) {
      for (let u = 0; u < width; u++) {
        let sum = 0;
        for (let j = 0; j < step_px; j++) {
          const row = (y0_px + v * step_px + j) * frameWidth + x0_px + u * step_px;
          for (let i = 0; i < step_px; i++) sum += f[row + i]!;
        }
        b[v * width + u] = Math.round(sum / (step_px * step_px));
      }
    }
    return b;
  });
  return { width, height, x0_px, y0_px, step_px, times_s: [...times_s], frames: out };
}
