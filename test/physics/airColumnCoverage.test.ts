/**
 * Coverage of the reported 95 % interval (the Monte Carlo one) for tall drops and a declared updraft: each family
 * simulates 500 series in a world whose true inputs differ from the measured ones by draws of their declared
 * standard uncertainties (the lapse rate and the air motion included), times from the fall through the true
 * column (fallThroughColumn.ts, checked against odex), and counts how often the interval holds the true C_d.
 * Binomial standard deviation for n = 500, p = 0.95: 0.97 %, so 93–97 % is about ±2σ. Invented scenario.
 */
import { describe, expect, it } from 'vitest';
import { AirColumn, DEFAULT_LAPSE_RATE_STANDARD_UNCERTAINTY_K_PER_M, STANDARD_LAPSE_RATE_K_PER_M } from '../../src/physics/airColumn';
import { airProperties, type AirInput } from '../../src/physics/airProperties';
import { analyzeSeries } from '../../src/physics/analyzeSeries';
import type { AnalysisRequest, UncertaintyInput } from '../../src/physics/analysisTypes';
import { createRandom } from '../../src/physics/createRandom';
import { fallThroughColumn } from '../../src/physics/fallThroughColumn';
import { localGravity } from '../../src/physics/normalGravity';

const SITE = { latitude_deg: 46.1, elevation_m: 430 };
const AIR: AirInput = { temperature_C: 17.5, pressure_Pa: 96120, pressure_reference: 'station', relative_humidity_pct: 55 };
const U: UncertaintyInput = { height_m: 0.5, mass_kg: 0.001, diameter_m: 0.0003, temperature_C: 0.3, pressure_Pa: 30, relative_humidity_pct: 3 };
const SERIES = 500;

interface Family {
  height: number;
  specimen: { shape: 'sphere'; mass_kg: number; diameter_m: number };
  timingU: number;
  /** Declared vertical wind and its uncertainty, and the horizontal wind's uncertainty (at a recorded 0). */
  motion?: { W: number; uW: number; uU: number };
}

function coverage(family: Family, seed: number): number {
  const random = createRandom(seed);
  const cd = 0.5;
  const g = localGravity(SITE).gravity_m_s2;
  let covered = 0;
  for (let i = 0; i < SERIES; i++) {
    const trueAir = {
      ...AIR,
      temperature_C: AIR.temperature_C + U.temperature_C! * random.normal(),
      pressure_Pa: AIR.pressure_Pa! + U.pressure_Pa! * random.normal(),
      relative_humidity_pct: AIR.relative_humidity_pct! + U.relative_humidity_pct! * random.normal(),
    };
    const props = airProperties(trueAir, SITE.elevation_m);
    const lapse = STANDARD_LAPSE_RATE_K_PER_M + DEFAULT_LAPSE_RATE_STANDARD_UNCERTAINTY_K_PER_M * random.normal();
    const W = family.motion ? family.motion.W + family.motion.uW * random.normal() : 0;
    const windU = family.motion ? family.motion.uU * random.normal() : 0;
    const column = new AirColumn(
      {
        height_m: 0,
        temperature_K: props.temperature_K,
        pressure_Pa: props.station_pressure_Pa!,
        gasFactor: (props.density_kg_m3 * props.temperature_K) / props.station_pressure_Pa!,
        verticalWind_m_s: W,
        windSpeed_m_s: windU,
      },
      g,
      lapse,
    );
    const mass = family.specimen.mass_kg + U.mass_kg! * random.normal();
    const d = family.specimen.diameter_m + U.diameter_m! * random.normal();
    const height = family.height + U.height_m! * random.normal();
    const body = {
      mass_kg: mass,
      area_m2: (Math.PI * d * d) / 4,
      volume_m3: (Math.PI * d ** 3) / 6,
      characteristic_length_m: d,
      buoyancy: true,
      added_mass_coefficient: 0.5,
      drag_coefficient: cd,
    };
    const truth = fallThroughColumn(height, body, column, 1e-10).time_s;
    const request: AnalysisRequest = {
      site: SITE,
      air: family.motion ? { ...AIR, vertical_wind_m_s: family.motion.W, wind_speed_m_s: 0 } : AIR,
      specimen: family.specimen,
      drops: Array.from({ length: 5 }, () => ({ height_m: family.height, time_s: truth + family.timingU * random.normal() })),
      timing: { standard_uncertainty_s: family.timingU },
      uncertainty: family.motion ? { ...U, vertical_wind_m_s: family.motion.uW, wind_speed_m_s: family.motion.uU } : U,
      options: { monte_carlo_draws: 1000, seed: i + 1 },
    };
    const [low, high] = analyzeSeries(request).drag_coefficient_interval_95;
    if (low <= cd && cd <= high) covered++;
  }
  return covered / SERIES;
}

// A 0.5 kg, 100 mm ball timed by hand from a tower, a balloon and an aircraft (0.05 s per drop, five drops).
const BALL = { shape: 'sphere' as const, mass_kg: 0.5, diameter_m: 0.1 };

describe('the reported 95 % interval covers the true C_d in 93–97 % of 500 series', () => {
  it.each([
    [300, 11],
    [1000, 12],
    [3000, 13],
  ])('tall drops from %i m, air read on the ground, the lapse rate uncertain', (height, seed) => {
    const rate = coverage({ height, specimen: BALL, timingU: 0.05 }, seed);
    if (process.env['PLUMMET_PRINT_COVERAGE']) console.log(`coverage from ${height} m: ${(100 * rate).toFixed(1)} %`);
    expect(rate).toBeGreaterThanOrEqual(0.93);
    expect(rate).toBeLessThanOrEqual(0.97);
  }, 600_000);

  it('a light ball from 20 m in a declared 0.3 ± 0.1 m/s updraft (crosswind 0 ± 0.3 m/s)', () => {
    const light = { shape: 'sphere' as const, mass_kg: 0.02, diameter_m: 0.1 };
    const rate = coverage({ height: 20, specimen: light, timingU: 0.01, motion: { W: 0.3, uW: 0.1, uU: 0.3 } }, 14);
    if (process.env['PLUMMET_PRINT_COVERAGE']) console.log(`coverage in the updraft: ${(100 * rate).toFixed(1)} %`);
    expect(rate).toBeGreaterThanOrEqual(0.93);
    expect(rate).toBeLessThanOrEqual(0.97);
  }, 600_000);
});
