/// <reference lib="webworker" />
/**
 * The decoding worker: reads the picked file with the demuxer (mediabunny: MP4, MOV, WebM, Matroska), refuses a
 * clip it cannot time before decoding it (clip-limits.ts), then decodes every frame with WebCodecs'
 * VideoDecoder, fed the container's encoded packets, and keeps of each frame only the grey band motion/ needs.
 *
 * Timing comes from each decoded frame's own presentation timestamp (the packet's, carried through the decoder),
 * never from a playback clock: a <video> element's clock skips and repeats frames under load.
 *
 * Platform traps, worked around here:
 * - A decoded VideoFrame holds decoder memory (on a phone, often a hardware surface from a small pool): each is
 *   closed as soon as its band is copied, or the decoder stalls once the pool is empty.
 * - The decoder's input queue is unbounded: packets are fed only while it holds fewer than DECODE_QUEUE.
 * - `copyTo` refuses a rectangle that cuts a chroma block: the copy rectangle is widened to even corners.
 * - The frame's visible rectangle may sit inside a larger coded one (1080 rows coded as 1088).
 */
import { BlobSource, EncodedPacketSink, Input, MATROSKA, MP4, QTFF, WEBM, type InputVideoTrack } from 'mediabunny';
import { PlummetError } from '../errors';
import type { ClipProbe } from '../motion';
import { checkClipProbe, checkClipSize, codecRefusal, frameIntervals, MAX_CLIP_DURATION_S, MAX_CLIP_FRAMES } from './clip-limits';
import type { FromWorker, ToWorker } from './decode-protocol';
import { codedRectOf, greyBandFromPlane, lumaOfRgb, type BandRequest, type ClipRotation } from './grey-band';
import { clipErrorWire, VideoClipError } from './video-clip-error';

declare const self: DedicatedWorkerGlobalScope;

/** Packets waiting in the decoder at most; more only costs memory. */
const DECODE_QUEUE = 8;
/** Frames per message to the page. */
const BATCH_FRAMES = 24;

let input: Input | null = null;
let track: InputVideoTrack | null = null;
let opened: { probe: ClipProbe; rotation: ClipRotation; config: VideoDecoderConfig } | null = null;

function post(message: FromWorker, transfer: Transferable[] = []): void {
  self.postMessage(message, transfer);
}

function fail(id: number | null, error: unknown): void {
  const coded =
    error instanceof PlummetError
      ? error
      : new VideoClipError({
          code: 'decode-failed',
          field: 'clip',
          value: error instanceof Error ? `${error.name}: ${error.message}` : String(error),
          allowed: null,
          message: `The clip could not be decoded (${error instanceof Error ? error.message : String(error)}). The file may be damaged or cut short: film again or pick another copy.`,
          cause: error,
        });
  post({ type: 'error', id, error: clipErrorWire(coded) });
}

self.onmessage = (event: MessageEvent<ToWorker>) => {
  const message = event.data;
  const id = message.type === 'open' ? null : message.id;
  const run = message.type === 'open' ? open(message.file) : message.type === 'still' ? still(message.id, message.time_s, message.width_px) : band(message.id, message.band);
  run.catch((error: unknown) => fail(id, error));
};

