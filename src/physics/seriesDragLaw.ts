/**
 * The drag-law stage of a series' analysis (dragLaw.ts), in two steps around the Monte Carlo.
 *
 * Before it (seriesDragLawChoice): choose the law, and for scaled_sphere fit the factor on the standard sphere curve
 * (and the timing offset when one is fitted) to the mean times, so that the scatter, each drop's own C_d, the budget's
 * Type A row and the Monte Carlo's timing noise are all taken about that law's fit.
 *
 * After it (seriesDragLaw): map every draw to the chosen law, report C_d at the terminal and at the highest impact
 * Reynolds number, and for any law test the per-height values for a trend.
 */
import type { AnalysisResult } from './analysisTypes';
import type { ScaledSphereLaw } from './dropDragCoefficient';
import type { DropGroups } from './dropGroups';
import {
  chooseDragLaw,
  fitSphereScale,
  interpolateRow,
  scaledSphereFallTime,
  scaledSphereTerminalVelocity,
  weightedTrend,
  type DragLawChoice,
  type DragLawOption,
  type ScaledSphereRow,
  type SphereScaleBody,
} from './dragLaw';
import { fallSpeedAtHeight, fallTime } from './fallModel';
import { fitDragConstant } from './fitDragConstant';
import { summariseDraws, type MonteCarloSummary } from './monteCarloPropagation';
import type { PhysicsWarning } from './physicsWarning';
import type { SeriesFit } from './seriesFit';
import { cdFromDragConstant, type SeriesSetup } from './seriesSetup';
import { standardSphereDragCoefficient } from './standardSphereDrag';

/** The law chosen before the Monte Carlo, and for scaled_sphere its fit to the nominal mean times. */
export interface SeriesDragLawChoice {
  requested: DragLawOption;
  choice: DragLawChoice;
  body: SphereScaleBody;
  /** Impact Reynolds number at each height, from the constant fit. */
  impactRe: number[];
  /** For scaled_sphere: the fitted factor and offset (0 without one), and whether the fit converged. */
  scaled: (ScaledSphereLaw & { converged: boolean }) | null;
}

/**
 * The law of a series (options.drag_law, or the rule of `auto` against the constant fit's relative uncertainty
 * uc/C_d), given whether drag is resolved at all (no speed dependence can be fitted to a delay within the noise:
 * then the law is constant). For scaled_sphere, the factor and offset fitted to the mean times less the declared
 * delay: the declared delay stays the prior the fitted offset is checked against.
 */
export function seriesDragLawChoice(setup: SeriesSetup, groups: DropGroups, fit: SeriesFit, uc: number, resolved: boolean): SeriesDragLawChoice {
  const requested: DragLawOption = setup.request.options?.drag_law ?? 'auto';
  const { geometry } = setup;
  const body: SphereScaleBody = {
    effective_gravity_m_s2: setup.effectiveGravity_m_s2,
    drag_constant_per_unit_cd_per_m: (setup.density_kg_m3 * geometry.area_m2) / (2 * setup.effectiveMass_kg),
    reynolds_per_speed_s_m: (setup.density_kg_m3 * geometry.characteristic_length_m) / setup.viscosity_Pa_s,
  };
  const kHat = fit.dragConstant_per_m;
  const constantCd = fit.estimate;
  const physical = { ...fit.fitted, drag_constant_per_m: Math.max(kHat, 0) };
  const impactRe = groups.heights.map((h) => body.reynolds_per_speed_s_m * fallSpeedAtHeight(h, physical));
  const relativeU = constantCd > 0 ? uc / constantCd : Infinity;
  let choice = chooseDragLaw(requested, geometry.shape, impactRe, relativeU);
  if (choice.law === 'scaled_sphere' && !(resolved && kHat > 0)) {
    choice = { ...choice, law: 'constant', reason: 'drag is not resolved: no speed dependence can be fitted' };
  }
  let scaled: SeriesDragLawChoice['scaled'] = null;
  if (choice.law === 'scaled_sphere') {
    const times = groups.meanTimes.map((t) => t - setup.subtractedOffset_s);
    const start = constantCd / standardSphereDragCoefficient(Math.max(...impactRe));
    const fitted = fitSphereScale(body, groups.heights, times, groups.counts, setup.fitOffset, start);
    scaled = { body, scale: fitted.scale, offset_s: setup.fitOffset ? fitted.offset_s : 0, converged: fitted.converged };
  }
  return { requested, choice, body, impactRe, scaled };
}

