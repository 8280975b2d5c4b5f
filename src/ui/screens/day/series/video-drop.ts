// From what motion/ found in a clip to the drop the log stores: the fall time, its uncertainty and the clip's
// evidence (timestamps, the track, the found instants, the crew's taps, a few small key frames) — never the clip.
import type { ClipProbe, ClipSetup, FoundInstant, GreyClip, TrackPoint } from '../../../../motion';
import type { ClipEvidence, DropBody } from '../../../../log';

/** How many key frames a drop keeps (the log allows 6): the frames before, at and after each found instant. */
export const KEY_FRAMES_PER_INSTANT = 3;

/**
 * The instant at a frame chosen by hand: that frame's timestamp, with the uncertainty of a rectangular
 * distribution one frame interval wide (GUM 4.3.7: half-width a = Δt/2, u = a/√3 = Δt/√12).
 */
export function instantAtFrame(clip: Pick<GreyClip, 'times_s'>, frame: number): FoundInstant {
  const t = clip.times_s;
  const i = Math.max(0, Math.min(t.length - 1, frame));
  const interval = t.length > 1 ? (t[t.length - 1]! - t[0]!) / (t.length - 1) : 0;
  return { time_s: t[i]!, u_time_s: interval / Math.sqrt(12), frame: i, by: 'moved' };
}

/** The combined standard uncertainty of impact − release (GUM 5.1.2, the two instants uncorrelated). */
export function fallTimeUncertainty(release: FoundInstant, impact: FoundInstant): number {
  return Math.hypot(release.u_time_s, impact.u_time_s);
}

export function clipEvidence(
  probe: ClipProbe,
  clip: GreyClip,
  track: readonly TrackPoint[],
  setup: ClipSetup,
  release: FoundInstant,
  impact: FoundInstant,
  keyFrames: { time_s: number; image: string }[],
): ClipEvidence {
  const rows: (number | null)[] = clip.times_s.map(() => null);
  for (const p of track) if (p.frame >= 0 && p.frame < rows.length) rows[p.frame] = p.y_px === null ? null : round3(p.y_px);
  return {
    codec: probe.codec,
    container: probe.container,
    width_px: probe.width_px,
    height_px: probe.height_px,
    frame_rate_hz: probe.frame_rate_hz,
    frame_times_s: [...clip.times_s],
    track_y_px: rows,
    release_s: release.time_s,
    u_release_s: release.u_time_s,
    impact_s: impact.time_s,
    u_impact_s: impact.u_time_s,
    fall_line: { ...setup.fall_line },
    landing_y_px: setup.landing_y_px,
    scale: setup.scale.map((m) => ({ ...m })),
    key_frames: keyFrames,
  };
}

/** The drop's fields a clip decides (the rest — series, number, note — are the entry's). */
export function clipDropFields(evidence: ClipEvidence, release: FoundInstant, impact: FoundInstant): Pick<DropBody, 'raw' | 'time_s' | 'release_time_known' | 'clip'> {
  return {
    raw: { kind: 'frames', frames: [release.frame, impact.frame], frame_rate_Hz: evidence.frame_rate_hz },
    time_s: evidence.impact_s - evidence.release_s,
    release_time_known: false,
    clip: evidence,
  };
}

function round3(x: number): number {
  return Math.round(x * 1000) / 1000;
}
