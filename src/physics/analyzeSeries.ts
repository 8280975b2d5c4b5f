/**
 * The analysis of one series of drops: the entry point shared by the app's screens and the
 * office command. It validates the request, computes air and gravity, fits the effective drag
 * coefficient (and optionally a timing offset), builds the GUM budget, propagates the input
 * distributions by Monte Carlo, predicts fall times, and collects every warning on the way.
 */
import type { AnalysisRequest, AnalysisResult, BudgetRow, DropResult, HeightResult } from './analysisTypes';
import { defaultAddedMassUncertainty } from './addedMassCoefficient';
import { budgetInputs, type BudgetInputs } from './budgetInputs';
import { dropDragCoefficients, type DropDragCoefficients, type ScaledSphereLaw } from './dropDragCoefficient';
import { groupDrops, type DropGroups } from './dropGroups';
import { fallParameters, fallSpeedAtHeight, fallTime, type FallParameters } from './fallModel';
import { fallWithVariableDrag } from './fallWithVariableDrag';
import { grubbsPerSeries } from './grubbsTest';
import { adaptiveMonteCarloPropagation, monteCarloNormals, monteCarloPropagation, type AdaptiveMonteCarloResult, type MonteCarloSpec } from './monteCarloPropagation';
import type { PhysicsWarning } from './physicsWarning';
import { fitSeries, type SeriesFit } from './seriesFit';
import { checkNotFasterThanFreeFall, seriesScatter, type SeriesScatter } from './seriesScatter';
import { DEFAULT_MONTE_CARLO_DRAWS, dragConstantFromCd, prepareSetup, type SeriesSetup } from './seriesSetup';
import { seriesDragLaw, seriesDragLawChoice } from './seriesDragLaw';
import { seriesStatistics } from './seriesStatistics';
import { STANDARD_SPHERE_DRAG_VALID_MAX_REYNOLDS, standardSphereDragCoefficient, standardSphereDragRelativeUncertainty } from './standardSphereDrag';
import { dragCrisisWarning } from './dragCrisisWarning';
import { studentTQuantile } from './studentT';
import { modelDerivatives, uncertaintyBudget, type BudgetInputSpec } from './uncertaintyBudget';
import { fallThroughColumn } from './fallThroughColumn';
import { nominalAirColumn, predictedFall, predictedSphereCurveFall } from './predictedFall';
import { PhysicsInputError } from './physicsInputError';
import { analyzeMarksSeries, requestHasMarks } from './analyzeMarksSeries';

/** Past this Mach number at impact the air near the body is compressed noticeably (ρ changes by about M²/2 ≈ 4.5 %; common practice). */
export const COMPRESSIBILITY_WARNING_MACH = 0.3;
/**
 * Past this Mach number at impact a constant quadratic-drag coefficient has no meaning: near a sphere's critical
 * Mach number (about 0.6, from memory) the flow around the body turns locally supersonic, shock waves add wave
 * drag and C_d rises steeply with speed, so one C_d cannot describe the fall.
 */
export const QUADRATIC_DRAG_LIMIT_MACH = 0.6;

/** Every model position the Monte Carlo draws, with its standard uncertainty (root-sum-square over the specs). */
function surrogateInputs(specs: BudgetInputSpec[]): { index: number; u: number }[] {
  const variance = new Map<number, number>();
  for (const spec of specs) {
    spec.indices.forEach((index, i) => {
      const u = spec.standard_uncertainty * spec.weights[i]!;
      if (u > 0) variance.set(index, (variance.get(index) ?? 0) + u * u);
    });
  }
  return [...variance].map(([index, v]) => ({ index, u: Math.sqrt(v) }));
}

