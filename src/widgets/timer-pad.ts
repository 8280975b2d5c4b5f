import { LitElement, css, html, nothing, type PropertyValues } from 'lit';
import type { RawCapture } from '../log';
import {
  SoundCapture,
  TimingError,
  fallTimeFromTaps,
  soundTravelCorrection,
  speedOfSoundAt,
  type CapturedInterval,
  type OnsetHeard,
  type SoundCaptureOptions,
  type SoundTravel,
} from '../timing';

/** Detail of `time-captured`: the fall time and the capture it came from, ready for a drop record. */
export interface TimeCapturedDetail {
  time_s: number;
  raw: Extract<RawCapture, { kind: 'taps' }> | Extract<RawCapture, { kind: 'sound' }>;
}

export type TimerMode = 'tap' | 'listen';

type Phase = 'ready' | 'timing' | 'listening' | 'starting' | 'done';

/** The speed of sound assumed when no air temperature is given: ISO 9613-1's reference at 20 °C. */
const REFERENCE_TEMPERATURE_C = 20;

let nextId = 0;

/**
 * `<pl-timer-pad>`: times a drop with the phone itself.
 *
 * Tap mode: two big buttons, Release and Impact. The time is taken from the press itself (the pointerdown or
 * keydown event's `timeStamp`, on the page's monotonic clock), not from when the page gets round to handling
 * it, nor from the click that follows on release of the finger. Listen mode: the microphone hears the release
 * sound and the impact (see timing/audio-capture.ts), corrected for sound travel when `releaseDistance` and
 * `landingDistance` are given (speed of sound from `airTemperature`, 20 °C if none).
 *
 * Fires `time-captured` (detail: TimeCapturedDetail) with the fall time and the raw capture, exactly as the
 * record model's RawCapture, and `mode-change` (detail: { mode }) when the person switches between Tap and
 * Listen. No property name starts with "on": Preact would take it for a listener.
 */
export class TimerPad extends LitElement {
  static override properties = {
    label: { type: String },
    mode: { type: String, reflect: true },
    releaseDistance: { type: Number, attribute: 'release-distance' },
    landingDistance: { type: Number, attribute: 'landing-distance' },
    airTemperature: { type: Number, attribute: 'air-temperature' },
    releaseHeight: { type: Number, attribute: 'release-height' },
    disabled: { type: Boolean, reflect: true },
    decimalComma: { type: Boolean, attribute: 'decimal-comma' },
    phase: { state: true },
    time: { state: true },
    elapsed: { state: true },
    message: { state: true },
    problem: { state: true },
  };

  /** The accessible name of the pad. */
  declare label: string;
  declare mode: TimerMode;
  /** Distance from the microphone to the release point, m; with `landingDistance`, corrects for sound travel. */
  declare releaseDistance: number | null;
  /** Distance from the microphone to the landing point, m. */
  declare landingDistance: number | null;
  /** Air temperature, °C, for the speed of sound. */
  declare airTemperature: number | null;
  /** The drop height, m, used to check the two distances. */
  declare releaseHeight: number | null;
  declare disabled: boolean;
  declare decimalComma: boolean;
  declare phase: Phase;
  /** The last captured fall time, s. */
  declare time: number | null;
  /** Seconds since the release tap, while timing. */
  declare elapsed: number | null;
  /** What the pad says to the person (status line). */
  declare message: string;
  /** What went wrong, shown as an alert. */
  declare problem: string | null;

  private readonly baseId = `pl-timer-${++nextId}`;
  private releaseAt: number | null = null;
  /** Set when a press was handled by pointerdown or keydown, so the click that follows is not a second tap. */
  private readonly pressed = { release: false, impact: false };
  private frame = 0;
  private capture: SoundCapture | null = null;

  constructor() {
    super();
    this.label = 'Fall timer';
    this.mode = 'tap';
    this.releaseDistance = null;
    this.landingDistance = null;
    this.airTemperature = null;
    this.releaseHeight = null;
    this.disabled = false;
    this.decimalComma = false;
    this.phase = 'ready';
    this.time = null;
    this.elapsed = null;
    this.message = '';
    this.problem = null;
  }

