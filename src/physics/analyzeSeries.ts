/**
 * The analysis of one series of drops: the entry point shared by the app's screens and the
 * office command. It validates the request, computes air and gravity, fits the effective drag
 * coefficient (and optionally a timing offset), builds the GUM budget, propagates the input
 * distributions by Monte Carlo, predicts fall times, and collects every warning on the way.
 */
import { airProperties } from './airProperties';
import type { AnalysisRequest, AnalysisResult, BudgetRow, DropResult, HeightResult } from './analysisTypes';
import { DEFAULT_SEED } from './createRandom';
import { dragCoefficientFromTime } from './dragCoefficientFromTime';
import { fallParameters, fallSpeedAtHeight, fallTime, type FallParameters } from './fallModel';
import { fallWithVariableDrag } from './fallWithVariableDrag';
import { solveFallTimeFactor } from './fitDragConstant';
import { grubbsTest } from './grubbsTest';
import { monteCarloPropagation, type MonteCarloSpec, type NormalInput } from './monteCarloPropagation';
import { localGravity } from './normalGravity';
import { PhysicsInputError } from './physicsInputError';
import type { PhysicsWarning } from './physicsWarning';
import { SeriesModel } from './seriesModel';
import { seriesStatistics } from './seriesStatistics';
import { checkSpecimen } from './specimenGeometry';
import { MORRISON_VALID_MAX_REYNOLDS, morrisonSphereDragCoefficient } from './sphereDragCoefficient';
import { studentTQuantile } from './studentT';
import { uncertaintyBudget, type BudgetInputSpec } from './uncertaintyBudget';
import { validateAnalysisRequest } from './validateAnalysisRequest';

export const DEFAULT_MONTE_CARLO_DRAWS = 20_000;
/** Reynolds numbers of the drag crisis of smooth spheres (common practice: 2e5 to 5e5). */
export const DRAG_CRISIS_REYNOLDS: readonly [number, number] = [2e5, 5e5];
/** Below this the flow is creeping and drag grows linearly with speed, not quadratically. */
export const CREEPING_FLOW_REYNOLDS = 1;

/** A drop faster than the drag-free time by more than this many standard uncertainties is an error. */
const FASTER_THAN_FREE_FALL_SIGMAS = 5;
/** A whole series faster than the drag-free model by more than this many standard uncertainties is an error. */
const SERIES_FASTER_SIGMAS = 3;

/**
 * Everything up to the uncertainty evaluation: validated inputs, air, gravity, the measurement
 * model at its nominal inputs, the fitted values, the scatter and the list of budget inputs.
 * The planner uses it on synthetic drops, so plans and analyses share one budget.
 */
