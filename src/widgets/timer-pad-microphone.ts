// The timer pad's microphone: opening and closing the sound capture, its events, and the sound-travel set-up
// it is given (checked before the drop, so a typo shows before rather than after).
import { soundTravelCorrection, speedOfSoundAt, type CapturedInterval, type OnsetHeard, type SoundCapture, type SoundCaptureOptions, type SoundTravel } from '../timing';

/** The speed of sound assumed when no air temperature is given: ISO 9613-1's reference at 20 °C. */
export const REFERENCE_TEMPERATURE_C = 20;

export interface SoundTravelInputs {
  releaseDistance: number | null | undefined;
  landingDistance: number | null | undefined;
  airTemperature: number | null | undefined;
  releaseHeight: number | null | undefined;
}

/** The sound-travel set-up for the two distances (null without both); throws a TimingError for a bad value. */
export function soundTravelFor(inputs: SoundTravelInputs): SoundTravel | null {
  const d_r = inputs.releaseDistance;
  const d_i = inputs.landingDistance;
  if (d_r === null || d_r === undefined || d_i === null || d_i === undefined) return null;
  const travel: SoundTravel = {
    distance_to_release_m: d_r,
    distance_to_landing_m: d_i,
    speed_of_sound_m_s: speedOfSoundAt(inputs.airTemperature ?? REFERENCE_TEMPERATURE_C),
    temperature_C: inputs.airTemperature ?? null,
  };
  soundTravelCorrection(travel, inputs.releaseHeight ?? undefined);
  return travel;
}

export interface MicrophoneHandlers {
  onset(heard: OnsetHeard): void;
  interval(interval: CapturedInterval): void;
  /** The capture failed by itself (the microphone was taken away, for example); it is already forgotten. */
  failed(reason: unknown): void;
}

/** One sound capture at a time, opened and closed on the pad's word. */
export class PadMicrophone {
  private capture: SoundCapture | null = null;

  constructor(
    private readonly create: (options: SoundCaptureOptions) => SoundCapture,
    private readonly handlers: MicrophoneHandlers,
  ) {}

  /** True from the moment opening starts until it is closed or fails. */
  get listening(): boolean {
    return this.capture !== null;
  }

  /**
   * Opens the microphone. Resolves "started", or "superseded" when it was closed while opening; rejects when it
   * cannot be opened (permission refused, no microphone).
   */
  async open(options: SoundCaptureOptions): Promise<'started' | 'superseded'> {
    const capture = this.create(options);
    this.capture = capture;
    capture.addEventListener('sound-onset', this.onOnset);
    capture.addEventListener('sound-interval', this.onInterval);
    capture.addEventListener('sound-error', this.onError);
    try {
      await capture.start();
    } catch (error) {
      if (this.capture === capture) this.capture = null;
      throw error;
    }
    return this.capture === capture ? 'started' : 'superseded';
  }

  async close(): Promise<void> {
    const capture = this.capture;
    if (!capture) return;
    this.capture = null;
    capture.removeEventListener('sound-onset', this.onOnset);
    capture.removeEventListener('sound-interval', this.onInterval);
    capture.removeEventListener('sound-error', this.onError);
    await capture.stop().catch(() => undefined);
  }

  /** New distances, temperature or height while listening: the next interval uses them. */
  retune(travel: SoundTravel | null, height_m: number | undefined): void {
    if (!this.capture) return;
    this.capture.soundTravel = travel;
    this.capture.height_m = height_m;
  }

  private readonly onOnset = (event: Event): void => this.handlers.onset((event as CustomEvent<OnsetHeard>).detail);

  private readonly onInterval = (event: Event): void => this.handlers.interval((event as CustomEvent<CapturedInterval>).detail);

  private readonly onError = (event: Event): void => {
    this.capture = null;
    this.handlers.failed((event as CustomEvent<unknown>).detail);
  };
}
