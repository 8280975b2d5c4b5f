import { LitElement, css, html, nothing, type PropertyValues } from 'lit';
import {
  deltaFromSI,
  deltaToSI,
  formatNumber,
  fromSI,
  parseAngle,
  parseDecimal,
  toSI,
  unitFor,
  type QuantityKind,
} from './units';

export interface QuantityChangeDetail {
  /** The SI value, or null when the field is empty or invalid. */
  value: number | null;
  /** Exactly what was typed, kept for the draft. */
  text: string;
  /** The message shown under the field, or null when the value is valid. */
  error: string | null;
}

let nextId = 0;

/**
 * `<pl-quantity>`: a number with its unit, typed with the phone's decimal keyboard.
 * The public value is SI (`value`); what is shown is in `unit`. Invalid or out-of-range input shows a
 * message naming the field, the value and the allowed range, and `value` stays null until it is valid.
 * Fires `quantity-change` (detail: QuantityChangeDetail) on every edit.
 *
 * `delta` marks a difference or standard uncertainty, converted without the unit's offset.
 */
export class QuantityInput extends LitElement {
  static override properties = {
    label: { type: String },
    quantity: { type: String },
    unit: { type: String },
    value: { type: Number },
    text: { type: String },
    min: { type: Number },
    max: { type: Number },
    minExclusive: { type: Boolean, attribute: 'min-exclusive' },
    required: { type: Boolean },
    delta: { type: Boolean },
    hint: { type: String },
    decimalComma: { type: Boolean, attribute: 'decimal-comma' },
    compact: { type: Boolean, reflect: true },
    hemispheres: { type: String },
    enterHint: { type: String, attribute: 'enter-hint' },
    error: { state: true },
  };

  declare label: string;
  declare quantity: QuantityKind;
  declare unit: string | undefined;
  declare value: number | null;
  /** Text to show instead of the formatted value (a draft being restored). */
  declare text: string | undefined;
  declare min: number | undefined;
  declare max: number | undefined;
  declare minExclusive: boolean;
  declare required: boolean;
  declare delta: boolean;
  declare hint: string;
  declare decimalComma: boolean;
  declare compact: boolean;
  /** For a coordinate: the hemisphere letters it takes ("NS" or "EW"); degrees-minutes-seconds are read too. */
  declare hemispheres: 'NS' | 'EW' | '';
  /** The label of the on-screen keyboard's Enter key (enterkeyhint): "next" by default, "done" or "send"… */
  declare enterHint: string;
  declare error: string | null;

  private readonly inputId = `pl-q-${++nextId}`;
  private typed = '';
  private editing = false;

  constructor() {
    super();
    this.label = '';
    this.quantity = 'ratio';
    this.value = null;
    this.minExclusive = false;
    this.required = false;
    this.delta = false;
    this.hint = '';
    this.decimalComma = false;
    this.compact = false;
    this.hemispheres = '';
    this.enterHint = 'next';
    this.error = null;
  }

  static override styles = css`
    :host {
      display: block;
      min-width: 0;
      margin: 0 0 var(--pl-gap, 0.9rem);
      font: inherit;
      color: var(--pl-ink, #111);
    }
    label {
      display: block;
      font-weight: 600;
      font-size: 0.95rem;
      margin-bottom: 0.3rem;
    }
    .row {
      display: flex;
      align-items: stretch;
      border: 2px solid var(--pl-line, #444);
      border-radius: 10px;
      background: var(--pl-field, #fff);
      min-height: 52px;
    }
    .row:focus-within {
      outline: 3px solid var(--pl-focus, #f2a900);
      outline-offset: 2px;
    }
    .row.bad {
      border-color: var(--pl-bad, #b00020);
    }
    input {
      flex: 1;
      width: 100%;
      min-width: 0;
      border: 0;
      background: transparent;
      color: inherit;
      font: inherit;
      font-size: 1.35rem;
      font-variant-numeric: tabular-nums;
      padding: 0.5rem 0.75rem;
      outline: none;
    }
    :host([compact]) input {
      font-size: 1.1rem;
    }
    .unit {
      display: flex;
      align-items: center;
      padding: 0 0.8rem;
      font-weight: 600;
      border-left: 1px solid var(--pl-line-soft, #999);
      color: var(--pl-ink-soft, #333);
      white-space: nowrap;
    }
    .sign {
      min-width: 48px;
      border: 0;
      border-left: 1px solid var(--pl-line-soft, #999);
      background: transparent;
      color: inherit;
      font: inherit;
      font-weight: 700;
      cursor: pointer;
    }
    .sr {
      position: absolute;
      width: 1px;
      height: 1px;
      overflow: hidden;
      clip: rect(0 0 0 0);
      white-space: nowrap;
    }
    .hint {
      font-size: 0.85rem;
      color: var(--pl-ink-soft, #333);
      margin-top: 0.25rem;
    }
    .error {
      font-size: 0.9rem;
      font-weight: 600;
      color: var(--pl-bad, #b00020);
      margin-top: 0.3rem;
    }
  `;

