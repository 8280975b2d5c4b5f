/**
 * Finding the falling body in a clip's grey band, its release and its impact (pure).
 *
 * 1. The camera's shake: each frame's translation against the first, from the side strips of the band (away from
 *    the fall line, where nothing moves), by Lucas–Kanade on the grey levels (two Gauss–Newton steps of a
 *    sub-pixel translation; pixels that changed by more than SHAKE_OUTLIER_GREY beyond what a 1.5 px shift explains
 *    are left out, so a passing shadow or a hand does not pull the estimate). Each frame is then resampled (bilinear) onto the first one's grid.
 * 2. Where things move: a frame differs from both the first and the last frame only where the body is in flight
 *    (at rest before the release it matches the first; at rest after the landing it matches the last), which
 *    gives the frames of the flight roughly, with no background model yet.
 * 3. A clean background (no body in it): per pixel, the median of the frames before the flight for the rows below
 *    the middle of the fall (the body was still up), and of the frames after it for the rows above (the body was
 *    down). A median of a still scene removes noise and compression flicker; the texture stays and cancels.
 * 4. The body in each frame: the absolute difference from the background in a corridor around the fall line,
 *    less half the background's local gradient (what a leftover half-pixel misalignment can leave on an edge),
 *    thresholded at max(5σ, 35 % of the frame's strongest difference) so that a shadow (a mild darkening) and the
 *    texture's residue fall below it, and the centroid of what is left in the strongest connected run of rows.
 *    Its own uncertainty is the centroid's under the pixel noise σ.
 * 5. The release and the impact, refined to a fraction of a frame by the two fits of trajectoryFit.ts.
 *
 * Frame timestamps are used as they are (the decoder's presentation timestamps), never a nominal rate.
 */
import type { ClipSetup, FoundInstant, GreyClip, TrackPoint } from './types';
import { MotionError } from './motionError';
import { fitImpact, fitRelease, type ImpactFit, type ReleaseFit } from './trajectoryFit';

export interface FallFinding {
  track: TrackPoint[];
  release: FoundInstant;
  impact: FoundInstant;
  /** The body's centre row at rest before the release, and where it touches the landing, full-frame px. */
  rest_y_px: number;
  contact_y_px: number;
  /** The body's radius as seen at rest, and just before the landing, full-frame px. */
  radius_px: number;
  landing_radius_px: number;
  /** The grey noise σ of one frame, and the detector's median own uncertainty of a row, px. */
  noise_grey: number;
  u_y_px: number;
  release_fit: ReleaseFit;
  impact_fit: ImpactFit;
}

const MIN_FRAMES = 8;
const SHAKE_OUTLIER_GREY = 30;
/** The part of the fall's rows (from the rest row) the release fit uses. */
const RELEASE_FIT_ROWS = 0.3;
/** The part of the fall's rows (before the contact row) the impact fit may use. */
const IMPACT_FIT_ROWS = 0.5;
const MAX_IMPACT_FRAMES = 12;
const MEDIAN_SAMPLES = 31;

interface Corridor {
  W: number;
  H: number;
  /** Columns of the corridor in each band row (inclusive). */
  lo: Int32Array;
  hi: Int32Array;
  /** Side-strip pixels for the shake: indices into a frame. */
  side: Int32Array;
}

