/**
 * The analysis of a series in which at least one drop carries marks (distance fallen against time): the same
 * stages and the same result as analyzeSeries — setup, fit, GUM budget, adaptive Monte Carlo, verdict — with the
 * measurement model of marksModel.ts (every mark of every drop, generalised least squares) in place of the mean
 * time per height. A drop without marks in such a series is one mark, its landing, with a known release.
 *
 * What differs, stated: the drag law is the constant one (the scaled sphere curve is fitted to mean times only);
 * the fall is the closed form in uniform still air at the reading (a warning says so when the request describes the
 * air along the fall or its motion); the prediction is from the reference C_d only.
 */
import type { AnalysisRequest, AnalysisResult, BudgetRow, DropResult, HeightResult } from './analysisTypes';
import { budgetInputs } from './budgetInputs';
import type { DropGroups } from './dropGroups';
import { groupDrops } from './dropGroups';
import { fallParameters, fallSpeedAtHeight, fallTime, type FallParameters } from './fallModel';
import { fitDragToMarks, type MarkedDrop } from './fitDragToMarks';
import { grubbsPerSeries } from './grubbsTest';
import { MarksModel, type MarksDropSetup } from './marksModel';
import { adaptiveMonteCarloPropagation, monteCarloNormals, monteCarloPropagation, type AdaptiveMonteCarloResult, type MonteCarloSpec } from './monteCarloPropagation';
import { PhysicsInputError } from './physicsInputError';
import type { PhysicsWarning } from './physicsWarning';
import type { SeriesFit } from './seriesFit';
import { SeriesModel } from './seriesModel';
import type { SeriesScatter } from './seriesScatter';
import { prepareSetup, type SeriesSetup } from './seriesSetup';
import { seriesStatistics } from './seriesStatistics';
import { standardSphereDragCoefficient } from './standardSphereDrag';
import { dragCrisisWarning } from './dragCrisisWarning';
import { studentTQuantile } from './studentT';
import { ROLLING_SHUTTER_STANDARD_UNCERTAINTY_S, TIMING_METHOD_DEFAULTS } from './timingMethodDefaults';
import { uncertaintyBudget, type BudgetInputSpec } from './uncertaintyBudget';

/** Mach numbers as in analyzeSeries.ts (compressibility warning, the end of quadratic drag). */
const COMPRESSIBILITY_WARNING_MACH = 0.3;
const QUADRATIC_DRAG_LIMIT_MACH = 0.6;

/** True when any drop of the (untrusted) request carries marks. */
export function requestHasMarks(request: unknown): boolean {
  const drops = (request as { drops?: unknown } | null)?.drops;
  return Array.isArray(drops) && drops.some((d) => typeof d === 'object' && d !== null && (d as { marks?: unknown }).marks !== undefined);
}

/** The per-drop timing parts of a marks series (see timingMethodDefaults.ts). */
function dropSetups(setup: SeriesSetup): MarksDropSetup[] {
  const { request: req, timingU } = setup;
  const method = req.timing.method;
  const defaults = method !== undefined ? TIMING_METHOD_DEFAULTS[method] : null;
  const markU = defaults?.mark_standard_uncertainty_s ?? timingU;
  const releaseU = req.timing.release_standard_uncertainty_s ?? defaults?.release_standard_uncertainty_s ?? 0;
  const distanceU = setup.uncertainty.mark_distance_m ?? 0;
  return req.drops.map((drop) => {
    const marks = drop.marks ?? [{ distance_m: drop.height_m, time_s: drop.time_s }];
    const marked = drop.marks !== undefined;
    const releaseKnown = drop.release_time_known !== false;
    return {
      distances_m: marks.map((m) => m.distance_m),
      times_s: marks.map((m) => m.time_s),
      releaseKnown,
      marked,
      timeU_s: marked ? markU : timingU,
      releaseU_s: marked && releaseKnown ? releaseU : 0,
      distanceU_m: marked ? distanceU : 0,
    };
  });
}

