/**
 * The inputs of a series' GUM budget (JCGM 100:2008): each input's standard uncertainty, its place in the
 * model's input vector and its weight there. Inputs given without an uncertainty count as exactly known, with a
 * warning.
 */
import type { DropGroups } from './dropGroups';
import type { PhysicsWarning } from './physicsWarning';
import type { SeriesFit } from './seriesFit';
import type { SeriesScatter } from './seriesScatter';
import type { SeriesSetup } from './seriesSetup';
import type { BudgetInputSpec } from './uncertaintyBudget';

export interface BudgetInputs {
  specs: BudgetInputSpec[];
  /** Where the mean times sit in the model's input vector. */
  timeIndices: number[];
  warnings: PhysicsWarning[];
}

export function budgetInputs(setup: SeriesSetup, groups: DropGroups, fit: SeriesFit, scatter: SeriesScatter): BudgetInputs {
  const { request: req, air, site, specimen, timingU, heightU, uncertainty: u } = setup;
  const L = fit.layout;
  const J = groups.heights.length;
  const counts = groups.counts;
  const { excess, dof } = scatter;
  const warnings: PhysicsWarning[] = [];
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
  if (setup.declaredOffset !== null && !setup.fitOffset) {
    // One delay for the whole series: a single input on one model position, so the budget and the Monte Carlo
    // (one draw per series) both treat its error as fully correlated across the drops.
    specs.push({
      input: 'timing_offset_s',
      description: `declared constant start/stop delay of ${setup.declaredOffset.offset_s} s, the same in every drop (systematic)`,
      evaluation: 'B',
      standard_uncertainty: setup.subtractedOffsetU_s,
      indices: [L.timingOffset_s],
      weights: [1],
      degrees_of_freedom: Infinity,
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
    if (setup.humidityKind === 'relative-humidity') {
      single('relative_humidity_pct', 'relative humidity', L.humidity, 0.01, u.relative_humidity_pct);
    } else {
      single('dew_point_C', 'dew point', L.humidity, 1, u.dew_point_C);
    }
  }
  if (air.cipm_extrapolation_relative_uncertainty > 0) {
    specs.push({
      input: 'air_density_formula',
      description: 'CIPM-2007 used outside 15–27 °C or 600–1100 hPa: the formula\'s extra relative uncertainty (|1 − Z|/√3, see airProperties.ts)',
      evaluation: 'B',
      standard_uncertainty: air.cipm_extrapolation_relative_uncertainty,
      indices: [L.densityRelativeChange],
      weights: [1],
      degrees_of_freedom: Infinity,
    });
  }
  if (u.gravity_m_s2 !== undefined || site.source === 'override') {
    single('gravity_m_s2', site.source === 'override' ? 'local gravity (given)' : 'local gravity', L.gravity_m_s2, 1, u.gravity_m_s2);
  }
  if (u.added_mass_coefficient !== undefined) {
    // Not in the "missing" list when absent: a request without it is analysed exactly as before.
    specs.push({
      input: 'added_mass_coefficient',
      description: `added-mass coefficient ${setup.added_mass_coefficient.toPrecision(3)} (potential-flow value; real accelerating flow differs)`,
      evaluation: 'B',
      standard_uncertainty: u.added_mass_coefficient,
      indices: [L.addedMassChange],
      weights: [1],
      degrees_of_freedom: Infinity,
    });
  }
  if (fit.model.columnWeight > 0) {
    // The air along the fall and its motion, each its own row (columnCorrection.ts); only where they matter.
    const c = setup.column;
    const row = (input: string, description: string, indices: number[], uncertainty: number, weight = 1): void => {
      specs.push({ input, description, evaluation: 'B', standard_uncertainty: uncertainty, indices, weights: indices.map(() => weight), degrees_of_freedom: Infinity });
    };
    if (c.aloft === null) {
      row('lapse_rate_K_per_m', `lapse rate along the fall, ${c.lapseRate_K_per_m * 1000} K/km (ISO 2533)${u.lapse_rate_K_per_m === undefined ? ', default uncertainty' : ''}`, [L.lapseRate_K_per_m], c.lapseRateU);
    } else {
      row('air_aloft.temperature_C', 'air temperature of the reading aloft', [L.aloftTemperature_K], u.temperature_C ?? 0);
      row('air_aloft.pressure_Pa', 'station pressure of the reading aloft', [L.aloftPressure_Pa], u.pressure_Pa ?? 0);
      if (c.setup.aloft!.humidity === 'relative-humidity') row('air_aloft.relative_humidity_pct', 'relative humidity of the reading aloft', [L.aloftHumidity], u.relative_humidity_pct ?? 0, 0.01);
      if (c.setup.aloft!.humidity === 'dew-point') row('air_aloft.dew_point_C', 'dew point of the reading aloft', [L.aloftHumidity], u.dew_point_C ?? 0);
    }
    if (c.motion) {
      const two = c.aloft !== null;
      row('vertical_wind_m_s', `vertical air motion${two ? ' at each reading' : ''} (positive up)${u.vertical_wind_m_s === undefined ? ', default uncertainty' : ''}`, two ? [L.verticalWind_m_s, L.aloftVerticalWind_m_s] : [L.verticalWind_m_s], c.verticalWindU);
      row('wind_speed_m_s', `horizontal wind${two ? ' at each reading' : ''}${u.wind_speed_m_s === undefined ? ', default uncertainty' : ''}`, two ? [L.windSpeed_m_s, L.aloftWindSpeed_m_s] : [L.windSpeed_m_s], c.windSpeedU);
    }
  }
  if (missing.length > 0) {
    warnings.push({
      code: 'uncertainty-not-given',
      message: `No standard uncertainty given for ${missing.join(', ')}: counted as exactly known, so the budget may be too small.`,
    });
  }
  return { specs, timeIndices, warnings };
}
