/**
 * The drop a clip gives: its fall time with a GUM budget (JCGM 100), and with scale marks the distance fallen
 * against time along the fall (pure).
 *
 * The budget of the fall time t = t_impact − t_release, each row a standard uncertainty in seconds:
 * - release and impact: from their trajectory fits (trajectoryFit.ts: Type A, from the frames' scatter about the
 *   trajectory, which holds the detector's own scatter and the sampling at the frame interval after refinement);
 *   an instant moved by hand: ± half a frame, rectangular (JCGM 100 §4.3.7).
 * - the landing line's placement: a tap on a still frame, ± TAP_PX rectangular (common practice), divided by the
 *   body's image speed at the landing.
 * - frame timestamps: each instant is read on the clip's own timestamps, which carry the container's time
 *   resolution (± half of it, rectangular) and any unevenness of the frame intervals (± the probe's largest
 *   departure of one interval, rectangular); two instants, so √2 of one.
 * - rolling shutter: a phone's sensor reads its lines one after another, so a row low in the picture is seen
 *   later than one high up by (Δrow / rows)·T_readout. The readout direction in the displayed picture depends on how
 *   the phone was held (in portrait it may sweep across the columns and not delay rows at all), so the sign is not
 *   known: the fall time is not corrected, and the delay between the release row and the contact row is bounded by
 *   ± (Δrow / rows)·T_readout, rectangular, with T_readout at most one frame interval when it is not known (a sensor
 *   cannot read slower than its frame rate).
 * - the clock's rate: ± 100 ppm of the time (a phone's crystal; common practice), rectangular.
 *
 * Marks: the distance fallen at each frame's time from the found release is h(rest row) − h(row), with h the map of
 * heightOfRow.ts. It assumes the scale marks are in the plane of the fall (tape on a pole beside it); a wall behind
 * the fall would show the body's parallax. Each mark's distance carries the track's row uncertainty and the scale's:
 * a tap on a mark (± TAP_PX) and the mark's height (± MARK_HEIGHT_M, a tape measure's reading; common practice),
 * propagated through the map by finite differences.
 */
import type { ClipBudgetRow, ClipDrop, ClipProbe, ClipSetup, ScaleMark } from './types';
import type { FallFinding } from './findFall';
import { heightMapOf } from './heightOfRow';

/** A tap on a still frame, ± px (half-width of a rectangular distribution; common practice for a zoomed frame). */
const TAP_PX = 1;
/** A scale mark's height as read off a tape measure, ± m (half-width, rectangular; common practice). */
const MARK_HEIGHT_M = 0.002;
/** A phone clock's rate error, ± relative (half-width, rectangular; common practice for a quartz crystal). */
const CLOCK_RATE = 1e-4;
/** Marks kept along one fall (the log allows 64 with the landing). */
const MAX_MARKS = 32;

export interface ClipDropOptions {
  /** The sensor's readout time (top to bottom), s; 0 for a global shutter; null/absent: not known. */
  readout_s?: number | null;
  /** The container's timestamp resolution, s (the track's timescale); 1 ms (a WebM's usual) when not given. */
  timestamp_resolution_s?: number;
}

