/**
 * Speed of the fall detector on this machine: `npm run bench:motion`.
 *
 * findFall on 720 frames (3 s at 240 frames/s) of a 96 × 400 band — the largest band clipBand hands over — of a
 * rendered 2 m fall (texture, shadow, blur, shake, noise; test/support/fall-scene.ts). Prints the median of 5 runs
 * after a warm-up, the frames per second that makes, the memory the run holds (heap and typed arrays), and the
 * load average beside them
 * (other work on a shared machine moves these numbers). Rendering the frames is not timed.
 */
import { cpus, loadavg } from 'node:os';
import { findFall, type GreyClip } from '../src/motion/index';
import { renderFallScene } from '../test/support/fall-scene';

const rate = 240;
const scene = renderFallScene({
  frame_rate_hz: rate,
  width_px: 96,
  height_px: 400,
  duration_s: 3,
  release_s: 1 + 0.37 / rate,
  release_height_m: 2,
  noise_grey: 3,
  shake_px: 0.3,
  shadow: true,
  exposure_s: 0.5 / rate,
  tilt_deg: 5,
  seed: 7,
});
const clip: GreyClip = { width: 96, height: 400, x0_px: 0, y0_px: 0, step_px: 1, times_s: scene.times_s, frames: scene.frames };

let sink = 0;
const run = () => {
  const f = findFall(clip, scene.setup);
  sink += f.impact.time_s - f.release.time_s;
  return f;
};
const check = run();
const times: number[] = [];
let heapPeak = 0;
for (let i = 0; i < 5; i++) {
  const m0 = process.memoryUsage();
  const t0 = performance.now();
  run();
  times.push(performance.now() - t0);
  const m1 = process.memoryUsage();
  // Heap and typed-array buffers together, read before the collector frees the run's frames: what the run holds at its end.
  heapPeak = Math.max(heapPeak, m1.heapUsed + m1.arrayBuffers - m0.heapUsed - m0.arrayBuffers);
}
times.sort((a, b) => a - b);
const ms = times[2]!;
const load = loadavg().map((x) => x.toFixed(2)).join(' ');
console.log(`findFall, ${clip.frames.length} frames of ${clip.width} × ${clip.height}: median ${ms.toFixed(0)} ms (${((clip.frames.length / ms) * 1000).toFixed(0)} frames/s), memory held at its end up to ${(heapPeak / 1e6).toFixed(0)} MB`);
console.log(`errors: release ${((check.release.time_s - scene.truth.release_s) * rate).toFixed(3)} frame, impact ${((check.impact.time_s - scene.truth.impact_s) * rate).toFixed(3)} frame`);
console.log(`load average ${load} on ${cpus().length} cores (sink ${sink.toFixed(3)})`);