/** The result's air_column block and the warnings about the speed at impact (compressibility). */
function airColumnSummary(
  setup: SeriesSetup,
  fit: SeriesFit,
  estimate: number,
  factor: number,
): { summary: NonNullable<AnalysisResult['air_column']>; warnings: PhysicsWarning[] } {
  const { model, x0, layout: L } = fit;
  const c = setup.column;
  const top = Math.max(...setup.request.drops.map((d) => d.height_m));
  model.evaluate(x0);
  const column = model.column(x0);
  const body = {
    mass_kg: setup.specimen.mass_kg,
    area_m2: setup.geometry.area_m2,
    volume_m3: setup.geometry.volume_m3,
    characteristic_length_m: setup.geometry.characteristic_length_m,
    buoyancy: setup.buoyancy,
    added_mass_coefficient: setup.added_mass_coefficient,
    drag_coefficient: Math.max(estimate, 0),
  };
  let fall: { impact_mach: number; drift_m: number; impact_relative_speed_m_s: number } = { impact_mach: NaN, drift_m: 0, impact_relative_speed_m_s: NaN };
  try {
    fall = fallThroughColumn(top, body, column, 1e-9);
  } catch {
    // Reported through the fit already; the summary then has no impact figures.
  }
  const warnings: PhysicsWarning[] = [];
  if (fall.impact_mach > QUADRATIC_DRAG_LIMIT_MACH) {
    const index = setup.request.drops.findIndex((d) => d.height_m === top);
    throw new PhysicsInputError({
      code: 'out-of-range',
      field: `drops[${index}].height_m`,
      value: top,
      allowed: `a fall whose impact stays below Mach ${QUADRATIC_DRAG_LIMIT_MACH} (this one reaches Mach ${fall.impact_mach.toFixed(2)}, ${fall.impact_relative_speed_m_s.toFixed(0)} m/s)`,
      reason: 'quadratic drag with one drag coefficient fails near the speed of sound (wave drag makes C_d rise steeply with speed)',
    });
  }
  if (fall.impact_mach > COMPRESSIBILITY_WARNING_MACH) {
    warnings.push({
      code: 'compressible-impact',
      message: `The fall reaches Mach ${fall.impact_mach.toFixed(2)} at impact (${fall.impact_relative_speed_m_s.toFixed(0)} m/s through the air): past Mach ${COMPRESSIBILITY_WARNING_MACH} the air near the body is compressed by several per cent and C_d starts to depend on speed; the fitted C_d is an average over the fall.`,
    });
  }
  const twoReadings = c.aloft !== null;
  const lapse = twoReadings ? -column.temperatureSlope : c.lapseRate_K_per_m;
  return {
    summary: {
      weight: model.columnWeight,
      effect_over_uncertainty: fit.columnEffect,
      correction_ratio: factor,
      readings: twoReadings ? 2 : 1,
      lapse_rate_K_per_m: lapse,
      lapse_rate_standard_uncertainty_K_per_m: twoReadings ? null : c.lapseRateU,
      vertical_wind_m_s: x0[L.verticalWind_m_s]!,
      vertical_wind_standard_uncertainty_m_s: c.motion ? c.verticalWindU : null,
      wind_speed_m_s: x0[L.windSpeed_m_s]!,
      wind_speed_standard_uncertainty_m_s: c.motion ? c.windSpeedU : null,
      notes: c.notes,
      density_at_release_kg_m3: column.density(top),
      density_at_landing_kg_m3: column.density(0),
      impact_mach: fall.impact_mach,
      drift_m: fall.drift_m,
    },
    warnings,
  };
}

export { DEFAULT_MONTE_CARLO_DRAWS };
/** Below this the flow is creeping and drag grows linearly with speed, not quadratically. */
export const CREEPING_FLOW_REYNOLDS = 1;

/**
 * Everything up to the uncertainty evaluation, as named stages: the setup (validated inputs, air, gravity,
 * the body), the drops grouped by height, the fit of the measurement model at its nominal inputs, each drop's
 * own C_d, the scatter and the list of budget inputs. Warnings come in the order the stages meet them.
 * prepareSeries gives them under a constant C_d; preparedUnderLaw again under the scaled sphere curve.
 */
export interface PreparedSeries {
  setup: SeriesSetup;
  groups: DropGroups;
  fit: SeriesFit;
  /** The scaled sphere law the stages after the fit follow; null under a constant C_d. */
  law: ScaledSphereLaw | null;
  /** Each drop's own C_d under the law (less the fitted offset), in the order of the request's drops. */
  dropCd: (number | null)[];
  scatter: SeriesScatter;
  inputs: BudgetInputs;
  warnings: PhysicsWarning[];
}

export function prepareSeries(request: AnalysisRequest): PreparedSeries {
  const setup = prepareSetup(request);
  const drops = setup.request.drops;
  const groups = groupDrops(drops);
  // Without an offset, single drops are checked first: a wild time gets an error naming that drop.
  let own = setup.fitOffset ? null : dropDragCoefficients(setup, drops, setup.subtractedOffset_s);
  const fit = fitSeries(setup, groups);
  if (setup.fitOffset) own = dropDragCoefficients(setup, drops, fit.offset_s);
  return preparedUnderLaw(setup, groups, fit, own!, null);
}