  static override styles = css`
    :host {
      display: block;
      font: inherit;
      color: var(--pl-ink, #111);
      margin: 0 0 var(--pl-gap, 0.9rem);
    }
    .pad {
      border: 2px solid var(--pl-line, #444);
      border-radius: 12px;
      padding: 0.75rem;
      background: var(--pl-field, #fff);
    }
    .title {
      font-weight: 600;
      margin: 0 0 0.5rem;
    }
    .modes {
      display: flex;
      gap: 0.5rem;
      margin-bottom: 0.75rem;
    }
    button {
      font: inherit;
      color: inherit;
      border-radius: 10px;
      border: 2px solid var(--pl-line, #444);
      background: var(--pl-field, #fff);
      touch-action: manipulation;
      -webkit-tap-highlight-color: transparent;
      user-select: none;
    }
    button:focus-visible {
      outline: 4px solid var(--pl-focus, #f2a900);
      outline-offset: 2px;
    }
    button:disabled {
      opacity: 0.5;
    }
    .mode {
      flex: 1;
      min-height: 48px;
      font-weight: 600;
    }
    .mode[aria-pressed='true'] {
      background: var(--pl-brand, #0b3d2e);
      border-color: var(--pl-brand, #0b3d2e);
      color: var(--pl-brand-ink, #fff);
    }
    .time {
      font-size: 3.2rem;
      line-height: 1.1;
      font-weight: 700;
      font-variant-numeric: tabular-nums;
      text-align: center;
      margin: 0.25rem 0 0.5rem;
      min-height: 1.1em;
    }
    .time .unit {
      font-size: 1.6rem;
      font-weight: 600;
    }
    .big {
      display: grid;
      grid-template-columns: 1fr 1fr;
      gap: 0.75rem;
    }
    .big.one {
      grid-template-columns: 1fr;
    }
    .target {
      min-height: 96px;
      min-width: 64px;
      font-size: 1.5rem;
      font-weight: 700;
    }
    .target.release[data-armed] {
      background: var(--pl-good-bg, #dcefe6);
    }
    .status {
      margin: 0.6rem 0 0;
      font-size: 0.95rem;
      color: var(--pl-ink-soft, #333);
      min-height: 1.3em;
    }
    .problem {
      margin: 0.5rem 0 0;
      font-weight: 600;
      color: var(--pl-bad, #b00020);
    }
  `;

  override disconnectedCallback(): void {
    super.disconnectedCallback();
    this.stopRunningClock();
    void this.stopListening();
  }

  protected override willUpdate(changed: PropertyValues<this>): void {
    if (changed.has('mode') && changed.get('mode') !== undefined) {
      // Switching mode abandons what was half done in the other one.
      this.releaseAt = null;
      this.stopRunningClock();
      if (this.mode !== 'listen') void this.stopListening();
      this.phase = 'ready';
      this.problem = null;
      this.message = '';
    }
    if (changed.has('disabled') && this.disabled) {
      void this.stopListening();
      this.releaseAt = null;
      this.stopRunningClock();
      if (this.phase !== 'done') this.phase = 'ready';
    }
    if (this.capture && (changed.has('releaseDistance') || changed.has('landingDistance') || changed.has('airTemperature') || changed.has('releaseHeight'))) {
      try {
        this.capture.soundTravel = this.soundTravel();
        this.capture.height_m = this.releaseHeight ?? undefined;
      } catch (error) {
        this.problem = describe(error);
      }
    }
  }

  // ---- Tap timing -------------------------------------------------------------------------------------

  private press(which: 'release' | 'impact', timeStamp: number): void {
    if (this.disabled) return;
    if (which === 'release') {
      this.releaseAt = timeStamp;
      this.problem = null;
      this.phase = 'timing';
      this.message = 'Timing: tap Impact when it lands.';
      this.startRunningClock();
      return;
    }
    if (this.releaseAt === null) {
      this.problem = 'Tap Release first, at the moment the specimen is let go.';
      return;
    }
    const release = this.releaseAt;
    this.releaseAt = null;
    this.stopRunningClock();
    try {
      const time_s = fallTimeFromTaps(release, timeStamp);
      this.captured(time_s, { kind: 'taps', timestamps_ms: [release, timeStamp] });
    } catch (error) {
      this.phase = 'ready';
      this.elapsed = null;
      this.message = '';
      this.problem = describe(error);
    }
  }

  private onPointerDown(which: 'release' | 'impact', event: PointerEvent): void {
    if (event.pointerType === 'mouse' && event.button !== 0) return;
    this.pressed[which] = true;
    this.press(which, event.timeStamp);
  }

  private onKeyDown(which: 'release' | 'impact', event: KeyboardEvent): void {
    if (event.key !== ' ' && event.key !== 'Enter') return;
    // Space would scroll the page; a held key repeats, and only the first press is the mark.
    event.preventDefault();
    if (event.repeat) return;
    this.pressed[which] = true;
    this.press(which, event.timeStamp);
  }

  /** A click without a press before it comes from assistive technology: it is the mark. */
  private onClick(which: 'release' | 'impact', event: MouseEvent): void {
    if (this.pressed[which]) {
      this.pressed[which] = false;
      return;
    }
    this.press(which, event.timeStamp);
  }

