import '../../../widgets';
import { useMemo, useRef, useState } from 'preact/hooks';
import { planDrop, type AnalysisRequest, type AnalysisResult } from '../../../physics';
import type { DropRecord, SeriesRecord, SpecimenRecord } from '../../../log/types';
import { inputRange, LIMITS } from '../../../log';
import type { DayView } from '../../../store';
import { useApp } from '../../app-context';
import { useDraft, useStoreData } from '../../hooks';
import { Notice, QField, TextField, field, fieldsValid, type FieldState } from '../../forms';
import { routeHref } from '../../router';
import { analyzeSeriesRecords, dropHeight, relativeUncertainty, singleDropDragCoefficient, type SeriesOutcome } from '../../../analysis';
import { seriesCurves } from '../../../analysis';
import { impactEnergyWarning } from '../../SafetyCaution';
import { TIMING_DEFAULTS } from './SeriesForm';
import { describeError } from '../../errors';
import type { PlotLine, PlotMark, TimeCapturedDetail } from '../../../widgets';
import { fromSI, unitFor } from '../../../widgets/units';

export function SeriesScreen({ dayId, seriesId }: { dayId: string; seriesId: string }) {
  const app = useApp();
  const data = useStoreData(() => app.store.loadDay(dayId), [dayId]);
  if (data.state === 'loading') return <p>Loading the series…</p>;
  if (data.state === 'failed') return <Notice tone="bad">This day could not be opened: {describeError(data.error)}</Notice>;
  const view = data.value;
  const series = view.series.find((s) => s.id === seriesId);
  if (!series) return <Notice tone="bad">This series is not in the day (it may have been removed).</Notice>;
  const specimen = view.specimens.find((s) => s.id === series.specimen_id);
  const drops = view.drops.filter((d) => d.series_id === series.id).sort((a, b) => a.seq - b.seq);
  return <SeriesBody view={view} series={series} specimen={specimen} drops={drops} />;
}

function SeriesBody({ view, series, specimen, drops }: { view: DayView; series: SeriesRecord; specimen: SpecimenRecord | undefined; drops: DropRecord[] }) {
  const app = useApp();
  const outcome = useMemo(() => analyzeSeriesRecords(view.site, view.readings, specimen, series, drops), [view, specimen, series, drops]);
  return (
    <div>
      <a class="back" href={routeHref('day', view.day.id)}>
        ← {view.site?.name ?? 'Day'} · {view.day.date}
      </a>
      <header class="card">
        <h2 class="series-title">{specimen?.name ?? 'Unknown specimen'}</h2>
        <div class="hint">
          from {app.format(series.height_m, 'length', 2)} ± {app.format(series.u_height_m, 'length', 3)} · {TIMING_DEFAULTS[series.timing_method].label}, ±{' '}
          {(series.u_time_s * 1000).toFixed(1)} ms per drop · target {(series.target_relative_uncertainty * 100).toFixed(1)} %
        </div>
      </header>
      <DropEntry
        series={series}
        nextSeq={drops.reduce((m, d) => Math.max(m, d.seq), 0) + 1}
        airTemperature={outcome.kind === 'ready' ? outcome.reading.temperature_C : (view.readings[view.readings.length - 1]?.temperature_C ?? null)}
      />
      <ResultPanel outcome={outcome} series={series} usedDrops={drops.filter((d) => !d.excluded && !d.deleted)} />
      {outcome.kind === 'ready' ? <Charts outcome={outcome} drops={drops} series={series} /> : null}
      <DropTable drops={drops} series={series} outcome={outcome} />
      {outcome.kind === 'ready' ? <Budget result={outcome.result} /> : null}
    </div>
  );
}

interface DropDraft {
  time: FieldState;
  height: FieldState;
  otherHeight: boolean;
  note: string;
  /** The phone's capture behind `time`, kept until the drop is saved; null when the time was typed. */
  captured: TimeCapturedDetail['raw'] | null;
  /** Sound timing: the phone's distance to the release point and to the landing point. */
  releaseDistance: FieldState;
  landingDistance: FieldState;
}