export function findFall(clip: GreyClip, setup: ClipSetup): FallFinding {
  checkClip(clip);
  const n = clip.frames.length;
  const s = clip.step_px;
  const toFullY = (v: number) => clip.y0_px + v * s + (s - 1) / 2;
  const toFullX = (u: number) => clip.x0_px + u * s + (s - 1) / 2;
  const toBandY = (y: number) => (y - clip.y0_px - (s - 1) / 2) / s;

  const cor = corridorOf(clip, setup);
  const shifts = cameraShifts(clip, cor);
  const aligned = clip.frames.map((f, i) => alignFrame(f, cor, shifts[i]!));
  const sigma = noiseLevel(aligned, cor);
  const flight = roughFlight(aligned, cor, sigma);
  const landingBand = toBandY(setup.landing_y_px);
  const plate = cleanPlate(aligned, cor, flight, (flight.firstY + Math.min(flight.lastY, landingBand)) / 2);
  const edges = edgeTolerance(plate, cor);
  const found = aligned.map((a) => detectBody(a, plate, edges, cor, sigma));

  const track: TrackPoint[] = found.map((f, i) => ({
    frame: i,
    time_s: clip.times_s[i]!,
    x_px: f ? toFullX(f.u) : null,
    y_px: f ? toFullY(f.v) : null,
    u_y_px: f ? f.u_v * s : null,
  }));
  const uys = track.flatMap((p) => (p.u_y_px === null ? [] : [p.u_y_px])).sort((a, b) => a - b);
  const u_y_px = uys[Math.floor(uys.length / 2)] ?? 0;

  // The body at rest before the flight: its row and its size.
  const restIdx = range(0, flight.first).filter((i) => found[i]);
  if (restIdx.length < 1) {
    throw new MotionError({ code: 'no-release', field: 'clip.frames', value: `${n} frames`, allowed: 'the body at rest on the fall line before it goes', reason: 'the clip does not show the body before its release' });
  }
  const earlyRest = restIdx.slice(0, Math.max(1, Math.ceil(restIdx.length / 2)));
  const rest_y_px = median(earlyRest.map((i) => track[i]!.y_px!));
  const radius_px = median(earlyRest.map((i) => found[i]!.radius)) * s;
  // The body's size where it lands (a tilted camera shows it larger or smaller there than at the release): from
  // the frames in the last quarter of the fall's rows, before the landing line.
  const nearLanding = range(flight.first, Math.min(n, flight.last + 3)).filter(
    (i) => found[i] && track[i]!.y_px! > setup.landing_y_px - 0.25 * (setup.landing_y_px - rest_y_px) && track[i]!.y_px! < setup.landing_y_px - 1.5 * radius_px,
  );
  const landing_radius_px = nearLanding.length > 0 ? median(nearLanding.map((i) => found[i]!.radius)) * s : radius_px;
  const contact_y_px = setup.landing_y_px - landing_radius_px;
  const span = contact_y_px - rest_y_px;
  if (!(span > 2 * radius_px) || !(radius_px > 0)) {
    throw new MotionError({ code: 'bad-setup', field: 'setup.landing_y_px', value: setup.landing_y_px, allowed: `a landing line well below the body at rest (row ${rest_y_px.toFixed(1)})`, reason: 'the landing line is not below the body' });
  }
  const frame_s = medianInterval(clip.times_s);

  // Release: the rest frames (the last 60) and the first part of the fall.
  const fitEnd = range(flight.first, n).find((i) => found[i] && track[i]!.y_px! - rest_y_px > RELEASE_FIT_ROWS * span) ?? flight.first;
  const relIdx = range(Math.max(0, flight.first - 60), fitEnd).filter((i) => found[i]);
  const rel = releaseFrom(relIdx.map((i) => track[i]!.time_s), relIdx.map((i) => track[i]!.y_px!), rest_y_px, frame_s, u_y_px);
  // The body must be seen at rest: at least two frames before the found release, and none of them moving.
  const seenAtRest = rel ? relIdx.filter((i) => track[i]!.time_s < rel.release_s - 0.5 * frame_s) : [];
  const still = seenAtRest.every((i) => Math.abs(track[i]!.y_px! - rel!.rest_y_px) < Math.max(1, 4 * rel!.residual_px));
  if (!rel || seenAtRest.length < 2 || !still) {
    throw new MotionError({ code: 'no-release', field: 'clip.frames', value: `${relIdx.length} frames near the release`, allowed: 'a body leaving rest in a way a fall from rest explains', reason: 'no release fits the first frames of the fall' });
  }

  // Impact: the last frames before the contact row, those whose exposure cannot include the landing.
  const imp = impactFrom(track, flight, rel, contact_y_px, span, frame_s);
  if (!imp || imp.impact_s > clip.times_s[n - 1]! || imp.impact_s <= rel.release_s) {
    throw new MotionError({
      code: 'no-impact',
      field: 'clip.frames',
      value: `${n} frames to ${clip.times_s[n - 1]!.toFixed(3)} s`,
      allowed: `the body reaching the landing line (row ${setup.landing_y_px.toFixed(0)}) within the clip`,
      reason: 'the clip does not show the body reaching the landing line',
    });
  }
  return {
    track,
    release: { time_s: rel.release_s, u_time_s: rel.u_release_s, frame: nearestFrame(clip.times_s, rel.release_s), by: 'found' },
    impact: { time_s: imp.impact_s, u_time_s: imp.u_impact_s, frame: nearestFrame(clip.times_s, imp.impact_s), by: 'found' },
    rest_y_px: rel.rest_y_px,
    contact_y_px,
    radius_px,
    landing_radius_px,
    noise_grey: sigma,
    u_y_px,
    release_fit: rel,
    impact_fit: imp,
  };
}

