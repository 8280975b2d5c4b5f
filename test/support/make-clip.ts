/**
 * Clips for the tests of video timing, written by Debian's ffmpeg from frames of test/support/fall-scene.ts.
 *
 * The frames go to ffmpeg as raw grey bytes on standard input; the exact commands (W×H, R frames/s):
 *
 *   H.264 MP4:  ffmpeg -y -loglevel error -f rawvideo -pix_fmt gray -s WxH -framerate R -i - \
 *                 -c:v libx264 -pix_fmt yuv420p -preset veryfast -crf 18 -movflags +faststart out.mp4
 *   VP9 WebM:   ffmpeg -y -loglevel error -f rawvideo -pix_fmt gray -s WxH -framerate R -i - \
 *                 -c:v libvpx-vp9 -pix_fmt yuv420p -b:v 0 -crf 32 -deadline realtime -cpu-used 8 -row-mt 1 out.webm
 *   HEVC MP4:   … -c:v libx265 -pix_fmt yuv420p -preset ultrafast -tag:v hvc1 out-hevc.mp4   (what many phones
 *               record by default; Chromium here cannot decode it: the "cannot decode" path)
 *
 * plus a file that is no clip at all (an MP4 name over bytes no demuxer accepts). Width and height must be even
 * (yuv420p). `decodeGreyFrames` reads a clip back through ffmpeg as grey frames, so unit tests meet real
 * compression noise without a browser.
 */
import { spawn, spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { renderFallScene, type FallScene, type FallSceneOptions } from './fall-scene';

export type ClipCodec = 'h264' | 'vp9' | 'hevc';

const ENCODER_ARGS: Record<ClipCodec, string[]> = {
  h264: ['-c:v', 'libx264', '-pix_fmt', 'yuv420p', '-preset', 'veryfast', '-crf', '18', '-movflags', '+faststart'],
  vp9: ['-c:v', 'libvpx-vp9', '-pix_fmt', 'yuv420p', '-b:v', '0', '-crf', '32', '-deadline', 'realtime', '-cpu-used', '8', '-row-mt', '1'],
  hevc: ['-c:v', 'libx265', '-pix_fmt', 'yuv420p', '-preset', 'ultrafast', '-tag:v', 'hvc1', '-x265-params', 'log-level=error'],
};
const EXTENSION: Record<ClipCodec, string> = { h264: 'mp4', vp9: 'webm', hevc: 'mp4' };

/** Where ffmpeg is, or why there is none. */
export function findFfmpeg(): { path: string | null; reason: string } {
  const path = process.env.FFMPEG_PATH ?? '/usr/bin/ffmpeg';
  const probe = spawnSync(path, ['-version'], { encoding: 'utf8' });
  return probe.status === 0 ? { path, reason: '' } : { path: null, reason: `no ffmpeg at ${path} (on Debian: apt-get install ffmpeg)` };
}

/** A fresh temporary folder for clips. */
export function clipFolder(): string {
  return mkdtempSync(join(tmpdir(), 'plummet-clips-'));
}

/** Encodes grey frames (width × height bytes each) at a constant rate into `file`. */
export async function encodeFrames(
  frames: readonly Uint8Array[],
  size: { width: number; height: number },
  frame_rate_hz: number,
  codec: ClipCodec,
  file: string,
): Promise<string> {
  if (size.width % 2 || size.height % 2) throw new Error(`clip size ${size.width}×${size.height} must be even for yuv420p`);
  const args = ['-y', '-loglevel', 'error', '-f', 'rawvideo', '-pix_fmt', 'gray', '-s', `${size.width}x${size.height}`];
  args.push('-framerate', String(frame_rate_hz), '-i', '-', ...ENCODER_ARGS[codec], file);
  const ffmpeg = spawn(findFfmpeg().path ?? 'ffmpeg', args, { stdio: ['pipe', 'ignore', 'pipe'] });
  let stderr = '';
  ffmpeg.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
  const done = new Promise<void>((resolve, reject) => {
    ffmpeg.on('error', reject);
    ffmpeg.on('close', (code) => (code === 0 ? resolve() : reject(new Error(`ffmpeg ${args.join(' ')} failed (${code}): ${stderr}`))));
  });
  for (const frame of frames) {
    if (!ffmpeg.stdin.write(frame)) await new Promise((r) => ffmpeg.stdin.once('drain', r));
  }
  ffmpeg.stdin.end();
  await done;
  return file;
}

export interface MadeClip {
  file: string;
  codec: ClipCodec;
  scene: FallScene;
}

/** Renders a fall and writes it as a clip of the given codec into `folder`. */
export async function makeFallClip(folder: string, name: string, options: FallSceneOptions, codec: ClipCodec): Promise<MadeClip> {
  const scene = renderFallScene(options);
  const file = join(folder, `${name}.${EXTENSION[codec]}`);
  await encodeFrames(scene.frames, scene, options.frame_rate_hz, codec, file);
  return { file, codec, scene };
}

/** A clip in which nothing falls: the ball hangs still the whole time. */
export function makeStillClip(folder: string, options: Omit<FallSceneOptions, 'falls'>, codec: ClipCodec = 'h264'): Promise<MadeClip> {
  return makeFallClip(folder, 'nothing-falls', { ...options, falls: false }, codec);
}

/** A file with a clip's name that no demuxer can read (bytes of no container). */
export function makeUndecodableFile(folder: string): string {
  const file = join(folder, 'undecodable.mp4');
  const bytes = new Uint8Array(4096);
  for (let i = 0; i < bytes.length; i++) bytes[i] = (i * 7919 + 13) % 251;
  writeFileSync(file, bytes);
  return file;
}

/** Decodes a clip back to grey frames with ffmpeg (for unit tests: real compression noise, no browser). */
export function decodeGreyFrames(file: string, size: { width: number; height: number }): Uint8Array[] {
  const out = spawnSync(findFfmpeg().path ?? 'ffmpeg', ['-loglevel', 'error', '-i', file, '-f', 'rawvideo', '-pix_fmt', 'gray', '-'], {
    maxBuffer: 1 << 30,
  });
  if (out.status !== 0) throw new Error(`ffmpeg could not decode ${file}: ${out.stderr.toString()}`);
  const frameBytes = size.width * size.height;
  const frames: Uint8Array[] = [];
  for (let at = 0; at + frameBytes <= out.stdout.length; at += frameBytes) frames.push(new Uint8Array(out.stdout.subarray(at, at + frameBytes)));
  return frames;
}
