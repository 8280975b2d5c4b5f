import { describe, expect, it } from 'vitest';
import { analyzeSeries } from '../../src/physics/analyzeSeries';
import type { AnalysisRequest, SpecimenInput } from '../../src/physics/index';
import { fallWithVariableDrag } from '../../src/physics/fallWithVariableDrag';
import { morrisonSphereDragCoefficient } from '../../src/physics/sphereDragCoefficient';
import {
  STANDARD_SPHERE_DRAG_RELATIVE_UNCERTAINTY,
  STANDARD_SPHERE_DRAG_VALID_MAX_REYNOLDS,
  standardSphereDragCoefficient,
} from '../../src/physics/standardSphereDrag';
import { AIR, exactTimes, SITE, UNCERTAINTY } from './syntheticSeries';

const relative = (re: number, cd: number): number => standardSphereDragCoefficient(re) / cd - 1;

describe('the standard sphere drag curve', () => {
  it('lies within 4 % of Pruppacher & Klett, Microphysics of Clouds and Precipitation, Table 10.1 (rigid spheres)', () => {
    // [Re, C_d] as reproduced in the exojax repository's data/clouds/drag_force.txt ("Table 10.1 p381, Pruppacher and Klett").
    const table: [number, number][] = [
      [10, 4.29],
      [30, 2.11],
      [57, 1.51],
      [100, 1.1],
      [300, 0.63],
    ];
    for (const [re, cd] of table) expect(Math.abs(relative(re, cd))).toBeLessThan(0.04);
  });

  it('follows the Proudman–Pearson low-Reynolds expansion within 0.5 % for 0.1 ≤ Re ≤ 0.5', () => {
    // C_d = 24/Re·(1 + 3Re/16 + (9/160)·Re²·ln(Re/2)) (Proudman & Pearson, J. Fluid Mech. 2, 237 (1957), from memory):
    // exact asymptotics, so a table is not needed where the flow is nearly creeping.
    for (const re of [0.1, 0.2, 0.3, 0.5]) {
      const theory = (24 / re) * (1 + (3 * re) / 16 + (9 / 160) * re * re * Math.log(re / 2));
      expect(Math.abs(relative(re, theory))).toBeLessThan(0.005);
    }
  });

  it('lies within 6 % of the standard curve as reproduced for 1 ≤ Re ≤ 6e4, and the points above show why 5 % is stated', () => {
    // [Re, C_d] "experimental values of C_D for spheres", Indiana University of Pennsylvania CalcDEMma project,
    // drag notebook §2.1 (www.ma.iup.edu/projects/CalcDEMma/drag/drag07.html): a digitised log–log chart, so read
    // to about ±3 %; its points below Re = 1 are off Stokes' law itself by 8 % and are not used.
    const table: [number, number][] = [
      [3.02, 10.86],
      [7.015, 5.623],
      [15.49, 3.388],
      [57.54, 1.479],
      [144.5, 0.9204],
      [264.9, 0.7194],
      [512.9, 0.5623],
      [1000, 0.4786],
      [1862, 0.4365],
      [3162, 0.4074],
      [4764, 0.389],
      [8375, 0.3981],
      [15560, 0.4395],
      [26480, 0.4571],
      [34670, 0.4775],
      [58880, 0.4732],
    ];
    for (const [re, cd] of table) expect(Math.abs(relative(re, cd))).toBeLessThan(0.06);
  });

  it('lies within 5 % of Roos & Willmarth (AIAA J. 9, 285 (1971)) wherever their measurements agree with the other tables', () => {
    // Their sphere data as reproduced in the sheardata repository (data/E1971001/spheres.csv), averaged per
    // band (geometric mean of the measured C_d against the curve). Bands and their measured points:
    const bands: { re: [number, number]; points: [number, number][] }[] = [
      { re: [5, 50], points: [[5.33, 7.06], [5.99, 6.41], [11, 4.01], [13.1, 3.76], [13.2, 3.66], [13.9, 3.59], [14.6, 3.41], [16.2, 3.29], [21.1, 2.82], [23.4, 2.48], [29.1, 2.28], [45, 1.79]] },
      { re: [50, 100], points: [[50.6, 1.58], [54.4, 1.52], [68.9, 1.35], [68.9, 1.33], [78.2, 1.27], [88.1, 1.12], [93.8, 1.03]] },
      { re: [100, 500], points: [[101, 1.08], [104, 1.05], [108, 1.02], [109, 1.03], [124, 0.994], [130, 0.927], [138, 0.907], [163, 0.879], [168, 0.799], [170, 0.819], [186, 0.799], [186, 0.841], [189, 0.778], [190, 0.751], [191, 0.799], [193, 0.732], [229, 0.711], [229, 0.71], [240, 0.7], [258, 0.721], [280, 0.674], [284, 0.646], [286, 0.675], [311, 0.592], [312, 0.607], [318, 0.656], [358, 0.627], [361, 0.6], [364, 0.632], [379, 0.595], [409, 0.579], [444, 0.585], [468, 0.578], [472, 0.566], [480, 0.572]] },
      { re: [500, 1000], points: [[500, 0.547], [522, 0.544], [532, 0.543], [532, 0.556], [557, 0.552], [579, 0.523], [588, 0.52], [603, 0.531], [644, 0.525], [713, 0.505], [727, 0.48], [833, 0.485], [932, 0.472], [984, 0.466], [985, 0.477], [985, 0.485]] },
      { re: [1000, 2000], points: [[1000, 0.472], [1000, 0.483], [1070, 0.452], [1330, 0.436], [1650, 0.44], [1690, 0.435], [1950, 0.427], [2000, 0.43]] },
      { re: [5e4, 1.2e5], points: [[52400, 0.503], [53500, 0.497], [57500, 0.48], [57700, 0.492], [71900, 0.451], [89000, 0.502], [100000, 0.467], [118300, 0.476]] },
    ];
    for (const band of bands) {
      const logRatio = band.points.reduce((s, [re, cd]) => s + Math.log(standardSphereDragCoefficient(re) / cd), 0) / band.points.length;
      expect(Math.abs(Math.expm1(logRatio))).toBeLessThan(0.05);
    }
    // Between 2e3 and 5e4 their tunnel reads 8–11 % above the reproduced curve of the previous test (and this
    // one): the spread between measured curves there is what the stated 5 % standard uncertainty stands for.
    expect(STANDARD_SPHERE_DRAG_RELATIVE_UNCERTAINTY).toBe(0.05);
    expect(STANDARD_SPHERE_DRAG_VALID_MAX_REYNOLDS).toBe(2e5);
  });

  it('follows Oseen and Proudman–Pearson in creeping flow (Re 0.001–0.01) within 0.05 %, joining its next piece there', () => {
    // C_d = 24/Re·(1 + 3Re/16 + (9/160)·Re²·ln(Re/2)) (Proudman & Pearson 1957, from memory), as above.
    for (const re of [0.001, 0.003, 0.01]) {
      const theory = (24 / re) * (1 + (3 * re) / 16 + (9 / 160) * re * re * Math.log(re / 2));
      expect(Math.abs(relative(re, theory))).toBeLessThan(5e-4);
    }
    const below = standardSphereDragCoefficient(0.01 * (1 - 1e-9));
    const above = standardSphereDragCoefficient(0.01 * (1 + 1e-9));
    expect(Math.abs(above / below - 1)).toBeLessThan(5e-4);
  });

  it('is nearly continuous where its pieces meet (within 0.8 % below the drag crisis)', () => {
    for (const re of [0.01, 20, 260, 1500, 1.2e4, 4.4e4, 3.38e5]) {
      const below = standardSphereDragCoefficient(re * (1 - 1e-9));
      const above = standardSphereDragCoefficient(re * (1 + 1e-9));
      expect(Math.abs(above / below - 1)).toBeLessThan(0.008);
    }
  });

  it('fixes the 15–17 % shortfall of the older correlation at Re 1e5–2e5', () => {
    // The Morrison correlation (sphereDragCoefficient.ts) lies 15–17 % below this curve there.
    for (const re of [1e5, 1.5e5, 2e5]) {
      expect(morrisonSphereDragCoefficient(re) / standardSphereDragCoefficient(re)).toBeLessThan(0.87);
    }
  });
});

