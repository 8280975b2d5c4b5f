import { useState } from 'preact/hooks';
import { inputRange, LIMITS, specimenMeasuresDiffer, type ShapeKind, type SpecimenBody, type SpecimenRecord, type SpecimenShape } from '../../log';
import { useApp } from '../app-context';
import { useDraft, useStoreData } from '../hooks';
import { Choice, MeasuredField, Notice, QField, TextField, field, fieldsValid, type FieldState } from '../forms';
import { navigate, routeHref } from '../router';
import { describeError } from '../errors';
import { RecordActions, RestoreRow } from '../record-edit';

const SHAPES: Array<{ value: ShapeKind; label: string }> = [
  { value: 'sphere', label: 'Sphere' },
  { value: 'cylinder', label: 'Cylinder' },
  { value: 'disc', label: 'Disc' },
  { value: 'box', label: 'Box' },
  { value: 'custom', label: 'Other' },
];

/** #/specimens: the catalogue; #/specimens/new and #/specimens/<id>: the form. */
export function SpecimensScreen({ params }: { params: string[] }) {
  const [id] = params;
  if (id) return <SpecimenEditor id={id === 'new' ? null : id} />;
  return <SpecimenList />;
}

function describeShape(shape: SpecimenShape, format: (v: number, k: 'smallLength' | 'area' | 'volume') => string): string {
  switch (shape.kind) {
    case 'sphere':
      return `sphere ⌀ ${format(shape.diameter_m, 'smallLength')}`;
    case 'cylinder':
      return `cylinder ⌀ ${format(shape.diameter_m, 'smallLength')} × ${format(shape.length_m, 'smallLength')}`;
    case 'disc':
      return `disc ⌀ ${format(shape.diameter_m, 'smallLength')} × ${format(shape.thickness_m, 'smallLength')}`;
    case 'box':
      return `box ${format(shape.length_m, 'smallLength')} × ${format(shape.width_m, 'smallLength')} × ${format(shape.height_m, 'smallLength')}`;
    case 'custom':
      return `area ${format(shape.area_m2, 'area')}, volume ${format(shape.volume_m3, 'volume')}`;
  }
}

function SpecimenList() {
  const app = useApp();
  const list = useStoreData(() => app.store.list('specimen'), []);
  const removed = useStoreData(async () => (await app.store.list('specimen', { includeDeleted: true })).filter((s) => s.deleted), []);
  return (
    <div>
      <a class="btn btn-block" href={routeHref('specimens', 'new')}>
        Add a specimen
      </a>
      {list.state === 'ready' && list.value.length === 0 ? <p>No specimens yet.</p> : null}
      <ul class="rows">
        {list.state === 'ready'
          ? list.value
              .sort((a, b) => a.name.localeCompare(b.name))
              .map((s) => (
                <li key={s.id}>
                  <a class="row row-link" href={routeHref('specimens', s.id)}>
                    <span class="row-main">
                      <strong>{s.name}</strong>
                      <br />
                      <span class="hint">
                        {app.format(s.mass_kg, 'mass')} · {describeShape(s.shape, (v, k) => app.format(v, k))}
                      </span>
                    </span>
                    <span class="row-side">{s.reference_drag_coefficient !== null ? `ref. C_d ${s.reference_drag_coefficient}` : ''}</span>
                  </a>
                </li>
              ))
          : null}
      </ul>
      {removed.state === 'ready' && removed.value.length > 0 ? (
        <section aria-labelledby="removed-spec-h">
          <h2 id="removed-spec-h">Removed</h2>
          <ul class="rows">
            {removed.value.map((s) => (
              <RestoreRow key={s.id} record={s} label={s.name} detail={app.format(s.mass_kg, 'mass')} />
            ))}
          </ul>
        </section>
      ) : null}
    </div>
  );
}

