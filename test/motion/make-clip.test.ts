// The clip makers the browser tests use: what ffprobe (Debian's ffmpeg) says each file is.
import { spawnSync } from 'node:child_process';
import { rmSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { clipFolder, findFfmpeg, makeFallClip, makeStillClip, makeUndecodableFile } from '../support/make-clip';

const ffmpeg = findFfmpeg();
if (!ffmpeg.path) console.warn(`clip-maker tests skipped: ${ffmpeg.reason}`);

function probe(file: string): { ok: boolean; out: string } {
  const r = spawnSync('ffprobe', ['-v', 'error', '-select_streams', 'v:0', '-count_frames', '-show_entries', 'stream=codec_name,codec_tag_string,width,height,r_frame_rate,nb_read_frames', '-of', 'csv=p=0', file], { encoding: 'utf8' });
  return { ok: r.status === 0, out: (r.stdout + r.stderr).trim() };
}

describe.skipIf(!ffmpeg.path)('make-clip', () => {
  const folder = clipFolder();
  afterAll(() => rmSync(folder, { recursive: true, force: true }));
  const options = { frame_rate_hz: 120, width_px: 64, height_px: 160, duration_s: 0.5, release_s: 0.05, release_height_m: 0.5, noise_grey: 2 };

  it('writes H.264 MP4, VP9 WebM and HEVC (hvc1) MP4 at the given rate, every frame kept', async () => {
    for (const [codec, expected] of [['h264', 'h264,avc1,64,160,120/1,60'], ['vp9', 'vp9,[0][0][0][0],64,160,120/1,60'], ['hevc', 'hevc,hvc1,64,160,120/1,60']] as const) {
      const clip = await makeFallClip(folder, `fall-${codec}`, options, codec);
      expect(probe(clip.file).out).toBe(expected);
    }
  }, 60_000);

  it('writes a clip with nothing falling, and a file no demuxer reads', async () => {
    const still = await makeStillClip(folder, options);
    expect(new Set(still.scene.truth.rows_px).size).toBe(1);
    const colour = await makeFallClip(folder, 'colour', options, 'h264', true);
    expect(probe(colour.file).out).toBe('h264,avc1,64,160,120/1,60');
    const bad = probe(makeUndecodableFile(folder));
    expect(bad.ok).toBe(false);
  }, 60_000);
});
