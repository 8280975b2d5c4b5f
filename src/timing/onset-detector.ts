/**
 * Sound onsets (a release click, an impact) in a stream of mono audio samples, timed to the sample.
 *
 * Pure: it takes blocks of samples with the absolute frame index of their first sample and returns onsets by
 * frame index. It knows nothing of Web Audio; audio-capture.ts feeds it from an AudioWorklet.
 *
 * How it works. Two envelopes of the signal energy x² are kept: a short one (time constant ~1 ms) that follows
 * a click, and a long one (~0.3 s) that follows the background noise. The detector triggers when the short
 * envelope rises above `triggerRatio` times the long one (an energy ratio; 20 is 13 dB) and above an absolute
 * floor. The envelope lags the click by a few samples, so the onset is then placed at the first sample in the
 * last `lookBack_s` whose absolute value passes the amplitude threshold (`amplitudeFactor` times the noise
 * RMS, at least `minimumLevel`). That makes the timing independent of the envelope's delay: two clicks of
 * similar shape are measured to the sample. After an onset the detector holds off for `holdOff_s` and re-arms
 * only once the short envelope has fallen back near the noise, so an impact with its ringing and rattle gives
 * one onset. While it is not armed the noise envelope is frozen, so a loud impact does not raise the floor.
 *
 * Gaps. Browsers' audio stacks sometimes insert a block of exact digital zeros into a live stream (Chromium:
 * one 10 ms block after ~30 s, sometimes one right after start). The samples after it are then late by the
 * gap's length, so an interval across it is wrong. A real microphone's noise is never exactly zero for long,
 * so a run of at least `minimumZeroRun` exact zeros is recorded as a gap, and so is a jump in the frame index
 * between blocks. sound-interval.ts refuses any interval that spans a gap. Exact zeros also never feed the
 * noise envelope, so the silence a stream starts with does not make the first noise look loud. (A phone that
 * gates its microphone to exact silence when the room is quiet would have its intervals refused: that is the
 * safe failure.)
 */
import { TimingError } from './timing-error';

export interface OnsetDetectorOptions {
  sampleRate_Hz: number;
  /** Time constant of the short energy envelope. */
  shortWindow_s?: number;
  /** Time constant of the long (background) energy envelope. */
  longWindow_s?: number;
  /** Background noise needed before the first onset can trigger (exact zeros do not count). */
  warmUp_s?: number;
  /** Short-to-long energy ratio that triggers an onset. */
  triggerRatio?: number;
  /** Short-to-long energy ratio below which the detector re-arms after the hold-off. */
  rearmRatio?: number;
  /** Absolute amplitude (full scale 1) that a sound must pass to count at all. */
  minimumLevel?: number;
  /** The onset sample must pass this many times the background RMS amplitude. */
  amplitudeFactor?: number;
  /** How far before the trigger the onset sample is looked for. */
  lookBack_s?: number;
  /** No second onset within this time of the first. */
  holdOff_s?: number;
  /** If the sound has not died down this long after an onset, the background envelope follows it again. */
  maximumFreeze_s?: number;
  /** Exact zeros in a row that count as a gap inserted by the audio stack. */
  minimumZeroRun?: number;
}

/** Defaults chosen for a phone microphone at arm's length from a release and an impact (common practice). */
export const ONSET_DEFAULTS = {
  shortWindow_s: 0.001,
  longWindow_s: 0.3,
  warmUp_s: 0.05,
  triggerRatio: 20,
  rearmRatio: 4,
  minimumLevel: 0.002,
  amplitudeFactor: 5,
  lookBack_s: 0.003,
  holdOff_s: 0.15,
  maximumFreeze_s: 1,
  minimumZeroRun: 64,
} as const satisfies Omit<Required<OnsetDetectorOptions>, 'sampleRate_Hz'>;

export interface Onset {
  /** Absolute frame index of the first sample of the sound. */
  frame: number;
  /** Its absolute value (full scale 1). */
  amplitude: number;
  /** The background RMS amplitude when it triggered. */
  background: number;
}

export interface AudioGap {
  /** First frame of the gap. */
  start_frame: number;
  /** First frame after it. */
  end_frame: number;
  /** A run of exact zeros in the stream, or frames missing (or repeated) between two blocks. */
  kind: 'zeros' | 'discontinuity';
}

export class OnsetDetector {
  readonly sampleRate_Hz: number;
  private readonly aShort: number;
  private readonly aLong: number;
  private readonly warmUpSamples: number;
  private readonly triggerRatio: number;
  private readonly rearmRatio: number;
  private readonly minimumEnergy: number;
  private readonly minimumLevel: number;
  private readonly amplitudeFactor: number;
  private readonly lookBack: number;
  private readonly holdOff: number;
  private readonly maximumFreeze: number;
  private readonly minimumZeroRun: number;

  private short = 0;
  private long = 0;
  private backgroundSamples = 0;
  private armed = true;
  private lastOnsetFrame = -Infinity;
  /** The frame the next block should start at; null before the first block. */
  private nextFrame: number | null = null;
  private zeroRunStart = -1;
  private zeroRunLength = 0;
  /** The last samples, indexed by frame modulo its length, valid from `ringFrom`. */
  private readonly ring: Float64Array;
  private ringFrom = 0;
  private readonly gapList: AudioGap[] = [];

