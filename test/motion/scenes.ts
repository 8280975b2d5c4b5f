/** Rendered falls cut to the band motion/ asks for: what the decoder would hand over. */
import { clipBand, type GreyClip } from '../../src/motion';
import { greyBand, renderFallScene, type FallScene, type FallSceneOptions } from '../support/fall-scene';

export function bandOfScene(scene: FallScene): GreyClip {
  const band = clipBand(scene.setup, { width_px: scene.width, height_px: scene.height });
  return greyBand(scene.frames, scene.times_s, scene.width, band);
}

/** A short, small fall: 1 m, a 6 cm ball, the release between frames. Tests vary what they study. */
export function smallFall(over: Partial<FallSceneOptions> = {}): { scene: FallScene; clip: GreyClip } {
  const rate = over.frame_rate_hz ?? 120;
  const scene = renderFallScene({
    frame_rate_hz: rate,
    width_px: 120,
    height_px: 280,
    duration_s: 0.75,
    release_s: 0.1 + 0.37 / rate,
    release_height_m: 1,
    noise_grey: 2,
    seed: 1,
    ...over,
  });
  return { scene, clip: bandOfScene(scene) };
}