export interface SeriesDragLaw {
  details: AnalysisResult['drag_law_details'];
  law: AnalysisResult['drag_law'];
  /** In the chosen law: C_d at the terminal Reynolds number for scaled_sphere, the constant C_d otherwise. */
  estimate: number;
  standardUncertainty: number;
  interval_95: [number, number];
  upperBound_95: number;
  terminalVelocity_m_s: number;
  warnings: PhysicsWarning[];
  /**
   * For scaled_sphere: the fitted fall (the body, the factor and the fitted offset, 0 without one) and dC_d/dC_d,const,
   * the slope of the map from the constant fit, which carries the constant law's budget rows to this law's C_d.
   * Null for the constant law.
   */
  scaled: (ScaledSphereLaw & { slope: number }) | null;
  /** For scaled_sphere with a fitted offset: the Monte Carlo's offset draws mapped to the scaled law. */
  offset: MonteCarloSummary | null;
}

/**
 * After the Monte Carlo: the reported values in the chosen law. For scaled_sphere every draw of the constant fit is
 * mapped to the scaled law through a table made by fitting both laws to the nominal mean times with their drag
 * delay scaled by λ (dragLaw.ts). With a fitted offset both laws fit their offset too; shifting every time by the
 * same amount moves each law's fitted offset by exactly that amount and leaves its drag alone, so a draw's offset
 * maps to the scaled law by adding the difference of the two laws' offsets at its λ.
 */
