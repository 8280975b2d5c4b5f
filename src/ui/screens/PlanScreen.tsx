import { useMemo } from 'preact/hooks';
import { STANDARD_SPHERE_DRAG_RELATIVE_UNCERTAINTY, type DropPlan } from '../../physics';
import { inputRange, LIMITS, type TimingMethod } from '../../log';
import { useApp } from '../app-context';
import { useDraft, useStoreData } from '../hooks';
import { Notice, QField, SelectField, field, fieldsValid, type FieldState } from '../forms';
import { routeHref } from '../router';
import { SafetyCaution, impactEnergyWarning } from '../SafetyCaution';
import { analyzeDay, PLAN_DEFAULTS, planFor, specimenDragCoefficientOfDay, type PlanSources } from '../../analysis';
import { TIMING_DEFAULTS, TIMING_OPTIONS } from './day/SeriesForm';
import { describeError } from '../errors';
import { useSettled } from '../use-settled';
import { inChosenUnits, warningText } from '../unit-text';
import { formatSignificant } from '../../widgets/units';

interface PlanDraft {
  specimenId: string;
  height: FieldState;
  timingMethod: TimingMethod;
  uTime: FieldState;
  target: FieldState;
  maxHeight: FieldState;
  /** Plan with the C_d measured today for this specimen, when there is one. */
  useMeasured?: boolean;
}

/** Try a drop before making it: fall time, impact, and the height and drops a target uncertainty needs. */
export function PlanScreen() {
  const app = useApp();
  const data = useStoreData(async () => {
    const specimens = await app.store.list('specimen');
    const dayId = app.settings.currentDayId;
    const view = dayId ? await app.store.loadDay(dayId).catch(() => null) : null;
    return { specimens, view };
  }, [app.settings.currentDayId]);
  const form = useDraft<PlanDraft>('planner', () => ({
    specimenId: '',
    height: field(PLAN_DEFAULTS.form.height_m),
    timingMethod: 'tap',
    uTime: field(TIMING_DEFAULTS.tap.u_s),
    target: field(PLAN_DEFAULTS.form.target_pct),
    maxHeight: field(PLAN_DEFAULTS.form.max_height_m),
    useMeasured: true,
  }));
  const d = form.value;
  const specimens = data.state === 'ready' ? data.value.specimens : [];
  const specimen = specimens.find((s) => s.id === d.specimenId) ?? specimens[0];
  const view = data.state === 'ready' ? data.value.view : null;
  const reading = view?.readings[view.readings.length - 1] ?? null;
  const site = view?.site ?? null;
  // Only the C_d is taken from today's series: few Monte Carlo draws do.
  const today = useMemo(() => (view ? analyzeDay(view, { monteCarloDraws: 200 }) : []), [view]);
  const measured = specimen ? specimenDragCoefficientOfDay(today, specimen.id) : null;
  // The plan follows the form once typing rests, not every keystroke.
  const settled = useSettled(d);

  const plan = useMemo(() => {
    if (!specimen || !fieldsValid(settled.height, settled.uTime, settled.target, settled.maxHeight)) return null;
    try {
      return { ok: true as const, ...planFor({
        specimen,
        reading,
        site,
        measuredDragCoefficient: settled.useMeasured !== false && measured ? measured.value : null,
        u_time_s: settled.uTime.value!,
        height_m: settled.height.value!,
        target_relative_uncertainty: settled.target.value! / 100,
        max_height_m: settled.maxHeight.value!,
      }) };
    } catch (e) {
      return { ok: false as const, message: describeError(e) };
    }
  }, [specimen, reading, site, measured?.value, settled]);

  return (
    <div>
      <SafetyCaution />
      {specimens.length === 0 ? (
        <Notice tone="info">
          Add a specimen to the <a href={routeHref('specimens', 'new')}>catalogue</a> to plan its drops.
        </Notice>
      ) : (
        <section class="card" aria-labelledby="plan-h">
          <h2 id="plan-h">Try a drop</h2>
          <p class="hint">
            Air: {reading ? `the latest reading of the current day (${app.format(reading.temperature_C, 'temperature')})` : `standard sea-level air, ${app.format(PLAN_DEFAULTS.air.temperature_C, 'temperature')}, dry (no current day with a reading)`}.
          </p>
          <SelectField
            id="plan-specimen"
            label="Specimen"
            value={specimen?.id ?? ''}
            options={specimens.map((s) => ({ value: s.id, label: s.name }))}
            onChange={(specimenId) => form.set({ specimenId })}
          />
          <QField label="Release height" kind="length" state={d.height} {...inputRange(LIMITS.height_m)} onChange={(height) => form.set({ height })} />
          <SelectField
            id="plan-timing"
            label="Timing method"
            value={d.timingMethod}
            options={TIMING_OPTIONS}
            onChange={(v) => form.set({ timingMethod: v as TimingMethod, uTime: field(TIMING_DEFAULTS[v as TimingMethod].u_s) })}
          />
          <QField label="Timing std. uncertainty per drop" kind="time" delta state={d.uTime} min={0} minExclusive max={1} onChange={(uTime) => form.set({ uTime })} />
          <QField label="Target uncertainty of C_d" kind="percent" state={d.target} min={0} minExclusive max={100} onChange={(target) => form.set({ target })} />
          <QField label="Highest release point available" kind="length" state={d.maxHeight} min={0.5} max={LIMITS.height_m.max} onChange={(maxHeight) => form.set({ maxHeight })} />
          {measured ? (
            <label class="check">
              <input type="checkbox" checked={d.useMeasured !== false} onChange={(e) => form.set({ useMeasured: (e.target as HTMLInputElement).checked })} />
              <span>Use the C_d measured today for this specimen ({measured.value.toFixed(3)})</span>
            </label>
          ) : null}
        </section>
      )}
      {plan && !plan.ok ? <Notice tone="bad">{inChosenUnits(plan.message, app.format)}</Notice> : null}
      {plan && plan.ok ? <PlanResult plan={plan.plan} sources={plan.sources} /> : null}
    </div>
  );
}