describe('sphere predictions in an analysis', () => {
  const ball: SpecimenInput = { shape: 'sphere', mass_kg: 0.21, diameter_m: 0.095 };
  const request = (specimen: SpecimenInput, cd: number, heights: number[]): AnalysisRequest => {
    const times = exactTimes({ site: SITE, air: AIR, specimen }, cd, heights);
    return {
      site: SITE,
      air: AIR,
      specimen,
      drops: heights.map((h, i) => ({ height_m: h, time_s: times[i]! })),
      timing: { standard_uncertainty_s: 0.004 },
      uncertainty: UNCERTAINTY,
      options: { monte_carlo_draws: 1000 },
    };
  };

  it('carry the curve’s 5 % uncertainty to the predicted time', () => {
    const result = analyzeSeries(request(ball, 0.47, [12, 12]));
    const drop = result.drops[0]!;
    const predicted = result.prediction.heights![0]!;
    expect(result.prediction.drag_coefficient_relative_standard_uncertainty).toBe(0.05);
    expect([predicted.height_m, predicted.time_s]).toEqual([12, drop.predicted_time_s]);
    // Independent check: the same fall integrated with the curve scaled by 1 ± 5 %.
    const body = {
      effective_gravity_m_s2: result.model.effective_gravity_m_s2,
      drag_constant_per_unit_cd_per_m: (result.air.density_kg_m3 * result.model.area_m2) / (2 * result.model.effective_mass_kg),
      reynolds_per_speed_s_m: (result.air.density_kg_m3 * 0.095) / result.air.dynamic_viscosity_Pa_s,
    };
    const up = fallWithVariableDrag(12, { ...body, dragCoefficient: (re) => 1.05 * standardSphereDragCoefficient(re) }).time_s;
    const down = fallWithVariableDrag(12, { ...body, dragCoefficient: (re) => 0.95 * standardSphereDragCoefficient(re) }).time_s;
    // (The prediction goes through the air along the fall; uniform air at the reading differs by about 1e-5 of the time.)
    expect(Math.abs(predicted.time_standard_uncertainty_s / ((up - down) / 2) - 1)).toBeLessThan(2e-3);
    // About 1.5 ms on a 1.6 s fall: 5 % of C_d moves a 12 m ball drop by a few thousandths of its time.
    expect(predicted.time_standard_uncertainty_s).toBeGreaterThan(0.001);
    expect(up).toBeGreaterThan(predicted.time_s);
  });

  it('warn of the drag crisis only for a sphere, not for a box or a disc at the same Reynolds number', () => {
    // A 250 mm, 2 kg ball from 30 m reaches about 22 m/s: Re ≈ 3.5e5 (as in the analysis tests).
    const big: SpecimenInput = { shape: 'sphere', mass_kg: 2, diameter_m: 0.25 };
    const sphere = analyzeSeries(request(big, 0.3, [30, 30, 30]));
    expect(sphere.drops[0]!.reynolds_number).toBeGreaterThan(2e5);
    expect(sphere.warnings.map((w) => w.code)).toContain('near-drag-crisis');
    const box: SpecimenInput = { shape: 'box', mass_kg: 3, length_m: 0.25, width_m: 0.25, thickness_m: 0.05 };
    const shapeFree = { height_m: 0.01, mass_kg: 0.0005, temperature_C: 0.3, pressure_Pa: 30, relative_humidity_pct: 3 };
    const boxResult = analyzeSeries({ ...request(box, 1.05, [30, 30, 30]), uncertainty: shapeFree });
    expect(boxResult.drops[0]!.reynolds_number).toBeGreaterThan(2e5);
    expect(boxResult.warnings.map((w) => w.code)).not.toContain('near-drag-crisis');
    const disc: SpecimenInput = { shape: 'disc', mass_kg: 3, diameter_m: 0.25, thickness_m: 0.02 };
    const discResult = analyzeSeries({ ...request(disc, 1.17, [30, 30, 30]), uncertainty: shapeFree });
    expect(discResult.drops[0]!.reynolds_number).toBeGreaterThan(2e5);
    expect(discResult.warnings.map((w) => w.code)).not.toContain('near-drag-crisis');
  });
});