export function seriesDragLaw(
  setup: SeriesSetup,
  groups: DropGroups,
  fit: SeriesFit,
  chosen: SeriesDragLawChoice,
  mc: {
    values: Float64Array;
    dragCoefficient: MonteCarloSummary;
    /** The successful draws in order, C_d beside the fitted offset (only with a fitted offset). */
    offsetDraws: { values: Float64Array; offsets: Float64Array } | null;
  },
  uc: number,
  /** Scatter beyond the declared timing uncertainty, s (seriesScatter.ts), about the chosen law's fit. */
  excessScatter_s: number,
): SeriesDragLaw {
  const { requested, choice, body, impactRe } = chosen;
  const kHat = fit.dragConstant_per_m;
  const constantCd = fit.estimate;
  const warnings: PhysicsWarning[] = [];
  // The mean times the laws are fitted to: less the declared delay (the fitted offset is fitted again below).
  const J = groups.heights.length;
  const times = groups.meanTimes.map((t) => t - setup.subtractedOffset_s);
  const randomU = (j: number) => Math.sqrt((setup.timingU ** 2 + excessScatter_s ** 2) / groups.counts[j]!);
  const noDragTimes = groups.heights.map((h) => fallTime(h, setup.noDrag));
  const base: Omit<SeriesDragLaw, 'details'> & { details: Omit<AnalysisResult['drag_law_details'], 'trend_z' | 'misfit'> } = {
    law: choice.law,
    estimate: constantCd,
    standardUncertainty: uc,
    interval_95: mc.dragCoefficient.interval_95,
    upperBound_95: mc.dragCoefficient.upper_bound_95,
    terminalVelocity_m_s: Math.sqrt(setup.effectiveGravity_m_s2 / kHat),
    warnings,
    scaled: null,
    offset: null,
    details: {
      requested,
      reason: choice.reason,
      reynolds_range: choice.reynolds_range,
      sphere_curve_change: choice.sphere_curve_change,
      constant_drag_coefficient: constantCd,
      scale_factor: null,
      scale_factor_standard_uncertainty: null,
      scale_factor_interval_95: null,
      terminal_reynolds_number: kHat > 0 ? body.reynolds_per_speed_s_m * Math.sqrt(setup.effectiveGravity_m_s2 / kHat) : null,
      drag_coefficient_at_terminal: kHat > 0 ? constantCd : null,
      drag_coefficient_at_max_impact: kHat > 0 ? constantCd : null,
    },
  };
  // Per-height values for the trend test, each from its own height's mean time (the fitted offset taken off).
  let perHeight: (j: number, t: number) => number = (j, t) =>
    cdFromDragConstant(setup, fitDragConstant(setup.effectiveGravity_m_s2, [groups.heights[j]!], [t], [groups.counts[j]!], false, kHat).drag_constant_per_m);
  // Under the scaled law the trend is tested in the fitted law's linearisation instead (scaledSphereTrendZ).
  let scaledTrend: (() => number | null) | null = null;

  const scaledFit = chosen.scaled;
  if (choice.law === 'scaled_sphere' && scaledFit !== null) {
    const offsetFit = setup.fitOffset;
    const maxRe = Math.max(...impactRe);
    const scale = scaledFit.scale;
    const fittedOffset = scaledFit.offset_s;
    const row = (constantCdValue: number, s: number, offsetShift_s: number): ScaledSphereRow => {
      const vT = scaledSphereTerminalVelocity(body, s);
      return { constantCd: constantCdValue, scale: s, terminalVelocity_m_s: vT, terminalCd: s * standardSphereDragCoefficient(body.reynolds_per_speed_s_m * vT), offsetShift_s };
    };
    // The map from the constant fit to the scaled one: both fitted to the nominal times with the drag delay scaled by λ
    // (the delay beyond the drag-free fall and the scaled law's fitted offset).
    const values = mc.values;
    let lowest = Infinity;
    let highest = -Infinity;
    for (let i = 0; i < values.length; i++) {
      lowest = Math.min(lowest, values[i]!);
      highest = Math.max(highest, values[i]!);
    }
    const lambdaLow = Math.max(0.05, (0.9 * lowest) / constantCd);
    const lambdaHigh = Math.max(1.1, (1.1 * highest) / constantCd);
    const table: ScaledSphereRow[] = [];
    const steps = 8;
    for (let i = 0; i <= steps; i++) {
      const lambda = lambdaLow * Math.pow(lambdaHigh / lambdaLow, i / steps);
      const scaled = times.map((t, j) => noDragTimes[j]! + fittedOffset + lambda * (t - fittedOffset - noDragTimes[j]!));
      if (offsetFit) {
        const constantRow = fitDragConstant(setup.effectiveGravity_m_s2, groups.heights, scaled, groups.counts, true, kHat);
        const scaledRow = fitSphereScale(body, groups.heights, scaled, groups.counts, true, scale * lambda);
        table.push(row(cdFromDragConstant(setup, constantRow.drag_constant_per_m), scaledRow.scale, scaledRow.offset_s - constantRow.offset_s));
      } else {
        const k = fitDragConstant(setup.effectiveGravity_m_s2, groups.heights, scaled, groups.counts, false, kHat).drag_constant_per_m;
        const s = fitSphereScale(body, groups.heights, scaled, groups.counts, false, scale * lambda).scale;
        table.push(row(cdFromDragConstant(setup, k), s, 0));
      }
    }
    table.sort((a, b) => a.constantCd - b.constantCd);
    const mappedScale = new Float64Array(values.length);
    const mappedCd = new Float64Array(values.length);
    for (let i = 0; i < values.length; i++) {
      mappedScale[i] = interpolateRow(table, values[i]!, 'scale');
      mappedCd[i] = interpolateRow(table, values[i]!, 'terminalCd');
    }
    const scaleSummary = summariseDraws(mappedScale, mc.dragCoefficient.draws, mc.dragCoefficient.failed);
    const cdSummary = summariseDraws(mappedCd, mc.dragCoefficient.draws, mc.dragCoefficient.failed);
    if (offsetFit && mc.offsetDraws !== null) {
      const { values: paired, offsets } = mc.offsetDraws;
      const mappedOffset = new Float64Array(paired.length);
      for (let i = 0; i < paired.length; i++) mappedOffset[i] = offsets[i]! + interpolateRow(table, paired[i]!, 'offsetShift_s');
      base.offset = summariseDraws(mappedOffset, mc.dragCoefficient.draws, mc.dragCoefficient.failed);
    }
    const nominal = row(constantCd, scale, 0);
    const step = 1e-3 * constantCd;
    const slope = (key: 'scale' | 'terminalCd') => (interpolateRow(table, constantCd + step, key) - interpolateRow(table, constantCd - step, key)) / (2 * step);
    base.estimate = nominal.terminalCd;
    base.standardUncertainty = Math.abs(slope('terminalCd')) * uc;
    base.interval_95 = cdSummary.interval_95;
    base.upperBound_95 = cdSummary.upper_bound_95;
    base.terminalVelocity_m_s = nominal.terminalVelocity_m_s;
    base.details.scale_factor = scale;
    base.details.scale_factor_standard_uncertainty = Math.abs(slope('scale')) * uc;
    base.details.scale_factor_interval_95 = scaleSummary.interval_95;
    base.details.terminal_reynolds_number = body.reynolds_per_speed_s_m * nominal.terminalVelocity_m_s;
    base.details.drag_coefficient_at_terminal = nominal.terminalCd;
    base.details.drag_coefficient_at_max_impact = scale * standardSphereDragCoefficient(maxRe);
    if (!scaledFit.converged) {
      warnings.push({ code: 'drag-law-fit-not-converged', message: 'The fit of the scaled standard sphere curve did not converge; its factor may be off.' });
    }
    base.scaled = { body, scale, offset_s: fittedOffset, slope: slope('terminalCd') };
    scaledTrend = () => scaledSphereTrendZ(body, groups, times, scale, fittedOffset, offsetFit, randomU, setup.heightU);
  }

  // Trend of the per-height values against ln(height). Under a constant C_d each height's own value, judged against
  // the random timing error only: inputs shared by every height (air, mass, size) move all values alike and make no
  // trend; a shared delay does, and is taken off first (declared, or fitted). (Each height's own height error is left
  // out here, as it always was: on clean data of the scaled curve the same test warned on about 10 % of series
  // where 5 % was meant; the scaled law's test, scaledSphereTrendZ, counts it.)
  let trendZ: number | null = null;
  const needed = setup.fitOffset ? 4 : 3;
  if (scaledTrend !== null) {
    if (J >= needed) trendZ = scaledTrend();
  } else if (J >= needed && kHat > 0) {
    const offset = setup.fitOffset && choice.law === 'constant' ? fit.offset_s : 0;
    const x: number[] = [];
    const v: number[] = [];
    const uv: number[] = [];
    for (let j = 0; j < J; j++) {
      const t = times[j]! - offset;
      const value = perHeight(j, t);
      const du = randomU(j);
      const derivative = (perHeight(j, t + du) - perHeight(j, t - du)) / 2;
      if (!Number.isFinite(value) || !(Math.abs(derivative) > 0)) continue;
      x.push(Math.log(groups.heights[j]!));
      v.push(value);
      uv.push(Math.abs(derivative));
    }
    if (x.length >= needed) {
      const trend = weightedTrend(x, v, uv);
      trendZ = trend.slope / trend.standard_error;
    }
  }
  const misfit = trendZ !== null && Math.abs(trendZ) > 2;
  if (misfit) {
    warnings.push({
      code: 'drag-law-misfit',
      message: `The ${choice.law === 'constant' ? 'constant drag coefficient' : 'scaled standard sphere curve'} does not fit these heights: the value from each height alone trends with height by ${trendZ!.toFixed(1)} standard errors. ${choice.law === 'constant' ? 'Drag may depend on speed (options.drag_law "scaled_sphere"),' : 'The body may not follow a sphere\'s curve,'} or a timing delay may differ between heights.`,
    });
  }
  return { ...base, details: { ...base.details, trend_z: trendZ, misfit } };
}