  constructor(options: OnsetDetectorOptions) {
    const o = { ...ONSET_DEFAULTS, ...options };
    const fs = o.sampleRate_Hz;
    if (!(fs > 0) || !Number.isFinite(fs)) throw new TimingError({ code: 'out-of-range', field: 'sampleRate_Hz', value: fs, allowed: 'a positive number of samples per second', message: `sampleRate_Hz = ${fs}: must be a positive number of samples per second` });
    this.sampleRate_Hz = fs;
    this.aShort = 1 - Math.exp(-1 / (o.shortWindow_s * fs));
    this.aLong = 1 - Math.exp(-1 / (o.longWindow_s * fs));
    this.warmUpSamples = Math.round(o.warmUp_s * fs);
    this.triggerRatio = o.triggerRatio;
    this.rearmRatio = o.rearmRatio;
    this.minimumLevel = o.minimumLevel;
    this.minimumEnergy = o.minimumLevel * o.minimumLevel;
    this.amplitudeFactor = o.amplitudeFactor;
    this.lookBack = Math.max(1, Math.round(o.lookBack_s * fs));
    this.holdOff = Math.round(o.holdOff_s * fs);
    this.maximumFreeze = Math.round(o.maximumFreeze_s * fs);
    this.minimumZeroRun = Math.max(1, Math.round(o.minimumZeroRun));
    this.ring = new Float64Array(this.lookBack + 1);
  }

  /** Every gap seen so far, in order. */
  get gaps(): readonly AudioGap[] {
    return this.gapList;
  }

  /**
   * Feeds one block of mono samples whose first sample has the absolute frame index `startFrame`;
   * returns the onsets found in it (usually none). Blocks should follow one another without a break:
   * a jump in the frame index is recorded as a gap.
   */
  process(samples: ArrayLike<number>, startFrame: number): Onset[] {
    if (!Number.isInteger(startFrame) || startFrame < 0) {
      throw new TimingError({ code: 'out-of-range', field: 'startFrame', value: startFrame, allowed: 'a frame index, an integer from 0', message: `startFrame = ${startFrame}: must be a frame index, an integer from 0` });
    }
    if (this.nextFrame !== null && startFrame !== this.nextFrame) this.discontinuity(startFrame);
    else if (this.nextFrame === null) this.ringFrom = startFrame;
    const onsets: Onset[] = [];
    const n = samples.length;
    const size = this.ring.length;
    for (let i = 0; i < n; i++) {
      const x = samples[i]!;
      const frame = startFrame + i;
      this.ring[frame % size] = x;
      if (x === 0) {
        if (this.zeroRunLength === 0) this.zeroRunStart = frame;
        this.zeroRunLength++;
      } else if (this.zeroRunLength > 0) {
        this.closeZeroRun(frame);
      }

      const e = x * x;
      this.short += this.aShort * (e - this.short);
      const sinceOnset = frame - this.lastOnsetFrame;
      if (x !== 0 && (this.armed || sinceOnset > this.maximumFreeze)) {
        this.backgroundSamples++;
        // A running mean while warming up, then the exponential average.
        this.long += Math.max(this.aLong, 1 / this.backgroundSamples) * (e - this.long);
      }

      if (this.armed) {
        if (
          this.backgroundSamples >= this.warmUpSamples &&
          this.short > this.triggerRatio * this.long &&
          this.short > this.minimumEnergy
        ) {
          const onset = this.locate(frame);
          onsets.push(onset);
          this.lastOnsetFrame = onset.frame;
          this.armed = false;
        }
      } else if (sinceOnset >= this.holdOff && this.short < this.rearmRatio * this.long) {
        this.armed = true;
      }
    }
    this.nextFrame = startFrame + n;
    return onsets;
  }

  /** Ends the stream: a run of zeros still open at the end is recorded as a gap. */
  flush(): void {
    if (this.nextFrame !== null && this.zeroRunLength > 0) this.closeZeroRun(this.nextFrame);
  }

  /** The first sample in the look-back window that passes the amplitude threshold. */
  private locate(triggerFrame: number): Onset {
    const background = Math.sqrt(this.long);
    const threshold = Math.max(this.minimumLevel, this.amplitudeFactor * background);
    const size = this.ring.length;
    const from = Math.max(this.ringFrom, triggerFrame - this.lookBack);
    for (let f = from; f <= triggerFrame; f++) {
      const a = Math.abs(this.ring[f % size]!);
      if (a > threshold) return { frame: f, amplitude: a, background };
    }
    // The energy rose from many small samples, none above the threshold: the trigger itself is the best mark.
    return { frame: triggerFrame, amplitude: Math.abs(this.ring[triggerFrame % size]!), background };
  }

  private closeZeroRun(endFrame: number): void {
    if (this.zeroRunLength >= this.minimumZeroRun) {
      this.gapList.push({ start_frame: this.zeroRunStart, end_frame: endFrame, kind: 'zeros' });
    }
    this.zeroRunLength = 0;
    this.zeroRunStart = -1;
  }

  private discontinuity(startFrame: number): void {
    const expected = this.nextFrame!;
    if (this.zeroRunLength > 0) this.closeZeroRun(expected);
    this.gapList.push({
      start_frame: Math.min(expected, startFrame),
      end_frame: Math.max(expected, startFrame),
      kind: 'discontinuity',
    });
    // Samples from before the break are not the ones just before this block.
    this.ringFrom = startFrame;
  }
}
