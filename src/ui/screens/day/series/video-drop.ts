// From what motion/ found in a clip to the drop the log stores: the fall time, with scale marks the marks along
// the fall, and the clip's evidence (timestamps, the track, the found instants, the crew's taps, a few small key
// frames) — never the clip. motion/ computes every figure; this file only lays them into the drop's fields.
import { clipDrop, clipEvidence, keyFrameIndices, type ClipProbe, type ClipSetup, type FallFinding, type GreyClip } from '../../../../motion';
import type { DropBody } from '../../../../log';

/** The drop's fields a clip decides (the rest — series, number, note — are the entry's), and its budget. */
export function clipDropFields(
  probe: ClipProbe,
  setup: ClipSetup,
  finding: FallFinding,
  keyFrame: (frame: number) => string,
): { fields: Pick<DropBody, 'raw' | 'time_s' | 'release_time_known' | 'clip' | 'marks'>; u_time_s: number } {
  const drop = clipDrop(finding, setup, probe);
  const keys = keyFrameIndices(finding).map((frame) => ({ time_s: finding.track[frame]!.time_s, image: keyFrame(frame) }));
  const evidence = clipEvidence(probe, setup, finding, keys);
  const fields: Pick<DropBody, 'raw' | 'time_s' | 'release_time_known' | 'clip' | 'marks'> = {
    raw: { kind: 'frames', frames: [finding.release.frame, finding.impact.frame], frame_rate_Hz: probe.frame_rate_hz },
    time_s: evidence.impact_s - evidence.release_s,
    release_time_known: false,
    clip: evidence,
  };
  if (drop.marks.length >= 2) fields.marks = drop.marks;
  return { fields, u_time_s: drop.u_time_s };
}

/** The standard uncertainty of a finding's fall time (motion's full budget). */
export function fallTimeUncertainty(probe: ClipProbe, setup: ClipSetup, finding: FallFinding): number {
  return clipDrop(finding, setup, probe).u_time_s;
}

export type { GreyClip };