function DropEntry({ series, nextSeq, airTemperature }: { series: SeriesRecord; nextSeq: number; airTemperature: number | null }) {
  const app = useApp();
  const key = `drop:${series.id}`;
  const form = useDraft<DropDraft>(key, () => ({
    time: field(),
    height: field(),
    otherHeight: false,
    note: '',
    captured: null,
    releaseDistance: field(series.height_m),
    landingDistance: field(1),
  }));
  const padMode = series.timing_method === 'sound' ? 'listen' : series.timing_method === 'tap' ? 'tap' : null;
  const [error, setError] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);
  const input = useRef<HTMLElement>(null);
  const d = form.value;
  const valid = fieldsValid(d.time) && (!d.otherHeight || fieldsValid(d.height));

  const save = async () => {
    if (!valid || saving) return;
    setSaving(true);
    setError(null);
    try {
      await app.store.create(
        'drop',
        {
          series_id: series.id,
          seq: nextSeq,
          raw: d.captured ?? { kind: 'typed', text: d.time.text ?? String(d.time.value) },
          time_s: d.time.value!,
          height_m: d.otherHeight ? d.height.value : null,
          excluded: false,
          exclusion_reason: null,
          note: d.note,
          captured_at: new Date().toISOString(),
        },
        { clearDraft: key },
      );
      await form.clear();
      form.replace({ ...d, time: { value: null, error: null, text: '' }, note: '', captured: null });
      app.notifyChanged();
      (input.current as { focus?: () => void } | null)?.focus?.();
    } catch (e) {
      setError(describeError(e));
    } finally {
      setSaving(false);
    }
  };

  return (
    <section class="card entry" aria-labelledby="entry-h">
      <h3 id="entry-h">Drop {nextSeq}</h3>
      <form
        onSubmit={(e) => {
          e.preventDefault();
          void save();
        }}
      >
        {padMode ? (
          <>
            {padMode === 'listen' ? (
              <div class="two">
                <QField label="Phone to release point" kind="length" compact state={d.releaseDistance} {...inputRange(LIMITS.sound_distance_m)} onChange={(releaseDistance) => form.set({ releaseDistance })} />
                <QField label="Phone to landing point" kind="length" compact state={d.landingDistance} {...inputRange(LIMITS.sound_distance_m)} onChange={(landingDistance) => form.set({ landingDistance })} />
              </div>
            ) : null}
            <pl-timer-pad
              label={`Drop ${nextSeq} timer`}
              mode={padMode}
              releaseHeight={d.otherHeight && d.height.value !== null ? d.height.value : series.height_m}
              releaseDistance={d.releaseDistance.value ?? undefined}
              landingDistance={d.landingDistance.value ?? undefined}
              airTemperature={airTemperature ?? undefined}
              decimalComma={app.settings.decimalComma}
              ontime-captured={(e: CustomEvent<TimeCapturedDetail>) => {
                // The capture carries its sound-travel correction as data (raw.sound_travel).
                const t = e.detail.time_s;
                form.set({ time: { value: t, error: null, text: t.toFixed(4) }, captured: e.detail.raw });
              }}
            />
          </>
        ) : null}
        <div ref={input as never}>
          <QField
            label="Fall time"
            kind="time"
            state={d.time}
            {...inputRange(LIMITS.time_s)}
            hint={d.captured ? `Captured by the phone (${d.captured.kind === 'sound' ? 'sound onsets' : 'taps'}); typing a new value replaces it.` : undefined}
            onChange={(time) => form.set({ time, captured: null })}
          />
        </div>
        <label class="check">
          <input type="checkbox" checked={d.otherHeight} onChange={(e) => form.set({ otherHeight: (e.target as HTMLInputElement).checked })} />
          <span>Dropped from another height</span>
        </label>
        {d.otherHeight ? (
          <QField label="Height of this drop" kind="length" state={d.height} {...inputRange(LIMITS.height_m)} onChange={(height) => form.set({ height })} />
        ) : null}
        <TextField id="drop-note" label="Note (optional)" value={d.note} onInput={(note) => form.set({ note })} />
        {error ? <Notice tone="bad">{error}</Notice> : null}
        <button type="submit" class="btn btn-block btn-big" disabled={!valid || saving}>
          Add drop {nextSeq}
        </button>
      </form>
    </section>
  );
}

