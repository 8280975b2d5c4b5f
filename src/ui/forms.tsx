import '../widgets';
import type { ComponentChildren } from 'preact';
import { useApp } from './app-context';
import type { QuantityChangeDetail } from '../widgets';
import type { QuantityKind } from '../widgets/units';
// A notice needs no form kit: screens that show one without a form import it from ./Notice.
export { Notice } from './Notice';

/** One quantity field of a form: what was typed (kept in the draft), its SI value and its message. */
export interface FieldState {
  text?: string;
  value: number | null;
  error: string | null;
}

export const field = (value: number | null = null): FieldState => ({ value, error: null });

export function fieldsValid(...fields: Array<FieldState | undefined>): boolean {
  return fields.every((f) => f !== undefined && f.value !== null && f.error === null);
}

export interface QFieldProps {
  label: string;
  kind: QuantityKind;
  state: FieldState | undefined;
  onChange(next: FieldState): void;
  min?: number;
  max?: number;
  minExclusive?: boolean;
  required?: boolean;
  delta?: boolean;
  hint?: string;
  compact?: boolean;
  id?: string;
  /** A coordinate: the hemisphere letters it takes. */
  hemispheres?: 'NS' | 'EW';
  /** The keyboard's Enter key label (enterkeyhint) and what Enter does; without onEnter, Enter does nothing. */
  enterHint?: 'next' | 'done' | 'send' | 'go' | 'enter';
  onEnter?(state: FieldState): void;
}

/** A quantity field bound to a form's state, in the crew's chosen unit. */
export function QField(props: QFieldProps) {
  const { unit, settings } = useApp();
  return (
    <pl-quantity
      id={props.id}
      label={props.label}
      quantity={props.kind}
      unit={unit(props.kind)}
      value={props.state?.value ?? null}
      text={props.state?.text}
      min={props.min}
      max={props.max}
      minExclusive={props.minExclusive ?? false}
      required={props.required ?? true}
      delta={props.delta ?? false}
      hint={props.hint ?? ''}
      compact={props.compact ?? false}
      hemispheres={props.hemispheres ?? ''}
      decimalComma={settings.decimalComma}
      enterHint={props.enterHint ?? 'next'}
      onquantity-change={(e: CustomEvent) => {
        const d = e.detail as QuantityChangeDetail;
        props.onChange({ text: d.text, value: d.value, error: d.error });
      }}
      onquantity-enter={(e: CustomEvent) => {
        const d = e.detail as QuantityChangeDetail;
        props.onEnter?.({ text: d.text, value: d.value, error: d.error });
      }}
    />
  );
}

export function TextField(props: {
  label: string;
  value: string;
  onInput(value: string): void;
  hint?: string;
  required?: boolean;
  multiline?: boolean;
  error?: string | null;
  id: string;
  autocomplete?: string;
}) {
  const describedBy = [props.hint ? `${props.id}-hint` : '', props.error ? `${props.id}-err` : ''].filter(Boolean).join(' ') || undefined;
  return (
    <div class="field">
      <label for={props.id}>{props.label}</label>
      {props.multiline ? (
        <textarea
          id={props.id}
          rows={3}
          value={props.value}
          aria-describedby={describedBy}
          onInput={(e) => props.onInput((e.target as HTMLTextAreaElement).value)}
        />
      ) : (
        <input
          id={props.id}
          type="text"
          value={props.value}
          required={props.required}
          aria-invalid={props.error ? 'true' : 'false'}
          aria-describedby={describedBy}
          autocomplete={props.autocomplete ?? 'off'}
          onInput={(e) => props.onInput((e.target as HTMLInputElement).value)}
        />
      )}
      {props.hint ? (
        <div class="hint" id={`${props.id}-hint`}>
          {props.hint}
        </div>
      ) : null}
      {props.error ? (
        <div class="error" id={`${props.id}-err`} role="alert">
          {props.error}
        </div>
      ) : null}
    </div>
  );
}

export function Choice<T extends string>(props: {
  legend: string;
  name: string;
  value: T;
  options: Array<{ value: T; label: string }>;
  onChange(value: T): void;
  hint?: string;
  /** One option under the other, for options that are sentences. */
  stacked?: boolean;
}) {
  return (
    <fieldset class="choice">
      <legend>{props.legend}</legend>
      <div class={props.stacked ? 'choice-row choice-stack' : 'choice-row'}>
        {props.options.map((o) => (
          <label key={o.value} class={`choice-opt ${props.value === o.value ? 'on' : ''}`}>
            <input type="radio" name={props.name} value={o.value} checked={props.value === o.value} onChange={() => props.onChange(o.value)} />
            <span>{o.label}</span>
          </label>
        ))}
      </div>
      {props.hint ? <div class="hint">{props.hint}</div> : null}
    </fieldset>
  );
}

export function SelectField(props: {
  id: string;
  label: string;
  value: string;
  options: Array<{ value: string; label: string }>;
  onChange(value: string): void;
  hint?: string;
}) {
  return (
    <div class="field">
      <label for={props.id}>{props.label}</label>
      <select id={props.id} value={props.value} onChange={(e) => props.onChange((e.target as HTMLSelectElement).value)}>
        {props.options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
      {props.hint ? <div class="hint">{props.hint}</div> : null}
    </div>
  );
}

/** A form whose draft holds FieldStates by name (what useDraft returns). */
interface FieldForm<D> {
  value: D;
  set(patch: Partial<D>): void;
}

/** A measured quantity and its standard uncertainty side by side, both bound to a form's draft by name. */
export function MeasuredField<D>(props: {
  form: FieldForm<D>;
  name: keyof D & string;
  uName: keyof D & string;
  label: string;
  kind: QFieldProps['kind'];
  min?: number;
  max?: number;
  minExclusive?: boolean;
  /** The largest standard uncertainty accepted. */
  uMax: number;
}) {
  const { form, name, uName } = props;
  return (
    <div class="two">
      <QField
        label={props.label}
        kind={props.kind}
        state={form.value[name] as FieldState}
        min={props.min}
        max={props.max}
        minExclusive={props.minExclusive}
        onChange={(v) => form.set({ [name]: v } as Partial<D>)}
      />
      <QField
        label="± (std. unc.)"
        kind={props.kind}
        delta
        compact
        state={form.value[uName] as FieldState}
        min={0}
        max={props.uMax}
        onChange={(v) => form.set({ [uName]: v } as Partial<D>)}
      />
    </div>
  );
}