function PlanResult({ plan, sources }: { plan: DropPlan; sources: PlanSources }) {
  const app = useApp();
  const at = plan.at_height;
  const energyWarning = impactEnergyWarning(at?.impact_energy_J);
  return (
    <section class="card result" aria-labelledby="planres-h" aria-live="polite">
      <h3 id="planres-h">What to expect</h3>
      <p class="hint">
        Assumed C_d {plan.drag_coefficient.toFixed(3)} (
        {sources.dragCoefficient === 'measured'
          ? 'measured today'
          : plan.drag_coefficient_source === 'reference'
            ? 'the specimen’s reference value'
            : plan.drag_coefficient_source === 'given'
              ? 'given'
              : `the standard sphere curve at ${at ? 'impact' : 'terminal velocity'}`}
        ).{sources.site === 'default' ? ` Gravity at ${PLAN_DEFAULTS.site.latitude_deg}° latitude at sea level (no current day with a site).` : ''}
      </p>
      {at ? (
        <>
          <p class="fall-story" data-testid="fall-story">
            Let go at rest, it lands after <strong>{at.fall_time_s.toFixed(3)} s</strong>, {(at.drag_delay_s * 1000).toFixed(1)} ms later than
            it would with no air, at <strong>{app.format(at.impact_speed_m_s, 'speed', 1)}</strong>, carrying{' '}
            <strong>{app.format(at.impact_energy_J, 'energy')}</strong>.
          </p>
          <p class="fall-story">
            However far it fell, still air would hold it below <strong>{app.format(plan.terminal_velocity_m_s, 'speed', 1)}</strong>. It comes
            within 5&nbsp;% of that after falling {app.format(plan.distance_to_95pct_terminal_velocity_m, 'length', 1)}, within 1&nbsp;% after{' '}
            {app.format(plan.distance_to_99pct_terminal_velocity_m, 'length', 1)}.
          </p>
          <dl class="readout">
            {at.fall_time_standard_uncertainty_s !== null ? (
              <>
                <dt>Fall time uncertainty</dt>
                <dd data-testid="plan-time-u">± {formatSignificant(at.fall_time_standard_uncertainty_s * 1000, 2, app.settings.decimalComma)} ms</dd>
              </>
            ) : null}
            <dt>C_d uncertainty from one drop</dt>
            <dd>{(at.relative_uncertainty_one_drop * 100).toFixed(1)} %</dd>
          </dl>
          {at.fall_time_standard_uncertainty_s !== null && plan.drag_coefficient_relative_standard_uncertainty !== null ? (
            <p class="hint" data-testid="plan-time-u-hint">
              How far the standard sphere curve’s own uncertainty of C_d moves the predicted time, as one standard uncertainty:{' '}
              {plan.drag_coefficient_relative_standard_uncertainty <= STANDARD_SPHERE_DRAG_RELATIVE_UNCERTAINTY
                ? '5\u00a0% of C_d at this speed (more above Re 10⁵, far more near the drag crisis).'
                : `${formatSignificant(plan.drag_coefficient_relative_standard_uncertainty * 100, 2, app.settings.decimalComma)}\u00a0% of C_d at this speed (5\u00a0% below Re 10⁵; the curve is least certain near the drag crisis).`}{' '}
              The timing adds its own.
            </p>
          ) : null}
        </>
      ) : null}
      {energyWarning ? (
        <Notice tone="bad" title="Impact energy">
          {energyWarning}
        </Notice>
      ) : null}
      {plan.target ? (
        <Notice tone={plan.target.reachable ? 'good' : 'warn'} title={plan.target.reachable ? 'The target can be reached' : 'The target cannot be reached'}>
          {/* A percentage stays on the line of its number. */}
          <p>{inChosenUnits(plan.target.message, app.format).replace(/ %/g, '\u00a0%')}</p>
          {plan.target.smallest_height_m !== null ? (
            <p>
              Lowest height: <strong>{app.format(plan.target.smallest_height_m, 'length', 1)}</strong> with {plan.target.drops_at_smallest_height} drop{plan.target.drops_at_smallest_height === 1 ? '' : 's'}.
              {plan.target.drops_at_planned_height !== null
                ? ` From the planned height: ${plan.target.drops_at_planned_height} drop${plan.target.drops_at_planned_height === 1 ? '' : 's'}.`
                : ''}
            </p>
          ) : null}
        </Notice>
      ) : null}
      {plan.warnings.map((w, i) => (
        <Notice key={`${w.code}${i}`} tone="warn">
          {warningText(w, app.format)}
        </Notice>
      ))}
    </section>
  );
}
