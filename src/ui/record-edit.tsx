// Correcting, removing and reading the history of any record the crew made, in one place for every kind.
// A correction is a new version (store.revise, with the revision the form was opened on); a measured value
// needs a reason, which the store asks for and this form passes on. Removing leaves a tombstone with a
// reason. Both offer an undo. The history lists every version: which phone, when, why, what changed.
import { useState } from 'preact/hooks';
import type { BodyOf, LogRecord, RecordKind, Revision } from '../log';
import { REASON_REQUIRED_FIELDS } from '../log';
import type { QuantityKind } from '../widgets/units';
import { useApp } from './app-context';
import { describeError } from './errors';
import { Notice, QField, SelectField, TextField, type FieldState } from './forms';
import { useStoreData } from './use-store-data';
import { useUndo } from './undo';

/** One editable field; `name` may reach into a nested value ("humidity.dew_point_C"), replaced whole in the patch. */
export type EditField =
  | { name: string; label: string; type: 'quantity'; kind: QuantityKind; min?: number; max?: number; minExclusive?: boolean; optional?: boolean }
  | { name: string; label: string; type: 'text' | 'instant' | 'date' | 'list' }
  | { name: string; label: string; type: 'select'; options: Array<{ value: string; label: string }> };

const getPath = (body: Record<string, unknown>, path: string): unknown =>
  path.split('.').reduce<unknown>((v, k) => (v !== null && typeof v === 'object' ? (v as Record<string, unknown>)[k] : undefined), body);

function withPath(body: Record<string, unknown>, path: string, value: unknown): Record<string, unknown> {
  const [head, ...rest] = path.split('.') as [string, ...string[]];
  if (rest.length === 0) return { ...body, [head]: value };
  return { ...body, [head]: withPath({ ...((body[head] as Record<string, unknown>) ?? {}) }, rest.join('.'), value) };
}

