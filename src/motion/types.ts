/**
 * The shapes shared by the two halves of video timing: src/video/ (browser-bound: reads a clip, decodes every frame
 * in a worker, hands over small grey frames with their own timestamps) and src/motion/ (pure: finds the falling
 * body in those frames, its release and impact to a fraction of a frame, the height fallen against time, and the
 * GUM budget of the result). Everything here is plain data: it crosses a worker boundary and is stored as evidence.
 *
 * Coordinates: pixels of the clip's full frame as displayed (after the container's rotation), x to the right, y
 * downward, origin at the top-left corner. Times: seconds on the clip's own timeline (presentation timestamps).
 */

/** What the container says about a clip before any frame is decoded. */
export interface ClipProbe {
  /** The container's codec string, for example "avc1.64001f", "vp09.00.10.08", "hvc1.1.6.L93.B0". */
  codec: string;
  /** "mp4", "webm", "quicktime", … as the demuxer names it. */
  container: string;
  width_px: number;
  height_px: number;
  /** The video track's duration, s. */
  duration_s: number;
  /** Frames in the video track, from the container's sample table. */
  frame_count: number;
  /** Median frame interval from the container's timestamps, as a rate, frames/s. */
  frame_rate_hz: number;
  /** Largest relative departure of one frame interval from the median (0 for a clip with even timing). */
  interval_spread: number;
  /** Bytes of the file. */
  size_bytes: number;
}

/** A segment on the frame, in full-frame pixels. */
export interface PixelSegment {
  x0_px: number;
  y0_px: number;
  x1_px: number;
  y1_px: number;
}

/** A mark of known height the crew tapped on a still frame: tape on a wall, a pole's bands. */
export interface ScaleMark {
  /** Where the mark is on the frame (its row matters; the column is where it was tapped). */
  x_px: number;
  y_px: number;
  /** Its height above the landing surface, m. */
  height_m: number;
}

/** What the crew sets on a still frame before the frames are searched. */
export interface ClipSetup {
  /** The line the body falls along, from above the release point to the landing: two taps. */
  fall_line: PixelSegment;
  /** The row (at the fall line) where the body meets the landing surface. */
  landing_y_px: number;
  /** Two or three marks of known height; empty: times only (no marks along the fall). */
  scale: ScaleMark[];
  /** The body's release height above the landing surface, m (from the series), used with the scale. */
  release_height_m: number;
}

/**
 * The frames the decoder hands over: a band around the fall line, downscaled and grey, one byte per pixel.
 * `frames[i]` is `width × height` bytes row by row; `times_s[i]` is its presentation timestamp. Pixel (u, v) of the
 * band is full-frame pixel (x0_px + u·step_px, y0_px + v·step_px): with step_px > 1, the mean of the step × step
 * block starting there, so its centre is at (x0_px + u·step_px + (step_px − 1)/2, y0_px + v·step_px + (step_px − 1)/2).
 */
export interface GreyClip {
  width: number;
  height: number;
  x0_px: number;
  y0_px: number;
  step_px: number;
  times_s: number[];
  frames: Uint8Array[];
}

/** Where the body was found in one frame. */
export interface TrackPoint {
  /** Index into GreyClip.frames. */
  frame: number;
  time_s: number;
  /** The body's centre, full-frame pixels; null when it was not found in this frame. */
  x_px: number | null;
  y_px: number | null;
  /** The detector's own standard uncertainty of y_px, pixels (null when not found). */
  u_y_px: number | null;
}

/** One found instant, refined to a fraction of a frame. */
export interface FoundInstant {
  /** On the clip's timeline, s. */
  time_s: number;
  /** Its standard uncertainty from the refinement, s. */
  u_time_s: number;
  /** The frame nearest to it (index into GreyClip.frames). */
  frame: number;
  /** How it was found: "found" by the detector, or "moved" by hand (the record's history keeps the reason). */
  by: 'found' | 'moved';
}

/** One row of a GUM budget for a time or a mark from a clip. */
export interface ClipBudgetRow {
  source: string;
  /** Standard uncertainty contribution, s. */
  u_s: number;
  /** Where the figure comes from (a clause of JCGM 100, a measurement, or "common practice"). */
  basis: string;
}

/** The drop a clip gives: what the log stores (see log/ DropRecord `marks` and `clip`). */
export interface ClipDrop {
  /** Fall time, impact − release, s, and its combined standard uncertainty. */
  time_s: number;
  u_time_s: number;
  budget: ClipBudgetRow[];
  /** With scale marks: distance fallen from the release point against time from the found release. */
  marks: { distance_m: number; time_s: number }[];
  release: FoundInstant;
  impact: FoundInstant;
  /** With scale marks: each mark's standard uncertainty of distance (track and scale together), m. */
  marks_u_distance_m: number[];
  /** With scale marks: the budget of the worst mark's distance, m. */
  marks_budget: { source: string; u_m: number; basis: string }[];
}

/** What a drop keeps from its clip (not the clip itself): the log's own record shape, built by clipEvidence.ts. */
export type { ClipEvidence } from '../log';