function releaseFrom(t: number[], y: number[], rest: number, frame_s: number, u_y: number): ReleaseFit | null {
  // First guess: √(y − y0) grows linearly from the release, √(a/2)·(t − t_r).
  const lift = Math.max(1, 3 * u_y);
  const pts = t.map((ti, i) => [ti, y[i]! - rest] as const).filter(([, d]) => d > lift);
  if (pts.length < 2) return null;
  const xs = pts.map(([ti]) => ti);
  const ys = pts.map(([, d]) => Math.sqrt(d));
  const mx = mean(xs);
  const my = mean(ys);
  let sxy = 0;
  let sxx = 0;
  for (let i = 0; i < xs.length; i++) {
    sxy += (xs[i]! - mx) * (ys[i]! - my);
    sxx += (xs[i]! - mx) ** 2;
  }
  const k = sxx > 0 ? sxy / sxx : 0;
  if (!(k > 0)) return null;
  const guess = { release_s: mx - my / k, acceleration_px_s2: 2 * k * k, rest_y_px: rest };
  return fitRelease(t, y, frame_s, guess);
}

function impactFrom(track: TrackPoint[], flight: Flight, rel: ReleaseFit, contact: number, span: number, frame_s: number): ImpactFit | null {
  const inFlight = track.filter((p) => p.y_px !== null && p.time_s > rel.release_s && p.frame <= flight.last + 2);
  let cutoff = Infinity;
  let fit: ImpactFit | null = null;
  for (let pass = 0; pass < 3; pass++) {
    const use = inFlight.filter((p) => p.y_px! > contact - IMPACT_FIT_ROWS * span && p.y_px! < contact && p.time_s <= cutoff).slice(-MAX_IMPACT_FRAMES);
    if (use.length < 3) return fit;
    const next = fitImpact(use.map((p) => p.time_s), use.map((p) => p.y_px!), contact, frame_s);
    if (!next) return fit;
    fit = next;
    // A frame exposed across the landing shows a body partly stopped: keep frames half an interval clear of it.
    const newCutoff = fit.impact_s - 0.5 * frame_s;
    if (newCutoff === cutoff) break;
    cutoff = newCutoff;
  }
  return fit;
}

function checkClip(clip: GreyClip): void {
  const n = clip.frames.length;
  if (n < MIN_FRAMES || clip.times_s.length !== n) {
    throw new MotionError({ code: 'bad-setup', field: 'clip.frames', value: n, allowed: `at least ${MIN_FRAMES} frames, each with its timestamp`, reason: 'too few frames' });
  }
  if (!(clip.width >= 8 && clip.height >= 16)) {
    throw new MotionError({ code: 'bad-setup', field: 'clip.width', value: `${clip.width} × ${clip.height}`, allowed: 'a band of at least 8 × 16 pixels', reason: 'the band is too small' });
  }
  for (let i = 0; i < n; i++) {
    if (clip.frames[i]!.length !== clip.width * clip.height) {
      throw new MotionError({ code: 'bad-setup', field: `clip.frames[${i}]`, value: clip.frames[i]!.length, allowed: `${clip.width * clip.height} bytes`, reason: 'a frame of the wrong size' });
    }
    if (i > 0 && !(clip.times_s[i]! > clip.times_s[i - 1]!)) {
      throw new MotionError({ code: 'bad-setup', field: `clip.times_s[${i}]`, value: clip.times_s[i], allowed: `after ${clip.times_s[i - 1]} s`, reason: 'timestamps out of order' });
    }
  }
}