  private startRunningClock(): void {
    this.stopRunningClock();
    if (typeof requestAnimationFrame !== 'function') return;
    const tick = () => {
      if (this.releaseAt === null) return;
      this.elapsed = Math.max(0, (performance.now() - this.releaseAt) / 1000);
      this.frame = requestAnimationFrame(tick);
    };
    this.frame = requestAnimationFrame(tick);
  }

  private stopRunningClock(): void {
    if (this.frame && typeof cancelAnimationFrame === 'function') cancelAnimationFrame(this.frame);
    this.frame = 0;
  }

  // ---- Listening --------------------------------------------------------------------------------------

  /** Where the sound capture comes from; a test may hand in its own. */
  protected createSoundCapture(options: SoundCaptureOptions): SoundCapture {
    return new SoundCapture(options);
  }

  private soundTravel(): SoundTravel | null {
    const d_r = this.releaseDistance;
    const d_i = this.landingDistance;
    if (d_r === null || d_r === undefined || d_i === null || d_i === undefined) return null;
    const travel: SoundTravel = {
      distance_to_release_m: d_r,
      distance_to_landing_m: d_i,
      speed_of_sound_m_s: speedOfSoundAt(this.airTemperature ?? REFERENCE_TEMPERATURE_C),
      temperature_C: this.airTemperature ?? null,
    };
    // Checks the distances now, so a typo shows before the drop rather than after it.
    soundTravelCorrection(travel, this.releaseHeight ?? undefined);
    return travel;
  }

  private async toggleListening(): Promise<void> {
    if (this.capture) {
      await this.stopListening();
      this.phase = this.time === null ? 'ready' : 'done';
      this.message = 'Stopped listening.';
      return;
    }
    if (this.disabled) return;
    let travel: SoundTravel | null;
    try {
      travel = this.soundTravel();
    } catch (error) {
      this.problem = describe(error);
      return;
    }
    const capture = this.createSoundCapture({ soundTravel: travel, ...(this.releaseHeight != null ? { height_m: this.releaseHeight } : {}) });
    this.capture = capture;
    this.problem = null;
    this.phase = 'starting';
    this.message = 'Opening the microphone…';
    capture.addEventListener('sound-onset', this.onOnset);
    capture.addEventListener('sound-interval', this.onInterval);
    capture.addEventListener('sound-error', this.onCaptureError);
    try {
      await capture.start();
    } catch (error) {
      if (this.capture === capture) this.capture = null;
      this.phase = 'ready';
      this.message = '';
      this.problem = describe(error);
      return;
    }
    if (this.capture !== capture) return;
    this.phase = 'listening';
    const assumed = travel && (this.airTemperature === null || this.airTemperature === undefined) ? ` (speed of sound at ${REFERENCE_TEMPERATURE_C} °C assumed)` : '';
    this.message = `Listening: make the release sound, then let it land.${travel ? ` Corrected for sound travel${assumed}.` : ''}`;
  }

  private async stopListening(): Promise<void> {
    const capture = this.capture;
    if (!capture) return;
    this.capture = null;
    capture.removeEventListener('sound-onset', this.onOnset);
    capture.removeEventListener('sound-interval', this.onInterval);
    capture.removeEventListener('sound-error', this.onCaptureError);
    await capture.stop().catch(() => undefined);
  }

  private readonly onOnset = (event: Event): void => {
    const heard = (event as CustomEvent<OnsetHeard>).detail;
    if (heard.role === 'release') this.message = 'Release heard: waiting for the impact…';
  };

  private readonly onInterval = (event: Event): void => {
    const interval = (event as CustomEvent<CapturedInterval>).detail;
    if (interval.problem || interval.time_s === null) {
      this.problem = `${describe(interval.problem)} Still listening: drop again.`;
      this.message = 'Listening: make the release sound, then let it land.';
      return;
    }
    void this.stopListening();
    this.captured(interval.time_s, interval.raw);
  };

  private readonly onCaptureError = (event: Event): void => {
    this.capture = null;
    this.phase = this.time === null ? 'ready' : 'done';
    this.message = '';
    this.problem = describe((event as CustomEvent<unknown>).detail);
  };

  // ---- Output -----------------------------------------------------------------------------------------

  private captured(time_s: number, raw: TimeCapturedDetail['raw']): void {
    this.time = time_s;
    this.elapsed = null;
    this.phase = 'done';
    this.problem = null;
    this.message = `Fall time ${this.format(time_s)} s captured.`;
    this.dispatchEvent(new CustomEvent<TimeCapturedDetail>('time-captured', { detail: { time_s, raw }, bubbles: true, composed: true }));
  }