/**
 * The trend test under the scaled sphere curve, in the fitted law's linearisation: each height's factor on its own is
 * s_j ≈ s + r_j/(∂T_j/∂s), r_j its mean time's residual, so a trend s_j = s + β·(ln h_j − mean) is the model
 * T_j(s) + δ + β·(ln h_j − mean)·∂T_j/∂s, fitted by weighted least squares to the residuals (with the offset's column
 * when an offset is fitted, so the trend is judged after the offset has taken what it can). Each height's mean time
 * is uncertain by its random timing error and by its own height's error (independent at each height, carried by
 * ∂T_j/∂h); inputs shared by every height (air, mass, size) move every s_j alike and make no trend. Returns β over
 * its standard error (GUM-style linear propagation: normal when the law holds), or null when it cannot be formed.
 */
function scaledSphereTrendZ(
  body: SphereScaleBody,
  groups: DropGroups,
  times: readonly number[],
  scale: number,
  offset_s: number,
  fitOffset: boolean,
  timeU: (j: number) => number,
  heightU_m: number,
): number | null {
  const J = groups.heights.length;
  const x = groups.heights.map((h) => Math.log(h));
  const meanX = x.reduce((sum, v) => sum + v, 0) / J;
  const ds = 1e-5 * scale;
  // Columns: ∂T/∂s, its trend, and the offset (only when fitted).
  const columns = fitOffset ? 3 : 2;
  const ata = Array.from({ length: columns }, () => new Array<number>(columns).fill(0));
  const atr = new Array<number>(columns).fill(0);
  for (let j = 0; j < J; j++) {
    const h = groups.heights[j]!;
    const dTds = (scaledSphereFallTime(h, body, scale + ds) - scaledSphereFallTime(h, body, scale - ds)) / (2 * ds);
    const dh = 1e-4 * h;
    const dTdh = (scaledSphereFallTime(h + dh, body, scale) - scaledSphereFallTime(h - dh, body, scale)) / (2 * dh);
    const u = Math.hypot(timeU(j), heightU_m * dTdh);
    if (!(u > 0) || !Number.isFinite(dTds)) return null;
    const w = 1 / (u * u);
    const r = times[j]! - offset_s - scaledSphereFallTime(h, body, scale);
    const row = [dTds, dTds * (x[j]! - meanX), 1].slice(0, columns);
    for (let a = 0; a < columns; a++) {
      atr[a]! += w * row[a]! * r;
      for (let b = 0; b < columns; b++) ata[a]![b]! += w * row[a]! * row[b]!;
    }
  }
  const inverse = invertSymmetric(ata);
  if (inverse === null) return null;
  const beta = inverse[1]!.reduce((sum, v, b) => sum + v * atr[b]!, 0);
  const variance = inverse[1]![1]!;
  return variance > 0 ? beta / Math.sqrt(variance) : null;
}

/** The inverse of a small symmetric positive-definite matrix (Gauss–Jordan with partial pivoting); null when singular. */
function invertSymmetric(m: number[][]): number[][] | null {
  const n = m.length;
  const a = m.map((row, i) => [...row, ...Array.from({ length: n }, (_, k) => (k === i ? 1 : 0))]);
  for (let c = 0; c < n; c++) {
    let pivot = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(a[r]![c]!) > Math.abs(a[pivot]![c]!)) pivot = r;
    if (!(Math.abs(a[pivot]![c]!) > 0)) return null;
    [a[c], a[pivot]] = [a[pivot]!, a[c]!];
    const p = a[c]![c]!;
    for (let k = 0; k < 2 * n; k++) a[c]![k]! /= p;
    for (let r = 0; r < n; r++) {
      if (r === c) continue;
      const f = a[r]![c]!;
      if (f !== 0) for (let k = 0; k < 2 * n; k++) a[r]![k]! -= f * a[c]![k]!;
    }
  }
  return a.map((row) => row.slice(n));
}
