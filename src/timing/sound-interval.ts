import type { AudioGap, Onset } from './onset-detector';
import { FALL_TIME_LIMITS_S } from './tap-timing';
import { TimingError } from './timing-error';

/**
 * Release → impact intervals from a stream of sound onsets: the first onset is the release, the next one the
 * impact, then the next pair begins. An interval across an audio gap (see onset-detector.ts) is refused, since
 * the samples after the gap are late by its length; the pairing then starts afresh with the next onset.
 * An onset that comes longer than the longest fall after the release replaces it as the release
 * (the first was a stray sound).
 */

export interface SoundInterval {
  release_frame: number;
  impact_frame: number;
  sample_rate_Hz: number;
  /** impact_frame − release_frame. */
  frames: number;
  /** The interval as the phone heard it, before any sound travel correction. */
  heard_s: number;
  /** Null when the interval can be used; otherwise why not (code 'spans-gap'). */
  problem: TimingError | null;
}

export class SoundIntervalPairer {
  private release: Onset | null = null;

  constructor(readonly sampleRate_Hz: number) {}

  /** The onset waiting for its impact, if any. */
  get pendingRelease(): Onset | null {
    return this.release;
  }

  /**
   * Feeds the next onset; returns the interval it closes, or null when it is a release.
   * `gaps` are the detector's gaps so far (those between the two onsets are all known by then).
   */
  push(onset: Onset, gaps: readonly AudioGap[]): SoundInterval | null {
    const release = this.release;
    if (!release || (onset.frame - release.frame) / this.sampleRate_Hz > FALL_TIME_LIMITS_S.max) {
      this.release = onset;
      return null;
    }
    this.release = null;
    return intervalBetween(release.frame, onset.frame, gaps, this.sampleRate_Hz);
  }

  reset(): void {
    this.release = null;
  }
}

/** The interval between two onset frames, refused if a gap lies between them. */
export function intervalBetween(
  release_frame: number,
  impact_frame: number,
  gaps: readonly AudioGap[],
  sample_rate_Hz: number,
): SoundInterval {
  const frames = impact_frame - release_frame;
  const heard_s = frames / sample_rate_Hz;
  const gap = gaps.find((g) => g.start_frame < impact_frame && g.end_frame > release_frame);
  const problem = gap
    ? new TimingError({
        code: 'spans-gap',
        field: 'onsets',
        value: { release_frame, impact_frame, gap_start_frame: gap.start_frame, gap_end_frame: gap.end_frame },
        allowed: 'release and impact with no gap in the audio between them',
        reason:
          gap.kind === 'zeros'
            ? `the audio had ${gap.end_frame - gap.start_frame} samples of exact silence (inserted by the audio stack) between release and impact, so this interval is not the fall time`
            : `${gap.end_frame - gap.start_frame} audio frames went missing between release and impact, so this interval is not the fall time`,
      })
    : null;
  return { release_frame, impact_frame, sample_rate_Hz, frames, heard_s, problem };
}
