// Demo drops with marks for the format, CSV and gate tests: our own invented scenario (a 240 frames/s clip of a
// ball falling past two scale marks, and a series timed by three gates), not measurements. The times follow a
// vacuum fall, t = √(2d/g) with g = 9.81 m/s², only so that they look like a fall; no test checks physics here.
import { Buffer } from 'node:buffer';
import type { ClipEvidence, DropMark, DropRecord, LogRecord, SeriesRecord } from '../../src/log/types';
import { byKind, revise, sampleLog } from '../sync/sample-log';

/** A data URL of `bytes` as `type`. */
export const dataUrl = (type: string, bytes: Uint8Array | number[]): string => `data:${type};base64,${Buffer.from(bytes).toString('base64')}`;

/** The bytes a PNG file starts with (PNG specification, §5.2 "PNG signature") and some made-up data after them. */
export const PNG_BYTES = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52, 1, 2, 3, 4];
/** A JPEG starts with SOI (FF D8) and a marker (FF …), ITU-T T.81 Annex B. */
export const JPEG_BYTES = [0xff, 0xd8, 0xff, 0xe0, 0, 16, 0x4a, 0x46, 0x49, 0x46, 0];
/** A WebP file is a RIFF container whose form type is "WEBP" (RFC 9649 §2.5). */
export const WEBP_BYTES = [...Buffer.from('RIFF'), 30, 0, 0, 0, ...Buffer.from('WEBPVP8 '), 1, 2, 3, 4];

const vacuumTime = (distance_m: number) => Math.sqrt((2 * distance_m) / 9.81);
const round = (x: number, digits = 6) => Number(x.toFixed(digits));

/** Marks at the given distances, timed as a vacuum fall from a release at time 0 (demo values). */
export function demoMarks(distances_m: readonly number[]): DropMark[] {
  return distances_m.map((d) => ({ distance_m: d, time_s: round(vacuumTime(d)) }));
}

/** A clip's evidence: 240 frames/s, release at 0.5 s, a fall of `time_s`, every frame tracked (demo values). */
export function demoClip(time_s: number): ClipEvidence {
  const rate = 240;
  const release_s = 0.5;
  const impact_s = round(release_s + time_s);
  const frames = Math.ceil((impact_s + 0.25) * rate);
  const frame_times_s = Array.from({ length: frames }, (_, i) => round(i / rate));
  const track_y_px: (number | null)[] = frame_times_s.map((t) => (t < release_s ? 120 : t > impact_s ? 1180 : round(120 + (1060 * (t - release_s) ** 2) / time_s ** 2, 2)));
  track_y_px[3] = null;
  return {
    codec: 'avc1.64001f',
    container: 'mp4',
    width_px: 720,
    height_px: 1280,
    frame_rate_hz: rate,
    frame_times_s,
    track_y_px,
    release_s,
    u_release_s: 0.0006,
    impact_s,
    u_impact_s: 0.0008,
    fall_line: { x0_px: 360, y0_px: 100, x1_px: 362, y1_px: 1190 },
    landing_y_px: 1180,
    scale: [
      { x_px: 300, y_px: 400, height_m: 1.5 },
      { x_px: 300, y_px: 900, height_m: 0.5 },
    ],
    key_frames: [
      { time_s: release_s, image: dataUrl('image/png', PNG_BYTES) },
      { time_s: impact_s, image: dataUrl('image/jpeg', JPEG_BYTES) },
      { time_s: 1, image: dataUrl('image/webp', WEBP_BYTES) },
    ],
  };
}

/**
 * The sample log (test/sync/sample-log.ts, one day, two series, five drops each) with marks: the first series
 * timed by three gates at 0.5, 1.0 and 1.5 m (each drop's marks, its time the last gate's), the second by clips
 * (marks along the fall, release time unknown, the clip's evidence). One clip drop is then corrected: its
 * release moved by hand, with a reason, so a clip sits in a history too.
 */
export function logWithMarks(): LogRecord[] {
  const log = sampleLog({ days: 1, seriesPerDay: 2, dropsPerSeries: 5 });
  const [gatesSeries, clipSeries] = byKind(log, 'series') as [SeriesRecord, SeriesRecord];
  const gates = [0.5, 1, 1.5];
  return log.map((record) => {
    if (record.id === gatesSeries.id) return { ...gatesSeries, timing_method: 'gates', gate_distances_m: gates };
    if (record.id === clipSeries.id) return { ...clipSeries, timing_method: 'video' };
    if (record.kind !== 'drop') return record;
    const drop = record as DropRecord;
    if (drop.series_id === gatesSeries.id) {
      const marks = demoMarks(gates).map((m) => ({ ...m, time_s: round(m.time_s + 0.001 * drop.seq) }));
      return { ...drop, marks, release_time_known: true, time_s: marks[2]!.time_s, height_m: 1.5, raw: { kind: 'typed', text: marks.map((m) => m.time_s).join(' ') } };
    }
    if (drop.series_id !== clipSeries.id) return drop;
    const clip = demoClip(drop.time_s);
    const withClip: DropRecord = {
      ...drop,
      marks: demoMarks([0.2, 0.6, 1.0]),
      release_time_known: false,
      clip,
      time_s: round(clip.impact_s - clip.release_s),
      raw: { kind: 'frames', frames: [120, Math.round(clip.impact_s * 240)], frame_rate_Hz: 240 },
    };
    if (drop.seq !== 2) return withClip;
    const moved = { ...clip, release_s: 0.502, impact_s: clip.impact_s };
    const corrected = revise(withClip, { clip: moved, time_s: round(moved.impact_s - moved.release_s) }, Date.parse(drop.updated_at) + 60_000, 'phoneA', 'release is one frame later: the ball still touched the hand');
    return corrected;
  });
}
