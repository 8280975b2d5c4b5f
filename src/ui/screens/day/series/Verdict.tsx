// The series' verdict: its C_d with the uncertainty, the figures, whether it is enough and what it would take.
import { useMemo } from 'preact/hooks';
import type { DropRecord, SeriesRecord } from '../../../../log';
import { dropOfResult, relativeUncertainty, seriesAdvice, type SeriesOutcome } from '../../../../analysis';
import { useApp } from '../../../app-context';
import { Notice } from '../../../forms';
import { impactEnergyWarning } from '../../../SafetyCaution';
import { describeError } from '../../../errors';
import { inChosenUnits, warningText } from '../../../unit-text';
import { formatSignificant } from '../../../../widgets/units';

export function Verdict({ outcome, series, usedDrops }: { outcome: SeriesOutcome; series: SeriesRecord; usedDrops: readonly DropRecord[] }) {
  const app = useApp();
  const dropsUsed = usedDrops.length;
  if (outcome.kind === 'missing') return <Notice tone="info">{inChosenUnits(outcome.message, app.format)}</Notice>;
  if (outcome.kind === 'error') return <Notice tone="bad" title="The series cannot be computed">{inChosenUnits(outcome.message, app.format)}</Notice>;
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
        <dt>Reynolds number at landing</dt>
        <dd>{formatSignificant(Math.max(...r.drops.map((d) => d.reynolds_number)), 3)}</dd>
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
      <Enough outcome={outcome} series={series} met={met} rel={rel} dropsUsed={dropsUsed} />
      {r.warnings
        .filter((w) => w.code !== 'possible-outlier')
        .map((w, i) => (
          <Notice key={`${w.code}-${i}`} tone="warn">
            {warningText(w, app.format, { temperature_C: outcome.reading.temperature_C, station_pressure_Pa: r.air.station_pressure_Pa })}
          </Notice>
        ))}
      {r.heights
        .filter((h) => h.grubbs?.outlier)
        .map((h) => {
          // The core numbers drops by their place in the fit; the crew knows them by their own number (joined by id).
          const drop = dropOfResult(r, h.grubbs!.suspect_drop_index, usedDrops);
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
      return seriesAdvice(outcome, series);
    } catch (e) {
      return { message: describeError(e), drops_at_planned_height: null, reachable: false } as const;
    }
    // A reload hands over a new series object: its revision stamp says whether it changed.
  }, [outcome, series.id, series.rev, met]);
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
          {inChosenUnits(advice.message, app.format)}
        </div>
      ) : null}
    </div>
  );
}
