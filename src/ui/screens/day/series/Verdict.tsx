// The series' verdict: its C_d with the uncertainty, the figures, whether it is enough and what it would take.
import { useMemo } from 'preact/hooks';
import type { SeriesRecord } from '../../../../log';
import { dragCoefficientWithoutBuoyancyAndAddedMass, seriesAdviceFacts, type SeriesOutcome, type SeriesVerdict } from '../../../../analysis';
import { adviceText, flagText, flagTitle, TONE_OF, verdictLine, verdictTone } from './verdict-text';
import { useApp } from '../../../app-context';
import { Notice } from '../../../forms';
import { impactEnergyWarning } from '../../../SafetyCaution';
import { describeError } from '../../../errors';
import { inChosenUnits, warningText } from '../../../unit-text';
import { formatSignificant } from '../../../../widgets/units';

export function Verdict({ outcome, series, verdict }: { outcome: SeriesOutcome; series: SeriesRecord; verdict: SeriesVerdict }) {
  const app = useApp();
  const lumped = useMemo(() => dragCoefficientWithoutBuoyancyAndAddedMass(outcome), [outcome]);
  const flags = verdict.flags.map((f, i) => (
    <Notice key={`${f.code}-${i}`} tone={TONE_OF[f.kind]} title={flagTitle(f)}>
      {flagText(f, app.format)}
    </Notice>
  ));
  if (outcome.kind === 'missing') return <Notice tone="info">{inChosenUnits(outcome.message, app.format)}</Notice>;
  if (outcome.kind === 'error')
    return (
      <>
        <Notice tone="bad" title="The series cannot be computed">
          {inChosenUnits(outcome.message, app.format)}
        </Notice>
        {flags}
      </>
    );
  const r = outcome.result;
  const cd = r.drag_coefficient;
  const U = 2 * r.drag_coefficient_standard_uncertainty;
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
          <p class="hint what-cd" data-testid="cd-meaning">
            This C_d comes from a fall model that {r.model.buoyancy ? 'includes' : 'leaves out'} the air’s buoyancy and includes its added mass (C_a ={' '}
            {r.model.added_mass_coefficient.toFixed(2)}).
            {lumped !== null && Math.abs(lumped - cd) >= 0.0005 ? (
              <>
                {' '}
                A model with drag alone would read <strong>{lumped.toFixed(3)}</strong> from the same drops.
              </>
            ) : null}
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
      <dl class="readout" aria-label="What the series says about the fall">
        <dt>Still-air top speed</dt>
        <dd>
          {r.terminal_velocity_m_s !== null ? app.format(r.terminal_velocity_m_s, 'speed', 1) : `above ${app.format(r.terminal_velocity_lower_bound_m_s, 'speed', 1)}`}
        </dd>
        <dt>Hardest landing</dt>
        <dd>{app.format(maxEnergy, 'energy')}</dd>
        <dt>Air density</dt>
        <dd>{app.format(r.air.density_kg_m3, 'density')}</dd>
        <dt>Gravity here</dt>
        <dd>{app.format(r.gravity_m_s2, 'acceleration')}</dd>
        <dt>Reynolds numbers of the series</dt>
        <dd>
          {formatSignificant(r.drag_law_details.reynolds_range[0], 2)} to {formatSignificant(r.drag_law_details.reynolds_range[1], 2)}
        </dd>
        {r.air_column && r.air_column.weight > 0 ? (
          <>
            <dt>Air along the fall</dt>
            <dd>
              {app.format(r.air_column.density_at_release_kg_m3, 'density')} at release, {app.format(r.air_column.density_at_landing_kg_m3, 'density')} at landing
              {r.air_column.drift_m > 0.005 ? `; drifts ${app.format(r.air_column.drift_m, 'length', 2)} downwind` : ''}
            </dd>
          </>
        ) : null}
        <dt>Drag law</dt>
        <dd>
          {r.drag_law === 'scaled_sphere'
            ? `sphere curve × ${formatSignificant(r.drag_law_details.scale_factor ?? 1, 3)}`
            : 'constant C_d'}
        </dd>
        {r.drag_law === 'scaled_sphere' && r.drag_law_details.drag_coefficient_at_max_impact !== null ? (
          <>
            <dt>C_d at the fastest landing</dt>
            <dd>{formatSignificant(r.drag_law_details.drag_coefficient_at_max_impact, 3)}</dd>
          </>
        ) : null}
        {r.timing_offset_s !== undefined ? (
          <>
            <dt>Timing offset</dt>
            <dd>
              {(r.timing_offset_s * 1000).toFixed(1)} ± {((r.timing_offset_standard_uncertainty_s ?? 0) * 1000).toFixed(1)} ms
            </dd>
          </>
        ) : null}
      </dl>
      {energyWarning ? <Notice tone="bad" title="Impact energy">{energyWarning}</Notice> : null}
      {verdict.verdict.state === 'not-met' || verdict.verdict.state === 'unresolved' ? <Advice outcome={outcome} series={series} dropsUsed={verdict.drops_used} /> : null}
      {flags}
    </section>
  );
}

/** The verdict and the C_d in one line, pinned at the top of the series screen while drops are entered. */
export function VerdictBar({ outcome, verdict }: { outcome: SeriesOutcome; verdict: SeriesVerdict }) {
  const r = outcome.kind === 'ready' ? outcome.result : null;
  return (
    <div class={`verdict-bar verdict-${verdictTone(verdict)}`} role="status" aria-live="polite" data-testid="verdict-bar">
      <span class="verdict-cd">
        {r?.drag_coefficient != null
          ? `C_d ${r.drag_coefficient.toFixed(3)} ± ${(2 * r.drag_coefficient_standard_uncertainty).toFixed(3)}`
          : r
            ? `C_d < ${r.drag_coefficient_upper_bound_95?.toFixed(3) ?? '?'}`
            : 'C_d —'}
      </span>
      <span class="verdict-line" data-testid="verdict-line">
        {verdictLine(verdict)}
      </span>
    </div>
  );
}

function Advice({ outcome, series, dropsUsed }: { outcome: Extract<SeriesOutcome, { kind: 'ready' }>; series: SeriesRecord; dropsUsed: number }) {
  const app = useApp();
  const advice = useMemo(() => {
    try {
      return adviceText(seriesAdviceFacts(outcome, series, dropsUsed), app.format);
    } catch (e) {
      return describeError(e);
    }
    // A reload hands over a new series object: its revision stamp says whether it changed.
  }, [outcome, series.id, series.rev, dropsUsed, app.format]);
  return (
    <p class="advice" data-testid="advice">
      {advice}
    </p>
  );
}