function corridorOf(clip: GreyClip, setup: ClipSetup): Corridor {
  const { width: W, height: H, step_px: s } = clip;
  const L = setup.fall_line;
  const lo = new Int32Array(H);
  const hi = new Int32Array(H);
  const half = Math.max(3, Math.floor(W / 4));
  const side: number[] = [];
  for (let v = 0; v < H; v++) {
    const y = clip.y0_px + v * s + (s - 1) / 2;
    const x = L.y1_px === L.y0_px ? (L.x0_px + L.x1_px) / 2 : L.x0_px + ((L.x1_px - L.x0_px) * (y - L.y0_px)) / (L.y1_px - L.y0_px);
    const uc = (x - clip.x0_px - (s - 1) / 2) / s;
    lo[v] = Math.max(1, Math.floor(uc - half));
    hi[v] = Math.min(W - 2, Math.ceil(uc + half));
    if (v < 1 || v >= H - 1) continue;
    for (let u = 1; u < W - 1; u++) if (u < lo[v]! - 1 || u > hi[v]! + 1) side.push(v * W + u);
  }
  return { W, H, lo, hi, side: Int32Array.from(side) };
}

/** Each frame's translation (band px) against the first, from the side strips; zero when they hold no texture. */
function cameraShifts(clip: GreyClip, cor: Corridor): { dx: number; dy: number }[] {
  const { W } = cor;
  const ref = clip.frames[0]!;
  const gx = new Float32Array(cor.side.length);
  const gy = new Float32Array(cor.side.length);
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  cor.side.forEach((p, k) => {
    gx[k] = (ref[p + 1]! - ref[p - 1]!) / 2;
    gy[k] = (ref[p + W]! - ref[p - W]!) / 2;
    sxx += gx[k]! * gx[k]!;
    sxy += gx[k]! * gy[k]!;
    syy += gy[k]! * gy[k]!;
  });
  const det = sxx * syy - sxy * sxy;
  if (cor.side.length < 50 || !(det > 1e-6 * (sxx + syy) ** 2) || sxx + syy < cor.side.length) {
    return clip.frames.map(() => ({ dx: 0, dy: 0 }));
  }
  return clip.frames.map((f, i) => {
    if (i === 0) return { dx: 0, dy: 0 };
    let dx = 0;
    let dy = 0;
    for (let iter = 0; iter < 3; iter++) {
      let bx = 0;
      let by = 0;
      let axx = 0;
      let axy = 0;
      let ayy = 0;
      for (let k = 0; k < cor.side.length; k++) {
        const p = cor.side[k]!;
        const e = sample(f, W, cor.H, (p % W) + dx, Math.floor(p / W) + dy) - ref[p]!;
        const x = gx[k]!;
        const y = gy[k]!;
        // Left out: what a shift of up to 1.5 px cannot explain (something moved there).
        if (Math.abs(e) > SHAKE_OUTLIER_GREY + 1.5 * (Math.abs(x) + Math.abs(y))) continue;
        bx += x * e;
        by += y * e;
        axx += x * x;
        axy += x * y;
        ayy += y * y;
      }
      const d = axx * ayy - axy * axy;
      if (!(d > 0)) break;
      const ddx = -(ayy * bx - axy * by) / d;
      const ddy = -(axx * by - axy * bx) / d;
      dx = Math.max(-8, Math.min(8, dx + ddx));
      dy = Math.max(-8, Math.min(8, dy + ddy));
      if (Math.abs(ddx) + Math.abs(ddy) < 0.01) break;
    }
    return { dx, dy };
  });
}

