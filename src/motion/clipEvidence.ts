/**
 * What a drop keeps from its clip: the frame timestamps, the tracked rows, the found instants, the lines and
 * marks the crew set, and a few small key frames the caller has drawn (video/ turns frames into images; motion/
 * only picks which frames and checks the limits). Not the clip: clips are large.
 */
import type { ClipEvidence, ClipProbe, ClipSetup } from './types';
import type { FallFinding } from './findFall';
import { MotionError } from './motionError';

export const EVIDENCE_MAX_FRAMES = 8000;
export const EVIDENCE_MAX_KEY_FRAMES = 6;
export const EVIDENCE_MAX_KEY_FRAME_BYTES = 16 * 1024;

const IMAGE = /^data:image\/(png|jpeg|webp);base64,([A-Za-z0-9+/]+={0,2})$/;

/** The frames worth keeping as pictures: the two frames either side of the release, and of the impact, and the one nearest to each. */
export function keyFrameIndices(finding: FallFinding): number[] {
  const n = finding.track.length;
  const around = (frame: number) => [frame - 1, frame, frame + 1];
  const picked = [...around(finding.release.frame), ...around(finding.impact.frame)].filter((i) => i >= 0 && i < n);
  return [...new Set(picked)].sort((a, b) => a - b).slice(0, EVIDENCE_MAX_KEY_FRAMES);
}

export function clipEvidence(
  probe: ClipProbe,
  setup: ClipSetup,
  finding: FallFinding,
  key_frames: { time_s: number; image: string }[],
): ClipEvidence {
  if (finding.track.length > EVIDENCE_MAX_FRAMES) {
    throw new MotionError({ code: 'bad-evidence', field: 'frame_times_s', value: finding.track.length, allowed: `at most ${EVIDENCE_MAX_FRAMES} frames`, reason: 'too many frames to keep' });
  }
  if (key_frames.length > EVIDENCE_MAX_KEY_FRAMES) {
    throw new MotionError({ code: 'bad-evidence', field: 'key_frames', value: key_frames.length, allowed: `at most ${EVIDENCE_MAX_KEY_FRAMES} images`, reason: 'too many key frames' });
  }
  key_frames.forEach((k, i) => {
    const m = IMAGE.exec(k.image);
    if (!m) {
      throw new MotionError({ code: 'bad-evidence', field: `key_frames[${i}].image`, value: k.image.slice(0, 40), allowed: 'a data: URL of a PNG, JPEG or WebP image in base64', reason: 'not an image' });
    }
    const bytes = Math.floor((m[2]!.length * 3) / 4) - (m[2]!.endsWith('==') ? 2 : m[2]!.endsWith('=') ? 1 : 0);
    if (bytes > EVIDENCE_MAX_KEY_FRAME_BYTES) {
      throw new MotionError({ code: 'bad-evidence', field: `key_frames[${i}].image`, value: `${bytes} bytes`, allowed: `at most ${EVIDENCE_MAX_KEY_FRAME_BYTES} bytes`, reason: 'a key frame too large to keep' });
    }
  });
  // Rows to a hundredth of a pixel: finer than the detector's figure, and it keeps the stored record small.
  const r = (x: number) => Math.round(x * 100) / 100;
  return {
    codec: probe.codec,
    container: probe.container,
    width_px: probe.width_px,
    height_px: probe.height_px,
    frame_rate_hz: probe.frame_rate_hz,
    frame_times_s: finding.track.map((p) => p.time_s),
    track_y_px: finding.track.map((p) => (p.y_px === null ? null : r(p.y_px))),
    release_s: finding.release.time_s,
    u_release_s: finding.release.u_time_s,
    impact_s: finding.impact.time_s,
    u_impact_s: finding.impact.u_time_s,
    fall_line: { ...setup.fall_line },
    landing_y_px: setup.landing_y_px,
    scale: setup.scale.map((m) => ({ x_px: m.x_px, y_px: m.y_px, height_m: m.height_m })),
    key_frames: key_frames.map((k) => ({ time_s: k.time_s, image: k.image })),
  };
}
