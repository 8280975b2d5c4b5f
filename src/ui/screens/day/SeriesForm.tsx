import { useState } from 'preact/hooks';
import { inputRange, LIMITS, LIST_LIMITS, type HeightMethod, type ReadingRecord, type SpecimenRecord, type TimingMethod } from '../../../log';
import { useApp } from '../../app-context';
import { useDraft } from '../../hooks';
import { Choice, MeasuredField, Notice, QField, SelectField, field, fieldsValid, type FieldState } from '../../forms';
import { navigate } from '../../router';
import { describeError } from '../../errors';
import { TIMING_METHOD_DEFAULTS } from '../../../physics';
import { emptySeriesAirTiming, seriesAirTimingBody, seriesAirTimingValid, SeriesAirTimingFields, type SeriesAirTimingDraft } from './SeriesAirTimingFields';
import { lazyScreen } from '../../lazy';

// The specimen form, loaded only when a series is started without the specimen in the catalogue.
const InlineSpecimenForm = lazyScreen(() => import('../SpecimensScreen').then((m) => m.SpecimenForm));

/**
 * Each timing method's label and the random standard uncertainty of one drop the form starts from: the physics'
 * documented defaults (physics/timingMethodDefaults.ts, with their sources), so the form and the analysis agree.
 * A typed time comes from an instrument the app does not know; the form starts from 20 ms (common practice for a
 * time read off a display to the hundredth) and the crew states its own.
 */
const LABELS: Record<TimingMethod, string> = {
  typed: 'Typed in',
  stopwatch: 'Hand stopwatch',
  tap: 'Taps on this phone',
  sound: 'Sound onsets',
  video: 'Video frames',
  gates: 'Light gates',
};
export const TIMING_DEFAULTS = Object.fromEntries(
  (Object.keys(LABELS) as TimingMethod[]).map((m) => [m, { label: LABELS[m], u_s: TIMING_METHOD_DEFAULTS[m].standard_uncertainty_s ?? 0.02 }]),
) as Record<TimingMethod, { label: string; u_s: number }>;

/** The timing methods as choices for a select. */
export const TIMING_OPTIONS = Object.entries(TIMING_DEFAULTS).map(([value, t]) => ({ value, label: t.label }));

const HEIGHT_METHODS: Record<HeightMethod, string> = {
  tape: 'Tape',
  laser: 'Laser rangefinder',
  survey: 'Survey',
  marked: 'Marked drop point',
  other: 'Other',
};

interface SeriesDraft extends SeriesAirTimingDraft {
  specimenId: string;
  height: FieldState;
  uHeight: FieldState;
  heightMethod: HeightMethod;
  timingMethod: TimingMethod;
  uTime: FieldState;
  target: FieldState;
  readingId: string;
  fitOffset: boolean;
  /** A gates series: each gate's distance fallen from the release point, typed once (older drafts lack it). */
  gates?: FieldState[];
}

/** The stored fraction's limit, as the percent the crew types. */
const TARGET_PERCENT = { ...LIMITS.target_relative_uncertainty, max: LIMITS.target_relative_uncertainty.max * 100, unit: '%' };

/**
 * What is wrong with typed gate distances, in the crew's units, naming the gate, the value and the rule; null when
 * they may be stored (each typed, rising from gate to gate, none beyond the release height).
 */
function gateDistancesProblem(gates: readonly FieldState[], height: number | null, format: (v: number, kind: 'length') => string): string | null {
  // What is typed wrong comes first; what is not typed yet last.
  for (let i = 0; i < gates.length; i++) {
    if (!fieldsValid(gates[i])) continue;
    const value = gates[i]!.value!;
    const before = i > 0 && fieldsValid(gates[i - 1]) ? gates[i - 1]!.value! : null;
    if (before !== null && value <= before) return `Gate ${i + 1} at ${format(value, 'length')} must be further down than gate ${i} (${format(before, 'length')}).`;
    if (height !== null && value > height) return `Gate ${i + 1} at ${format(value, 'length')} is below the landing: the release height is ${format(height, 'length')}.`;
  }
  const missing = gates.findIndex((g) => !fieldsValid(g));
  return missing >= 0 ? `Gate ${missing + 1} needs its distance fallen from the release point.` : null;
}