  private get unitDef() {
    return unitFor(this.quantity, this.unit);
  }

  private toDisplay(si: number): number {
    return this.delta ? deltaFromSI(si, this.unitDef) : fromSI(si, this.unitDef);
  }

  private toSi(shown: number): number {
    return this.delta ? deltaToSI(shown, this.unitDef) : toSI(shown, this.unitDef);
  }

  private formatted(si: number | null): string {
    if (si === null || si === undefined || !Number.isFinite(si)) return '';
    const shown = this.toDisplay(si);
    // Two digits beyond the unit's usual ones: 14.2 m shows as 46.5879 ft, not 46.58792651 ft. The SI value
    // itself is kept as it is until the person types, so showing fewer digits loses nothing.
    const text = String(Number(shown.toFixed(this.unitDef.decimals + 2)));
    return this.decimalComma ? text.replace('.', ',') : text;
  }

  protected override willUpdate(changed: PropertyValues<this>): void {
    if (changed.has('text') && this.text !== undefined) {
      this.typed = this.text;
      // An empty field handed in (a form reset after a save) is not an error until the person leaves it.
      this.error = this.typed.trim() === '' ? null : this.check(this.typed).error;
    } else if ((changed.has('value') || changed.has('unit')) && !this.editing) {
      const parsed = this.check(this.typed);
      if (this.value === null || this.value === undefined) {
        if (parsed.value !== null || changed.has('unit')) this.typed = '';
      } else if (parsed.value === null || Math.abs(parsed.value - this.value) > 1e-12 * Math.max(1, Math.abs(this.value)) || changed.has('unit')) {
        this.typed = this.formatted(this.value);
      }
      if (changed.has('unit')) this.error = null;
    }
  }

  private rangeText(): string {
    const u = this.unitDef;
    const fmt = (si: number) => formatNumber(this.toDisplay(si), u.decimals, this.decimalComma).replace(/\.?0+$/, '') || '0';
    const sym = u.symbol ? ` ${u.symbol}` : '';
    const { min, max } = this;
    if (min !== undefined && max !== undefined) {
      return this.minExclusive ? `more than ${fmt(min)} and at most ${fmt(max)}${sym}` : `${fmt(min)} to ${fmt(max)}${sym}`;
    }
    if (min !== undefined) return `${this.minExclusive ? 'more than' : 'at least'} ${fmt(min)}${sym}`;
    if (max !== undefined) return `at most ${fmt(max)}${sym}`;
    return 'any number';
  }

  /** Parses and range-checks typed text: the message names the field, the value and the allowed range. */
  check(text: string): { value: number | null; error: string | null } {
    const name = this.label || 'Value';
    if (text.trim() === '') {
      return { value: null, error: this.required ? `${name} is required (${this.rangeText()}).` : null };
    }
    let shown = parseDecimal(text);
    if (shown === null && this.hemispheres) {
      const angle = parseAngle(text, this.hemispheres);
      if ('reason' in angle) {
        const [a, b] = this.hemispheres;
        return { value: null, error: `${name}: "${text}" cannot be read (${angle.reason}). Type decimal degrees, or degrees, minutes and seconds with ${a} or ${b}, e.g. 46°06'30" ${a}. Allowed: ${this.rangeText()}.` };
      }
      shown = angle.value;
    }
    if (shown === null) {
      return { value: null, error: `${name}: "${text}" is not a number. Allowed: ${this.rangeText()}.` };
    }
    const si = this.toSi(shown);
    const low = this.min !== undefined && (this.minExclusive ? si <= this.min : si < this.min - 1e-12 * Math.abs(this.min));
    const high = this.max !== undefined && si > this.max + 1e-12 * Math.abs(this.max);
    if (low || high) {
      const sym = this.unitDef.symbol ? ` ${this.unitDef.symbol}` : '';
      return { value: null, error: `${name}: ${text.trim()}${sym} is out of range. Allowed: ${this.rangeText()}.` };
    }
    // A value let through by the round-off allowance of a unit conversion is the limit itself, so the store
    // (which allows no round-off) never refuses what this field accepted.
    if (this.max !== undefined && si > this.max) return { value: this.max, error: null };
    if (this.min !== undefined && si < this.min) return { value: this.min, error: null };
    return { value: si, error: null };
  }