export function clipDrop(finding: FallFinding, setup: ClipSetup, probe: ClipProbe, options: ClipDropOptions = {}): ClipDrop {
  const { release, impact } = finding;
  const time_s = impact.time_s - release.time_s;
  const frame_s = 1 / probe.frame_rate_hz;
  const budget: ClipBudgetRow[] = [];
  const instantRow = (name: 'release' | 'impact') => {
    const inst = finding[name];
    const fit = name === 'release' ? finding.release_fit : finding.impact_fit;
    budget.push({
      source: `${name} instant`,
      u_s: inst.u_time_s,
      basis:
        inst.by === 'moved'
          ? 'moved by hand to a frame: ± half a frame interval, rectangular (JCGM 100 §4.3.7)'
          : `trajectory fit over ${fit.frames} frames, residual ${fit.residual_px.toFixed(2)} px: Type A (JCGM 100 §4.2)`,
    });
  };
  instantRow('release');
  instantRow('impact');
  if (impact.by === 'found') {
    budget.push({
      source: 'landing line placement',
      u_s: TAP_PX / Math.sqrt(3) / finding.impact_fit.speed_px_s,
      basis: `± ${TAP_PX} px tap (common practice) at the image speed ${finding.impact_fit.speed_px_s.toFixed(0)} px/s, rectangular`,
    });
  }
  const resolution = options.timestamp_resolution_s ?? 1e-3;
  const uneven = probe.interval_spread * frame_s;
  budget.push({
    source: 'frame timestamps',
    u_s: Math.SQRT2 * Math.hypot(resolution / Math.sqrt(12), uneven / Math.sqrt(3)),
    basis: `resolution ${(resolution * 1e3).toPrecision(3)} ms and interval unevenness ± ${(uneven * 1e3).toPrecision(3)} ms, rectangular, two instants`,
  });
  const readout = options.readout_s ?? frame_s;
  const rows = Math.abs(finding.contact_y_px - finding.rest_y_px) / probe.height_px;
  budget.push({
    source: 'rolling shutter',
    u_s: (rows * readout) / Math.sqrt(3),
    basis:
      options.readout_s === undefined || options.readout_s === null
        ? `row delay between release and landing rows, ± ${(rows * 100).toFixed(0)} % of a readout bounded by one frame interval, rectangular; not corrected (direction unknown)`
        : `row delay between release and landing rows, ± ${(rows * 100).toFixed(0)} % of the stated ${(readout * 1e3).toPrecision(3)} ms readout, rectangular`,
  });
  budget.push({ source: 'clock rate', u_s: (CLOCK_RATE * time_s) / Math.sqrt(3), basis: '± 100 ppm (common practice for a phone crystal), rectangular' });
  const u_time_s = Math.sqrt(budget.reduce((s, r) => s + r.u_s * r.u_s, 0));

  const marks: { distance_m: number; time_s: number }[] = [];
  const marks_u_distance_m: number[] = [];
  const marks_budget: { source: string; u_m: number; basis: string }[] = [];
  if (setup.scale.length >= 2) {
    const map = heightMapOf(setup.scale);
    const rest = finding.rest_y_px;
    const inFall = finding.track.filter((p) => p.y_px !== null && p.time_s > release.time_s && p.time_s < impact.time_s);
    const picked = inFall.length <= MAX_MARKS ? inFall : Array.from({ length: MAX_MARKS }, (_, j) => inFall[Math.round(((j + 0.5) * inFall.length) / MAX_MARKS - 0.5)]!);
    let worst = { track: 0, taps: 0, heights: 0, total: -1 };
    for (const p of picked) {
      const distance_m = map.heightOf(rest) - map.heightOf(p.y_px!);
      const t = p.time_s - release.time_s;
      const last = marks[marks.length - 1];
      if (!(distance_m > 0 && distance_m < setup.release_height_m) || (last && !(distance_m > last.distance_m && t > last.time_s))) continue;
      const track = Math.abs(map.slopeAt(p.y_px!)) * Math.hypot(p.u_y_px ?? 0, finding.release_fit.residual_px);
      const taps = scaleSpread(setup.scale, rest, p.y_px!, (m, e) => ({ ...m, y_px: m.y_px + e * TAP_PX }), TAP_PX);
      const heights = scaleSpread(setup.scale, rest, p.y_px!, (m, e) => ({ ...m, height_m: m.height_m + e * MARK_HEIGHT_M }), MARK_HEIGHT_M);
      const total = Math.hypot(track, taps, heights);
      marks.push({ distance_m, time_s: t });
      marks_u_distance_m.push(total);
      if (total > worst.total) worst = { track, taps, heights, total };
    }
    marks_budget.push(
      { source: 'track row', u_m: worst.track, basis: "the detector's row uncertainty and the rest row's, through the scale" },
      { source: 'scale mark taps', u_m: worst.taps, basis: `± ${TAP_PX} px per tap (common practice), rectangular, through the ${map.kind} map` },
      { source: 'scale mark heights', u_m: worst.heights, basis: `± ${MARK_HEIGHT_M * 1e3} mm per mark (common practice), rectangular, through the ${map.kind} map` },
    );
  }
  return { time_s, u_time_s, budget, marks, release, impact, marks_u_distance_m, marks_budget };
}

/**
 * The standard uncertainty of the distance between two rows that one kind of scale error gives: each mark moved
 * by ± its half-width in turn (a rectangular distribution: u = half-width/√3), the changes added in quadrature.
 */
function scaleSpread(scale: readonly ScaleMark[], fromRow: number, toRow: number, move: (m: ScaleMark, e: number) => ScaleMark, halfWidth: number): number {
  const base = heightMapOf(scale);
  const d0 = base.heightOf(fromRow) - base.heightOf(toRow);
  let sum = 0;
  for (let k = 0; k < scale.length; k++) {
    const moved = scale.map((m, j) => (j === k ? move(m, 1) : m));
    const map = heightMapOf(moved);
    const change = map.heightOf(fromRow) - map.heightOf(toRow) - d0;
    sum += (change / Math.sqrt(3)) ** 2;
  }
  return halfWidth > 0 ? Math.sqrt(sum) : 0;
}