interface SpecimenDraft {
  name: string;
  mass: FieldState;
  uMass: FieldState;
  shape: ShapeKind;
  diameter: FieldState;
  uDiameter: FieldState;
  length: FieldState;
  uLength: FieldState;
  width: FieldState;
  uWidth: FieldState;
  thickness: FieldState;
  uThickness: FieldState;
  area: FieldState;
  uArea: FieldState;
  volume: FieldState;
  uVolume: FieldState;
  referenceCd: FieldState;
  notes: string;
  reason: string;
  /** The record's rev when this form was opened: a save is refused if the record changed since (another tab, a sync). */
  openedRev?: string | null;
}

function draftFrom(s: SpecimenRecord | null): SpecimenDraft {
  const base: SpecimenDraft = {
    name: '',
    mass: field(),
    uMass: field(0.0005),
    shape: 'sphere',
    diameter: field(),
    uDiameter: field(0.0002),
    length: field(),
    uLength: field(0.0005),
    width: field(),
    uWidth: field(0.0005),
    thickness: field(),
    uThickness: field(0.0002),
    area: field(),
    uArea: field(0),
    volume: field(),
    uVolume: field(0),
    referenceCd: { value: null, error: null },
    notes: '',
    reason: '',
    openedRev: s?.rev ?? null,
  };
  if (!s) return base;
  const sh = s.shape;
  const d: SpecimenDraft = { ...base, name: s.name, mass: field(s.mass_kg), uMass: field(s.u_mass_kg), shape: sh.kind, notes: s.notes, referenceCd: field(s.reference_drag_coefficient) };
  if (sh.kind === 'sphere') Object.assign(d, { diameter: field(sh.diameter_m), uDiameter: field(sh.u_diameter_m) });
  if (sh.kind === 'cylinder') Object.assign(d, { diameter: field(sh.diameter_m), uDiameter: field(sh.u_diameter_m), length: field(sh.length_m), uLength: field(sh.u_length_m) });
  if (sh.kind === 'disc') Object.assign(d, { diameter: field(sh.diameter_m), uDiameter: field(sh.u_diameter_m), thickness: field(sh.thickness_m), uThickness: field(sh.u_thickness_m) });
  if (sh.kind === 'box')
    Object.assign(d, { length: field(sh.length_m), uLength: field(sh.u_length_m), width: field(sh.width_m), uWidth: field(sh.u_width_m), thickness: field(sh.height_m), uThickness: field(sh.u_height_m) });
  if (sh.kind === 'custom') Object.assign(d, { area: field(sh.area_m2), uArea: field(sh.u_area_m2), volume: field(sh.volume_m3), uVolume: field(sh.u_volume_m3) });
  return d;
}

function shapeFrom(d: SpecimenDraft): SpecimenShape | null {
  const v = (f: FieldState) => f.value!;
  switch (d.shape) {
    case 'sphere':
      return fieldsValid(d.diameter, d.uDiameter) ? { kind: 'sphere', diameter_m: v(d.diameter), u_diameter_m: v(d.uDiameter) } : null;
    case 'cylinder':
      return fieldsValid(d.diameter, d.uDiameter, d.length, d.uLength)
        ? { kind: 'cylinder', diameter_m: v(d.diameter), u_diameter_m: v(d.uDiameter), length_m: v(d.length), u_length_m: v(d.uLength) }
        : null;
    case 'disc':
      return fieldsValid(d.diameter, d.uDiameter, d.thickness, d.uThickness)
        ? { kind: 'disc', diameter_m: v(d.diameter), u_diameter_m: v(d.uDiameter), thickness_m: v(d.thickness), u_thickness_m: v(d.uThickness) }
        : null;
    case 'box':
      return fieldsValid(d.length, d.uLength, d.width, d.uWidth, d.thickness, d.uThickness)
        ? { kind: 'box', length_m: v(d.length), u_length_m: v(d.uLength), width_m: v(d.width), u_width_m: v(d.uWidth), height_m: v(d.thickness), u_height_m: v(d.uThickness) }
        : null;
    case 'custom':
      return fieldsValid(d.area, d.uArea, d.volume, d.uVolume)
        ? { kind: 'custom', area_m2: v(d.area), u_area_m2: v(d.uArea), volume_m3: v(d.volume), u_volume_m3: v(d.uVolume) }
        : null;
  }
}