/** Bilinear sample of a frame at a real position, clamped to the frame. */
function sample(f: Uint8Array, W: number, H: number, x: number, y: number): number {
  const xc = Math.max(0, Math.min(W - 1.001, x));
  const yc = Math.max(0, Math.min(H - 1.001, y));
  const ix = Math.floor(xc);
  const iy = Math.floor(yc);
  const ax = xc - ix;
  const ay = yc - iy;
  const p = iy * W + ix;
  return (1 - ay) * ((1 - ax) * f[p]! + ax * f[p + 1]!) + ay * ((1 - ax) * f[p + W]! + ax * f[p + W + 1]!);
}

/** The corridor of a frame resampled onto the first frame's grid (other pixels left zero). */
function alignFrame(f: Uint8Array, cor: Corridor, shift: { dx: number; dy: number }): Float32Array {
  const { W, H } = cor;
  const out = new Float32Array(W * H);
  const still = Math.abs(shift.dx) < 0.02 && Math.abs(shift.dy) < 0.02;
  for (let v = 0; v < H; v++) {
    for (let u = cor.lo[v]!; u <= cor.hi[v]!; u++) {
      out[v * W + u] = still ? f[v * W + u]! : sample(f, W, H, u + shift.dx, v + shift.dy);
    }
  }
  return out;
}

/** The grey noise σ of one frame: the robust spread of the difference of the first two aligned frames. */
function noiseLevel(aligned: Float32Array[], cor: Corridor): number {
  const d: number[] = [];
  for (let v = 0; v < cor.H; v++) for (let u = cor.lo[v]!; u <= cor.hi[v]!; u++) d.push(Math.abs(aligned[1]![v * cor.W + u]! - aligned[0]![v * cor.W + u]!));
  // MAD of a difference of two frames: σ√2 · 0.6745.
  return Math.max(0.5, median(d) / 0.6745 / Math.SQRT2);
}

interface Flight {
  first: number;
  last: number;
  /** Band rows of the body in the first and last frames of the flight. */
  firstY: number;
  lastY: number;
}

function roughFlight(aligned: Float32Array[], cor: Corridor, sigma: number): Flight {
  const n = aligned.length;
  const F0 = aligned[0]!;
  const L0 = aligned[n - 1]!;
  const T = Math.max(6 * sigma, 12);
  const G0 = edgeTolerance(F0, cor);
  const G1 = edgeTolerance(L0, cor);
  const rows = new Float64Array(cor.H);
  const ys: (number | null)[] = aligned.map((a) => {
    rows.fill(0);
    for (let v = 0; v < cor.H; v++) {
      for (let u = cor.lo[v]!; u <= cor.hi[v]!; u++) {
        const p = v * cor.W + u;
        if (Math.abs(a[p]! - F0[p]!) > T + G0[p]! && Math.abs(a[p]! - L0[p]!) > T + G1[p]!) rows[v] = rows[v]! + 1;
      }
    }
    const blob = strongestRun(rows);
    return blob && blob.mass >= 4 ? blob.centre : null;
  });
  // The longest run of frames with something in flight (gaps of up to 2 frames bridged).
  let best: [number, number] | null = null;
  let start = -1;
  let lastSeen = -10;
  for (let i = 0; i <= n; i++) {
    const seen = i < n && ys[i] !== null;
    if (seen) {
      if (start < 0 || i - lastSeen > 3) start = i;
      lastSeen = i;
      if (!best || i - start > best[1] - best[0]) best = [start, i];
    }
  }
  if (!best || best[1] - best[0] < 1 || ys[best[1]]! - ys[best[0]]! < 3) {
    throw new MotionError({
      code: 'nothing-falls',
      field: 'clip.frames',
      value: `${n} frames`,
      allowed: 'a body moving down the fall line in at least 2 frames',
      reason: 'nothing moves down the fall line in this clip',
    });
  }
  return { first: best[0], last: best[1], firstY: ys[best[0]]!, lastY: ys[best[1]]! };
}