async function open(file: Blob): Promise<void> {
  checkClipSize(file.size);
  input = new Input({ formats: [MP4, QTFF, WEBM, MATROSKA], source: new BlobSource(file) });
  const notVideo = (why: string) =>
    new VideoClipError({
      code: 'not-a-video',
      field: 'clip',
      value: (file as File).name ?? 'the file',
      allowed: 'an MP4, MOV or WebM video',
      message: `${(file as File).name ?? 'The file'} is not a video this app reads (${why}); allowed: an MP4, MOV or WebM video, as a phone's camera records it.`,
    });
  if (!(await input.canRead().catch(() => false))) throw notVideo('no MP4, MOV or WebM container');
  track = await input.getPrimaryVideoTrack();
  if (!track) throw notVideo('no video track in it');
  const codec = (await track.getCodecParameterString()) ?? (await track.getCodec()) ?? 'unknown';
  if (typeof VideoDecoder === 'undefined') {
    throw new VideoClipError({
      code: 'no-decoder',
      field: 'browser',
      value: 'no VideoDecoder',
      allowed: 'a browser with WebCodecs (Chrome, Edge, Safari 16.4+, Firefox 130+)',
      message: 'This browser has no video decoder for pages (WebCodecs); allowed: a browser with WebCodecs (Chrome, Edge, Safari 16.4+, Firefox 130+). Time the drop another way or update the browser.',
    });
  }
  const config = await track.getDecoderConfig();
  const supported = config ? await VideoDecoder.isConfigSupported(config).then((s) => s.supported === true, () => false) : false;
  if (!config || !supported) throw codecRefusal(codec);
  const container = (await input.getFormat()).name;
  // The container's own duration first: a clip far too long is refused without reading its sample table.
  const declared = await track.getDurationFromMetadata().catch(() => null);
  const size_bytes = file.size;
  const width_px = await track.getDisplayWidth();
  const height_px = await track.getDisplayHeight();
  if (declared !== null && declared > MAX_CLIP_DURATION_S * 1.5) {
    checkClipProbe({ codec, container, width_px, height_px, duration_s: declared, frame_count: 0, frame_rate_hz: 0, interval_spread: 0, size_bytes });
  }
  const times: number[] = [];
  const sink = new EncodedPacketSink(track);
  for await (const packet of sink.packets(undefined, undefined, { metadataOnly: true })) {
    times.push(packet.timestamp);
    if (times.length > MAX_CLIP_FRAMES) break;
  }
  if (times.length === 0) throw notVideo('its video track has no frames');
  const resolution = await track.getTimeResolution().catch(() => 0);
  const { mean_s, spread } = frameIntervals(times, resolution > 0 ? 1 / resolution : 0);
  const first = Math.min(...times);
  const last = Math.max(...times);
  const probe: ClipProbe = {
    codec,
    container,
    width_px,
    height_px,
    duration_s: last - first + mean_s,
    frame_count: times.length,
    frame_rate_hz: mean_s > 0 ? 1 / mean_s : 0,
    interval_spread: spread,
    size_bytes,
  };
  checkClipProbe(probe);
  opened = { probe, rotation: normalRotation(await track.getRotation()), config };
  post({ type: 'opened', probe, rotation: opened.rotation });
}

/**
 * One frame near `time_s`, scaled to `width_px` and turned upright, for the crew to tap on: decoded from the key
 * frame before it (the demuxer's own frame-to-canvas helper would double the worker's size, which is precached).
 */
async function still(id: number, time_s: number, width_px: number): Promise<void> {
  if (!track || !opened) throw new Error('still before open'); // the page opens first (clip-reader.ts)
  const sink = new EncodedPacketSink(track);
  const key = (await sink.getKeyPacket(time_s)) ?? (await sink.getFirstPacket());
  if (!key) throw new Error('no frame in the clip');
  let best: VideoFrame | null = null;
  let failure: unknown = null;
  const distance = (f: VideoFrame) => Math.abs(f.timestamp / 1e6 - time_s);
  const decoder = new VideoDecoder({
    output: (frame) => {
      if (!best || distance(frame) < distance(best)) {
        best?.close();
        best = frame;
      } else frame.close();
    },
    error: (error) => {
      failure ??= error;
    },
  });
  decoder.configure(opened.config);
  const frame_s = 1 / Math.max(1, opened.probe.frame_rate_hz);
  for await (const packet of sink.packets(key)) {
    if (failure) break;
    decoder.decode(packet.toEncodedVideoChunk());
    // Frames come out of order with B-frames: go a few frames past the time asked for.
    if (packet.timestamp > time_s + 4 * frame_s) break;
  }
  if (!failure) await decoder.flush().catch((error: unknown) => (failure ??= error));
  if (decoder.state !== 'closed') decoder.close();
  const frame = best as VideoFrame | null;
  if (failure || !frame) {
    (frame as VideoFrame | null)?.close();
    throw failure ?? new Error('no frame decoded');
  }
  try {
    const rotation = opened.rotation;
    const scale = Math.max(16, Math.round(width_px)) / opened.probe.width_px;
    const canvas = new OffscreenCanvas(Math.round(opened.probe.width_px * scale), Math.round(opened.probe.height_px * scale));
    const ctx = canvas.getContext('2d');
    if (!ctx) throw new Error('no 2D canvas in the worker');
    const w = frame.displayWidth * scale;
    const h = frame.displayHeight * scale;
    ctx.translate(canvas.width / 2, canvas.height / 2);
    ctx.rotate((rotation * Math.PI) / 180);
    ctx.drawImage(frame, -w / 2, -h / 2, w, h);
    const bitmap = canvas.transferToImageBitmap();
    post({ type: 'still', id, bitmap, time_s: frame.timestamp / 1e6 }, [bitmap]);
  } finally {
    frame.close();
  }
}