function ResultPanel({ outcome, series, usedDrops }: { outcome: SeriesOutcome; series: SeriesRecord; usedDrops: DropRecord[] }) {
  const app = useApp();
  const dropsUsed = usedDrops.length;
  if (outcome.kind === 'missing') return <Notice tone="info">{outcome.message}</Notice>;
  if (outcome.kind === 'error') return <Notice tone="bad" title="The series cannot be computed">{outcome.message}</Notice>;
  const r = outcome.result;
  const cd = r.drag_coefficient;
  const U = 2 * r.drag_coefficient_standard_uncertainty;
  const rel = relativeUncertainty(r);
  const met = rel !== null && rel <= series.target_relative_uncertainty;
  const maxEnergy = Math.max(...r.drops.map((d) => d.impact_energy_J));
  const energyWarning = impactEnergyWarning(maxEnergy);
  return (
    <section class="card result" aria-labelledby="result-h" aria-live="polite">
      <h3 id="result-h">Drag coefficient</h3>
      {cd !== null ? (
        <>
          <p class="big-number" data-testid="cd-value">
            {cd.toFixed(3)} <span class="pm">± {U.toFixed(3)}</span>
          </p>
          <p class="hint">
            Expanded uncertainty (k = 2) from the GUM budget; 95 % interval from {r.monte_carlo.draws.toLocaleString()} Monte Carlo draws:{' '}
            <strong>
              {r.drag_coefficient_interval_95[0].toFixed(3)} to {r.drag_coefficient_interval_95[1].toFixed(3)}
            </strong>
          </p>
        </>
      ) : (
        <>
          <p class="big-number">not resolved</p>
          <p>
            The drag delay is too small for this timing: C_d is below <strong>{r.drag_coefficient_upper_bound_95?.toFixed(3)}</strong> (95 %). Drop from
            higher or time more precisely.
          </p>
        </>
      )}
      <div class="figures">
        <div class="figure">
          <span class="figure-label">Terminal velocity</span>
          <span class="figure-value">
            {r.terminal_velocity_m_s !== null ? app.format(r.terminal_velocity_m_s, 'speed', 1) : `above ${app.format(r.terminal_velocity_lower_bound_m_s, 'speed', 1)}`}
          </span>
        </div>
        <div class="figure">
          <span class="figure-label">Air density</span>
          <span class="figure-value">{app.format(r.air.density_kg_m3, 'density')}</span>
        </div>
        <div class="figure">
          <span class="figure-label">Gravity</span>
          <span class="figure-value">{r.gravity_m_s2.toFixed(5)} m/s²</span>
        </div>
        <div class="figure">
          <span class="figure-label">Reynolds number</span>
          <span class="figure-value">{Math.max(...r.drops.map((d) => d.reynolds_number)).toExponential(2)}</span>
        </div>
        {r.timing_offset_s !== undefined ? (
          <div class="figure">
            <span class="figure-label">Timing offset</span>
            <span class="figure-value">
              {(r.timing_offset_s * 1000).toFixed(1)} ± {((r.timing_offset_standard_uncertainty_s ?? 0) * 1000).toFixed(1)} ms
            </span>
          </div>
        ) : null}
        <div class="figure">
          <span class="figure-label">Impact energy</span>
          <span class="figure-value">{app.format(maxEnergy, 'energy')}</span>
        </div>
      </div>
      {energyWarning ? <Notice tone="bad" title="Impact energy">{energyWarning}</Notice> : null}
      <Enough outcome={outcome} series={series} met={met} rel={rel} dropsUsed={dropsUsed} />
      {r.warnings
        .filter((w) => w.code !== 'possible-outlier')
        .map((w, i) => (
          <Notice key={`${w.code}-${i}`} tone="warn">
            {w.message}
          </Notice>
        ))}
      {r.heights
        .filter((h) => h.grubbs?.outlier)
        .map((h) => {
          // The core numbers drops by their place in the fit; the crew knows them by their own number.
          const drop = usedDrops[h.grubbs!.suspect_drop_index];
          return (
            <Notice key={`g${h.height_m}`} tone="warn" title="Possible outlier">
              Grubbs’ test flags drop {drop?.seq ?? '?'} ({drop?.time_s.toFixed(3)} s from {app.format(h.height_m, 'length', 2)}): G ={' '}
              {h.grubbs!.statistic.toFixed(2)} is above the critical {h.grubbs!.critical_value.toFixed(2)} (α = 0.05). It is kept: check it, and exclude it
              only with a reason.
            </Notice>
          );
        })}
    </section>
  );
}

