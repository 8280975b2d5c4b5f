import { LitElement, html, nothing, type PropertyValues } from 'lit';
import type { RawCapture } from '../log';
import { SoundCapture, type CapturedInterval, type OnsetHeard, type SoundCaptureOptions, type SoundTravel } from '../timing';
import { PadMicrophone, REFERENCE_TEMPERATURE_C, soundTravelFor } from './timer-pad-microphone';
import {
  captured,
  captureFailed,
  clicked,
  initialPadState,
  intervalRefused,
  listenFailed,
  listenStarted,
  listenStarting,
  listenStopped,
  modeSwitched,
  openPressGate,
  padDisabled,
  pressed,
  releaseHeard,
  tapMark,
  withProblem,
  type PadPhase,
  type PadState,
  type PadTarget,
} from './timer-pad-state';
import { timerPadStyles } from './timer-pad-styles';
import { PAD_TEXT, formatSeconds } from './timer-pad-text';
import { formatQuantity, inChosenUnits, unitSystemOf, type UnitChoice } from './units';

/** Detail of `time-captured`: the fall time and the capture it came from, ready for a drop record. */
export interface TimeCapturedDetail {
  time_s: number;
  raw: Extract<RawCapture, { kind: 'taps' }> | Extract<RawCapture, { kind: 'sound' }>;
}