/** Every frame decoded, each reduced to the grey band at once. */
async function band(id: number, request: BandRequest): Promise<void> {
  if (!track || !opened) throw new Error('band before open'); // the page opens first (clip-reader.ts)
  const { width, height } = request;
  const total = opened.probe.frame_count;
  const rotation = opened.rotation;
  let times: number[] = [];
  let frames: ArrayBuffer[] = [];
  let done = 0;
  let failure: unknown = null;
  // Frames come out in presentation order; each one's copy is chained after the last so the order holds.
  let chain: Promise<void> = Promise.resolve();
  let scratch = new Uint8Array(0);
  const flushBatch = () => {
    if (times.length === 0) return;
    post({ type: 'frames', id, times_s: times, frames }, frames);
    post({ type: 'progress', id, frames_done: done, frames_total: total });
    times = [];
    frames = [];
  };
  const take = async (frame: VideoFrame) => {
    try {
      const out = new Uint8Array(width * height);
      const visible = frame.visibleRect ?? { x: 0, y: 0, width: frame.codedWidth, height: frame.codedHeight };
      const rect = codedRectOf(request, rotation, visible.width, visible.height);
      const copyRect = { x: visible.x + rect.x, y: visible.y + rect.y, width: rect.width, height: rect.height };
      const format = frame.format;
      if (format && /^(I420|I420A|I422|I422A|I444|I444A|NV12)$/.test(format)) {
        const size = frame.allocationSize({ rect: copyRect });
        if (scratch.length < size) scratch = new Uint8Array(size);
        const [luma] = await frame.copyTo(scratch, { rect: copyRect });
        greyBandFromPlane(scratch, { offset: luma!.offset, stride: luma!.stride, pixelBytes: 1 }, rect, request, rotation, visible.width, visible.height, out);
      } else if (format && /^I4(20|22|44)A?P1[02]$/.test(format)) {
        const size = frame.allocationSize({ rect: copyRect });
        if (scratch.length < size) scratch = new Uint8Array(size);
        const [luma] = await frame.copyTo(scratch, { rect: copyRect });
        const bitDepth = format.endsWith('12') ? 12 : 10;
        greyBandFromPlane(scratch, { offset: luma!.offset, stride: luma!.stride, pixelBytes: 2, bitDepth }, rect, request, rotation, visible.width, visible.height, out);
      } else {
        // RGB frames, or an opaque (hardware) one: ask for RGBA and take its luma.
        const rgbFormat = format === 'BGRA' || format === 'BGRX' ? format : 'RGBA';
        const options = { rect: copyRect, format: rgbFormat } as VideoFrameCopyToOptions;
        const size = frame.allocationSize(options);
        if (scratch.length < size) scratch = new Uint8Array(size);
        const [plane] = await frame.copyTo(scratch, options);
        const luma = lumaOfRgb(scratch.subarray(plane!.offset), rect.width, rect.height, plane!.stride, rgbFormat !== 'RGBA');
        greyBandFromPlane(luma, { offset: 0, stride: rect.width, pixelBytes: 1 }, rect, request, rotation, visible.width, visible.height, out);
      }
      times.push(frame.timestamp / 1e6);
      frames.push(out.buffer);
      done++;
      if (times.length >= BATCH_FRAMES) flushBatch();
    } finally {
      frame.close();
    }
  };
  // Wakes the feeding loop when the decoder takes a packet or fails (a failed decoder never dequeues again).
  let wake: () => void = () => undefined;
  const decoder = new VideoDecoder({
    output: (frame) => {
      if (failure) {
        frame.close();
        return;
      }
      chain = chain.then(() => take(frame)).catch((error: unknown) => {
        failure ??= error;
      });
    },
    error: (error) => {
      failure ??= error;
      wake();
    },
  });
  decoder.configure(opened.config);
  const sink = new EncodedPacketSink(track);
  for await (const packet of sink.packets()) {
    if (failure) break;
    decoder.decode(packet.toEncodedVideoChunk());
    while (decoder.decodeQueueSize >= DECODE_QUEUE && !failure) {
      await new Promise<void>((resolve) => {
        wake = resolve;
        decoder.addEventListener('dequeue', () => resolve(), { once: true });
      });
    }
  }
  if (!failure) await decoder.flush().catch((error: unknown) => (failure ??= error));
  await chain;
  if (decoder.state !== 'closed') decoder.close();
  if (failure) throw failure;
  flushBatch();
  post({ type: 'band-done', id, band: request, width, height });
}

function normalRotation(r: number): ClipRotation {
  const n = (((Math.round(r / 90) * 90) % 360) + 360) % 360;
  return n as ClipRotation;
}