const pad = (n: number) => String(n).padStart(2, '0');
/** An instant as the phone's local "YYYY-MM-DDTHH:MM" (what a datetime-local input shows). */
export function localInput(iso: string): string {
  const d = new Date(iso);
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

type Values = Record<string, FieldState | string>;

/** "this series" → "Series", "drop 3" → "Drop 3": how the undo bar names the record. */
const undoName = (label: string) => {
  const name = label.replace(/^this /, '');
  return name.charAt(0).toUpperCase() + name.slice(1);
};

function initialValues(record: LogRecord, fields: readonly EditField[]): Values {
  const body = record as unknown as Record<string, unknown>;
  const values: Values = {};
  for (const f of fields) {
    const v = getPath(body, f.name);
    if (f.type === 'quantity') values[f.name] = { value: typeof v === 'number' ? v : null, error: null };
    else if (f.type === 'instant') values[f.name] = typeof v === 'string' ? localInput(v) : '';
    else if (f.type === 'list') values[f.name] = Array.isArray(v) ? v.join(', ') : '';
    else values[f.name] = v === null || v === undefined ? '' : String(v);
  }
  return values;
}

/** The patch the form's values make, and the first problem that keeps it from being saved. */
function patchOf(record: LogRecord, fields: readonly EditField[], values: Values): { patch: Record<string, unknown>; problem: string | null } {
  let body = record as unknown as Record<string, unknown>;
  let problem: string | null = null;
  for (const f of fields) {
    const raw = values[f.name];
    let value: unknown;
    if (f.type === 'quantity') {
      const s = raw as FieldState;
      if (s.error) problem ??= `${f.label}: ${s.error}`;
      if (s.value === null && !f.optional) problem ??= `${f.label} is needed`;
      value = s.value;
    } else if (f.type === 'instant') {
      const ms = Date.parse(raw as string);
      if (Number.isNaN(ms)) problem ??= `${f.label}: give a date and a time`;
      // An unchanged field keeps the stored instant to the millisecond (the input shows minutes only).
      value = (raw as string) === localInput(getPath(body, f.name) as string) ? getPath(body, f.name) : new Date(ms).toISOString();
    } else if (f.type === 'list') {
      value = (raw as string).split(',').map((s) => s.trim()).filter(Boolean);
    } else if (f.type === 'select') {
      value = raw === '' ? null : raw;
    } else value = raw;
    body = withPath(body, f.name, value);
  }
  const patch: Record<string, unknown> = {};
  for (const f of fields) {
    const top = f.name.split('.')[0]!;
    patch[top] = body[top];
  }
  return { patch, problem };
}

const SHOW_FIELD: Record<string, string> = {
  time_s: 'time',
  height_m: 'height',
  u_height_m: 'height uncertainty',
  taken_at: 'reading time',
  started_at: 'start',
  temperature_C: 'temperature',
  pressure_Pa: 'pressure',
  specimen_id: 'specimen',
  reading_id: 'air reading',
  site_id: 'site',
  series_id: 'series',
  excluded: 'excluded',
};

/** Stored numbers shown in the crew's units in the history (the rest as stored). */
const FIELD_KIND: Record<string, QuantityKind> = {
  time_s: 'time',
  height_m: 'length',
  u_height_m: 'length',
  temperature_C: 'temperature',
  u_temperature_C: 'temperature',
  pressure_Pa: 'pressure',
  u_pressure_Pa: 'pressure',
  mass_kg: 'mass',
  u_mass_kg: 'mass',
  wind_speed_m_s: 'speed',
  u_wind_speed_m_s: 'speed',
  vertical_wind_m_s: 'speed',
  u_vertical_wind_m_s: 'speed',
  elevation_m: 'length',
  timing_delay_s: 'time',
  u_timing_delay_s: 'time',
  u_time_s: 'time',
};

type Format = (value: number, kind: QuantityKind) => string;

function shownValue(key: string, v: unknown, format: Format): string {
  const kind = FIELD_KIND[key];
  return typeof v === 'number' && kind ? format(v, kind) : shortValue(v);
}

function shortValue(v: unknown): string {
  if (v === null || v === undefined || v === '') return '—';
  if (typeof v === 'number') return String(Math.round(v * 1e9) / 1e9);
  if (typeof v === 'string') return v.length > 40 ? `${v.slice(0, 37)}…` : v;
  if (Array.isArray(v)) return v.join(', ');
  return Object.entries(v as Record<string, unknown>)
    .filter(([k]) => k !== 'kind')
    .map(([k, x]) => `${k} ${shortValue(x)}`)
    .join(', ');
}

function changes(before: Revision<Record<string, unknown>> | undefined, after: Revision<Record<string, unknown>>, format: Format): string[] {
  if (!before) return ['created'];
  const out: string[] = [];
  if (before.deleted !== after.deleted) out.push(after.deleted ? 'removed' : 'restored');
  for (const k of Object.keys(after.body)) {
    if (k === 'raw') continue;
    const a = JSON.stringify(before.body[k]);
    const b = JSON.stringify(after.body[k]);
    if (a !== b) out.push(`${SHOW_FIELD[k] ?? k.replace(/_/g, ' ')}: ${shownValue(k, before.body[k], format)} → ${shownValue(k, after.body[k], format)}`);
  }
  return out.length ? out : ['no change of value'];
}

/** Every version of a record, newest first: what changed, on which phone, when, and why. */
export function RecordHistory({ kind, id }: { kind: RecordKind; id: string }) {
  const app = useApp();
  const data = useStoreData(async () => ({ versions: await app.store.history(kind, id), me: await app.store.deviceId() }), [kind, id]);
  if (data.state !== 'ready') return <p class="hint">{data.state === 'loading' ? 'Loading the history…' : describeError(data.error)}</p>;
  const { versions, me } = data.value;
  const all = versions as unknown as Revision<Record<string, unknown>>[];
  // A version's reason is stored with it when the next one replaced it: shown beside the change it explains.
  const format: Format = (value, kind) => app.format(value, kind);
  const rows = all.map((v, i) => ({ v, what: changes(all[i - 1], v, format), why: all[i - 1]?.reason ?? null })).reverse();
  return (
    <ol class="history" aria-label="History">
      {rows.map(({ v, what, why }) => (
        <li key={`${v.rev}`} class="history-row">
          <div class="history-when">
            {new Date(v.updated_at).toLocaleString([], { month: 'short', day: 'numeric', hour: '2-digit', minute: '2-digit', second: '2-digit' })} ·{' '}
            {v.device === me ? 'this phone' : `phone ${v.device.slice(0, 6)}`}
          </div>
          <div>{what.join('; ')}</div>
          {why ? <div class="hint">Why: {why}</div> : null}
        </li>
      ))}
    </ol>
  );
}

function EditForm({ record, label, fields, onDone }: { record: LogRecord; label: string; fields: readonly EditField[]; onDone(): void }) {
  const app = useApp();
  const { offerUndo } = useUndo();
  const [values, setValues] = useState<Values>(() => initialValues(record, fields));
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string | null>(null);
  const { patch, problem } = patchOf(record, fields, values);
  const measured = (REASON_REQUIRED_FIELDS[record.kind] as readonly string[]).filter((k) => k in patch && JSON.stringify(patch[k]) !== JSON.stringify((record as unknown as Record<string, unknown>)[k]));
  const set = (name: string, v: FieldState | string) => setValues((old) => ({ ...old, [name]: v }));
  const idBase = `edit-${record.id.slice(0, 8)}`;

  const save = async () => {
    setError(null);
    try {
      const next = await app.store.revise(record.kind, record.id, patch as Partial<BodyOf[RecordKind]>, reason.trim() || null, { expectedRev: record.rev });
      if (next.rev !== record.rev) offerUndo(`${undoName(label)} corrected`, [next]);
      app.notifyChanged();
      onDone();
    } catch (e) {
      setError(describeError(e));
    }
  };

  return (
    <div class="subform" role="group" aria-label={`Correct ${label}`}>
      {fields.map((f, i) => {
        const id = `${idBase}-${i}`;
        const v = values[f.name]!;
        if (f.type === 'quantity')
          return <QField key={f.name} id={id} label={f.label} kind={f.kind} state={v as FieldState} min={f.min} max={f.max} minExclusive={f.minExclusive} required={!f.optional} onChange={(s) => set(f.name, s)} />;
        if (f.type === 'select') return <SelectField key={f.name} id={id} label={f.label} value={v as string} options={f.options} onChange={(s) => set(f.name, s)} />;
        if (f.type === 'instant' || f.type === 'date')
          return (
            <div class="field" key={f.name}>
              <label for={id}>{f.label}</label>
              <input id={id} type={f.type === 'instant' ? 'datetime-local' : 'date'} value={v as string} onInput={(e) => set(f.name, (e.target as HTMLInputElement).value)} />
            </div>
          );
        return <TextField key={f.name} id={id} label={f.label} value={v as string} onInput={(s) => set(f.name, s)} />;
      })}
      <TextField
        id={`${idBase}-why`}
        label={measured.length ? 'Why the correction (needed)' : 'Why the correction (optional)'}
        hint="Kept in the history with the old value."
        value={reason}
        onInput={setReason}
      />
      {problem ? <p class="hint">{problem}</p> : null}
      {error ? <Notice tone="bad">{error}</Notice> : null}
      <div class="btn-row">
        <button type="button" class="btn" disabled={problem !== null || (measured.length > 0 && reason.trim() === '')} onClick={() => void save()}>
          Save the correction
        </button>
        <button type="button" class="btn btn-quiet" onClick={onDone}>
          Cancel
        </button>
      </div>
    </div>
  );
}

function RemoveForm({ record, label, consequence, onDone }: { record: LogRecord; label: string; consequence?: string; onDone(removed: boolean): void }) {
  const app = useApp();
  const { offerUndo } = useUndo();
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string | null>(null);
  const remove = async () => {
    setError(null);
    try {
      const gone = await app.store.remove(record.kind, record.id, reason.trim());
      // Undoing the container restores what was removed with it.
      offerUndo(`${undoName(label)} removed`, [gone]);
      app.notifyChanged();
      onDone(true);
    } catch (e) {
      setError(describeError(e));
    }
  };
  return (
    <div class="subform" role="group" aria-label={`Remove ${label}`}>
      <TextField
        id={`remove-${record.id.slice(0, 8)}`}
        label={`Why remove ${label}?`}
        hint={`${consequence ?? ''}It stays in the log as removed, with this reason, and can be restored.`}
        value={reason}
        onInput={setReason}
      />
      {error ? <Notice tone="bad">{error}</Notice> : null}
      <div class="btn-row">
        <button type="button" class="btn btn-bad" disabled={reason.trim() === ''} onClick={() => void remove()}>
          Remove it
        </button>
        <button type="button" class="btn btn-quiet" onClick={() => onDone(false)}>
          Cancel
        </button>
      </div>
    </div>
  );
}

/** Correct, remove and see the history of one record: three buttons, one panel open at a time. */
export function RecordActions({
  record,
  label,
  fields,
  consequence,
  removable = true,
  correctable = true,
  onRemoved,
}: {
  record: LogRecord;
  /** What the record is called in buttons and messages: "drop 3", "this series". */
  label: string;
  fields: readonly EditField[];
  /** What else a removal takes with it, as a sentence ending in a space. */
  consequence?: string;
  removable?: boolean;
  /** False where the screen has its own form for the record (a specimen). */
  correctable?: boolean;
  /** Called after the record was removed (a screen showing only it goes back). */
  onRemoved?: () => void;
}) {
  const [open, setOpen] = useState<'edit' | 'history' | 'remove' | null>(null);
  const toggle = (which: typeof open) => setOpen((o) => (o === which ? null : which));
  return (
    <div class="record-actions">
      <div class="btn-row">
        {correctable ? (
          <button type="button" class="btn btn-quiet" aria-expanded={open === 'edit'} aria-label={`Correct ${label}`} onClick={() => toggle('edit')}>
            Correct
          </button>
        ) : null}
        <button type="button" class="btn btn-quiet" aria-expanded={open === 'history'} aria-label={`History of ${label}`} onClick={() => toggle('history')}>
          History
        </button>
        {removable ? (
          <button type="button" class="btn btn-quiet" aria-expanded={open === 'remove'} aria-label={`Remove ${label}`} onClick={() => toggle('remove')}>
            Remove
          </button>
        ) : null}
      </div>
      {open === 'edit' ? <EditForm key={record.rev} record={record} label={label} fields={fields} onDone={() => setOpen(null)} /> : null}
      {open === 'history' ? <RecordHistory kind={record.kind} id={record.id} /> : null}
      {open === 'remove' ? <RemoveForm
          record={record}
          label={label}
          consequence={consequence}
          onDone={(removed) => {
            setOpen(null);
            if (removed) onRemoved?.();
          }}
        /> : null}
    </div>
  );
}

/** A removed record with the way to bring it back: a reason, then Restore (with undo). */
export function RestoreRow({ record, label, detail }: { record: LogRecord; label: string; detail?: string }) {
  const app = useApp();
  const { offerUndo } = useUndo();
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string | null>(null);
  const removedWhy = record.history[record.history.length - 1]?.reason ?? null;
  const restore = async () => {
    setError(null);
    try {
      const back = await app.store.restore(record.kind, record.id, reason.trim());
      offerUndo(`${undoName(label)} restored`, [back]);
      app.notifyChanged();
    } catch (e) {
      setError(describeError(e));
    }
  };
  return (
    <li class="row removed-row">
      <span class="row-main">
        <s>{label}</s>
        {detail ? ` · ${detail}` : ''}
        <span class="hint"> — removed{removedWhy ? `: ${removedWhy}` : ''}</span>
      </span>
      {open ? (
        <div class="subform" role="group" aria-label={`Restore ${label}`}>
          <TextField id={`restore-${record.id.slice(0, 8)}`} label={`Why restore ${label}?`} value={reason} onInput={setReason} />
          {error ? <Notice tone="bad">{error}</Notice> : null}
          <div class="btn-row">
            <button type="button" class="btn" disabled={reason.trim() === ''} onClick={() => void restore()}>
              Restore it
            </button>
            <button type="button" class="btn btn-quiet" onClick={() => setOpen(false)}>
              Cancel
            </button>
          </div>
        </div>
      ) : (
        <button type="button" class="btn btn-quiet" aria-label={`Restore ${label}`} onClick={() => setOpen(true)}>
          Restore
        </button>
      )}
    </li>
  );
}