/** The background with no body: frames after the flight above `split`, frames before it below. */
function cleanPlate(aligned: Float32Array[], cor: Corridor, flight: Flight, split: number): Float32Array {
  const n = aligned.length;
  const before = spread(range(0, flight.first), MEDIAN_SAMPLES);
  const after = spread(range(flight.last + 1, n), MEDIAN_SAMPLES);
  const plate = new Float32Array(cor.W * cor.H);
  const buf: number[] = [];
  for (let v = 0; v < cor.H; v++) {
    let from = v < split ? after : before;
    if (from.length === 0) from = v < split ? before : after;
    for (let u = cor.lo[v]!; u <= cor.hi[v]!; u++) {
      const p = v * cor.W + u;
      buf.length = 0;
      for (const i of from) buf.push(aligned[i]![p]!);
      plate[p] = median(buf);
    }
  }
  return plate;
}

/**
 * How much a difference may be at each pixel from a residual misalignment alone: half the grey gradient (a
 * shift of half a pixel, which bilinear resampling of thin lines and the shake's leftover can leave). Without
 * it a sharp line (the landing line, a tape band) lights up in every shaken frame.
 */
function edgeTolerance(f: Float32Array, cor: Corridor): Float32Array {
  const { W, H } = cor;
  const out = new Float32Array(W * H);
  for (let v = 1; v < H - 1; v++) {
    for (let u = cor.lo[v]!; u <= cor.hi[v]!; u++) {
      const p = v * W + u;
      out[p] = 0.5 * (Math.abs(f[p + 1]! - f[p - 1]!) / 2 + Math.abs(f[p + W]! - f[p - W]!) / 2);
    }
  }
  return out;
}

interface Detection {
  u: number;
  v: number;
  /** Standard uncertainty of v, band px. */
  u_v: number;
  /** The body's radius from the spread of its columns (a ball or disc; not changed by vertical blur), band px. */
  radius: number;
}

