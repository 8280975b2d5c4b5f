// The evidence a drop keeps from its clip: every frame's timestamp and tracked row, the instants, the taps, and at
// most six small key frames; never the clip.
import { describe, expect, it } from 'vitest';
import { clipEvidence, findFall, keyFrameIndices, type ClipProbe } from '../../src/motion';
import { smallFall } from './scenes';

const PNG_1PX = 'data:image/png;base64,iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAAAAAA6fptVAAAACklEQVR4nGNgAAAAAgABSK+kcQAAAABJRU5ErkJggg==';

describe('clipEvidence', () => {
  const { scene, clip } = smallFall({ scale_heights_m: [0.25, 0.9] });
  const finding = findFall(clip, scene.setup);
  const probe: ClipProbe = { codec: 'vp09.00.10.08', container: 'webm', width_px: scene.width, height_px: scene.height, duration_s: 0.75, frame_count: clip.frames.length, frame_rate_hz: 120, interval_spread: 0, size_bytes: 12345 };

  it('keeps the timestamps, the track, the instants, the taps and the key frames as plain data', () => {
    const keys = keyFrameIndices(finding);
    expect(keys.length).toBeLessThanOrEqual(6);
    expect(keys).toContain(finding.release.frame);
    expect(keys).toContain(finding.impact.frame);
    const ev = clipEvidence(probe, scene.setup, finding, keys.map((i) => ({ time_s: clip.times_s[i]!, image: PNG_1PX })));
    expect(ev.frame_times_s).toEqual(clip.times_s);
    expect(ev.track_y_px.length).toBe(clip.frames.length);
    expect(ev.track_y_px[finding.impact.frame - 3]).toBeCloseTo(finding.track[finding.impact.frame - 3]!.y_px!, 2);
    expect(ev.release_s).toBe(finding.release.time_s);
    expect(ev.impact_s - ev.release_s).toBeCloseTo(scene.truth.fall_time_s, 3);
    expect(ev.scale.map((m) => m.height_m)).toEqual([0.25, 0.9]);
    expect(ev.codec).toBe('vp09.00.10.08');
    // Plain data: survives a JSON round trip unchanged.
    expect(JSON.parse(JSON.stringify(ev))).toEqual(ev);
  });

  it('refuses more than six key frames, one over 16 KB, and anything that is not an image', () => {
    const big = 'data:image/jpeg;base64,' + 'A'.repeat(Math.ceil((16 * 1024 + 3) / 3) * 4);
    expect(() => clipEvidence(probe, scene.setup, finding, Array.from({ length: 7 }, () => ({ time_s: 0, image: PNG_1PX })))).toThrow(
      expect.objectContaining({ code: 'bad-evidence', field: 'key_frames' }),
    );
    expect(() => clipEvidence(probe, scene.setup, finding, [{ time_s: 0, image: big }])).toThrow(expect.objectContaining({ code: 'bad-evidence', field: 'key_frames[0].image' }));
    expect(() => clipEvidence(probe, scene.setup, finding, [{ time_s: 0, image: 'javascript:alert(1)' }])).toThrow(expect.objectContaining({ code: 'bad-evidence' }));
  });
});
