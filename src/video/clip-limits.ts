import type { ClipProbe } from '../motion';
import { VideoClipError } from './video-clip-error';

/**
 * What a clip may be before any frame of it is decoded, and why:
 * - at most 20 s: a drop from 50 m lasts about 3.5 s, so 20 s leaves the crew time to start filming before the
 *   release; every frame is decoded and searched, and the phone's time and battery go with the clip's length;
 * - at most 400 MB: a phone's slow-motion clip (1080p at 240 frames/s) runs at roughly 100–160 Mbit/s
 *   (common practice), so 20 s of it is 250–400 MB; the file is read in pieces and never held whole;
 * - at most 8000 frames: every frame's timestamp and tracked row are kept as evidence with the drop;
 * - frame intervals within ±50 % of their mean (less the container's timestamp step): the refinement of the release and the impact to a fraction
 *   of a frame fits the track over neighbouring frames and needs them evenly spaced; a clip that dropped or
 *   doubled frames (a phone short of storage speed) has intervals of 0 % or 200 % of the median.
 */
export const MAX_CLIP_BYTES = 400e6;
export const MAX_CLIP_DURATION_S = 20;
export const MAX_CLIP_FRAMES = 8000;
export const FRAME_INTERVAL_SPREAD_LIMIT = 0.5;

/**
 * The mean frame interval (s) and the largest relative departure of one interval from it, less the container's
 * timestamp step `tick_s`: WebM writes times in whole milliseconds, so a steady 240 frames/s clip has intervals of
 * 4 and 5 ms, which is even timing rounded, not uneven timing.
 */
export function frameIntervals(times_s: readonly number[], tick_s = 0): { mean_s: number; spread: number } {
  const sorted = [...times_s].sort((a, b) => a - b);
  if (sorted.length < 2) return { mean_s: 0, spread: 0 };
  const mean_s = (sorted[sorted.length - 1]! - sorted[0]!) / (sorted.length - 1);
  if (!(mean_s > 0)) return { mean_s, spread: Infinity };
  let spread = 0;
  for (let i = 1; i < sorted.length; i++) {
    const departure = Math.max(0, Math.abs(sorted[i]! - sorted[i - 1]! - mean_s) - tick_s);
    spread = Math.max(spread, departure / mean_s);
  }
  return { mean_s, spread };
}

/** The file's size, checked before the container is read at all. */
export function checkClipSize(size_bytes: number): void {
  if (size_bytes > MAX_CLIP_BYTES) {
    throw new VideoClipError({
      code: 'clip-too-large',
      field: 'clip.size_bytes',
      value: size_bytes,
      allowed: `≤ ${MAX_CLIP_BYTES / 1e6} MB`,
      message: `The clip is ${megabytes(size_bytes)} MB; allowed: ≤ ${MAX_CLIP_BYTES / 1e6} MB. Trim it to the drop (a few seconds around the fall) on the phone and pick it again.`,
    });
  }
}

/** The limits on what the container says; throws the first one the clip is past. */
export function checkClipProbe(probe: ClipProbe): void {
  checkClipSize(probe.size_bytes);
  if (probe.duration_s > MAX_CLIP_DURATION_S) {
    throw new VideoClipError({
      code: 'clip-too-long',
      field: 'clip.duration_s',
      value: round3(probe.duration_s),
      allowed: `≤ ${MAX_CLIP_DURATION_S} s`,
      message: `The clip lasts ${round3(probe.duration_s)} s; allowed: ≤ ${MAX_CLIP_DURATION_S} s. Trim it to the drop (a few seconds around the fall) and pick it again.`,
    });
  }
  if (probe.frame_count > MAX_CLIP_FRAMES) {
    throw new VideoClipError({
      code: 'too-many-frames',
      field: 'clip.frame_count',
      value: probe.frame_count,
      allowed: `≤ ${MAX_CLIP_FRAMES} frames`,
      message: `The clip has ${probe.frame_count} frames; allowed: ≤ ${MAX_CLIP_FRAMES} frames. Trim it to the drop and pick it again.`,
    });
  }
  if (!(probe.interval_spread <= FRAME_INTERVAL_SPREAD_LIMIT)) {
    const percent = Math.round(probe.interval_spread * 100);
    throw new VideoClipError({
      code: 'frame-timing-uneven',
      field: 'clip.interval_spread',
      value: `${percent} %`,
      allowed: `every frame interval within ±${FRAME_INTERVAL_SPREAD_LIMIT * 100} % of the mean`,
      message: `The clip's frame timing is uneven: one frame interval departs ${percent} % from the mean (${probe.frame_rate_hz.toFixed(1)} frames/s); allowed: every frame interval within ±${FRAME_INTERVAL_SPREAD_LIMIT * 100} % of the mean. Film with a fixed frame rate (the camera's slow-motion or a "constant frame rate" setting) and with room on the phone's storage.`,
    });
  }
}

/** A codec name people recognise beside the container's string. */
export function codecFamily(codec: string): string {
  const tag = codec.split('.')[0]!.toLowerCase();
  if (tag === 'avc1' || tag === 'avc3') return 'H.264';
  if (tag === 'hvc1' || tag === 'hev1') return 'HEVC';
  if (tag === 'vp09' || tag === 'vp9') return 'VP9';
  if (tag === 'vp8') return 'VP8';
  if (tag === 'av01') return 'AV1';
  return tag || 'unknown';
}

/** The refusal for a codec this browser's decoder does not take. */
export function codecRefusal(codec: string): VideoClipError {
  const family = codecFamily(codec);
  const hevc = family.startsWith('HEVC');
  const what = hevc
    ? 'Set the camera to its most compatible format (H.264) and film again, or convert the clip to H.264 MP4.'
    : 'Film again in H.264 (the camera\'s most compatible format), or convert the clip to H.264 MP4.';
  return new VideoClipError({
    code: 'codec-unsupported',
    field: 'clip.codec',
    value: codec,
    allowed: 'a codec this browser decodes (H.264, VP9 or AV1 on most phones)',
    message: `This browser cannot decode the clip's codec ${codec} (${family}). ${what}`,
  });
}

function megabytes(bytes: number): string {
  return (bytes / 1e6).toFixed(bytes < 1e7 ? 1 : 0);
}

function round3(x: number): number {
  return Math.round(x * 1000) / 1000;
}
