// A clip's drop against the truth of rendered falls: the fall time within its stated uncertainty over many clips
// (a coverage figure), and the marks along the fall against the closed-form fall (src/physics fallModel) that drew
// them. The crew's taps are drawn with the errors the budget states (± 1 px on the landing line and on each scale
// mark, ± 2 mm on each mark's height, rectangular), so the coverage tests the whole stated budget.
import { describe, expect, it } from 'vitest';
import { clipDrop, findFall, moveInstant, type ClipProbe, type ClipSetup } from '../../src/motion';
import { seededRandom } from '../support/fall-scene';
import { smallFall } from './scenes';

const probeOf = (width: number, height: number, rate: number, frames: number): ClipProbe => ({
  codec: 'avc1.64001e',
  container: 'mp4',
  width_px: width,
  height_px: height,
  duration_s: frames / rate,
  frame_count: frames,
  frame_rate_hz: rate,
  interval_spread: 0,
  size_bytes: 1,
});

/** The setup a crew would tap: each tap off by up to ± 1 px, each mark's height off by up to ± 2 mm. */
function tapped(setup: ClipSetup, seed: number): ClipSetup {
  const rng = seededRandom(seed);
  const off = (half: number) => (2 * rng.uniform() - 1) * half;
  return {
    ...setup,
    landing_y_px: setup.landing_y_px + off(1),
    scale: setup.scale.map((m) => ({ ...m, y_px: m.y_px + off(1), height_m: m.height_m + off(0.002) })),
  };
}

