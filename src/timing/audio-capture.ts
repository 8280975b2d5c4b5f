import { PlummetError, type PlummetErrorOptions } from '../errors';
import type { RawCapture } from '../log';
import { OnsetDetector, type AudioGap, type Onset, type OnsetDetectorOptions } from './onset-detector';
import { SoundIntervalPairer, type SoundInterval } from './sound-interval';
import { soundTravelRecord, type SoundTravel } from './sound-travel';
import { checkFallTime } from './tap-timing';
import { TimingError } from './timing-error';

/**
 * Listening for the release and the impact with the phone's microphone: the browser glue around the pure
 * onset detector.
 *
 * Platform traps, worked around here:
 * - Voice processing (echo cancellation, noise suppression, automatic gain) smears and delays clicks, so all
 *   three are switched off.
 * - Messages from the audio thread reach the page 0.1 to 12 ms after the sound (more on a busy phone), so
 *   nothing is timed by when a message arrives: the AudioWorklet sends each chunk of samples with the frame
 *   index of its first sample (`currentFrame`), and onsets are frame indices.
 * - The AudioWorklet's module is a string in this file, loaded from a Blob URL: it is part of the JavaScript
 *   bundle, which the service worker precaches, so listening works offline and needs no separate file in
 *   the build. A Content-Security-Policy, if one is ever added, must allow `blob:` for scripts.
 * - The stream may start with silence and Chromium inserts 10 ms of exact zeros now and then; the detector
 *   records those as gaps, and an interval across one is reported as refused (see onset-detector.ts).
 * - When the AudioContext stops running (phone call, tab in the background), the frame count stops while the
 *   world goes on: a release heard before that is forgotten.
 */

/** Stable codes for what can stop listening before it starts. */
export type SoundCaptureErrorCode = 'microphone-unavailable' | 'microphone-refused' | 'microphone-failed' | 'audio-unavailable';

/** `value` is the platform error's name (NotAllowedError, NotFoundError…), or null. */
export class SoundCaptureError extends PlummetError<SoundCaptureErrorCode> {
  declare readonly value: string | null;
  constructor(options: PlummetErrorOptions<SoundCaptureErrorCode> & { value: string | null }) {
    super(options);
    this.name = 'SoundCaptureError';
  }
}

/**
 * The raw capture of a sound-timed drop, exactly as RawCapture 'sound' in the record model: onsets in seconds
 * from the first sample of this recording, and the sound-travel correction applied (null when none).
 */
export type SoundRawCapture = Extract<RawCapture, { kind: 'sound' }>;

export interface CapturedInterval extends SoundInterval {
  /** The fall time, corrected for sound travel when distances are given; null when refused. */
  time_s: number | null;
  /** The seconds added for sound travel (0 without distances). */
  sound_travel_correction_s: number;
  raw: SoundRawCapture;
}

export interface OnsetHeard {
  onset: Onset;
  /** Seconds from the first sample of the recording. */
  onset_s: number;
  /** Whether it starts a new interval or closes one. */
  role: 'release' | 'impact';
}

export interface SoundCaptureOptions {
  /** Tuning of the detector; the sample rate comes from the AudioContext. */
  detector?: Omit<OnsetDetectorOptions, 'sampleRate_Hz'>;
  /** Where the phone is relative to the release and landing points; null for no correction. */
  soundTravel?: SoundTravel | null;
  /** The release height, used to check the distances (see soundTravelCorrection). */
  height_m?: number;
  /** Defaults to navigator.mediaDevices. */
  mediaDevices?: MediaDevices;
}

export interface SoundCaptureEventMap {
  'sound-onset': CustomEvent<OnsetHeard>;
  'sound-interval': CustomEvent<CapturedInterval>;
  /** Listening stopped by itself (the microphone went away); detail is the error. */
  'sound-error': CustomEvent<SoundCaptureError>;
}

/** The sample rate the fake and real microphones deliver without resampling (see TOOLCHAIN notes). */
export const CAPTURE_SAMPLE_RATE_HZ = 44_100;
/** Samples per message from the audio thread: 8 render quanta, 23 ms at 44.1 kHz. */
const CHUNK_FRAMES = 1024;
const PROCESSOR_NAME = 'plummet-onset-tap';

// The AudioWorklet processor. It only copies samples out with their frame index; detection runs on the page.
// A render quantum with no input (no microphone data yet) is sent as zeros, so the detector sees it as a gap.
const WORKLET_SOURCE = `
class OnsetTap extends AudioWorkletProcessor {
  constructor(options) {
    super();
    this.size = options.processorOptions.chunkFrames;
    this.buffer = new Float32Array(this.size);
    this.fill = 0;
    this.start = 0;
    this.expected = -1;
    this.stopped = false;
    this.port.onmessage = (event) => {
      if (event.data === 'stop') this.stopped = true;
    };
  }
  send() {
    const samples = this.buffer.slice(0, this.fill);
    this.port.postMessage({ frame: this.start, samples }, [samples.buffer]);
    this.fill = 0;
  }
  process(inputs) {
    if (this.stopped) return false;
    const input = inputs[0];
    const channel = input && input.length > 0 ? input[0] : null;
    const n = channel ? channel.length : 128;
    const frame = currentFrame;
    if (this.fill > 0 && frame !== this.expected) this.send();
    for (let i = 0; i < n; i++) {
      if (this.fill === 0) this.start = frame + i;
      this.buffer[this.fill++] = channel ? channel[i] : 0;
      if (this.fill === this.size) this.send();
    }
    this.expected = frame + n;
    return true;
  }
}
registerProcessor(${JSON.stringify(PROCESSOR_NAME)}, OnsetTap);
`;