  private onInput(event: Event): void {
    this.accept((event.target as HTMLInputElement).value);
  }

  /**
   * A signed field (one whose range goes below zero: a west longitude, a frost temperature) gets a sign key of its
   * own, because many phones' decimal keypads have no minus.
   */
  private get signed(): boolean {
    return this.min !== undefined && this.min < 0;
  }

  private flipSign(): void {
    const t = this.typed.trim();
    this.accept(/^[-\u2212]/.test(t) ? t.replace(/^[-\u2212]\s*/, '') : `-${t.replace(/^\+/, '')}`);
    this.editing = false;
    this.renderRoot.querySelector('input')?.focus();
  }

  private accept(text: string): void {
    this.editing = true;
    this.typed = text;
    const { value, error } = this.check(this.typed);
    // Show "required" only once the field is left, not while it is being cleared to retype.
    this.error = this.typed.trim() === '' ? null : error;
    this.value = value;
    this.dispatchEvent(
      new CustomEvent<QuantityChangeDetail>('quantity-change', {
        detail: { value, text: this.typed, error },
        bubbles: true,
        composed: true,
      }),
    );
  }

  /**
   * Enter (or the keyboard's Next) fires `quantity-enter` with the current check, so a screen can act on the
   * value in one motion (the drop entry adds the drop). The key never reaches the text.
   */
  private onKeyDown(event: KeyboardEvent): void {
    if (event.key !== 'Enter' || event.isComposing) return;
    event.preventDefault();
    const { value, error } = this.check(this.typed);
    this.dispatchEvent(new CustomEvent<QuantityChangeDetail>('quantity-enter', { detail: { value, text: this.typed, error }, bubbles: true, composed: true }));
  }

  private onBlur(): void {
    this.editing = false;
    this.error = this.check(this.typed).error;
  }

  /** Moves focus into the text field (for screens that focus the first field). */
  override focus(): void {
    this.renderRoot.querySelector('input')?.focus();
  }

  override render() {
    const u = this.unitDef;
    const errorId = `${this.inputId}-error`;
    const hintId = `${this.inputId}-hint`;
    const described = [this.hint ? hintId : '', this.error ? errorId : ''].filter(Boolean).join(' ');
    return html`
      <label for=${this.inputId}>${this.label}${u.symbol ? html` <span class="sr">(${u.name})</span>` : nothing}</label>
      <div class="row ${this.error ? 'bad' : ''}">
        <input
          id=${this.inputId}
          type="text"
          inputmode="decimal"
          autocomplete="off"
          enterkeyhint=${this.enterHint}
          .value=${this.typed}
          aria-invalid=${this.error ? 'true' : 'false'}
          aria-describedby=${described || nothing}
          ?required=${this.required}
          @input=${this.onInput}
          @keydown=${this.onKeyDown}
          @blur=${this.onBlur}
        />
        ${this.signed
          ? html`<button type="button" class="sign" aria-label=${`Change the sign of ${this.label || 'the value'}`} @click=${this.flipSign}>−/+</button>`
          : nothing}
        ${u.symbol ? html`<span class="unit" aria-hidden="true">${u.symbol}</span>` : nothing}
      </div>
      ${this.hint ? html`<div class="hint" id=${hintId}>${this.hint}</div>` : nothing}
      ${this.error ? html`<div class="error" id=${errorId} role="alert">${this.error}</div>` : nothing}
    `;
  }
}

if (!customElements.get('pl-quantity')) customElements.define('pl-quantity', QuantityInput);

declare global {
  interface HTMLElementTagNameMap {
    'pl-quantity': QuantityInput;
  }
}