export function prepareSeries(request: AnalysisRequest) {
  const req = validateAnalysisRequest(request);
  const warnings: PhysicsWarning[] = [];
  const site = localGravity(req.site);
  const g = site.gravity_m_s2;
  const air = airProperties(req.air, req.site.elevation_m);
  warnings.push(...air.warnings);
  const rho = air.density_kg_m3;
  const mu = air.dynamic_viscosity_Pa_s;
  const specimen = checkSpecimen(req.specimen);
  const geometry = specimen.geometry;
  const options = req.options ?? {};
  const buoyancy = options.buoyancy ?? true;
  const addedMass = options.added_mass_coefficient ?? geometry.default_added_mass_coefficient;
  const fitOffset = req.timing.offset === 'fit';
  const timingU = req.timing.standard_uncertainty_s;
  const draws = options.monte_carlo_draws ?? DEFAULT_MONTE_CARLO_DRAWS;
  const seed = options.seed ?? DEFAULT_SEED;
  const u = req.uncertainty ?? {};

  const body = {
    mass_kg: specimen.mass_kg,
    area_m2: geometry.area_m2,
    volume_m3: geometry.volume_m3,
    density_kg_m3: rho,
    gravity_m_s2: g,
    buoyancy,
    added_mass_coefficient: addedMass,
  };
  const noDrag = fallParameters({ ...body, drag_coefficient: 0 }); // throws when not heavier than air
  const gEff = noDrag.effective_gravity_m_s2;
  const mEff = noDrag.effective_mass_kg;
  const cdFromK = (k: number): number => (2 * mEff * k) / (rho * geometry.area_m2);
  const kFromCd = (cd: number): number => (rho * cd * geometry.area_m2) / (2 * mEff);

  // Group drops by height, in order of first appearance.
  const groupOf = new Map<number, number>();
  const groupHeights: number[] = [];
  const groupDrops: number[][] = [];
  req.drops.forEach((drop, i) => {
    let j = groupOf.get(drop.height_m);
    if (j === undefined) {
      j = groupHeights.length;
      groupOf.set(drop.height_m, j);
      groupHeights.push(drop.height_m);
      groupDrops.push([]);
    }
    groupDrops[j]!.push(i);
  });
  const J = groupHeights.length;
  const counts = Float64Array.from(groupDrops, (d) => d.length);
  const groupTimes = groupDrops.map((indices) => indices.map((i) => req.drops[i]!.time_s));
  const meanTimes = groupTimes.map((times) => seriesStatistics(times).mean);

  // Each drop on its own (its time less the fitted offset, when one is fitted).
  const heightU = u.height_m ?? 0;
  const slowDrops: string[] = [];
  const eachDrop = (offset: number): (number | null)[] =>
    req.drops.map((drop, i) => {
      const time = drop.time_s - offset;
      const noDragTime = fallTime(drop.height_m, noDrag);
      const sigma = Math.hypot(timingU, (noDragTime * heightU) / (2 * drop.height_m));
      if (time < noDragTime - FASTER_THAN_FREE_FALL_SIGMAS * sigma) {
        throw new PhysicsInputError({
          code: 'faster-than-free-fall',
          field: `drops[${i}].time_s`,
          value: drop.time_s,
          allowed: `at least about ${(noDragTime - FASTER_THAN_FREE_FALL_SIGMAS * sigma + offset).toFixed(4)} s (the drag-free fall from ${drop.height_m} m takes ${noDragTime.toFixed(4)} s${offset !== 0 ? `, plus the fitted timing offset ${offset.toFixed(4)} s` : ''})`,
        });
      }
      if (time <= noDragTime) {
        slowDrops.push(`drop ${i + 1} of the series (${drop.time_s} s from ${drop.height_m} m, drag-free ${noDragTime.toFixed(4)} s)`);
        return null;
      }
      return dragCoefficientFromTime(body, drop.height_m, time, `drops[${i}].time_s`);
    });
  // Without an offset, single drops are checked first: a wild time gets an error naming that drop.
  let dropCd: (number | null)[] = fitOffset ? [] : eachDrop(0);

  // The measurement model and its nominal inputs.
  const humidityKind = air.density_source === 'override' ? 'none' : req.air.relative_humidity_pct !== undefined ? 'relative-humidity' : 'dew-point';
  const model = new SeriesModel({
    shape: geometry.shape,
    dimensionCount: specimen.dimensions.length,
    characteristicLength: geometry.shape === 'custom' ? geometry.characteristic_length_m : undefined,
    humidity: humidityKind,
    densityOverride: air.density_source === 'override',
    co2MoleFraction: req.air.co2_mole_fraction ?? 0.0004,
    buoyancy,
    addedMassCoefficient: options.added_mass_coefficient ?? null,
    fitOffset,
    counts,
  });
  const L = model.layout;
  const x0 = new Float64Array(L.length);
  x0[L.temperature_K] = air.temperature_K;
  x0[L.pressure_Pa] = air.station_pressure_Pa ?? 0;
  x0[L.humidity] =
    humidityKind === 'relative-humidity' ? req.air.relative_humidity_pct! / 100 : humidityKind === 'dew-point' ? req.air.dew_point_C! + 273.15 : 0;
  x0[L.density_kg_m3] = rho;
  x0[L.gravity_m_s2] = g;
  x0[L.mass_kg] = specimen.mass_kg;
  specimen.dimensions.forEach((d, i) => (x0[L.firstDimension + i] = d));
  for (let j = 0; j < J; j++) {
    x0[L.firstHeight + j] = groupHeights[j]!;
    x0[L.firstTime + j] = meanTimes[j]!;
  }
  const estimate = model.evaluate(x0);
  if (model.status !== 'ok') {
    throw new PhysicsInputError({
      code: model.status === 'faster-than-free-fall' ? 'faster-than-free-fall' : model.status === 'drag-unexplained' ? 'drag-unexplained' : 'solver-failed',
      field: 'drops',
      value: meanTimes.map((t, j) => `${t.toFixed(4)} s from ${groupHeights[j]} m`).join(', '),
      allowed: 'times a finite, non-negative drag explains for this specimen',
    });
  }
  const kHat = model.dragConstant_per_m;
  const offsetHat = fitOffset ? model.offset_s : 0;
  model.startDragConstant = kHat;
  if (fitOffset) dropCd = eachDrop(offsetHat);
  if (slowDrops.length > 0) {
    warnings.push({
      code: 'drop-not-slower-than-free-fall',
      message: `No drag coefficient of its own for ${slowDrops.join('; ')}: the time is not longer than a drag-free fall, which timing noise explains. The drop stays in the series fit.`,
    });
  }
  const fitted: FallParameters = { effective_gravity_m_s2: gEff, drag_constant_per_m: kHat, effective_mass_kg: mEff };

  // Residual scatter: Type A.
  const fittedTimes = req.drops.map((d) => fallTime(d.height_m, fitted) + offsetHat);
  const residuals = req.drops.map((d, i) => d.time_s - fittedTimes[i]!);
  const dof = req.drops.length - (fitOffset ? 2 : 1);
  const scatter = dof > 0 ? Math.sqrt(residuals.reduce((s, r) => s + r * r, 0) / dof) : null;
  const excess = scatter !== null && scatter > timingU ? Math.sqrt(scatter * scatter - timingU * timingU) : 0;
  if (scatter === null) {
    warnings.push({
      code: 'scatter-not-assessed',
      message: 'Too few drops to see their scatter: the uncertainty rests on the declared timing uncertainty alone.',
    });
  } else if (dof >= 2 && scatter > 2 * timingU) {
    warnings.push({
      code: 'scatter-exceeds-timing-uncertainty',
      message: `The drops scatter by ${scatter.toPrecision(3)} s, more than twice the declared timing uncertainty of ${timingU} s; the excess enters the budget as a Type A component.`,
    });
  }

  // Per-height standard uncertainty of a mean time (declared timing and excess scatter).
  const meanTimeU = (j: number): number => Math.sqrt((timingU * timingU + excess * excess) / counts[j]!);

  // A series faster than the drag-free model by far more than its noise is an error.
  if (kHat < 0) {
    for (let j = 0; j < J; j++) {
      const deficit = fallTime(groupHeights[j]!, noDrag) - fallTime(groupHeights[j]!, fitted);
      if (deficit > SERIES_FASTER_SIGMAS * meanTimeU(j)) {
        throw new PhysicsInputError({
          code: 'faster-than-free-fall',
          field: 'drops',
          value: `mean ${meanTimes[j]!.toFixed(4)} s from ${groupHeights[j]} m`,
          allowed: `no faster than the drag-free fall (${fallTime(groupHeights[j]!, noDrag).toFixed(4)} s) by more than about ${SERIES_FASTER_SIGMAS} standard uncertainties (${(SERIES_FASTER_SIGMAS * meanTimeU(j)).toFixed(4)} s)`,
        });
      }
    }
  }

  // GUM budget.
  const specs: BudgetInputSpec[] = [];
  const missing: string[] = [];
  const timeIndices = Array.from({ length: J }, (_, j) => L.firstTime + j);
  const timeWeights = Array.from({ length: J }, (_, j) => 1 / Math.sqrt(counts[j]!));
  specs.push({
    input: 'time_s',
    description: 'random timing error of one drop (declared)',
    evaluation: 'B',
    standard_uncertainty: timingU,
    indices: timeIndices,
    weights: timeWeights,
    degrees_of_freedom: Infinity,
  });
  if (excess > 0) {
    specs.push({
      input: 'scatter_s',
      description: `scatter between drops beyond the declared timing uncertainty (Type A, ν = ${dof})`,
      evaluation: 'A',
      standard_uncertainty: excess,
      indices: timeIndices,
      weights: timeWeights,
      degrees_of_freedom: dof,
    });
  }
  const single = (input: string, description: string, index: number, weight: number, value: number | undefined): void => {
    if (value === undefined) missing.push(input);
    specs.push({
      input,
      description,
      evaluation: 'B',
      standard_uncertainty: value ?? 0,
      indices: [index],
      weights: [weight],
      degrees_of_freedom: Infinity,
    });
  };
  if (u.height_m === undefined) missing.push('height_m');
  specs.push({
    input: 'height_m',
    description: J > 1 ? `release height, independent at each of the ${J} heights` : 'release height',
    evaluation: 'B',
    standard_uncertainty: heightU,
    indices: Array.from({ length: J }, (_, j) => L.firstHeight + j),
    weights: Array.from({ length: J }, () => 1),
    degrees_of_freedom: Infinity,
  });
  single('mass_kg', 'specimen mass', L.mass_kg, 1, u.mass_kg);
  specimen.dimension_names.forEach((name, i) => {
    single(name, `specimen ${name.replace(/_m\d?$/, '').replace('_', ' ')}`, L.firstDimension + i, 1, u[name as keyof typeof u]);
  });
  if (air.density_source === 'override') {
    single('density_kg_m3', 'air density (given)', L.density_kg_m3, 1, u.density_kg_m3);
  } else {
    single('temperature_C', 'air temperature', L.temperature_K, 1, u.temperature_C);
    const pressureWeight = req.air.pressure_reference === 'sea_level' ? air.station_pressure_Pa! / req.air.pressure_Pa! : 1;
    single('pressure_Pa', req.air.pressure_reference === 'sea_level' ? 'sea-level pressure' : 'station pressure', L.pressure_Pa, pressureWeight, u.pressure_Pa);
    if (humidityKind === 'relative-humidity') {
      single('relative_humidity_pct', 'relative humidity', L.humidity, 0.01, u.relative_humidity_pct);
    } else {
      single('dew_point_C', 'dew point', L.humidity, 1, u.dew_point_C);
    }
  }
  if (u.gravity_m_s2 !== undefined || site.source === 'override') {
    single('gravity_m_s2', site.source === 'override' ? 'local gravity (given)' : 'local gravity', L.gravity_m_s2, 1, u.gravity_m_s2);
  }
  if (missing.length > 0) {
    warnings.push({
      code: 'uncertainty-not-given',
      message: `No standard uncertainty given for ${missing.join(', ')}: counted as exactly known, so the budget may be too small.`,
    });
  }
  return {
    req, warnings, site, g, air, rho, mu, specimen, geometry, buoyancy, addedMass, fitOffset, timingU, draws, seed,
    body, noDrag, gEff, mEff, cdFromK, kFromCd, J, counts, groupHeights, groupDrops, groupTimes, meanTimes, dropCd,
    humidityKind, model, L, x0, estimate, kHat, offsetHat, fitted, fittedTimes, residuals, dof, scatter, excess,
    meanTimeU, specs, timeIndices,
  };
}