type State = 'idle' | 'starting' | 'listening' | 'stopped';

/**
 * Listens to the microphone and reports release → impact intervals.
 * Events: 'sound-onset' (each onset), 'sound-interval' (each pair, usable or refused), 'sound-error'.
 * start() must be called from a user gesture (a tap) on phones, for the AudioContext to run.
 */
export class SoundCapture extends EventTarget {
  soundTravel: SoundTravel | null;
  height_m: number | undefined;
  private readonly detectorOptions: Omit<OnsetDetectorOptions, 'sampleRate_Hz'>;
  private readonly mediaDevices: MediaDevices | undefined;
  private stateValue: State = 'idle';
  private context: AudioContext | null = null;
  private stream: MediaStream | null = null;
  private node: AudioWorkletNode | null = null;
  private source: MediaStreamAudioSourceNode | null = null;
  private detector: OnsetDetector | null = null;
  private pairer: SoundIntervalPairer | null = null;
  private originFrame: number | null = null;
  private lastFrame = 0;

  constructor(options: SoundCaptureOptions = {}) {
    super();
    this.detectorOptions = options.detector ?? {};
    this.soundTravel = options.soundTravel ?? null;
    this.height_m = options.height_m;
    this.mediaDevices = options.mediaDevices;
  }

  get state(): State {
    return this.stateValue;
  }

  /** The AudioContext's sample rate once listening (44 100 Hz where the browser allows it). */
  get sampleRate_Hz(): number | null {
    return this.context?.sampleRate ?? null;
  }

  /** Gaps the detector has found in this recording (inserted silence, lost frames). */
  get gaps(): readonly AudioGap[] {
    return this.detector?.gaps ?? [];
  }

  /** Frames analysed so far (for a level meter or a test). */
  get framesHeard(): number {
    return this.originFrame === null ? 0 : this.lastFrame - this.originFrame;
  }

  override addEventListener<K extends keyof SoundCaptureEventMap>(
    type: K,
    listener: ((event: SoundCaptureEventMap[K]) => void) | null,
    options?: boolean | AddEventListenerOptions,
  ): void;
  override addEventListener(type: string, listener: EventListenerOrEventListenerObject | null, options?: boolean | AddEventListenerOptions): void;
  override addEventListener(type: string, listener: EventListenerOrEventListenerObject | null, options?: boolean | AddEventListenerOptions): void {
    super.addEventListener(type, listener, options);
  }

  async start(): Promise<void> {
    if (this.stateValue === 'starting' || this.stateValue === 'listening') return;
    this.stateValue = 'starting';
    try {
      await this.open();
      this.stateValue = 'listening';
    } catch (error) {
      await this.close();
      this.stateValue = 'stopped';
      throw error;
    }
  }

  async stop(): Promise<void> {
    if (this.stateValue === 'idle' || this.stateValue === 'stopped') return;
    await this.close();
    this.stateValue = 'stopped';
  }

