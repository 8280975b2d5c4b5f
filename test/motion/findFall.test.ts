// The detector on rendered falls (test/support/fall-scene.ts: the project's own closed-form fall for the truth),
// with a textured wall, a shadow, motion blur, camera shake, a tilted camera and pixel noise.
import { describe, expect, it } from 'vitest';
import { findFall, MotionError } from '../../src/motion';
import { renderFallScene } from '../support/fall-scene';
import { bandOfScene, smallFall } from './scenes';

const HARD = (rate: number) => ({ shake_px: 0.4, shadow: true, exposure_s: 0.5 / rate, tilt_deg: 8, noise_grey: 4 });

function codeOf(run: () => unknown): string {
  try {
    run();
  } catch (e) {
    expect(e).toBeInstanceOf(MotionError);
    return (e as MotionError).code;
  }
  return 'no error';
}

describe('findFall', () => {
  for (const rate of [30, 120, 240]) {
    it(`finds release and impact within half a frame at ${rate} frames/s, on a textured, shaken, blurred, tilted view with a shadow`, () => {
      for (const seed of [1, 2]) {
        const { scene, clip } = smallFall({ frame_rate_hz: rate, seed, release_s: 0.1 + (0.13 + 0.41 * seed) / rate, ...HARD(rate) });
        const f = findFall(clip, scene.setup);
        const releaseFrames = (f.release.time_s - scene.truth.release_s) * rate;
        const impactFrames = (f.impact.time_s - scene.truth.impact_s) * rate;
        expect(Math.abs(releaseFrames), `release, seed ${seed}`).toBeLessThan(0.5);
        expect(Math.abs(impactFrames), `impact, seed ${seed}`).toBeLessThan(0.5);
        expect(f.release.by).toBe('found');
        expect(f.track[f.release.frame]!.time_s).toBeCloseTo(Math.round(scene.truth.release_s * rate) / rate, 9);
      }
    });
  }

  it('tracks the centre row to a tenth of a pixel in flight (the truth: the scene row at each frame time, shake removed)', () => {
    const { scene, clip } = smallFall({ frame_rate_hz: 120, shake_px: 0.4, tilt_deg: 8, noise_grey: 4 });
    const f = findFall(clip, scene.setup);
    const inFlight = f.track.filter((p) => p.time_s > scene.truth.release_s + 0.02 && p.time_s < scene.truth.impact_s - 0.02);
    expect(inFlight.length).toBeGreaterThan(40);
    for (const p of inFlight) expect(Math.abs(p.y_px! - scene.truth.rows_px[p.frame]!), `frame ${p.frame}`).toBeLessThan(0.1);
    // The contact row: the landing line less the radius seen at the landing, against the scene's own.
    expect(f.contact_y_px).toBeCloseTo(scene.truth.rowOfHeight(0.03), 0);
  });

  it('says nothing falls in a clip where the ball hangs still', () => {
    const { scene, clip } = smallFall({ falls: false, shake_px: 0.4, noise_grey: 4 });
    expect(codeOf(() => findFall(clip, scene.setup))).toBe('nothing-falls');
  });

  it('says there is no release when the clip starts in mid-fall, and no impact when it stops before the landing', () => {
    const early = smallFall({ release_s: -0.1 });
    expect(codeOf(() => findFall(early.clip, early.scene.setup))).toBe('no-release');
    const late = renderFallScene({ frame_rate_hz: 120, width_px: 120, height_px: 280, duration_s: 0.4, release_s: 0.1031, release_height_m: 1, noise_grey: 2 });
    expect(codeOf(() => findFall(bandOfScene(late), late.setup))).toBe('no-impact');
  });

  it('names what it looked for in its message', () => {
    const { scene, clip } = smallFall({ falls: false });
    try {
      findFall(clip, scene.setup);
    } catch (e) {
      expect((e as MotionError).field).toBe('clip.frames');
      expect((e as MotionError).message).toMatch(/nothing moves down the fall line.*looked for: a body moving down/);
    }
  });

  it('refuses too few frames and timestamps out of order', () => {
    const { scene, clip } = smallFall();
    expect(codeOf(() => findFall({ ...clip, frames: clip.frames.slice(0, 5), times_s: clip.times_s.slice(0, 5) }, scene.setup))).toBe('bad-setup');
    const times = [...clip.times_s];
    times[3] = times[2]!;
    expect(codeOf(() => findFall({ ...clip, times_s: times }, scene.setup))).toBe('bad-setup');
  });
});