/** The nominal input vector: the physical inputs as fitSeries sets them (seriesFit.ts), then the marks'. */
function nominalInputs(setup: SeriesSetup, model: MarksModel): Float64Array {
  const { request: req, air, specimen } = setup;
  const M = model.layout;
  const L = M.physics;
  const x0 = new Float64Array(M.fullLength);
  x0[L.temperature_K] = air.temperature_K;
  x0[L.pressure_Pa] = air.station_pressure_Pa ?? 0;
  x0[L.humidity] =
    setup.humidityKind === 'relative-humidity' ? req.air.relative_humidity_pct! / 100 : setup.humidityKind === 'dew-point' ? req.air.dew_point_C! + 273.15 : 0;
  x0[L.density_kg_m3] = setup.density_kg_m3;
  x0[L.gravity_m_s2] = setup.gravity_m_s2;
  x0[L.mass_kg] = specimen.mass_kg;
  specimen.dimensions.forEach((d, i) => (x0[L.firstDimension + i] = d));
  x0[L.timingOffset_s] = setup.subtractedOffset_s;
  model.setup.drops.forEach((drop, i) => drop.times_s.forEach((t, k) => (x0[M.markTime[i]![k]!] = t)));
  return x0;
}

/** The budget rows of the body and the air, exactly as for single times (budgetInputs.ts), without its time and height rows. */
function physicalSpecs(setup: SeriesSetup, physics: SeriesModel): { specs: BudgetInputSpec[]; warnings: PhysicsWarning[] } {
  const none: DropGroups = { heights: [], members: [], counts: new Float64Array(0), times: [], meanTimes: [] };
  const fit = { layout: physics.layout, model: { columnWeight: 0 } } as unknown as SeriesFit;
  const scatter = { excess: 0, dof: 0 } as unknown as SeriesScatter;
  const inputs = budgetInputs(setup, none, fit, scatter);
  const replaced = new Set(['time_s', 'scatter_s', 'height_m', 'timing_offset_s']);
  return { specs: inputs.specs.filter((s) => !replaced.has(s.input)), warnings: inputs.warnings };
}