export type PreparedSeries = ReturnType<typeof prepareSeries>;

export function analyzeSeries(request: AnalysisRequest): AnalysisResult {
  const prepared = prepareSeries(request);
  const {
    req, warnings, site, g, air, rho, mu, specimen, geometry, buoyancy, addedMass, fitOffset, timingU, draws, seed,
    body, noDrag, gEff, mEff, cdFromK, kFromCd, J, counts, groupHeights, groupDrops, groupTimes, dropCd,
    humidityKind, model, L, x0, estimate, kHat, offsetHat, fitted, fittedTimes, residuals, dof, scatter, excess,
    meanTimeU, specs, timeIndices,
  } = prepared;
  const budget = uncertaintyBudget(model, x0, specs);

  // Monte Carlo.
  const normals: NormalInput[] = [];
  for (const spec of specs) {
    if (spec.input === 'time_s' || spec.input === 'scatter_s' || !(spec.standard_uncertainty > 0)) continue;
    spec.indices.forEach((index, i) => {
      const input: NormalInput = { index, u: spec.standard_uncertainty * spec.weights[i]! };
      if (spec.input === 'relative_humidity_pct') {
        input.min = 0;
        input.max = 1;
      }
      normals.push(input);
    });
  }
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
  const mc = monteCarloPropagation(model, x0, mcSpec, fitOffset);
  const mcCd = mc.dragCoefficient;
  if (mcCd.failed > 0) {
    warnings.push({
      code: 'monte-carlo-failed-draws',
      message: `${mcCd.failed} of ${draws} Monte Carlo draws gave no drag coefficient and were left out.`,
    });
  }

  // Is drag resolved at all?
  let bestDelayRatio = -Infinity;
  let detectionK = Infinity;
  for (let j = 0; j < J; j++) {
    const h = groupHeights[j]!;
    const t0 = fallTime(h, noDrag);
    const uj = meanTimeU(j);
    bestDelayRatio = Math.max(bestDelayRatio, (fallTime(h, fitted) - t0) / uj);
    const solved = solveFallTimeFactor(1 + (2 * uj) / t0);
    if (solved.status === 'ok') detectionK = Math.min(detectionK, solved.x / h);
  }
  const resolved = kHat > 0 && mcCd.interval_95[0] > 0 && bestDelayRatio >= 2;
  const detectionCd = Number.isFinite(detectionK) ? cdFromK(detectionK) : 0;
  const upperBound = Math.max(mcCd.upper_bound_95, detectionCd);
  if (!resolved) {
    warnings.push({
      code: 'drag-not-resolved',
      message: `Drag is not resolved: the delay it causes is within about twice the timing uncertainty (or the 95 % interval reaches zero). The drag coefficient is below ${upperBound.toPrecision(3)} with 95 % probability; drop from higher or time more precisely to measure it.`,
    });
  }

  // GUM interval (for comparison with the Monte Carlo one).
  const nuEff = budget.effective_degrees_of_freedom;
  const coverageFactor = nuEff === null ? 1.959963984540054 : studentTQuantile(0.975, nuEff);
  const uc = budget.combined_standard_uncertainty;

  // Predictions.
  const reference = specimen.reference_drag_coefficient;
  let predictionMethod: AnalysisResult['prediction']['method'] = 'none';
  const predictedByHeight = new Map<number, number>();
  if (reference !== null) {
    predictionMethod = 'reference-drag-coefficient';
    const refParams = fallParameters({ ...body, drag_coefficient: reference });
    for (const h of groupHeights) predictedByHeight.set(h, fallTime(h, refParams));
  } else if (geometry.shape === 'sphere') {
    predictionMethod = 'morrison-sphere-correlation';
    let maxRe = 0;
    for (const h of groupHeights) {
      const fall = fallWithVariableDrag(h, {
        effective_gravity_m_s2: gEff,
        drag_constant_per_unit_cd_per_m: (rho * geometry.area_m2) / (2 * mEff),
        reynolds_per_speed_s_m: (rho * geometry.characteristic_length_m) / mu,
        dragCoefficient: morrisonSphereDragCoefficient,
      });
      predictedByHeight.set(h, fall.time_s);
      maxRe = Math.max(maxRe, fall.reynolds_number);
    }
    if (maxRe > MORRISON_VALID_MAX_REYNOLDS) {
      warnings.push({
        code: 'outside-sphere-correlation-range',
        message: `The predicted fall reaches Re = ${maxRe.toPrecision(3)}, beyond the Morrison correlation's range (Re ≤ 1e6); the prediction is extrapolated.`,
      });
    }
  }

  // Per drop.
  const physicalK = Math.max(kHat, 0);
  const physical: FallParameters = { ...fitted, drag_constant_per_m: physicalK };
  const reynoldsPerSpeed = (rho * geometry.characteristic_length_m) / mu;
  const drops: DropResult[] = req.drops.map((drop, i) => {
    const v = fallSpeedAtHeight(drop.height_m, physical);
    return {
      height_m: drop.height_m,
      time_s: drop.time_s,
      drag_coefficient: dropCd[i]!,
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
  if (drops.some((d) => d.reynolds_number >= DRAG_CRISIS_REYNOLDS[0] && d.reynolds_number <= DRAG_CRISIS_REYNOLDS[1])) {
    warnings.push({
      code: 'near-drag-crisis',
      message: `The Reynolds number at impact (up to ${maxRe.toPrecision(3)}) lies in the drag crisis (2e5 to 5e5), where C_d can drop sharply with small changes in speed or surface roughness; repeated drops may disagree.`,
    });
  }
  if (minRe < CREEPING_FLOW_REYNOLDS) {
    warnings.push({
      code: 'creeping-flow',
      message: `The Reynolds number at impact (${minRe.toPrecision(3)}) is in creeping flow (below 1), where drag is nearly proportional to speed; a single quadratic-drag coefficient then describes this fall only.`,
    });
  }

  // Per height statistics and outlier flags.
  const heights: HeightResult[] = groupHeights.map((h, j) => {
    const times = groupTimes[j]!;
    const stats = seriesStatistics(times);
    const grubbs = grubbsTest(times);
    if (grubbs?.outlier) {
      const dropIndex = groupDrops[j]![grubbs.suspect_index]!;
      warnings.push({
        code: 'possible-outlier',
        message: `Drop ${dropIndex + 1} of the series (${times[grubbs.suspect_index]} s from ${h} m) fails Grubbs' test (G = ${grubbs.statistic.toFixed(3)} > ${grubbs.critical_value.toFixed(3)} at α = 0.05). It is kept; check the log before removing it.`,
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
    sensitivity: e.sensitivity,
    contribution: e.contribution,
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
    drag_coefficient: resolved ? estimate : null,
    drag_coefficient_estimate: estimate,
    drag_coefficient_standard_uncertainty: uc,
    drag_coefficient_interval_95: resolved ? mcCd.interval_95 : [0, upperBound],
    drag_resolved: resolved,
    terminal_velocity_m_s: resolved ? Math.sqrt(gEff / kHat) : null,
    drops,
    heights,
    budget: budgetRows,
    gum: {
      combined_standard_uncertainty: uc,
      effective_degrees_of_freedom: nuEff,
      coverage_factor: coverageFactor,
      interval_95: [estimate - coverageFactor * uc, estimate + coverageFactor * uc],
    },
    monte_carlo: {
      draws,
      failed_draws: mcCd.failed,
      seed,
      mean: mcCd.mean,
      standard_deviation: mcCd.standard_deviation,
      interval_95: mcCd.interval_95,
      upper_bound_95: mcCd.upper_bound_95,
    },
    prediction: { method: predictionMethod, reference_drag_coefficient: reference },
    model: {
      buoyancy,
      added_mass_coefficient: addedMass,
      area_m2: geometry.area_m2,
      volume_m3: geometry.volume_m3,
      characteristic_length_m: geometry.characteristic_length_m,
      effective_mass_kg: mEff,
      effective_gravity_m_s2: gEff,
      timing_offset: fitOffset ? 'fit' : 'none',
      scatter_standard_deviation_s: scatter,
      scatter_degrees_of_freedom: Math.max(dof, 0),
    },
    warnings,
  };
  if (!resolved) {
    result.drag_coefficient_upper_bound_95 = upperBound;
    result.terminal_velocity_lower_bound_m_s = Math.sqrt(gEff / kFromCd(upperBound));
  }
  if (fitOffset && mc.offset) {
    result.timing_offset_s = offsetHat;
    result.timing_offset_standard_uncertainty_s = mc.offset.standard_deviation;
    result.timing_offset_interval_95_s = mc.offset.interval_95;
  }
  return result;
}