/**
 * The stages after the fit (each drop's own C_d given, the scatter, the budget inputs) about the constant fit, or,
 * given `law`, about the scaled sphere curve's fit with its own offset: its residuals are the Type A scatter, the
 * Monte Carlo's timing noise and each height's uncertainty.
 */
export function preparedUnderLaw(setup: SeriesSetup, groups: DropGroups, fit: SeriesFit, own: DropDragCoefficients, law: ScaledSphereLaw | null): PreparedSeries {
  const drops = setup.request.drops;
  const warnings: PhysicsWarning[] = [...setup.warnings];
  if (own.slow.length > 0) {
    warnings.push({
      code: 'drop-not-slower-than-free-fall',
      message: `No drag coefficient of its own for ${own.slow.join('; ')}: the time is not longer than a drag-free fall, which timing noise explains. The drop stays in the series fit.`,
    });
  }
  const scatter = seriesScatter(setup, drops, groups, fit, law);
  warnings.push(...scatter.warnings);
  checkNotFasterThanFreeFall(setup, groups, fit, scatter);
  const inputs = budgetInputs(setup, groups, fit, scatter);
  warnings.push(...inputs.warnings);
  return { setup, groups, fit, law, dropCd: own.values, scatter, inputs, warnings };
}

export function analyzeSeries(request: AnalysisRequest): AnalysisResult {
  // A series with marks has its own measurement model (every mark, generalised least squares); without marks
  // nothing below changes.
  if (requestHasMarks(request)) return analyzeMarksSeries(request);
  const constantLaw = prepareSeries(request);
  const { setup, groups, fit } = constantLaw;
  const { site, air, specimen, geometry, fitOffset, timingU, draws, seed, body, noDrag, humidityKind } = setup;
  const req = setup.request;
  const g = setup.gravity_m_s2;
  const rho = setup.density_kg_m3;
  const mu = setup.viscosity_Pa_s;
  const buoyancy = setup.buoyancy;
  const addedMass = setup.added_mass_coefficient;
  const gEff = setup.effectiveGravity_m_s2;
  const mEff = setup.effectiveMass_kg;
  const J = groups.heights.length;
  const { counts, heights: groupHeights, members: groupDrops, times: groupTimes } = groups;
  const { model, layout: L, x0, estimate, fitted } = fit;
  const kHat = fit.dragConstant_per_m;
  const adaptive = req.options?.monte_carlo_draws === undefined;

  // The Monte Carlo of the constant model, its timing noise set by the scatter about the law's fit.
  const monteCarlo = (prepared: PreparedSeries) => {
    const { specs, timeIndices } = prepared.inputs;
    const { dof, excess } = prepared.scatter;
    // The Monte Carlo evaluates the air along the fall through its surrogate (columnCorrection.ts).
    if (model.columnWeight > 0) model.freezeColumn(x0, surrogateInputs(specs));
    const normals = monteCarloNormals(specs, addedMass);
    const mcSpec: MonteCarloSpec = {
      draws,
      seed,
      normals,
      times: {
        indices: timeIndices,
        counts: Array.from(counts),
        declared_s: timingU,
        excess_s: excess,
        degrees_of_freedom: Math.max(dof, 1),
      },
    };
    if (humidityKind === 'dew-point') mcSpec.dewPoint = { index: L.humidity, temperatureIndex: L.temperature_K };
    // A request that names its number of draws gets exactly that many; otherwise the draws go on in batches until
    // the reported values are numerically stable (JCGM 101 §7.9, monteCarloPropagation.ts), up to a cap.
    const run = adaptive ? adaptiveMonteCarloPropagation(model, x0, mcSpec, fitOffset) : monteCarloPropagation(model, x0, mcSpec, fitOffset);
    model.columnSurrogate = null;
    return run;
  };

  // First under a constant C_d: whether drag is resolved at all, and the uncertainty `auto` weighs the law by.
  let prepared = constantLaw;
  let budget = uncertaintyBudget(model, x0, prepared.inputs.specs);
  let mc = monteCarlo(prepared);
  // Is drag resolved at all? (Judged on the constant fit: a delay beyond the noise, whatever law explains it.)
  let bestDelayRatio = -Infinity;
  for (let j = 0; j < J; j++) {
    const h = groupHeights[j]!;
    const t0 = fallTime(h, noDrag);
    const uj = constantLaw.scatter.meanTimeU(j);
    bestDelayRatio = Math.max(bestDelayRatio, (fallTime(h, fitted) - t0) / uj);
  }
  const resolved = kHat > 0 && mc.dragCoefficient.interval_95[0] > 0 && bestDelayRatio >= 2;

  // The drag law (dragLaw.ts). Under the scaled sphere curve everything after the fit follows that law: each drop's
  // own C_d, the scatter about its fit (the budget's Type A row and the Monte Carlo's timing noise, drawn again), and
  // the fitted offset. The constant fit stays the model every draw is mapped from.
  const lawChoice = seriesDragLawChoice(setup, groups, fit, budget.combined_standard_uncertainty, resolved);
  const scaledLaw = lawChoice.scaled;
  if (scaledLaw !== null) {
    const own = dropDragCoefficients(setup, req.drops, scaledLaw.offset_s + setup.subtractedOffset_s, scaledLaw);
    prepared = preparedUnderLaw(setup, groups, fit, own, scaledLaw);
    // The inputs differ only in the scatter beyond the declared timing; when that is the same (none, or one height,
    // where both fits pass through the mean) the budget and the draws are too, and are kept.
    if (prepared.scatter.excess !== constantLaw.scatter.excess) {
      budget = uncertaintyBudget(model, x0, prepared.inputs.specs);
      mc = monteCarlo(prepared);
    }
  }
  const { dropCd, scatter, warnings } = prepared;
  const { dof, scatter: scatterSd, excess } = scatter;
  const adaptiveRun = adaptive ? (mc as AdaptiveMonteCarloResult).adaptive : null;
  const mcCd = mc.dragCoefficient;
  if (mcCd.failed > 0) {
    warnings.push({
      code: 'monte-carlo-failed-draws',
      message: `${mcCd.failed} of ${mcCd.draws} Monte Carlo draws gave no drag coefficient and were left out.`,
    });
  }
  if (adaptiveRun && !adaptiveRun.stabilized) {
    warnings.push({
      code: 'monte-carlo-not-stabilized',
      message: `The Monte Carlo interval did not settle to its numerical tolerance (${adaptiveRun.tolerance.toPrecision(2)}, a twentieth of its standard deviation) within ${adaptiveRun.max_draws} draws: its ends may move by about ${(adaptiveRun.worst_ratio * adaptiveRun.tolerance).toPrecision(2)} between runs.`,
    });
  }
  // The one-sided bound is the Monte Carlo's 95th percentile: a floor at the detection limit would make it hold
  // far more often than the 95 % it states (measured: 100 % instead of 95 % on heavy balls, coverageUnresolved.test.ts).
  const upperBound = Math.max(mcCd.upper_bound_95, 0);
  if (!resolved) {
    warnings.push({
      code: 'drag-not-resolved',
      message: `Drag is not resolved: the delay it causes is within about twice the timing uncertainty (or the 95 % interval reaches zero). The drag coefficient is below ${upperBound.toPrecision(3)} with 95 % probability; drop from higher or time more precisely to measure it.`,
    });
  }

  // Reported values in the chosen law, the constant fit kept beside them.
  const dragLaw = seriesDragLaw(setup, groups, fit, lawChoice, mc, budget.combined_standard_uncertainty, excess);
  warnings.push(...dragLaw.warnings);

  // Under the scaled sphere curve the fit, its times and its budget are the scaled law's: each drop's fitted time
  // is the scaled curve's fall (plus the fitted offset or declared delay; seriesScatter.ts), and each budget row is
  // carried to the reported C_d by the slope of the map from the constant fit (dragLaw.ts: exact with one height).
  const scaledFit = dragLaw.scaled;
  const { fittedTimes, residuals } = scatter;
  const offsetHat = scaledFit === null ? fit.offset_s : scaledFit.offset_s;
  const offsetDraws = scaledFit === null ? mc.offset : dragLaw.offset;
  const budgetSlope = scaledFit === null ? 1 : scaledFit.slope;

  // GUM interval (for comparison with the Monte Carlo one).
  const nuEff = budget.effective_degrees_of_freedom;
  if (setup.uncertainty.added_mass_coefficient === undefined) {
    // C_a taken as exact: say so when the shape's default uncertainty would add more than a tenth to u_c
    // (a contribution above √(1.1² − 1) ≈ 0.46·u_c). The derivative is taken on the side, the result is unchanged.
    const uDefault = defaultAddedMassUncertainty(addedMass, geometry.shape === 'custom');
    if (uDefault > 0) {
      const step = 1e-3 * uDefault;
      const derivative = modelDerivatives(model, x0, new Map([[L.addedMassChange, step]])).get(L.addedMassChange)!;
      model.evaluate(x0);
      const contribution = Math.abs(derivative) * uDefault;
      if (contribution > 0.46 * budget.combined_standard_uncertainty) {
        warnings.push({
          code: 'added-mass-uncertainty-not-given',
          message: `The added-mass coefficient ${addedMass.toPrecision(3)} is taken as exact, but this body is light for its size: the usual doubt about it (standard uncertainty ${uDefault.toPrecision(2)}) would move C_d by ${contribution.toPrecision(2)}, against the stated ${budget.combined_standard_uncertainty.toPrecision(2)}. Give uncertainty.added_mass_coefficient.`,
        });
      }
    }
  }
  const coverageFactor = nuEff === null ? 1.959963984540054 : studentTQuantile(0.975, nuEff);
  const uc = budget.combined_standard_uncertainty * Math.abs(budgetSlope);
  const gumEstimate = scaledFit === null ? estimate : dragLaw.estimate;

  // Predictions.
  const reference = specimen.reference_drag_coefficient;
  let predictionMethod: AnalysisResult['prediction']['method'] = 'none';
  const predictedByHeight = new Map<number, number>();
  const predictedUByHeight = new Map<number, { time: number; cd: number }>();
  // Predicted falls go through the air along the fall, as the planner's do (predictedFall.ts).
  if (reference !== null) {
    predictionMethod = 'reference-drag-coefficient';
    const column = nominalAirColumn(setup);
    for (const h of groupHeights) predictedByHeight.set(h, predictedFall(setup, column, h, reference, 1e-10, true).time_s);
  } else if (geometry.shape === 'sphere') {
    predictionMethod = 'standard-sphere-drag-curve';
    let maxRe = 0;
    const column = nominalAirColumn(setup);
    for (const h of groupHeights) {
      const fall = predictedSphereCurveFall(setup, column, h);
      predictedByHeight.set(h, fall.time_s);
      predictedUByHeight.set(h, { time: fall.time_standard_uncertainty_s, cd: fall.drag_coefficient_relative_standard_uncertainty });
      maxRe = Math.max(maxRe, fall.impact_reynolds_number);
    }
    if (maxRe > STANDARD_SPHERE_DRAG_VALID_MAX_REYNOLDS) {
      warnings.push({
        code: 'outside-sphere-correlation-range',
        message: `The predicted fall reaches Re = ${maxRe.toPrecision(3)}, where the standard sphere curve is uncertain by ${(100 * standardSphereDragRelativeUncertainty(maxRe)).toPrecision(2)} % (5 % up to Re = 1e5); near the drag crisis the prediction may be far off.`,
      });
    }
  }

  // The air along the fall: its summary, the speed of sound at impact.
  const columnFactor = model.columnWeight > 0 ? 1 + model.columnWeight * (model.columnRatio - 1) : 1;
  const airColumn = airColumnSummary(setup, fit, estimate, columnFactor);
  warnings.push(...airColumn.warnings);

  // Per drop.
  const physicalK = Math.max(kHat, 0);
  const physical: FallParameters = { ...fitted, drag_constant_per_m: physicalK };
  const reynoldsPerSpeed = (rho * geometry.characteristic_length_m) / mu;
  // Under the scaled law the impact speed is the scaled curve's too (its time is scaledSphereFallTime's, to 1e-9).
  const scaledImpact = new Map<number, number>();
  if (scaledFit !== null) {
    const { body: b, scale } = scaledFit;
    for (const h of groupHeights) {
      const dragCoefficient = (re: number) => scale * standardSphereDragCoefficient(re);
      scaledImpact.set(h, fallWithVariableDrag(h, { ...b, dragCoefficient }, 1e-9).impact_speed_m_s);
    }
  }
  const drops: DropResult[] = req.drops.map((drop, i) => {
    const v = scaledImpact.get(drop.height_m) ?? fallSpeedAtHeight(drop.height_m, physical);
    return {
      ...(drop.id !== undefined ? { id: drop.id } : {}),
      height_m: drop.height_m,
      time_s: drop.time_s,
      // In the air along the fall each drop's own C_d takes the series' correction (columnCorrection.ts).
      // Under the scaled law it is the drop's own factor's C_d, as the series' (which takes no such correction).
      drag_coefficient: dropCd[i] === null ? null : scaledFit === null ? dropCd[i]! * columnFactor : dropCd[i]!,
      vacuum_time_s: Math.sqrt((2 * drop.height_m) / g),
      predicted_time_s: predictedByHeight.get(drop.height_m) ?? null,
      fitted_time_s: fittedTimes[i]!,
      residual_s: residuals[i]!,
      impact_speed_m_s: v,
      impact_energy_J: 0.5 * specimen.mass_kg * v * v,
      reynolds_number: reynoldsPerSpeed * v,
    };
  });
  const reynolds = drops.map((d) => d.reynolds_number);
  const maxRe = Math.max(...reynolds);
  const minRe = Math.min(...reynolds);
  const crisis = dragCrisisWarning(geometry.shape, reynolds);
  if (crisis) warnings.push(crisis);
  if (minRe < CREEPING_FLOW_REYNOLDS) {
    warnings.push({
      code: 'creeping-flow',
      message: `The Reynolds number at impact (${minRe.toPrecision(3)}) is in creeping flow (below 1), where drag is nearly proportional to speed; a single quadratic-drag coefficient then describes this fall only.`,
    });
  }

  // Per height statistics and outlier flags (Grubbs' α shared out over the heights: at most 5 % false alarms per series).
  const grubbsByHeight = grubbsPerSeries(groupTimes);
  const heights: HeightResult[] = groupHeights.map((h, j) => {
    const times = groupTimes[j]!;
    const stats = seriesStatistics(times);
    const grubbs = grubbsByHeight[j]!;
    if (grubbs?.outlier) {
      const dropIndex = groupDrops[j]![grubbs.suspect_index]!;
      warnings.push({
        code: 'possible-outlier',
        message: `Drop ${dropIndex + 1} of the series (${times[grubbs.suspect_index]} s from ${h} m) fails Grubbs' test (G = ${grubbs.statistic.toFixed(3)} > ${grubbs.critical_value.toFixed(3)} at α = ${grubbs.alpha.toPrecision(2)} for this height, 0.05 for the series). It is kept; check the log before removing it.`,
      });
    }
    return {
      height_m: h,
      count: stats.count,
      mean_time_s: stats.mean,
      standard_deviation_s: stats.standard_deviation,
      standard_error_s: stats.standard_error,
      t_interval_95_s: stats.t_interval,
      grubbs: grubbs && {
        statistic: grubbs.statistic,
        critical_value: grubbs.critical_value,
        alpha: grubbs.alpha,
        suspect_drop_index: groupDrops[j]![grubbs.suspect_index]!,
        outlier: grubbs.outlier,
      },
    };
  });

  const budgetRows: BudgetRow[] = budget.entries.map((e) => ({
    input: e.input,
    standard_uncertainty: e.standard_uncertainty,
    sensitivity: e.sensitivity * budgetSlope,
    contribution: e.contribution * Math.abs(budgetSlope),
    evaluation: e.evaluation,
    description: e.description,
    degrees_of_freedom: e.degrees_of_freedom,
  }));

  const result: AnalysisResult = {
    air: {
      density_kg_m3: rho,
      station_pressure_Pa: air.station_pressure_Pa,
      dynamic_viscosity_Pa_s: mu,
      speed_of_sound_m_s: air.speed_of_sound_m_s,
      density_source: air.density_source,
      cipm_density_kg_m3: air.cipm_density_kg_m3,
      sea_level_pressure_Pa: air.sea_level_pressure_Pa,
      vapour_mole_fraction: air.vapour_mole_fraction,
      compressibility_factor: air.compressibility_factor,
    },
    gravity_m_s2: g,
    gravity_source: site.source,
    drag_coefficient: resolved ? dragLaw.estimate : null,
    drag_coefficient_estimate: dragLaw.estimate,
    drag_coefficient_standard_uncertainty: dragLaw.standardUncertainty,
    drag_coefficient_interval_95: resolved ? dragLaw.interval_95 : [0, upperBound],
    drag_resolved: resolved,
    drag_law: dragLaw.law,
    drag_law_details: dragLaw.details,
    terminal_velocity_m_s: resolved ? dragLaw.terminalVelocity_m_s : null,
    drops,
    heights,
    budget: budgetRows,
    gum: {
      combined_standard_uncertainty: uc,
      effective_degrees_of_freedom: nuEff,
      coverage_factor: coverageFactor,
      interval_95: [gumEstimate - coverageFactor * uc, gumEstimate + coverageFactor * uc],
    },
    monte_carlo: {
      draws: mcCd.draws,
      failed_draws: mcCd.failed,
      seed,
      mean: mcCd.mean,
      standard_deviation: mcCd.standard_deviation,
      interval_95: mcCd.interval_95,
      upper_bound_95: mcCd.upper_bound_95,
      ...(adaptiveRun
        ? {
            adaptive: {
              batch_size: adaptiveRun.batch_size,
              batches: adaptiveRun.batches,
              numerical_tolerance: adaptiveRun.tolerance,
              relative_tolerance: adaptiveRun.relative_tolerance,
              max_draws: adaptiveRun.max_draws,
              stabilized: adaptiveRun.stabilized,
            },
          }
        : {}),
    },
    prediction: {
      method: predictionMethod,
      reference_drag_coefficient: reference,
      ...(predictedUByHeight.size > 0
        ? {
            // The largest over the heights: the curve is least certain at the fastest impact.
            drag_coefficient_relative_standard_uncertainty: Math.max(...[...predictedUByHeight.values()].map((u) => u.cd)),
            heights: groupHeights.map((h) => ({
              height_m: h,
              time_s: predictedByHeight.get(h)!,
              time_standard_uncertainty_s: predictedUByHeight.get(h)!.time,
              drag_coefficient_relative_standard_uncertainty: predictedUByHeight.get(h)!.cd,
            })),
          }
        : {}),
    },
    model: {
      mass_kg: specimen.mass_kg,
      buoyancy,
      added_mass_coefficient: addedMass,
      area_m2: geometry.area_m2,
      volume_m3: geometry.volume_m3,
      characteristic_length_m: geometry.characteristic_length_m,
      effective_mass_kg: mEff,
      effective_gravity_m_s2: gEff,
      timing_offset: fitOffset ? 'fit' : 'none',
      scatter_standard_deviation_s: scatterSd,
      scatter_degrees_of_freedom: Math.max(dof, 0),
    },
    air_column: airColumn.summary,
    warnings,
  };
  if (!resolved) {
    result.drag_coefficient_upper_bound_95 = upperBound;
    result.terminal_velocity_lower_bound_m_s = Math.sqrt(gEff / dragConstantFromCd(setup, upperBound));
  }
  if (fitOffset && offsetDraws) {
    result.timing_offset_s = offsetHat;
    result.timing_offset_standard_uncertainty_s = offsetDraws.standard_deviation;
    result.timing_offset_interval_95_s = offsetDraws.interval_95;
  }
  if (setup.declaredOffset !== null) {
    result.declared_timing_offset = { ...setup.declaredOffset };
    if (fitOffset && offsetDraws) {
      // The declared delay is the prior the fit is checked against: the two disagree when they differ by more than
      // twice the standard uncertainty of their difference (independent estimates, about a 95 % two-sided test).
      const declared = setup.declaredOffset;
      const uDifference = Math.hypot(offsetDraws.standard_deviation, declared.standard_uncertainty_s);
      if (Math.abs(offsetHat - declared.offset_s) > 2 * uDifference) {
        warnings.push({
          code: 'timing-offset-disagrees',
          message: `The fitted timing offset ${(offsetHat * 1000).toFixed(1)} ± ${(offsetDraws.standard_deviation * 1000).toFixed(1)} ms differs from the declared ${(declared.offset_s * 1000).toFixed(1)} ± ${(declared.standard_uncertainty_s * 1000).toFixed(1)} ms by more than twice the uncertainty of the difference (${(2 * uDifference * 1000).toFixed(1)} ms): check the timing method, or the drag law (a speed-dependent drag can look like an offset).`,
        });
      }
    }
  }
  return result;
}