  private format(seconds: number, decimals = 3): string {
    const text = seconds.toFixed(decimals);
    return this.decimalComma ? text.replace('.', ',') : text;
  }

  private setMode(mode: TimerMode): void {
    if (this.mode === mode) return;
    this.mode = mode;
    this.dispatchEvent(new CustomEvent<{ mode: TimerMode }>('mode-change', { detail: { mode }, bubbles: true, composed: true }));
  }

  override render() {
    const titleId = `${this.baseId}-title`;
    const running = this.phase === 'timing' && this.elapsed !== null;
    const shown = running ? this.format(this.elapsed!, 1) : this.time !== null ? this.format(this.time) : '–.–––';
    const listening = this.capture !== null;
    return html`
      <div class="pad" role="group" aria-labelledby=${titleId}>
        <p class="title" id=${titleId}>${this.label}</p>
        <div class="modes" role="group" aria-label="Timing by">
          <button type="button" class="mode" aria-pressed=${this.mode === 'tap' ? 'true' : 'false'} ?disabled=${this.disabled} @click=${() => this.setMode('tap')}>
            Tap
          </button>
          <button type="button" class="mode" aria-pressed=${this.mode === 'listen' ? 'true' : 'false'} ?disabled=${this.disabled} @click=${() => this.setMode('listen')}>
            Listen
          </button>
        </div>
        <div class="time" aria-hidden=${running || this.time === null ? 'true' : 'false'}>
          ${shown} <span class="unit">s</span>
        </div>
        ${this.mode === 'tap'
          ? html`<div class="big">
              <button
                type="button"
                class="target release"
                ?data-armed=${this.phase === 'timing'}
                ?disabled=${this.disabled}
                @pointerdown=${(e: PointerEvent) => this.onPointerDown('release', e)}
                @keydown=${(e: KeyboardEvent) => this.onKeyDown('release', e)}
                @click=${(e: MouseEvent) => this.onClick('release', e)}
              >
                Release
              </button>
              <button
                type="button"
                class="target impact"
                ?disabled=${this.disabled}
                @pointerdown=${(e: PointerEvent) => this.onPointerDown('impact', e)}
                @keydown=${(e: KeyboardEvent) => this.onKeyDown('impact', e)}
                @click=${(e: MouseEvent) => this.onClick('impact', e)}
              >
                Impact
              </button>
            </div>`
          : html`<div class="big one">
              <button
                type="button"
                class="target listen"
                aria-pressed=${listening ? 'true' : 'false'}
                ?disabled=${this.disabled || this.phase === 'starting'}
                @click=${() => void this.toggleListening()}
              >
                ${listening ? 'Stop listening' : 'Start listening'}
              </button>
            </div>`}
        <p class="status" role="status">${this.message}</p>
        ${this.problem ? html`<p class="problem" role="alert">${this.problem}</p>` : nothing}
      </div>
    `;
  }
}

/** What each field is called on the pad. */
const FIELD_WORDS: Record<string, { name: string; unit: string }> = {
  distance_to_release_m: { name: 'Distance to the release point', unit: ' m' },
  distance_to_landing_m: { name: 'Distance to the landing point', unit: ' m' },
  speed_of_sound_m_s: { name: 'Speed of sound', unit: ' m/s' },
  temperature_C: { name: 'Air temperature', unit: ' °C' },
  height_m: { name: 'Drop height', unit: ' m' },
  onsets: { name: 'Sound timing', unit: '' },
};

/** A sentence for the crew naming the field, the value and the allowed range. */
function describe(error: unknown): string {
  if (error instanceof TimingError) {
    const words = FIELD_WORDS[error.field] ?? { name: 'Fall time', unit: ' s' };
    if (error.code === 'out-of-range' || error.code === 'not-finite') {
      const what = error.code === 'not-finite' ? 'is not a number' : 'is out of range';
      return `${words.name}: ${String(error.value)}${words.unit} ${what}. Allowed: ${error.allowed}.`;
    }
    const reason = error.reason.charAt(0).toUpperCase() + error.reason.slice(1);
    return `${words.name}: ${reason}. Allowed: ${error.allowed}.`;
  }
  if (error instanceof Error) return error.message;
  return String(error);
}

if (!customElements.get('pl-timer-pad')) customElements.define('pl-timer-pad', TimerPad);

declare global {
  interface HTMLElementTagNameMap {
    'pl-timer-pad': TimerPad;
  }
  interface HTMLElementEventMap {
    'time-captured': CustomEvent<TimeCapturedDetail>;
    'mode-change': CustomEvent<{ mode: TimerMode }>;
  }
}