export type TimerMode = 'tap' | 'listen';

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
    units: { attribute: false },
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
  /** The crew's units: the pad's sentences (distances, the assumed temperature) are shown in them. */
  declare units: UnitChoice;
  declare phase: PadPhase;
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
  /** Which presses were handled by pointerdown or keydown, so the click that follows is not a second tap. */
  private gate = openPressGate();
  private frame = 0;
  private readonly microphone = new PadMicrophone((options) => this.createSoundCapture(options), {
    onset: (heard: OnsetHeard) => {
      if (heard.role === 'release') this.apply(releaseHeard(this.state()));
    },
    interval: (interval: CapturedInterval) => {
      if (interval.problem || interval.time_s === null) {
        this.apply(intervalRefused(this.state(), interval.problem));
        return;
      }
      void this.microphone.close();
      this.captured(interval.time_s, interval.raw);
    },
    failed: (reason: unknown) => this.apply(captureFailed(this.state(), reason)),
  });

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
    this.units = {};
    this.phase = 'ready';
    this.time = null;
    this.elapsed = null;
    this.message = '';
    this.problem = null;
  }

  static override styles = timerPadStyles;

  override disconnectedCallback(): void {
    super.disconnectedCallback();
    this.stopRunningClock();
    void this.microphone.close();
  }

  protected override willUpdate(changed: PropertyValues<this>): void {
    if (changed.has('mode') && changed.get('mode') !== undefined) {
      // Switching mode abandons what was half done in the other one.
      this.stopRunningClock();
      if (this.mode !== 'listen') void this.microphone.close();
      this.apply(modeSwitched(this.state()));
    }
    if (changed.has('disabled') && this.disabled) {
      void this.microphone.close();
      this.stopRunningClock();
      this.apply(padDisabled(this.state()));
    }
    if (this.microphone.listening && (changed.has('releaseDistance') || changed.has('landingDistance') || changed.has('airTemperature') || changed.has('releaseHeight'))) {
      try {
        this.microphone.retune(this.soundTravel(), this.releaseHeight ?? undefined);
      } catch (error) {
        this.apply(withProblem(this.state(), error));
      }
    }
  }

  /** The pad's state as the pure state machine sees it (timer-pad-state.ts). */
  private state(): PadState {
    return { phase: this.phase, releaseAt: this.releaseAt, time: this.time, message: this.message, problem: this.problem };
  }

  private apply(next: PadState): void {
    this.phase = next.phase;
    this.releaseAt = next.releaseAt;
    this.time = next.time;
    this.message = next.message;
    this.problem = next.problem;
  }

  // ---- Tap timing -------------------------------------------------------------------------------------

  private press(which: PadTarget, timeStamp: number): void {
    if (this.disabled) return;
    const before = this.releaseAt;
    const { state, capture } = tapMark(this.state(), which, timeStamp);
    this.apply(state);
    if (which === 'release') {
      this.startRunningClock();
      return;
    }
    if (before === null) return;
    this.stopRunningClock();
    this.elapsed = null;
    if (capture) this.captured(capture.time_s, capture.raw);
  }

  private onPointerDown(which: PadTarget, event: PointerEvent): void {
    if (event.pointerType === 'mouse' && event.button !== 0) return;
    this.gate = pressed(this.gate, which);
    this.press(which, event.timeStamp);
  }

  private onKeyDown(which: PadTarget, event: KeyboardEvent): void {
    if (event.key !== ' ' && event.key !== 'Enter') return;
    // Space would scroll the page; a held key repeats, and only the first press is the mark.
    event.preventDefault();
    if (event.repeat) return;
    this.gate = pressed(this.gate, which);
    this.press(which, event.timeStamp);
  }

  /** A click without a press before it comes from assistive technology: it is the mark. */
  private onClick(which: PadTarget, event: MouseEvent): void {
    const { gate, mark } = clicked(this.gate, which);
    this.gate = gate;
    if (mark) this.press(which, event.timeStamp);
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
    return soundTravelFor(this);
  }

  private async toggleListening(): Promise<void> {
    if (this.microphone.listening) {
      await this.microphone.close();
      this.apply(listenStopped(this.state()));
      return;
    }
    if (this.disabled) return;
    let travel: SoundTravel | null;
    try {
      travel = this.soundTravel();
    } catch (error) {
      this.apply(withProblem(this.state(), error));
      return;
    }
    const opening = this.microphone.open({ soundTravel: travel, ...(this.releaseHeight != null ? { height_m: this.releaseHeight } : {}) });
    this.apply(listenStarting(this.state()));
    try {
      if ((await opening) === 'superseded') return;
    } catch (error) {
      this.apply(listenFailed(this.state(), error));
      return;
    }
    const assumed = travel && (this.airTemperature === null || this.airTemperature === undefined) ? REFERENCE_TEMPERATURE_C : null;
    this.apply(listenStarted(this.state(), travel !== null, assumed));
  }

  // ---- Output -----------------------------------------------------------------------------------------

  private captured(time_s: number, raw: TimeCapturedDetail['raw']): void {
    this.elapsed = null;
    this.apply(captured(this.state(), time_s, this.format(time_s)));
    this.dispatchEvent(new CustomEvent<TimeCapturedDetail>('time-captured', { detail: { time_s, raw }, bubbles: true, composed: true }));
  }

  private format(seconds: number, decimals = 3): string {
    return formatSeconds(seconds, this.decimalComma, decimals);
  }

  private setMode(mode: TimerMode): void {
    if (this.mode === mode) return;
    this.mode = mode;
    this.dispatchEvent(new CustomEvent<{ mode: TimerMode }>('mode-change', { detail: { mode }, bubbles: true, composed: true }));
  }

  /** A sentence of the pad in the crew's units (in SI it is shown as written). */
  private inUnits(text: string): string {
    if (unitSystemOf(this.units) === 'si') return text;
    return inChosenUnits(text, (value, kind, decimals) =>
      formatQuantity(value, kind, this.units, { decimalComma: this.decimalComma, ...(decimals !== undefined ? { decimals } : {}) }),
    );
  }

  override render() {
    const titleId = `${this.baseId}-title`;
    const running = this.phase === 'timing' && this.elapsed !== null;
    const shown = running ? this.format(this.elapsed!, 1) : this.time !== null ? this.format(this.time) : PAD_TEXT.noTime;
    const listening = this.microphone.listening;
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
        <p class="status" role="status">${this.inUnits(this.message)}</p>
        ${this.problem ? html`<p class="problem" role="alert">${this.inUnits(this.problem)}</p>` : nothing}
      </div>
    `;
  }
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