function Enough({
  outcome,
  series,
  met,
  rel,
  dropsUsed,
}: {
  outcome: Extract<SeriesOutcome, { kind: 'ready' }>;
  series: SeriesRecord;
  met: boolean;
  rel: number | null;
  dropsUsed: number;
}) {
  const app = useApp();
  const advice = useMemo(() => {
    if (met) return null;
    try {
      const cd = outcome.result.drag_coefficient ?? outcome.result.drag_coefficient_upper_bound_95;
      const plan = planDrop({
        site: outcome.request.site,
        air: outcome.request.air,
        specimen: outcome.request.specimen,
        timing: { standard_uncertainty_s: series.u_time_s },
        uncertainty: outcome.request.uncertainty,
        ...(cd && cd > 0 ? { drag_coefficient: cd } : {}),
        height_m: series.height_m,
        target_relative_uncertainty: series.target_relative_uncertainty,
        max_height_m: Math.max(100, series.height_m),
        max_drops: 50,
      });
      return plan.target;
    } catch (e) {
      return { message: describeError(e), drops_at_planned_height: null, reachable: false } as const;
    }
  }, [outcome, series, met]);
  return (
    <div class={`enough ${met ? 'enough-yes' : 'enough-no'}`} role="status">
      <strong>{met ? 'Enough: the target is met.' : 'Not enough yet.'}</strong>{' '}
      {rel !== null ? `Relative uncertainty ${(rel * 100).toFixed(1)} % against a target of ${(series.target_relative_uncertainty * 100).toFixed(1)} %.` : ''}
      {!met && advice ? (
        <div>
          {advice.drops_at_planned_height !== null && advice.drops_at_planned_height !== undefined
            ? advice.drops_at_planned_height > dropsUsed
              ? `About ${advice.drops_at_planned_height - dropsUsed} more drops from ${app.format(series.height_m, 'length', 1)} should reach it. `
              : ''
            : ''}
          {advice.message}
        </div>
      ) : null}
    </div>
  );
}