export function SeriesForm({
  dayId,
  specimens,
  readings,
  onDone,
}: {
  dayId: string;
  specimens: SpecimenRecord[];
  readings: ReadingRecord[];
  onDone(): void;
}) {
  const app = useApp();
  const key = `series:${dayId}`;
  const form = useDraft<SeriesDraft>(key, () => ({
    specimenId: specimens[0]?.id ?? '',
    height: field(),
    uHeight: field(0.01),
    heightMethod: 'tape',
    timingMethod: 'typed',
    uTime: field(TIMING_DEFAULTS.typed.u_s),
    target: field(5),
    readingId: '',
    fitOffset: false,
    ...emptySeriesAirTiming(),
  }));
  const d = form.value;
  const [error, setError] = useState<string | null>(null);
  const [addingSpecimen, setAddingSpecimen] = useState(false);
  const specimenOk = specimens.some((s) => s.id === d.specimenId);
  const byGates = d.timingMethod === 'gates';
  const gates = d.gates ?? [field(), field(), field()];
  const gateProblem = byGates ? gateDistancesProblem(gates, d.height.value, app.format) : null;
  const valid = specimenOk && fieldsValid(d.height, d.uHeight, d.uTime, d.target) && seriesAirTimingValid(d, d.readingId) && gateProblem === null;

  const save = async () => {
    setError(null);
    try {
      const series = await app.store.create(
        'series',
        {
          day_id: dayId,
          specimen_id: d.specimenId,
          height_m: d.height.value!,
          u_height_m: d.uHeight.value!,
          height_method: d.heightMethod,
          timing_method: d.timingMethod,
          u_time_s: d.uTime.value!,
          target_relative_uncertainty: d.target.value! / 100,
          reading_id: d.readingId || null,
          timing_offset: d.fitOffset ? 'fit' : 'none',
          ...(byGates ? { gate_distances_m: gates.map((g) => g.value!) } : {}),
          ...seriesAirTimingBody(d),
          started_at: new Date().toISOString(),
          notes: '',
        },
        { clearDraft: key },
      );
      await form.clear();
      app.notifyChanged();
      onDone();
      navigate('day', dayId, 'series', series.id);
    } catch (e) {
      setError(describeError(e));
    }
  };

  const picked = (id: string) => {
    form.set({ specimenId: id });
    setAddingSpecimen(false);
  };
  if (specimens.length === 0 || addingSpecimen) {
    return (
      <section class="card" aria-labelledby="series-h">
        <h3 id="series-h">Start a series</h3>
        {specimens.length === 0 ? <p>The specimen catalogue is empty. Add the specimen you will drop here; the series follows.</p> : null}
        <InlineSpecimenForm record={null} onCreated={picked} />
        {specimens.length ? (
          <button type="button" class="btn btn-quiet" onClick={() => setAddingSpecimen(false)}>
            Back to the series
          </button>
        ) : null}
      </section>
    );
  }

  return (
    <section class="card" aria-labelledby="series-h">
      <h3 id="series-h">Start a series</h3>
      {form.restored ? <Notice tone="info">Your unsaved entries were brought back.</Notice> : null}
      <SelectField
        id="series-specimen"
        label="Specimen"
        value={d.specimenId}
        options={specimens.map((s) => ({ value: s.id, label: s.name }))}
        onChange={(specimenId) => form.set({ specimenId })}
      />
      <button type="button" class="btn btn-quiet btn-small" onClick={() => setAddingSpecimen(true)}>
        A new specimen
      </button>
      <MeasuredField form={form} name="height" uName="uHeight" label="Release height" kind="length" {...inputRange(LIMITS.height_m)} uMax={LIMITS.u_height_m.max} />
      <SelectField
        id="height-method"
        label="Height measured by"
        value={d.heightMethod}
        options={Object.entries(HEIGHT_METHODS).map(([value, label]) => ({ value, label }))}
        onChange={(v) => form.set({ heightMethod: v as HeightMethod })}
      />
      <SelectField
        id="timing-method"
        label="Timing method"
        value={d.timingMethod}
        options={TIMING_OPTIONS}
        onChange={(v) => {
          const m = v as TimingMethod;
          form.set({ timingMethod: m, uTime: { value: TIMING_DEFAULTS[m].u_s, error: null } });
        }}
      />
      {byGates ? (
        <fieldset class="gates" data-testid="gate-distances">
          <legend>Gates: distance fallen from the release point</legend>
          {gates.map((g, i) => (
            <QField
              key={i}
              label={`Gate ${i + 1}`}
              kind="length"
              compact
              state={g}
              {...inputRange(LIMITS.mark_distance_m)}
              onChange={(next) => form.set({ gates: gates.map((x, k) => (k === i ? next : x)) })}
            />
          ))}
          <div class="btn-row">
            <button type="button" class="btn btn-quiet btn-small" disabled={gates.length >= LIST_LIMITS.gates_max} onClick={() => form.set({ gates: [...gates, field()] })}>
              Add a gate
            </button>
            <button type="button" class="btn btn-quiet btn-small" disabled={gates.length <= LIST_LIMITS.gates_min} onClick={() => form.set({ gates: gates.slice(0, -1) })}>
              Remove the last gate
            </button>
          </div>
          {gateProblem && gates.some((g) => g.value !== null) ? <Notice tone="warn">{gateProblem}</Notice> : null}
        </fieldset>
      ) : null}
      <QField
        label="Timing std. uncertainty per drop"
        kind="time"
        delta
        state={d.uTime}
        {...inputRange(LIMITS.u_time_s)}
        hint="Random spread of one drop’s time. A delay the same in every drop is declared below, or fitted."
        onChange={(uTime) => form.set({ uTime })}
      />
      <QField
        label="Target uncertainty of the drag coefficient"
        kind="percent"
        state={d.target}
        {...inputRange(TARGET_PERCENT)}
        hint="Relative standard uncertainty the crew aims for."
        onChange={(target) => form.set({ target })}
      />
      <SelectField
        id="series-reading"
        label="Air reading"
        value={d.readingId}
        options={[
          { value: '', label: 'The nearest in time' },
          ...readings.map((r) => ({ value: r.id, label: `${new Date(r.taken_at).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' })} · ${app.format(r.temperature_C, 'temperature')}` })),
        ]}
        onChange={(readingId) => form.set({ readingId })}
      />
      <SeriesAirTimingFields draft={d} method={d.timingMethod} readingId={d.readingId} readings={readings} onChange={(next) => form.set(next)} />
      <label class="check">
        <input type="checkbox" checked={d.fitOffset} onChange={(e) => form.set({ fitOffset: (e.target as HTMLInputElement).checked })} />
        <span>Fit a constant timing offset too (needs drops from at least three heights)</span>
      </label>
      {error ? <Notice tone="bad">{error}</Notice> : null}
      <div class="btn-row">
        <button type="button" class="btn" disabled={!valid} onClick={save}>
          Start the series
        </button>
        <button type="button" class="btn btn-quiet" onClick={onDone}>
          Close
        </button>
      </div>
    </section>
  );
}
