/**
 * The fit of a series: the measurement model (seriesModel.ts) at its nominal inputs gives C_d (and the timing
 * offset when fitted) from the mean time at each height.
 */
import type { DropGroups } from './dropGroups';
import type { FallParameters } from './fallModel';
import { PhysicsInputError } from './physicsInputError';
import { columnWeight } from './columnCorrection';
import { SeriesModel, type SeriesModelLayout } from './seriesModel';
import type { SeriesSetup } from './seriesSetup';

export interface SeriesFit {
  model: SeriesModel;
  layout: SeriesModelLayout;
  /** The nominal inputs, in the model's layout. */
  x0: Float64Array;
  /** C_d at the nominal inputs (the least-squares value, even when slightly negative). */
  estimate: number;
  /** The fitted drag constant k, 1/m. */
  dragConstant_per_m: number;
  /** The fitted timing offset, s (0 when none is fitted). */
  offset_s: number;
  /** The fall with the fitted drag constant. */
  fitted: FallParameters;
  /** The air along the fall's effect on the times over their smallest uncertainty, and the weight it gives (columnCorrection.ts). */
  columnEffect: number;
}

/** The inputs of the air along the fall and its motion with their standard uncertainties, in model units. */
export function columnUncertainties(setup: SeriesSetup, L: SeriesModelLayout): { index: number; u: number }[] {
  const c = setup.column;
  const u = setup.uncertainty;
  const list: { index: number; u: number }[] = [];
  if (c.aloft === null) {
    list.push({ index: L.lapseRate_K_per_m, u: c.lapseRateU });
  } else {
    list.push({ index: L.aloftTemperature_K, u: u.temperature_C ?? 0 }, { index: L.aloftPressure_Pa, u: u.pressure_Pa ?? 0 });
    if (c.setup.aloft!.humidity === 'relative-humidity') list.push({ index: L.aloftHumidity, u: (u.relative_humidity_pct ?? 0) / 100 });
    if (c.setup.aloft!.humidity === 'dew-point') list.push({ index: L.aloftHumidity, u: u.dew_point_C ?? 0 });
  }
  if (c.motion) {
    list.push({ index: L.verticalWind_m_s, u: c.verticalWindU }, { index: L.windSpeed_m_s, u: c.windSpeedU });
    if (c.aloft !== null) list.push({ index: L.aloftVerticalWind_m_s, u: c.verticalWindU }, { index: L.aloftWindSpeed_m_s, u: c.windSpeedU });
  }
  return list.filter((i) => i.u > 0);
}

/** The measurement model of these groups on the setup, and its nominal inputs (before any fit). */
export function seriesModelAt(setup: SeriesSetup, groups: DropGroups): { model: SeriesModel; x0: Float64Array } {
  const { request: req, air, specimen, geometry } = setup;
  const model = new SeriesModel({
    shape: geometry.shape,
    dimensionCount: specimen.dimensions.length,
    characteristicLength: geometry.shape === 'custom' ? geometry.characteristic_length_m : undefined,
    humidity: setup.humidityKind,
    densityOverride: air.density_source === 'override',
    co2MoleFraction: req.air.co2_mole_fraction ?? 0.0004,
    buoyancy: setup.buoyancy,
    addedMassCoefficient: req.options?.added_mass_coefficient ?? null,
    fitOffset: setup.fitOffset,
    counts: groups.counts,
    column: setup.column.setup,
  });
  const L = model.layout;
  const x0 = new Float64Array(L.fullLength);
  x0[L.temperature_K] = air.temperature_K;
  x0[L.pressure_Pa] = air.station_pressure_Pa ?? 0;
  x0[L.humidity] =
    setup.humidityKind === 'relative-humidity' ? req.air.relative_humidity_pct! / 100 : setup.humidityKind === 'dew-point' ? req.air.dew_point_C! + 273.15 : 0;
  x0[L.density_kg_m3] = setup.density_kg_m3;
  x0[L.gravity_m_s2] = setup.gravity_m_s2;
  x0[L.mass_kg] = specimen.mass_kg;
  specimen.dimensions.forEach((d, i) => (x0[L.firstDimension + i] = d));
  for (let j = 0; j < groups.heights.length; j++) {
    x0[L.firstHeight + j] = groups.heights[j]!;
    x0[L.firstTime + j] = groups.meanTimes[j]!;
  }
  x0[L.timingOffset_s] = setup.subtractedOffset_s;
  x0[L.addedMassChange] = 0;
  x0[L.densityRelativeChange] = 0;
  const column = setup.column;
  x0[L.lapseRate_K_per_m] = column.lapseRate_K_per_m;
  x0[L.verticalWind_m_s] = column.verticalWind_m_s;
  x0[L.windSpeed_m_s] = column.windSpeed_m_s;
  if (column.aloft !== null) {
    x0[L.aloftTemperature_K] = column.aloft.temperature_K;
    x0[L.aloftPressure_Pa] = column.aloft.pressure_Pa;
    x0[L.aloftHumidity] = column.aloft.humidity;
    x0[L.aloftVerticalWind_m_s] = column.aloft.verticalWind_m_s;
    x0[L.aloftWindSpeed_m_s] = column.aloft.windSpeed_m_s;
  }
  return { model, x0 };
}

export function fitSeries(setup: SeriesSetup, groups: DropGroups): SeriesFit {
  const { model, x0 } = seriesModelAt(setup, groups);
  const L = model.layout;
  // The air along the fall: its weight from its effect at the nominal inputs, fixed for the whole analysis.
  const columnEffect = model.columnEffect(x0, setup.timingU, columnUncertainties(setup, L));
  model.columnWeight = columnWeight(columnEffect);
  const estimate = model.evaluate(x0);
  if (model.status !== 'ok') {
    throw new PhysicsInputError({
      code: model.status === 'faster-than-free-fall' ? 'faster-than-free-fall' : model.status === 'drag-unexplained' ? 'drag-unexplained' : 'solver-failed',
      field: 'drops',
      value: groups.meanTimes.map((t, j) => `${t.toFixed(4)} s from ${groups.heights[j]} m`).join(', '),
      allowed: 'times a finite, non-negative drag explains for this specimen',
    });
  }
  const kHat = model.dragConstant_per_m;
  const offset = setup.fitOffset ? model.offset_s : 0;
  model.startDragConstant = kHat;
  return {
    model,
    layout: L,
    x0,
    estimate,
    dragConstant_per_m: kHat,
    offset_s: offset,
    fitted: { effective_gravity_m_s2: setup.effectiveGravity_m_s2, drag_constant_per_m: kHat, effective_mass_kg: setup.effectiveMass_kg },
    columnEffect,
  };
}