function Charts({ outcome, drops, series }: { outcome: Extract<SeriesOutcome, { kind: 'ready' }>; drops: DropRecord[]; series: SeriesRecord }) {
  const app = useApp();
  const lu = unitFor('length', app.unit('length'));
  const L = (m: number) => fromSI(m, lu);
  const curves = useMemo(() => seriesCurves(outcome.request, outcome.result), [outcome]);
  const lines: PlotLine[] = [];
  const conv = (c: Array<[number, number]>) => c.map(([t, y]) => [t, L(y)] as const);
  if (curves.fitted) lines.push({ label: `measured C_d ${outcome.result.drag_coefficient?.toFixed(3)}`, points: conv(curves.fitted), tone: 'brand', style: 'solid' });
  if (curves.predicted) lines.push({ label: 'predicted', points: conv(curves.predicted), tone: 'accent', style: 'dash' });
  lines.push({ label: 'no air', points: conv(curves.vacuum), tone: 'ink', style: 'dot' });
  const marks: PlotMark[] = drops.map((d) => ({
    label: `drop ${d.seq}: ${d.time_s.toFixed(3)} s from ${L(dropHeight(d, series)).toFixed(2)} ${lu.symbol}${d.excluded ? ' (excluded)' : ''}`,
    x: d.time_s,
    y: L(dropHeight(d, series)),
    hollow: d.excluded,
  }));
  const heights = new Set(outcome.request.drops.map((d) => d.height_m));
  const r = outcome.result;
  return (
    <section class="card" aria-labelledby="chart-h">
      <h3 id="chart-h">Height against time</h3>
      <pl-plot
        lines={lines}
        marks={marks}
        xLabel="time (s)"
        yLabel={`distance fallen (${lu.symbol})`}
        summary={`Chart of distance fallen against time: ${drops.length} measured drops with the curve for the measured drag coefficient${curves.predicted ? ', the predicted curve' : ''} and the curve without air. The table below lists the same values.`}
      />
      {heights.size > 1 ? (
        <>
          <h3>Residuals against height</h3>
          <p class="hint">Measured minus fitted time. A steady trend with height points to a timing offset.</p>
          <pl-plot
            lines={[]}
            zeroLine
            marks={r.drops.map((d, i) => ({ label: `${(d.residual_s * 1000).toFixed(1)} ms at ${L(d.height_m).toFixed(2)} ${lu.symbol}`, x: L(d.height_m), y: d.residual_s * 1000, yError: series.u_time_s * 1000, hollow: false, key: i }))}
            xLabel={`height (${lu.symbol})`}
            yLabel="residual (ms)"
            summary="Residuals of each drop against its height; the table lists the same values."
          />
        </>
      ) : null}
    </section>
  );
}

