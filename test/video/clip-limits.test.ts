// What a clip may be before its frames are decoded: each refusal names the field, the value and the limit.
import { describe, expect, it } from 'vitest';
import type { ClipProbe } from '../../src/motion';
import { checkClipProbe, clipErrorWire, codecFamily, codecRefusal, frameIntervals, MAX_CLIP_BYTES, MAX_CLIP_DURATION_S, MAX_CLIP_FRAMES, VideoClipError } from '../../src/video';

const probe: ClipProbe = {
  codec: 'avc1.64001f',
  container: 'MP4',
  width_px: 1280,
  height_px: 720,
  duration_s: 3,
  frame_count: 720,
  frame_rate_hz: 240,
  interval_spread: 0.02,
  size_bytes: 8e6,
};

function refusal(p: ClipProbe): VideoClipError {
  try {
    checkClipProbe(p);
  } catch (e) {
    return e as VideoClipError;
  }
  throw new Error('expected a refusal');
}

describe('clip limits', () => {
  it('accepts a usual slow-motion clip', () => {
    expect(() => checkClipProbe(probe)).not.toThrow();
  });

  it('refuses a clip too large, too long or with too many frames, naming the limit', () => {
    const big = refusal({ ...probe, size_bytes: MAX_CLIP_BYTES + 1 });
    expect(big.code).toBe('clip-too-large');
    expect(big.message).toContain('400 MB');
    const long = refusal({ ...probe, duration_s: MAX_CLIP_DURATION_S + 0.5 });
    expect(long.code).toBe('clip-too-long');
    expect(long.message).toContain('20.5 s');
    expect(long.message).toContain('≤ 20 s');
    expect(refusal({ ...probe, frame_count: MAX_CLIP_FRAMES + 1 }).code).toBe('too-many-frames');
  });

  it('refuses uneven frame timing and says how to film', () => {
    const e = refusal({ ...probe, interval_spread: 1 });
    expect(e.code).toBe('frame-timing-uneven');
    expect(e.field).toBe('clip.interval_spread');
    expect(e.message).toContain('100 %');
    expect(e.message).toContain('±50 %');
  });

  it('measures frame intervals from timestamps in any order', () => {
    // 240 frames/s over 1 s with one frame missing: that interval is twice the others.
    const times = Array.from({ length: 241 }, (_, i) => i / 240).filter((_, i) => i !== 7).reverse();
    const { mean_s, spread } = frameIntervals(times);
    expect(mean_s).toBeCloseTo(1 / 239, 12);
    expect(spread).toBeCloseTo((2 / 240 - 1 / 239) * 239, 9);
    expect(spread).toBeGreaterThan(0.5);
    expect(frameIntervals([0, 1 / 30, 2 / 30]).spread).toBeCloseTo(0, 12);
  });

  it('reads steady frames on a millisecond timeline (WebM) as steady', () => {
    // 240 frames/s written in whole milliseconds: intervals of 4 and 5 ms.
    const times = Array.from({ length: 720 }, (_, i) => Math.round((i / 240) * 1000) / 1000);
    expect(frameIntervals(times).spread).toBeGreaterThan(0.15);
    const { mean_s, spread } = frameIntervals(times, 0.001);
    expect(1 / mean_s).toBeCloseTo(240, 0);
    expect(spread).toBeLessThan(0.01);
  });

  it('names HEVC and tells the crew to set the camera to its most compatible format', () => {
    const e = codecRefusal('hvc1.1.6.L93.B0');
    expect(e.code).toBe('codec-unsupported');
    expect(e.value).toBe('hvc1.1.6.L93.B0');
    expect(e.message).toContain('hvc1.1.6.L93.B0');
    expect(e.message).toContain('HEVC');
    expect(e.message).toContain('most compatible format (H.264)');
    expect(codecFamily('avc1.42e01e')).toBe('H.264');
    expect(codecFamily('vp09.00.10.08')).toBe('VP9');
    expect(codecFamily('av01.0.04M.08')).toBe('AV1');
  });

  it('carries an error across the worker boundary unchanged', () => {
    const e = codecRefusal('hev1.1.6.L93.B0');
    const back = VideoClipError.fromWire(structuredClone(clipErrorWire(e)));
    expect(back).toBeInstanceOf(VideoClipError);
    expect(back.toJSON()).toEqual(e.toJSON());
    expect(back.name).toBe('VideoClipError');
  });
});