  private async open(): Promise<void> {
    const devices = this.mediaDevices ?? (typeof navigator === 'undefined' ? undefined : navigator.mediaDevices);
    if (!devices?.getUserMedia) {
      throw new SoundCaptureError({ code: 'microphone-unavailable', field: 'microphone', value: null, allowed: null, message: 'This browser gives no access to a microphone here (it needs https or localhost).' });
    }
    if (typeof AudioContext === 'undefined' || typeof AudioWorkletNode === 'undefined') {
      throw new SoundCaptureError({ code: 'audio-unavailable', field: 'microphone', value: null, allowed: null, message: 'This browser cannot analyse microphone sound (no AudioWorklet).' });
    }
    try {
      this.stream = await devices.getUserMedia({
        audio: { echoCancellation: false, noiseSuppression: false, autoGainControl: false },
        video: false,
      });
    } catch (error) {
      const name = (error as { name?: string }).name ?? null;
      if (name === 'NotAllowedError' || name === 'SecurityError') {
        throw new SoundCaptureError({ code: 'microphone-refused', field: 'microphone', value: name, allowed: null, message: 'The microphone was not allowed: allow it for this app in the browser settings to time by sound.' });
      }
      if (name === 'NotFoundError' || name === 'OverconstrainedError') {
        throw new SoundCaptureError({ code: 'microphone-unavailable', field: 'microphone', value: name, allowed: null, message: 'No microphone was found on this phone.' });
      }
      throw new SoundCaptureError({ code: 'microphone-failed', field: 'microphone', value: name, allowed: null, message: `The microphone could not be opened (${name ?? String(error)}).` });
    }
    const context = new AudioContext({ sampleRate: CAPTURE_SAMPLE_RATE_HZ, latencyHint: 'interactive' });
    this.context = context;
    const url = URL.createObjectURL(new Blob([WORKLET_SOURCE], { type: 'text/javascript' }));
    try {
      await context.audioWorklet.addModule(url);
    } finally {
      URL.revokeObjectURL(url);
    }
    this.detector = new OnsetDetector({ ...this.detectorOptions, sampleRate_Hz: context.sampleRate });
    this.pairer = new SoundIntervalPairer(context.sampleRate);
    this.originFrame = null;
    const node = new AudioWorkletNode(context, PROCESSOR_NAME, {
      numberOfInputs: 1,
      numberOfOutputs: 1,
      outputChannelCount: [1],
      // Stereo microphones are mixed down to one channel by the audio graph itself.
      channelCount: 1,
      channelCountMode: 'explicit',
      channelInterpretation: 'speakers',
      processorOptions: { chunkFrames: CHUNK_FRAMES },
    });
    this.node = node;
    node.port.onmessage = (event: MessageEvent<{ frame: number; samples: Float32Array }>) => this.receive(event.data.frame, event.data.samples);
    this.source = context.createMediaStreamSource(this.stream);
    this.source.connect(node);
    // The node's output is silence; connecting it keeps the graph pulling it on every browser.
    node.connect(context.destination);
    context.addEventListener('statechange', this.onStateChange);
    for (const track of this.stream.getAudioTracks()) track.addEventListener('ended', this.onTrackEnded);
    await context.resume();
  }

  private readonly onStateChange = (): void => {
    // Frames stop counting while the context is not running, but time goes on: a pending release is void.
    if (this.context && this.context.state !== 'running') this.pairer?.reset();
  };

  private readonly onTrackEnded = (): void => {
    const error = new SoundCaptureError({ code: 'microphone-failed', field: 'microphone', value: null, allowed: null, message: 'The microphone stopped (taken by another app, or the permission was withdrawn).' });
    void this.stop().then(() => this.dispatchEvent(new CustomEvent('sound-error', { detail: error })));
  };

  private receive(frame: number, samples: Float32Array): void {
    const detector = this.detector;
    const pairer = this.pairer;
    if (!detector || !pairer || this.stateValue === 'stopped') return;
    if (this.originFrame === null) this.originFrame = frame;
    this.lastFrame = frame + samples.length;
    for (const onset of detector.process(samples, frame)) {
      const interval = pairer.push(onset, detector.gaps);
      this.dispatchEvent(
        new CustomEvent<OnsetHeard>('sound-onset', {
          detail: { onset, onset_s: this.secondsOf(onset.frame), role: interval ? 'impact' : 'release' },
        }),
      );
      if (interval) this.dispatchEvent(new CustomEvent<CapturedInterval>('sound-interval', { detail: this.complete(interval) }));
    }
  }

  private secondsOf(frame: number): number {
    return (frame - (this.originFrame ?? 0)) / this.detector!.sampleRate_Hz;
  }

  private complete(interval: SoundInterval): CapturedInterval {
    const raw: SoundRawCapture = {
      kind: 'sound',
      onsets_s: [this.secondsOf(interval.release_frame), this.secondsOf(interval.impact_frame)],
      sample_rate_Hz: interval.sample_rate_Hz,
      sound_travel: null,
    };
    if (interval.problem) return { ...interval, time_s: null, sound_travel_correction_s: 0, raw };
    try {
      // Computed once here and stored with the capture; the time is the stored capture's own arithmetic.
      raw.sound_travel = this.soundTravel ? soundTravelRecord(this.soundTravel, this.height_m) : null;
      const correction_s = raw.sound_travel?.correction_s ?? 0;
      const time_s = checkFallTime(interval.heard_s + correction_s, 'time_s');
      return { ...interval, time_s, sound_travel_correction_s: correction_s, raw };
    } catch (error) {
      if (!(error instanceof TimingError)) throw error;
      return { ...interval, problem: error, time_s: null, sound_travel_correction_s: 0, raw };
    }
  }

  private async close(): Promise<void> {
    this.node?.port.postMessage('stop');
    if (this.node) this.node.port.onmessage = null;
    this.source?.disconnect();
    this.node?.disconnect();
    for (const track of this.stream?.getTracks() ?? []) {
      track.removeEventListener('ended', this.onTrackEnded);
      track.stop();
    }
    const context = this.context;
    context?.removeEventListener('statechange', this.onStateChange);
    this.context = null;
    this.stream = null;
    this.node = null;
    this.source = null;
    if (context && context.state !== 'closed') await context.close().catch(() => undefined);
  }
}