function DropTable({ drops, series, outcome }: { drops: DropRecord[]; series: SeriesRecord; outcome: SeriesOutcome }) {
  const app = useApp();
  const [excluding, setExcluding] = useState<string | null>(null);
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string | null>(null);
  if (drops.length === 0) return null;
  const ready = outcome.kind === 'ready' ? outcome : null;
  let used = 0;
  const rows = drops.map((d) => {
    const h = dropHeight(d, series);
    let own: number | null = null;
    let predicted: number | null = null;
    let residual: number | null = null;
    if (ready) {
      if (!d.excluded) {
        const r = ready.result.drops[used++];
        own = r?.drag_coefficient ?? null;
        predicted = r?.predicted_time_s ?? null;
        residual = r?.residual_s ?? null;
      } else {
        own = singleDropDragCoefficient(ready.request as AnalysisRequest, ready.result as AnalysisResult, h, d.time_s).value;
      }
    }
    return { d, h, own, predicted, residual };
  });

  const toggle = async (d: DropRecord) => {
    setError(null);
    try {
      if (d.excluded) {
        await app.store.revise('drop', d.id, { excluded: false, exclusion_reason: null }, reason.trim() || 'included again');
      } else {
        await app.store.revise('drop', d.id, { excluded: true, exclusion_reason: reason.trim() }, reason.trim());
      }
      setExcluding(null);
      setReason('');
      app.notifyChanged();
    } catch (e) {
      setError(describeError(e));
    }
  };

  const oneHeight = new Set(rows.map((r) => r.h)).size === 1;
  return (
    <section class="card" aria-labelledby="drops-h">
      <h3 id="drops-h">Predicted and measured</h3>
      {oneHeight ? <p class="hint">All drops from {app.format(rows[0]!.h, 'length', 2)}.</p> : null}
      <div class="table-wrap">
        <table class="drops">
          <thead>
            <tr>
              <th scope="col">#</th>
              {oneHeight ? null : <th scope="col">h ({app.unit('length')})</th>}
              <th scope="col">
                <abbr title="measured time">t</abbr> (s)
              </th>
              <th scope="col">
                <abbr title="predicted time">pred.</abbr> (s)
              </th>
              <th scope="col">C_d</th>
              <th scope="col">
                <abbr title="measured minus fitted time">resid.</abbr> (ms)
              </th>
              <th scope="col">
                <span class="sr-only">Action</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {rows.map(({ d, h, own, predicted, residual }) => (
              <tr key={d.id} class={d.excluded ? 'excluded' : ''}>
                <th scope="row">{d.seq}</th>
                {oneHeight ? null : <td>{app.format(h, 'length', 2).replace(/ \S+$/, '')}</td>}
                <td>{d.time_s.toFixed(3)}</td>
                <td>{predicted !== null ? predicted.toFixed(3) : '—'}</td>
                <td>{own !== null ? own.toFixed(3) : '—'}</td>
                <td>{residual !== null ? (residual * 1000).toFixed(1) : d.excluded ? 'excl.' : '—'}</td>
                <td>
                  <button
                    type="button"
                    class="btn btn-small btn-quiet btn-icon"
                    title={d.excluded ? 'Include again' : 'Exclude'}
                    aria-label={d.excluded ? `Include drop ${d.seq} again` : `Exclude drop ${d.seq}`}
                    onClick={() => {
                      setExcluding(d.id);
                      setReason('');
                    }}
                  >
                    <span aria-hidden="true">{d.excluded ? '↺' : '✕'}</span>
                  </button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {rows
        .filter((r) => r.d.excluded)
        .map((r) => (
          <p key={r.d.id} class="hint">
            Drop {r.d.seq} excluded: {r.d.exclusion_reason}
          </p>
        ))}
      {excluding
        ? (() => {
            const d = drops.find((x) => x.id === excluding)!;
            return (
              <div class="subform" role="group" aria-label={d.excluded ? `Include drop ${d.seq}` : `Exclude drop ${d.seq}`}>
                <TextField
                  id="exclude-reason"
                  label={d.excluded ? `Why include drop ${d.seq} again?` : `Why exclude drop ${d.seq}?`}
                  hint="The reason is kept in the drop’s history. Nothing is deleted."
                  value={reason}
                  onInput={setReason}
                />
                {error ? <Notice tone="bad">{error}</Notice> : null}
                <div class="btn-row">
                  <button type="button" class="btn" disabled={!d.excluded && reason.trim() === ''} onClick={() => void toggle(d)}>
                    {d.excluded ? 'Include it' : 'Exclude it'}
                  </button>
                  <button type="button" class="btn btn-quiet" onClick={() => setExcluding(null)}>
                    Cancel
                  </button>
                </div>
              </div>
            );
          })()
        : null}
    </section>
  );
}

function Budget({ result }: { result: AnalysisResult }) {
  const total = result.budget.reduce((s, b) => s + b.contribution ** 2, 0);
  const bars = result.budget
    .filter((b) => b.contribution > 0)
    .map((b) => ({
      label: b.description || b.input,
      value: b.contribution,
      text: `${b.contribution.toExponential(1)} (${total > 0 ? ((100 * b.contribution ** 2) / total).toFixed(0) : 0} %)`,
    }));
  return (
    <section class="card" aria-labelledby="budget-h">
      <h3 id="budget-h">Uncertainty budget</h3>
      <p class="hint">Contribution of each input to the standard uncertainty of C_d, and its share of the variance.</p>
      <pl-bars bars={bars} heading="Contributions to the uncertainty of the drag coefficient" />
    </section>
  );
}