function detectBody(a: Float32Array, plate: Float32Array, edges: Float32Array, cor: Corridor, sigma: number): Detection | null {
  const { W, H } = cor;
  let peak = 0;
  let second = 0;
  for (let v = 0; v < H; v++) {
    for (let u = cor.lo[v]!; u <= cor.hi[v]!; u++) {
      const d = Math.abs(a[v * W + u]! - plate[v * W + u]!) - edges[v * W + u]!;
      if (d > peak) [second, peak] = [peak, d];
      else if (d > second) second = d;
    }
  }
  // The second largest: one hot pixel is not a body.
  if (second < Math.max(8 * sigma, 20)) return null;
  const thr = Math.max(5 * sigma, 0.35 * second);
  const rows = new Float64Array(H);
  for (let v = 0; v < H; v++) {
    for (let u = cor.lo[v]!; u <= cor.hi[v]!; u++) {
      const w = Math.abs(a[v * W + u]! - plate[v * W + u]!) - edges[v * W + u]! - thr;
      if (w > 0) rows[v] = rows[v]! + w;
    }
  }
  const run = strongestRun(rows);
  if (!run) return null;
  // The body's own grey: the median over its core.
  const core: number[] = [];
  for (let v = run.from; v <= run.to; v++) {
    for (let u = cor.lo[v]!; u <= cor.hi[v]!; u++) {
      if (Math.abs(a[v * W + u]! - plate[v * W + u]!) - edges[v * W + u]! > 0.6 * second) core.push(a[v * W + u]!);
    }
  }
  const body = median(core);
  // Each pixel's weight is the part of it the body covers, (a − plate)/(body − plate), in the thresholded region
  // grown by one pixel: a centroid linear in coverage has no pull towards the pixel grid (thresholding alone
  // has, by a few tenths of a pixel, which near the release is several frames' motion), and a dark texture patch
  // weighs no more than a light one.
  const inside = (u: number, v: number) =>
    v >= run.from && v <= run.to && u >= cor.lo[v]! && u <= cor.hi[v]! && Math.abs(a[v * W + u]! - plate[v * W + u]!) - edges[v * W + u]! > thr;
  let sw = 0;
  let su = 0;
  let suu = 0;
  let sv = 0;
  let count = 0;
  const rowsUsed: number[] = [];
  const var2: number[] = [];
  const seen = new Uint8Array(W * H);
  for (let v = Math.max(0, run.from - 1); v <= Math.min(H - 1, run.to + 1); v++) {
    for (let u = cor.lo[v]!; u <= cor.hi[v]!; u++) {
      if (!(inside(u, v) || inside(u - 1, v) || inside(u + 1, v) || inside(u, v - 1) || inside(u, v + 1))) continue;
      const p = v * W + u;
      if (seen[p]) continue;
      seen[p] = 1;
      const contrast = body - plate[p]!;
      const c = Math.abs(contrast) < 20 ? (inside(u, v) ? 1 : 0) : Math.max(0, Math.min(1, (a[p]! - plate[p]!) / contrast));
      if (c <= 0) continue;
      sw += c;
      su += c * u;
      suu += c * u * u;
      sv += c * v;
      count++;
      rowsUsed.push(v);
      var2.push(Math.abs(contrast) < 20 ? 0 : (1.1 * sigma * sigma) / (contrast * contrast));
    }
  }
  if (count < 3 || sw <= 0) return null;
  const cv = sv / sw;
  // σ of the centroid Σc·v/Σc, each coverage carrying the noise σ/(body − plate) of a frame less a median
  // (σ√1.1: the median of the background's frames has noise too): Σ σ_c²·(v − centroid)² / (Σc)².
  let varSum = 0;
  for (let k = 0; k < rowsUsed.length; k++) varSum += var2[k]! * (rowsUsed[k]! - cv) ** 2;
  // A disc's columns have variance r²/4 about its centre, whatever its vertical blur; one pixel's width adds 1/12.
  const varU = suu / sw - (su / sw) ** 2 - 1 / 12;
  return { u: su / sw, v: cv, u_v: Math.sqrt(varSum) / sw, radius: 2 * Math.sqrt(Math.max(0, varU)) };
}

/** The connected run of rows (gaps of one row bridged) with the largest total, around its strongest row. */
function strongestRun(rows: Float64Array): { from: number; to: number; mass: number; centre: number } | null {
  let best: { from: number; to: number; mass: number; centre: number } | null = null;
  let from = -1;
  let mass = 0;
  let moment = 0;
  let gap = 0;
  for (let v = 0; v <= rows.length; v++) {
    const r = v < rows.length ? rows[v]! : 0;
    if (r > 0) {
      if (from < 0) {
        from = v;
        mass = 0;
        moment = 0;
      }
      mass += r;
      moment += r * v;
      gap = 0;
    } else if (from >= 0) {
      gap++;
      if (gap > 1 || v === rows.length) {
        if (!best || mass > best.mass) best = { from, to: v - gap, mass, centre: moment / mass };
        from = -1;
        gap = 0;
      }
    }
  }
  return best;
}

function range(a: number, b: number): number[] {
  const out: number[] = [];
  for (let i = a; i < b; i++) out.push(i);
  return out;
}

/** At most k of the items, evenly spread. */
function spread(items: number[], k: number): number[] {
  if (items.length <= k) return items;
  return Array.from({ length: k }, (_, j) => items[Math.round((j * (items.length - 1)) / (k - 1))]!);
}

function median(xs: number[]): number {
  if (xs.length === 0) return NaN;
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
}

function mean(xs: number[]): number {
  return xs.reduce((s, x) => s + x, 0) / xs.length;
}

function medianInterval(times: readonly number[]): number {
  const d: number[] = [];
  for (let i = 1; i < times.length; i++) d.push(times[i]! - times[i - 1]!);
  return median(d);
}

export function nearestFrame(times: readonly number[], t: number): number {
  let best = 0;
  for (let i = 1; i < times.length; i++) if (Math.abs(times[i]! - t) < Math.abs(times[best]! - t)) best = i;
  return best;
}
