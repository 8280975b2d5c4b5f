// The detector on frames that went through a real encoder and back (Debian's ffmpeg: H.264 and VP9, the codecs
// Chromium decodes here), so it meets block artefacts and compression noise, not only the renderer's own noise.
import { rmSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { findFall } from '../../src/motion';
import { clipFolder, decodeGreyFrames, encodeFrames, findFfmpeg } from '../support/make-clip';
import { renderFallScene } from '../support/fall-scene';
import { bandOfScene } from './scenes';

const ffmpeg = findFfmpeg();
if (!ffmpeg.path) console.warn(`compressed-clip tests skipped: ${ffmpeg.reason}`);

describe.skipIf(!ffmpeg.path)('findFall on encoded clips', () => {
  const folder = clipFolder();
  afterAll(() => rmSync(folder, { recursive: true, force: true }));
  for (const codec of ['h264', 'vp9'] as const) {
    for (const rate of [30, 120, 240]) {
      it(`finds release and impact within half a frame in a ${codec} clip at ${rate} frames/s`, async () => {
        const scene = renderFallScene({
          frame_rate_hz: rate,
          width_px: 96,
          height_px: 240,
          duration_s: 0.7,
          release_s: 0.1 + 0.29 / rate,
          release_height_m: 1,
          noise_grey: 3,
          shake_px: 0.3,
          shadow: true,
          tilt_deg: 5,
          exposure_s: 0.5 / rate,
          seed: rate,
        });
        const file = await encodeFrames(scene.frames, scene, rate, codec, `${folder}/fall-${rate}.${codec === 'vp9' ? 'webm' : 'mp4'}`);
        const frames = decodeGreyFrames(file, scene);
        expect(frames.length).toBe(scene.frames.length);
        const f = findFall(bandOfScene({ ...scene, frames }), scene.setup);
        console.log(`${codec} ${rate}/s: release ${((f.release.time_s - scene.truth.release_s) * rate).toFixed(3)} frame, impact ${((f.impact.time_s - scene.truth.impact_s) * rate).toFixed(3)} frame`);
        expect(Math.abs(f.release.time_s - scene.truth.release_s) * rate).toBeLessThan(0.5);
        expect(Math.abs(f.impact.time_s - scene.truth.impact_s) * rate).toBeLessThan(0.5);
      }, 60_000);
    }
  }
});