function SpecimenEditor({ id }: { id: string | null }) {
  const app = useApp();
  const existing = useStoreData(async () => (id ? ((await app.store.get('specimen', id)) ?? null) : null), [id]);
  if (existing.state === 'loading') return <p>Loading…</p>;
  if (existing.state === 'failed') return <Notice tone="bad">{describeError(existing.error)}</Notice>;
  return <SpecimenForm record={existing.value} key={id ?? 'new'} />;
}

/**
 * A specimen's form. With `onCreated`, a new specimen made from inside another form (the series form): the crew
 * stays where they are and that form picks the new specimen.
 */
export function SpecimenForm({ record: opened, onCreated }: { record: SpecimenRecord | null; onCreated?: (id: string) => void }) {
  const app = useApp();
  // The record as this form last read it: replaced by the stored one when the crew reloads a stale form.
  const [record, setRecord] = useState(opened);
  const key = `specimen:${record?.id ?? 'new'}`;
  const form = useDraft<SpecimenDraft>(key, () => draftFrom(record));
  const [error, setError] = useState<string | null>(null);
  const [stale, setStale] = useState(false);
  const d = form.value;
  const shape = shapeFrom(d);
  const valid = d.name.trim() !== '' && fieldsValid(d.mass, d.uMass) && shape !== null && d.referenceCd.error === null;
  const measuredChanged =
    record !== null && shape !== null && specimenMeasuresDiffer({ shape, mass_kg: d.mass.value as number, u_mass_kg: d.uMass.value as number }, record);
  const needsReason = measuredChanged && d.reason.trim() === '';
  const S = (props: { label: string; f: keyof SpecimenDraft & string; u: keyof SpecimenDraft & string; kind?: 'smallLength' | 'area' | 'volume' }) => {
    const [limit, uLimit] =
      props.kind === 'area' ? [LIMITS.area_m2, LIMITS.u_area_m2] : props.kind === 'volume' ? [LIMITS.volume_m3, LIMITS.u_volume_m3] : [LIMITS.length_m, LIMITS.u_length_m];
    return <MeasuredField form={form} name={props.f} uName={props.u} label={props.label} kind={props.kind ?? 'smallLength'} {...inputRange(limit)} uMax={uLimit.max} />;
  };

  const save = async () => {
    if (!shape) return;
    setError(null);
    const body: SpecimenBody = {
      name: d.name.trim(),
      mass_kg: d.mass.value!,
      u_mass_kg: d.uMass.value!,
      shape,
      reference_drag_coefficient: d.referenceCd.value,
      notes: d.notes,
    };
    try {
      // Compared with the stored rev inside the write: an edit from a form opened before another tab's rename
      // is refused instead of reverting it.
      const expected = d.openedRev ? { expectedRev: d.openedRev } : {};
      if (record) await app.store.revise('specimen', record.id, body, measuredChanged ? d.reason.trim() : null, { clearDraft: key, ...expected });
      const created = record ? null : await app.store.create('specimen', body, { clearDraft: key });
      await form.clear();
      app.notifyChanged();
      if (created && onCreated) onCreated(created.id);
      else navigate('specimens');
    } catch (e) {
      setError(describeError(e));
      setStale((e as { code?: unknown } | null)?.code === 'changed-elsewhere');
    }
  };

  /** Reads the specimen as stored now and starts the form again from it (the typed changes are to be made again). */
  const reload = async () => {
    if (!record) return;
    const fresh = (await app.store.get('specimen', record.id)) ?? record;
    await form.clear();
    form.replace(draftFrom(fresh));
    setRecord(fresh);
    setError(null);
    setStale(false);
  };

  return (
    <section class="card" aria-labelledby="spec-h">
      {onCreated ? null : (
        <a class="back" href={routeHref('specimens')}>
          ← Catalogue
        </a>
      )}
      <h2 id="spec-h">{record ? `Edit ${record.name}` : 'New specimen'}</h2>
      {form.restored ? <Notice tone="info">Your unsaved entries were brought back.</Notice> : null}
      <TextField id="spec-name" label="Name" value={d.name} required onInput={(name) => form.set({ name })} />
      <MeasuredField form={form} name="mass" uName="uMass" label="Mass" kind="mass" {...inputRange(LIMITS.mass_kg)} uMax={LIMITS.u_mass_kg.max} />
      <Choice legend="Shape" name="shape" value={d.shape} options={SHAPES} onChange={(s) => form.set({ shape: s })} />
      {d.shape === 'sphere' ? S({ label: 'Diameter', f: 'diameter', u: 'uDiameter' }) : null}
      {d.shape === 'cylinder' ? (
        <>
          <p class="hint">Falls with its axis vertical.</p>
          {S({ label: 'Diameter', f: 'diameter', u: 'uDiameter' })}
          {S({ label: 'Length', f: 'length', u: 'uLength' })}
        </>
      ) : null}
      {d.shape === 'disc' ? (
        <>
          <p class="hint">Falls flat, face down.</p>
          {S({ label: 'Diameter', f: 'diameter', u: 'uDiameter' })}
          {S({ label: 'Thickness', f: 'thickness', u: 'uThickness' })}
        </>
      ) : null}
      {d.shape === 'box' ? (
        <>
          <p class="hint">Falls with its length × width face down.</p>
          {S({ label: 'Length', f: 'length', u: 'uLength' })}
          {S({ label: 'Width', f: 'width', u: 'uWidth' })}
          {S({ label: 'Height', f: 'thickness', u: 'uThickness' })}
        </>
      ) : null}
      {d.shape === 'custom' ? (
        <>
          {S({ label: 'Frontal area', f: 'area', u: 'uArea', kind: 'area' as const })}
          {S({ label: 'Volume', f: 'volume', u: 'uVolume', kind: 'volume' as const })}
        </>
      ) : null}
      <QField
        label="Reference drag coefficient (optional)"
        kind="ratio"
        required={false}
        state={d.referenceCd}
        {...inputRange(LIMITS.reference_drag_coefficient)}
        hint="From a handbook or a wind tunnel; used to predict fall times. Spheres without one use a published correlation."
        onChange={(referenceCd) => form.set({ referenceCd })}
      />
      <TextField id="spec-notes" label="Notes" value={d.notes} multiline onInput={(notes) => form.set({ notes })} />
      {measuredChanged ? (
        <TextField
          id="spec-reason"
          label="Why did the measured values change?"
          hint="Required: the earlier values stay in the specimen’s history."
          value={d.reason}
          error={needsReason ? 'Reason: give a reason for changing a measured value.' : null}
          onInput={(reason) => form.set({ reason })}
        />
      ) : null}
      {error ? <Notice tone="bad">{error}</Notice> : null}
      {stale ? (
        <button type="button" class="btn btn-block" onClick={() => void reload()}>
          Reload the specimen
        </button>
      ) : null}
      <button type="button" class="btn btn-block" disabled={!valid || needsReason} onClick={save}>
        {record ? 'Save changes' : 'Add to the catalogue'}
      </button>
      {record && !record.deleted ? (
        <RecordActions
          key={record.rev}
          record={record}
          label={record.name}
          correctable={false}
          fields={[]}
          consequence="Series that use it keep it until they are changed; a specimen in use cannot be removed. "
          onRemoved={() => navigate('specimens')}
        />
      ) : null}
    </section>
  );
}
