/**
 * The drag-law stage of a series' analysis (dragLaw.ts): after the constant-C_d fit and its Monte Carlo, choose
 * the law, and for scaled_sphere fit the factor on the standard sphere curve, map every draw to it, and report C_d
 * at the terminal and at the highest impact Reynolds number. For any law, test the per-height values for a trend.
 */
import type { AnalysisResult } from './analysisTypes';
import type { DropGroups } from './dropGroups';
import {
  chooseDragLaw,
  fitSphereScale,
  interpolateRow,
  scaledSphereTerminalVelocity,
  weightedTrend,
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
  scaled: { body: SphereScaleBody; scale: number; offset_s: number; slope: number } | null;
}

export function seriesDragLaw(
  setup: SeriesSetup,
  groups: DropGroups,
  fit: SeriesFit,
  mc: { values: Float64Array; dragCoefficient: MonteCarloSummary },
  uc: number,
  resolved: boolean,
  /** Scatter beyond the declared timing uncertainty, s (seriesScatter.ts). */
  excessScatter_s: number,
): SeriesDragLaw {
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
  const warnings: PhysicsWarning[] = [];
  if (choice.law === 'scaled_sphere' && !(resolved && kHat > 0)) {
    choice = { ...choice, law: 'constant', reason: 'drag is not resolved: no speed dependence can be fitted' };
  }
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

  if (choice.law === 'scaled_sphere') {
    const offsetFit = setup.fitOffset;
    const maxRe = Math.max(...impactRe);
    const fitted = fitSphereScale(body, groups.heights, times, groups.counts, offsetFit, constantCd / standardSphereDragCoefficient(maxRe));
    const scale = fitted.scale;
    const row = (constantCdValue: number, s: number): ScaledSphereRow => {
      const vT = scaledSphereTerminalVelocity(body, s);
      return { constantCd: constantCdValue, scale: s, terminalVelocity_m_s: vT, terminalCd: s * standardSphereDragCoefficient(body.reynolds_per_speed_s_m * vT) };
    };
    // The map from the constant fit to the scaled one: both fitted to the nominal times with the drag delay scaled by λ.
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
    const offset = offsetFit ? fit.offset_s : 0;
    const steps = 8;
    for (let i = 0; i <= steps; i++) {
      const lambda = lambdaLow * Math.pow(lambdaHigh / lambdaLow, i / steps);
      const scaled = times.map((t, j) => noDragTimes[j]! + offset + lambda * (t - offset - noDragTimes[j]!));
      const k = fitDragConstant(setup.effectiveGravity_m_s2, groups.heights, scaled.map((t) => t - offset), groups.counts, false, kHat).drag_constant_per_m;
      const s = fitSphereScale(body, groups.heights, scaled.map((t) => t - offset), groups.counts, false, scale * lambda).scale;
      table.push(row(cdFromDragConstant(setup, k), s));
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
    const nominal = row(constantCd, scale);
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
    if (!fitted.converged) {
      warnings.push({ code: 'drag-law-fit-not-converged', message: 'The fit of the scaled standard sphere curve did not converge; its factor may be off.' });
    }
    const fittedOffset = fitted.offset_s;
    base.scaled = { body, scale, offset_s: offsetFit ? fittedOffset : 0, slope: slope('terminalCd') };
    perHeight = (j, t) => fitSphereScale(body, [groups.heights[j]!], [t - fittedOffset], [groups.counts[j]!], false, scale).scale;
  }

  // Trend of the per-height values against ln(height), judged against the random timing error only: inputs shared
  // by every height (air, mass, size) move all values alike and make no trend; a shared delay does, and is taken
  // off first (declared, or fitted).
  let trendZ: number | null = null;
  const needed = setup.fitOffset ? 4 : 3;
  if (J >= needed && kHat > 0) {
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