describe('clipDrop', () => {
  it('gives fall times whose stated uncertainty covers the truth over 30 rendered clips (30, 120 and 240 frames/s)', () => {
    let within1 = 0;
    let within2 = 0;
    let marksWithin2 = 0;
    let marks = 0;
    let releaseWithin2 = 0;
    let impactWithin2 = 0;
    const N = 30;
    const worstFrames = { release: 0, impact: 0 };
    for (let k = 0; k < N; k++) {
      const rate = [30, 120, 240][k % 3]!;
      const { scene, clip } = smallFall({
        frame_rate_hz: rate,
        seed: 200 + k,
        release_s: 0.1 + ((k * 0.618) % 1) / rate,
        shake_px: 0.3,
        shadow: k % 2 === 0,
        exposure_s: (k % 4) / 8 / rate,
        tilt_deg: (k % 5) * 2 - 4,
        noise_grey: 2 + (k % 3),
        width_px: 96,
        height_px: 240,
        scale_heights_m: [0.2, 0.55, 0.9],
      });
      const setup = tapped(scene.setup, 900 + k);
      const finding = findFall(clip, setup);
      // A rendered clip has a global shutter and exact timestamps.
      const drop = clipDrop(finding, setup, probeOf(scene.width, scene.height, rate, clip.frames.length), { readout_s: 0, timestamp_resolution_s: 1e-6 });
      const err = drop.time_s - scene.truth.fall_time_s;
      if (Math.abs(err) <= drop.u_time_s) within1++;
      if (Math.abs(err) <= 2 * drop.u_time_s) within2++;
      const re = finding.release.time_s - scene.truth.release_s;
      const ie = finding.impact.time_s - scene.truth.impact_s;
      if (Math.abs(re) <= 2 * finding.release.u_time_s) releaseWithin2++;
      const uImpact = Math.hypot(finding.impact.u_time_s, ...drop.budget.filter((r) => r.source === 'landing line placement' || r.source === 'contact row').map((r) => r.u_s));
      if (Math.abs(ie) <= 2 * uImpact) impactWithin2++;
      worstFrames.release = Math.max(worstFrames.release, Math.abs(re) * rate);
      worstFrames.impact = Math.max(worstFrames.impact, Math.abs(ie) * rate);
      // Each mark against the closed-form distance at its true time from the true release.
      drop.marks.forEach((m, i) => {
        const truth = scene.truth.distanceAt(m.time_s + finding.release.time_s - scene.truth.release_s);
        marks++;
        if (Math.abs(m.distance_m - truth) <= 2 * drop.marks_u_distance_m[i]!) marksWithin2++;
      });
    }
    const figures = {
      fall_time_within_u: within1 / N,
      fall_time_within_2u: within2 / N,
      release_within_2u: releaseWithin2 / N,
      impact_within_2u: impactWithin2 / N,
      marks_within_2u: marksWithin2 / marks,
      worst_release_frames: worstFrames.release,
      worst_impact_frames: worstFrames.impact,
    };
    console.log('clip coverage', JSON.stringify(figures));
    // 95 % nominal for k = 2; with 30 clips one standard deviation of the count is 4 %: below 85 % is a budget that is too small.
    expect(figures.fall_time_within_2u).toBeGreaterThanOrEqual(0.85);
    // A budget far too large would put every clip within u (68 % nominal, 58 % for a rectangular-led budget).
    expect(figures.fall_time_within_u).toBeLessThan(0.97);
    expect(figures.release_within_2u).toBeGreaterThanOrEqual(0.85);
    expect(figures.impact_within_2u).toBeGreaterThanOrEqual(0.85);
    expect(figures.marks_within_2u).toBeGreaterThanOrEqual(0.85);
    expect(worstFrames.release).toBeLessThan(0.5);
    expect(worstFrames.impact).toBeLessThan(0.5);
  }, 240_000);

  it('states each part of the budget with its basis, and the marks run from the release in both distance and time', () => {
    const { scene, clip } = smallFall({ scale_heights_m: [0.25, 0.9] });
    const drop = clipDrop(findFall(clip, scene.setup), scene.setup, probeOf(scene.width, scene.height, 120, clip.frames.length));
    expect(drop.budget.map((r) => r.source)).toEqual(['release instant', 'impact instant', 'landing line placement', 'contact row', 'frame timestamps', 'rolling shutter', 'clock rate']);
    for (const r of drop.budget) {
      expect(r.u_s).toBeGreaterThanOrEqual(0);
      expect(r.basis.length).toBeGreaterThan(10);
    }
    // Unknown readout: bounded by one frame interval over the rows fallen (a quarter frame or so here), rectangular.
    const rolling = drop.budget.find((r) => r.source === 'rolling shutter')!;
    expect(rolling.u_s).toBeGreaterThan(0.2 / 120 / Math.sqrt(3));
    expect(rolling.u_s).toBeLessThan(1 / 120 / Math.sqrt(3));
    expect(drop.u_time_s ** 2).toBeCloseTo(drop.budget.reduce((s, r) => s + r.u_s ** 2, 0), 12);
    expect(drop.marks.length).toBeGreaterThanOrEqual(2);
    expect(drop.marks.length).toBeLessThanOrEqual(32);
    for (let i = 1; i < drop.marks.length; i++) {
      expect(drop.marks[i]!.distance_m).toBeGreaterThan(drop.marks[i - 1]!.distance_m);
      expect(drop.marks[i]!.time_s).toBeGreaterThan(drop.marks[i - 1]!.time_s);
    }
    expect(drop.marks.at(-1)!.distance_m).toBeLessThan(1);
    expect(drop.marks.at(-1)!.time_s).toBeLessThan(drop.time_s);
    expect(drop.marks_budget.map((r) => r.source)).toEqual(['track row', 'scale mark taps', 'scale mark heights']);
  });

  it('gives no marks without a scale, and a moved instant ± half a frame', () => {
    const { scene, clip } = smallFall();
    const finding = findFall(clip, scene.setup);
    const probe = probeOf(scene.width, scene.height, 120, clip.frames.length);
    expect(clipDrop(finding, scene.setup, probe).marks).toEqual([]);
    const moved = moveInstant(finding, 'impact', clip.times_s[finding.impact.frame + 1]!);
    expect(moved.impact).toEqual({ time_s: clip.times_s[finding.impact.frame + 1], u_time_s: expect.closeTo(1 / 120 / Math.sqrt(12), 12), frame: finding.impact.frame + 1, by: 'moved' });
    expect(moved.release).toBe(finding.release);
    const drop = clipDrop(moved, scene.setup, probe);
    expect(drop.budget.map((r) => r.source)).not.toContain('landing line placement');
    expect(drop.budget[1]!.basis).toMatch(/moved by hand/);
    expect(() => moveInstant(finding, 'release', finding.impact.time_s + 0.01)).toThrow(expect.objectContaining({ code: 'bad-instant', field: 'release.time_s' }));
    expect(() => moveInstant(finding, 'impact', 99)).toThrow(expect.objectContaining({ code: 'bad-instant' }));
  });
});