export function analyzeMarksSeries(request: AnalysisRequest): AnalysisResult {
  const setup = prepareSetup(request);
  const req = setup.request;
  const warnings: PhysicsWarning[] = [...setup.warnings];
  const { specimen, geometry, fitOffset, timingU, seed, noDrag } = setup;
  if (req.options?.drag_law === 'scaled_sphere') {
    throw new PhysicsInputError({
      code: 'conflicting-fields',
      field: 'options.drag_law',
      value: 'scaled_sphere',
      allowed: '"auto" or "constant" for a series with marks (the scaled sphere curve is fitted to single times only)',
    });
  }
  const drops = dropSetups(setup);
  const video = req.timing.method === 'video' && drops.some((d) => d.marked);
  const physics = new SeriesModel({
    shape: geometry.shape,
    dimensionCount: specimen.dimensions.length,
    characteristicLength: geometry.shape === 'custom' ? geometry.characteristic_length_m : undefined,
    humidity: setup.humidityKind,
    densityOverride: setup.air.density_source === 'override',
    co2MoleFraction: req.air.co2_mole_fraction ?? 0.0004,
    buoyancy: setup.buoyancy,
    addedMassCoefficient: req.options?.added_mass_coefficient ?? null,
    fitOffset: false,
    counts: new Float64Array(0),
  });
  const model = new MarksModel(
    { shape: geometry.shape, characteristicLength: physics.setup.characteristicLength, buoyancy: setup.buoyancy, addedMassCoefficient: physics.setup.addedMassCoefficient, fitOffset, video, drops },
    physics,
    specimen.dimensions.length,
  );
  const M = model.layout;
  const L = M.physics;
  const x0 = nominalInputs(setup, model);
  const estimate = model.evaluate(x0);
  const fit = model.lastFit!;
  if (model.status !== 'ok' || !Number.isFinite(estimate)) {
    throw new PhysicsInputError({
      code: model.status === 'no-drag-information' ? 'drag-unexplained' : 'solver-failed',
      field: 'drops',
      value: `${drops.reduce((n, d) => n + d.times_s.length, 0)} marks in ${drops.length} drops`,
      allowed: 'marks a finite drag explains for this specimen, with at least two distinct distances in a drop whose release is estimated',
      reason: model.status === 'no-drag-information' ? 'the marks say nothing about drag (too few distinct distances)' : undefined,
    });
  }
  const kHat = fit.dragConstant_per_m;
  model.startDragConstant = kHat;
  // The effective-variance weights depend on the speeds, so on k: from here on they stay those of the nominal fit,
  // which makes the budget and the Monte Carlo propagate one fixed generalised least squares (its value at x0 is
  // the same) and spares a reweighting in every draw.
  model.freezeWeights(x0);
  const fitted: FallParameters = { effective_gravity_m_s2: setup.effectiveGravity_m_s2, drag_constant_per_m: kHat, effective_mass_kg: setup.effectiveMass_kg };
  const speedAt = (d: number) => fallSpeedAtHeight(d, { ...fitted, drag_constant_per_m: Math.max(kHat, 0) });

  // Each mark's random time at the nominal point: its reading and its distance's noise over the speed there
  // (fitDragToMarks.ts), the reference uncertainty the rows are stated in, and the scatter beyond them (Birge ratio).
  const effectiveU = drops.map((d) =>
    d.distances_m.map((x) => {
      const v = speedAt(x);
      return d.distanceU_m > 0 && v > 0 ? Math.hypot(d.timeU_s, d.distanceU_m / v) : d.timeU_s;
    }),
  );
  const markedDrop = drops.find((d) => d.marked)!;
  const referenceU = drops.every((d) => d.marked) ? markedDrop.timeU_s : timingU;
  const dof = fit.degreesOfFreedom;
  const birge2 = dof > 0 ? fit.sumOfSquares / dof : NaN;
  const excess = dof > 0 && birge2 > 1 ? referenceU * Math.sqrt(birge2 - 1) : 0;
  const timeIndices = M.markTime.flat();
  const timeWeights = effectiveU.flat().map((u) => u / referenceU);

  const specs: BudgetInputSpec[] = [];
  specs.push({
    input: 'time_s',
    description: `random timing error of each mark (declared${drops.some((d) => d.distanceU_m > 0) ? ', with the distance noise over the speed at the mark' : ''})`,
    evaluation: 'B',
    standard_uncertainty: referenceU,
    indices: timeIndices,
    weights: timeWeights,
    degrees_of_freedom: Infinity,
  });
  if (excess > 0) {
    specs.push({
      input: 'scatter_s',
      description: `scatter of the marks beyond the declared timing uncertainty (Type A, ν = ${dof})`,
      evaluation: 'A',
      standard_uncertainty: excess,
      indices: timeIndices,
      weights: timeWeights,
      degrees_of_freedom: dof,
    });
  }
  const releaseDrops = drops.map((d, i) => ({ d, i })).filter(({ d }) => d.releaseU_s > 0);
  if (releaseDrops.length > 0) {
    specs.push({
      input: 'release_s',
      description: `release instant of each drop with a known release, shared by its marks (${releaseDrops.length} drops)`,
      evaluation: 'B',
      standard_uncertainty: releaseDrops[0]!.d.releaseU_s,
      indices: releaseDrops.map(({ i }) => M.firstRelease + i),
      weights: releaseDrops.map(() => 1),
      degrees_of_freedom: Infinity,
    });
  }
  if (setup.declaredOffset !== null && !fitOffset) {
    specs.push({
      input: 'timing_offset_s',
      description: `declared constant start/stop delay of ${setup.declaredOffset.offset_s} s, the same in every drop (systematic; a drop whose release is estimated takes it into its release shift)`,
      evaluation: 'B',
      standard_uncertainty: setup.subtractedOffsetU_s,
      indices: [L.timingOffset_s],
      weights: [1],
      degrees_of_freedom: Infinity,
    });
  }
  if (video) {
    specs.push({
      input: 'rolling_shutter_s',
      description: 'rolling shutter: a delay growing with the distance fallen, this much at the bottom of each clip\'s fall, the same camera for the series (systematic)',
      evaluation: 'B',
      standard_uncertainty: ROLLING_SHUTTER_STANDARD_UNCERTAINTY_S,
      indices: [M.rollingShutter_s],
      weights: [1],
      degrees_of_freedom: Infinity,
    });
  }
  // Without a stated tape error the distances are exact (budgetInputs' warning says so): no row, and none of the
  // many distinct distances of a video is differentiated for nothing.
  if (setup.heightU > 0) specs.push({
    input: 'height_m',
    description: `distance of each mark, independent at each of the ${M.distinctDistances.length} distinct distances (shared by every drop that has it)`,
    evaluation: 'B',
    standard_uncertainty: setup.heightU,
    indices: M.distinctDistances.map((_, g) => M.firstDistance + g),
    weights: M.distinctDistances.map(() => 1),
    degrees_of_freedom: Infinity,
  });
  const scaleU = setup.uncertainty.mark_scale_relative;
  if (scaleU !== undefined) {
    const scaled = drops.map((d, i) => ({ d, i })).filter(({ d }) => d.marked);
    specs.push({
      input: 'mark_scale_relative',
      description: `distance scale of each drop's marks, independent between drops (${scaled.length} drops)`,
      evaluation: 'B',
      standard_uncertainty: scaleU,
      indices: scaled.map(({ i }) => M.firstScale + i),
      weights: scaled.map(() => 1),
      degrees_of_freedom: Infinity,
    });
  }
  const physical = physicalSpecs(setup, physics);
  specs.push(...physical.specs);
  warnings.push(...physical.warnings);
  const budget = uncertaintyBudget(model, x0, specs);

  // Monte Carlo: every input drawn, the marks' times through the same draw as single times (one normal per mark,
  // its variance the declared one, scaled by ν/χ²_ν when the marks scatter more; counts carry the per-mark ratio).
  const normals = monteCarloNormals(specs, setup.added_mass_coefficient);
  const mcSpec: MonteCarloSpec = {
    draws: setup.draws,
    seed,
    normals,
    times: {
      indices: timeIndices,
      counts: timeWeights.map((w) => 1 / (w * w)),
      declared_s: referenceU,
      excess_s: excess,
      degrees_of_freedom: Math.max(dof, 1),
    },
  };
  if (setup.humidityKind === 'dew-point') mcSpec.dewPoint = { index: L.humidity, temperatureIndex: L.temperature_K };
  const adaptive = req.options?.monte_carlo_draws === undefined;
  const mc = adaptive ? adaptiveMonteCarloPropagation(model, x0, mcSpec, fitOffset) : monteCarloPropagation(model, x0, mcSpec, fitOffset);
  const adaptiveRun = adaptive ? (mc as AdaptiveMonteCarloResult).adaptive : null;
  model.evaluate(x0);
  const mcCd = mc.dragCoefficient;
  if (mcCd.failed > 0) {
    warnings.push({ code: 'monte-carlo-failed-draws', message: `${mcCd.failed} of ${mcCd.draws} Monte Carlo draws gave no drag coefficient and were left out.` });
  }
  if (adaptiveRun && !adaptiveRun.stabilized) {
    warnings.push({
      code: 'monte-carlo-not-stabilized',
      message: `The Monte Carlo interval did not settle to its numerical tolerance (${adaptiveRun.tolerance.toPrecision(2)}, a twentieth of its standard deviation) within ${adaptiveRun.max_draws} draws: its ends may move by about ${(adaptiveRun.worst_ratio * adaptiveRun.tolerance).toPrecision(2)} between runs.`,
    });
  }
  const uc = budget.combined_standard_uncertainty;
  const resolved = kHat > 0 && mcCd.interval_95[0] > 0 && estimate >= 2 * uc;
  const upperBound = Math.max(mcCd.upper_bound_95, 0);
  if (!resolved) {
    warnings.push({
      code: 'drag-not-resolved',
      message: `Drag is not resolved: the marks' delay from drag is within about twice its uncertainty (or the 95 % interval reaches zero). The drag coefficient is below ${upperBound.toPrecision(3)} with 95 % probability.`,
    });
  }
  if (!fitOffset && drops.every((d) => !d.releaseKnown)) {
    warnings.push({
      code: 'offset-absorbed-by-release',
      severity: 'info',
      message: 'Every drop\'s release is estimated: a constant timing delay of the series is taken into each drop\'s release shift, so none is fitted or needed.',
    });
  }
  if (req.air_aloft !== undefined || setup.column.motion) {
    warnings.push({
      code: 'marks-in-uniform-air',
      message: 'The marks are fitted with the fall in uniform still air at the reading: the air along the fall and its motion given in the request are not used for a series with marks.',
    });
  }

  // Per drop: the marks' fitted times, the drop's own C_d from its own marks.
  const rho = setup.density_kg_m3;
  const reynoldsPerSpeed = (rho * geometry.characteristic_length_m) / setup.viscosity_Pa_s;
  const declared = setup.subtractedOffset_s;
  const ownCd = (i: number): number | null => {
    const d = drops[i]!;
    const own: MarkedDrop = {
      distances_m: Float64Array.from(d.distances_m),
      times_s: Float64Array.from(d.times_s, (t) => t - (d.releaseKnown ? declared + fit.offset_s : 0)),
      releaseKnown: d.releaseKnown,
      timeU_s: d.timeU_s,
      releaseU_s: d.releaseU_s,
      distanceU_m: d.distanceU_m,
    };
    if (d.times_s.length === 1) {
      if (own.times_s[0]! <= fallTime(d.distances_m[0]!, noDrag)) return null;
    }
    const alone = fitDragToMarks(setup.effectiveGravity_m_s2, [own], false, kHat);
    if (alone.status !== 'ok' || !(alone.dragConstant_per_m > 0)) return null;
    return (2 * setup.effectiveMass_kg * alone.dragConstant_per_m) / (rho * geometry.area_m2);
  };
  const reference = specimen.reference_drag_coefficient;
  const refParams = reference !== null ? fallParameters({ ...setup.body, drag_coefficient: reference }) : null;
  const physicalFall: FallParameters = { ...fitted, drag_constant_per_m: Math.max(kHat, 0) };
  const resultDrops: DropResult[] = req.drops.map((drop, i) => {
    const d = drops[i]!;
    const shift = fit.shifts_s[i] ?? null;
    const zero = shift !== null ? shift : declared + fit.offset_s;
    const fittedTimes = d.distances_m.map((x) => fallTime(x, fitted) + zero);
    const v = fallSpeedAtHeight(drop.height_m, physicalFall);
    const last = d.distances_m.length - 1;
    const result: DropResult = {
      ...(drop.id !== undefined ? { id: drop.id } : {}),
      height_m: drop.height_m,
      time_s: drop.time_s,
      drag_coefficient: ownCd(i),
      vacuum_time_s: Math.sqrt((2 * drop.height_m) / setup.gravity_m_s2),
      predicted_time_s: refParams !== null ? fallTime(drop.height_m, refParams) : null,
      fitted_time_s: fittedTimes[last]!,
      residual_s: drop.time_s - fittedTimes[last]!,
      impact_speed_m_s: v,
      impact_energy_J: 0.5 * specimen.mass_kg * v * v,
      reynolds_number: reynoldsPerSpeed * v,
    };
    if (d.marked) {
      result.marks = d.distances_m.map((x, k) => ({ distance_m: x, time_s: d.times_s[k]!, fitted_time_s: fittedTimes[k]!, residual_s: d.times_s[k]! - fittedTimes[k]! }));
      result.release_shift_s = shift;
    }
    return result;
  });

  // The speed at impact against the speed of sound, as for single times.
  const top = Math.max(...req.drops.map((d) => d.height_m));
  const topIndex = req.drops.findIndex((d) => d.height_m === top);
  const impactMach = fallSpeedAtHeight(top, physicalFall) / setup.air.speed_of_sound_m_s;
  if (impactMach > QUADRATIC_DRAG_LIMIT_MACH) {
    throw new PhysicsInputError({
      code: 'out-of-range',
      field: `drops[${topIndex}].height_m`,
      value: top,
      allowed: `a fall whose impact stays below Mach ${QUADRATIC_DRAG_LIMIT_MACH} (this one reaches Mach ${impactMach.toFixed(2)})`,
      reason: 'quadratic drag with one drag coefficient fails near the speed of sound',
    });
  }
  if (impactMach > COMPRESSIBILITY_WARNING_MACH) {
    warnings.push({ code: 'compressible-impact', message: `The fall reaches Mach ${impactMach.toFixed(2)} at impact: past Mach ${COMPRESSIBILITY_WARNING_MACH} C_d starts to depend on speed; the fitted C_d is an average over the fall.` });
  }

  // Per landing height: the same statistics and outlier flags as single times.
  const groups = groupDrops(req.drops);
  const grubbsByHeight = grubbsPerSeries(groups.times);
  const heights: HeightResult[] = groups.heights.map((h, j) => {
    const stats = seriesStatistics(groups.times[j]!);
    const grubbs = grubbsByHeight[j]!;
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
        suspect_drop_index: groups.members[j]![grubbs.suspect_index]!,
        outlier: grubbs.outlier,
      },
    };
  });

  const nuEff = budget.effective_degrees_of_freedom;
  const coverageFactor = nuEff === null ? 1.959963984540054 : studentTQuantile(0.975, nuEff);
  const impactRe = resultDrops.map((d) => d.reynolds_number);
  const crisis = dragCrisisWarning(geometry.shape, impactRe);
  if (crisis) warnings.push(crisis);
  const reRange: [number, number] = [Math.min(...impactRe) / 2, Math.max(...impactRe)];
  const sphereChange = geometry.shape === 'sphere' ? Math.abs(standardSphereDragCoefficient(reRange[0]) / standardSphereDragCoefficient(reRange[1]) - 1) : 0;
  const terminal = kHat > 0 ? Math.sqrt(setup.effectiveGravity_m_s2 / kHat) : null;
  const budgetRows: BudgetRow[] = budget.entries.map((e) => ({ ...e }));
  const result: AnalysisResult = {
    air: {
      density_kg_m3: rho,
      station_pressure_Pa: setup.air.station_pressure_Pa,
      dynamic_viscosity_Pa_s: setup.viscosity_Pa_s,
      speed_of_sound_m_s: setup.air.speed_of_sound_m_s,
      density_source: setup.air.density_source,
      cipm_density_kg_m3: setup.air.cipm_density_kg_m3,
      sea_level_pressure_Pa: setup.air.sea_level_pressure_Pa,
      vapour_mole_fraction: setup.air.vapour_mole_fraction,
      compressibility_factor: setup.air.compressibility_factor,
    },
    gravity_m_s2: setup.gravity_m_s2,
    gravity_source: setup.site.source,
    drag_coefficient: resolved ? estimate : null,
    drag_coefficient_estimate: estimate,
    drag_coefficient_standard_uncertainty: uc,
    drag_coefficient_interval_95: resolved ? mcCd.interval_95 : [0, upperBound],
    drag_resolved: resolved,
    drag_law: 'constant',
    drag_law_details: {
      requested: req.options?.drag_law ?? 'auto',
      reason: 'marks: the constant drag law (the scaled sphere curve is fitted to single times only)',
      reynolds_range: reRange,
      sphere_curve_change: sphereChange,
      constant_drag_coefficient: estimate,
      scale_factor: null,
      scale_factor_standard_uncertainty: null,
      scale_factor_interval_95: null,
      terminal_reynolds_number: terminal !== null ? reynoldsPerSpeed * terminal : null,
      drag_coefficient_at_terminal: kHat > 0 ? estimate : null,
      drag_coefficient_at_max_impact: kHat > 0 ? estimate : null,
      trend_z: null,
      misfit: false,
    },
    terminal_velocity_m_s: resolved ? terminal : null,
    drops: resultDrops,
    heights,
    budget: budgetRows,
    gum: {
      combined_standard_uncertainty: uc,
      effective_degrees_of_freedom: nuEff,
      coverage_factor: coverageFactor,
      interval_95: [estimate - coverageFactor * uc, estimate + coverageFactor * uc],
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
    prediction: { method: reference !== null ? 'reference-drag-coefficient' : 'none', reference_drag_coefficient: reference },
    model: {
      mass_kg: specimen.mass_kg,
      buoyancy: setup.buoyancy,
      added_mass_coefficient: setup.added_mass_coefficient,
      area_m2: geometry.area_m2,
      volume_m3: geometry.volume_m3,
      characteristic_length_m: geometry.characteristic_length_m,
      effective_mass_kg: setup.effectiveMass_kg,
      effective_gravity_m_s2: setup.effectiveGravity_m_s2,
      timing_offset: fitOffset ? 'fit' : 'none',
      scatter_standard_deviation_s: dof > 0 ? referenceU * Math.sqrt(birge2) : null,
      scatter_degrees_of_freedom: Math.max(dof, 0),
    },
    warnings,
  };
  if (!resolved) {
    result.drag_coefficient_upper_bound_95 = upperBound;
    const kBound = (rho * upperBound * geometry.area_m2) / (2 * setup.effectiveMass_kg);
    result.terminal_velocity_lower_bound_m_s = Math.sqrt(setup.effectiveGravity_m_s2 / kBound);
  }
  if (fitOffset && mc.offset) {
    result.timing_offset_s = fit.offset_s;
    result.timing_offset_standard_uncertainty_s = mc.offset.standard_deviation;
    result.timing_offset_interval_95_s = mc.offset.interval_95;
  }
  if (setup.declaredOffset !== null) result.declared_timing_offset = { ...setup.declaredOffset };
  return result;
}
