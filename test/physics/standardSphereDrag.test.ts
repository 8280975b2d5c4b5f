import { describe, expect, it } from 'vitest';
import { analyzeSeries } from '../../src/physics/analyzeSeries';
import type { AnalysisRequest, SpecimenInput } from '../../src/physics/index';
import { fallWithVariableDrag } from '../../src/physics/fallWithVariableDrag';
import { morrisonSphereDragCoefficient } from '../../src/physics/sphereDragCoefficient';
import {
  STANDARD_SPHERE_DRAG_RELATIVE_UNCERTAINTY,
  STANDARD_SPHERE_DRAG_VALID_MAX_REYNOLDS,
  standardSphereDragCoefficient,
  standardSphereDragRelativeUncertainty,
} from '../../src/physics/standardSphereDrag';
import { AIR, exactTimes, SITE, UNCERTAINTY } from './syntheticSeries';
import { nominalAirColumn } from '../../src/physics/predictedFall';
import { prepareSetup } from '../../src/physics/seriesSetup';
import { sphereColumnFallTime } from './sphereColumnFall';

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

/** Roos & Willmarth (AIAA J. 9, 285 (1971)): every sphere point as reproduced in the sheardata repository (data/E1971001/spheres.csv). */
const ROOS_WILLMARTH: [number, number][] = [
  [5.33, 7.06], [5.99, 6.41], [11, 4.01], [13.1, 3.76], [13.2, 3.66], [13.9, 3.59], [14.6, 3.41], [16.2, 3.29], [21.1, 2.82], [23.4, 2.48],
  [29.1, 2.28], [45, 1.79], [50.6, 1.58], [54.4, 1.52], [68.9, 1.35], [68.9, 1.33], [78.2, 1.27], [88.1, 1.12], [93.8, 1.03], [101, 1.08],
  [104, 1.05], [108, 1.02], [109, 1.03], [124, 0.994], [130, 0.927], [138, 0.907], [163, 0.879], [168, 0.799], [170, 0.819], [186, 0.799],
  [186, 0.841], [189, 0.778], [190, 0.751], [191, 0.799], [193, 0.732], [229, 0.711], [229, 0.71], [240, 0.7], [258, 0.721], [280, 0.674],
  [284, 0.646], [286, 0.675], [311, 0.592], [312, 0.607], [318, 0.656], [358, 0.627], [361, 0.6], [364, 0.632], [379, 0.595], [409, 0.579],
  [444, 0.585], [468, 0.578], [472, 0.566], [480, 0.572], [500, 0.547], [522, 0.544], [532, 0.543], [532, 0.556], [557, 0.552], [579, 0.523],
  [588, 0.52], [603, 0.531], [644, 0.525], [713, 0.505], [727, 0.48], [833, 0.485], [932, 0.472], [984, 0.466], [985, 0.477], [985, 0.485],
  [1000, 0.472], [1000, 0.483], [1070, 0.452], [1330, 0.436], [1650, 0.44], [1690, 0.435], [1950, 0.427], [2000, 0.43], [5570, 0.46],
  [5990, 0.43], [6210, 0.39], [6250, 0.451], [6900, 0.46], [7280, 0.43], [7520, 0.435], [8230, 0.429], [8580, 0.39], [8700, 0.49],
  [9620, 0.49], [13300, 0.46], [13400, 0.48], [13900, 0.4], [14700, 0.46], [16800, 0.452], [18000, 0.51], [18700, 0.523], [19500, 0.5],
  [21200, 0.509], [23100, 0.511], [23600, 0.529], [23700, 0.455], [24100, 0.524], [24200, 0.52], [25000, 0.519], [28000, 0.495],
  [31900, 0.5], [32400, 0.479], [33800, 0.457], [35400, 0.482], [35500, 0.504], [38200, 0.513], [41800, 0.485], [45900, 0.467],
  [46800, 0.468], [52400, 0.503], [53500, 0.497], [57500, 0.48], [57700, 0.492], [71900, 0.451], [89000, 0.502], [100000, 0.467],
  [118300, 0.476],
];

/** Re from 0.1 to `high`, 1000 points a decade. */
const reynoldsGrid = (low: number, high: number): number[] => {
  const out: number[] = [];
  for (let w = Math.log10(low); w <= Math.log10(high) + 1e-12; w += 1e-3) out.push(10 ** w);
  return out;
};

describe('the standard sphere curve’s stated uncertainty', () => {
  const u = standardSphereDragRelativeUncertainty;

  it('is 5 % up to Re 1e5, 10 % at 2e5 and 50 % from 3e5 on', () => {
    for (const re of [1e-3, 0.1, 1, 100, 1e4, 1e5]) expect(u(re)).toBe(STANDARD_SPHERE_DRAG_RELATIVE_UNCERTAINTY);
    expect(u(2e5)).toBeCloseTo(0.1, 12);
    for (const re of [3e5, 4e5, 1e6, 1e7]) expect(u(re)).toBeCloseTo(0.5, 12);
    expect(u(1.5e5)).toBeGreaterThan(0.05);
    expect(u(1.5e5)).toBeLessThan(0.1);
    expect(u(2.5e5)).toBeGreaterThan(0.1);
    expect(u(2.5e5)).toBeLessThan(0.5);
  });

  it('grows without a step: continuous and never falling, its slope continuous too', () => {
    const grid = reynoldsGrid(1e4, 1e6);
    for (let i = 1; i < grid.length; i++) {
      const change = u(grid[i]!) - u(grid[i - 1]!);
      expect(change).toBeGreaterThanOrEqual(0);
      // The steepest part (0.4 over log10 1.5 = 0.176 decades, 1.5× the mean slope) moves at most 3.5e-3 per 1e-3 decade.
      expect(change).toBeLessThan(3.5e-3);
    }
    for (const re of [1e5, 2e5, 3e5]) {
      // At each join both neighbours' slopes vanish (smoothsteps): no kink.
      const slope = (u(re * (1 + 1e-6)) - u(re * (1 - 1e-6))) / 2e-6;
      expect(Math.abs(slope)).toBeLessThan(1e-4);
    }
  });

  it('holds Morsi & Alexander’s fit to the standard table within ±5 % for 0.1 ≤ Re ≤ 5e4', () => {
    // Morsi & Alexander, J. Fluid Mech. 55, 193 (1972), their eight pieces fitted to the standard curve's table,
    // as transcribed in the fluids library (CalebBell/fluids, fluids/drag.py, Morsi_Alexander, "original was
    // reviewed"). The largest difference, 4.7 %, is at Re ≈ 48.
    const morsiAlexander = (re: number): number => {
      if (re < 1) return 22.73 / re + 0.0903 / re ** 2 + 3.69;
      if (re < 10) return 29.1667 / re - 3.8889 / re ** 2 + 1.222;
      if (re < 100) return 46.5 / re - 116.67 / re ** 2 + 0.6167;
      if (re < 1000) return 98.33 / re - 2778 / re ** 2 + 0.3644;
      if (re < 5000) return 148.62 / re - 4.75e4 / re ** 2 + 0.357;
      if (re < 10000) return -490.546 / re + 57.87e4 / re ** 2 + 0.46;
      return -1662.5 / re + 5.4167e6 / re ** 2 + 0.5191;
    };
    for (const re of reynoldsGrid(0.1, 5e4)) expect(Math.abs(morsiAlexander(re) / standardSphereDragCoefficient(re) - 1)).toBeLessThanOrEqual(u(re));
  });

  it('puts correlations of compiled data within 1.5 u for 0.1 ≤ Re ≤ 2e5, and within u up to Re 7e4 but 2 % over', () => {
    // Brown & Lawler, J. Environ. Eng. 129, 222 (2003), fitted to 480 points corrected for wall effects, as used in
    // the fluidity repository's sphere test; Clift & Gauvin (1970) and Haider & Levenspiel, Powder Technol. 58, 63
    // (1989), as in the fluids library (fluids/drag.py). Each is stated for Re ≤ 2e5.
    const correlations: Record<string, (re: number) => number> = {
      brownLawler: (re) => (24 / re) * (1 + 0.15 * re ** 0.681) + 0.407 / (1 + 8710 / re),
      cliftGauvin: (re) => (24 / re) * (1 + 0.152 * re ** 0.677) + 0.417 / (1 + 5070 * re ** -0.94),
      haiderLevenspiel: (re) => (24 / re) * (1 + 0.1806 * re ** 0.6459) + 0.4251 / (1 + 6880.95 / re),
    };
    for (const correlation of Object.values(correlations)) {
      let worstLow = 0;
      let worstAll = 0;
      for (const re of reynoldsGrid(0.1, 2e5)) {
        const z = Math.abs(correlation(re) / standardSphereDragCoefficient(re) - 1) / u(re);
        worstAll = Math.max(worstAll, z);
        if (re <= 7e4) worstLow = Math.max(worstLow, z);
      }
      // Up to 7e4 their largest gap, 5.5 %, is at the curve's join at Re 20 or 1500; at 1e5 they lie 6–7 % below.
      expect(worstLow).toBeLessThan(1.1);
      expect(worstAll).toBeLessThan(1.5);
    }
  });

  it('holds Roos & Willmarth’s measured points about as a normal distribution of that width would', () => {
    // A normal distribution holds 68 % within ±1σ, 95 % within ±2σ and 99.7 % within ±3σ. Their 122 points: 65 % and
    // 85 % (their tunnel reads 9–12 % high at 5e3–5e4, so even 5 % is on the small side for them). Taken as a
    // rectangular half-width instead (5 %/√3 = 2.9 %), the stated uncertainty would hold 71 % within ±2 u and 82 %
    // within ±3 u: far too small.
    const within = (k: number, scale = 1) =>
      ROOS_WILLMARTH.filter(([re, cd]) => Math.abs(cd / standardSphereDragCoefficient(re) - 1) <= k * scale * u(re)).length / ROOS_WILLMARTH.length;
    expect(within(1)).toBeGreaterThan(0.6);
    expect(within(2)).toBeGreaterThan(0.8);
    expect(within(2, 1 / Math.sqrt(3))).toBeLessThan(0.75);
    expect(within(3, 1 / Math.sqrt(3))).toBeLessThan(0.85);
  });

  it('covers the sources at 1e5–2e5, where they differ by 8–12 %, within 1.5 u', () => {
    // Hoerner, Fluid-Dynamic Drag (1965), sphere chart as tabulated in the EMSSL repository's dragSphe.m: 0.5 from
    // Re 2e4 to 3.25e5; Roos & Willmarth at 1e5 and 1.18e5 (above); Brown & Lawler's correlation (above).
    const sources: [number, number][] = [
      [1e5, 0.5], [2e5, 0.5], [1e5, 0.467], [1.183e5, 0.476],
      [1.5e5, (24 / 1.5e5) * (1 + 0.15 * 1.5e5 ** 0.681) + 0.407 / (1 + 8710 / 1.5e5)],
      [2e5, (24 / 2e5) * (1 + 0.15 * 2e5 ** 0.681) + 0.407 / (1 + 8710 / 2e5)],
    ];
    for (const [re, cd] of sources) expect(Math.abs(cd / standardSphereDragCoefficient(re) - 1)).toBeLessThan(1.5 * u(re));
  });

  it('is large in the drag crisis: both the subcritical 0.5 and the crisis minimum lie within 1.5 u of the curve', () => {
    // Hoerner's chart (as above): 0.5 up to Re 3.25e5, 0.1 at 5e5. Achenbach, J. Fluid Mech. 54, 565 (1972): the
    // smallest C_d of a smooth sphere, 0.07, near Re 3.7e5 (from memory).
    const sources: [number, number][] = [[3.25e5, 0.5], [5e5, 0.1], [3.7e5, 0.07], [1e6, 0.1]];
    for (const [re, cd] of sources) expect(Math.abs(cd / standardSphereDragCoefficient(re) - 1)).toBeLessThan(1.5 * u(re));
    // A relative uncertainty cannot hold a crisis that comes late (C_d 0.5 where the curve has fallen to 0.09 at 4e5):
    // the near-drag-crisis warning says so.
    expect(0.5 / standardSphereDragCoefficient(4e5) - 1).toBeGreaterThan(3 * u(4e5));
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
    expect(predicted.drag_coefficient_relative_standard_uncertainty).toBe(0.05);
  });

  it('carry the curve’s larger uncertainty near the drag crisis, moved with the Reynolds number along the fall', () => {
    // A 250 mm, 2 kg ball from 8 m and 30 m: impact Re about 1.9e5 and 3.5e5.
    const big: SpecimenInput = { shape: 'sphere', mass_kg: 2, diameter_m: 0.25 };
    const req = request(big, 0.45, [8, 8, 30, 30]);
    const result = analyzeSeries(req);
    const column = nominalAirColumn(prepareSetup(req));
    const moved = (sign: number) => (re: number) => standardSphereDragCoefficient(re) * (1 + sign * standardSphereDragRelativeUncertainty(re));
    for (const predicted of result.prediction.heights!) {
      // Independent check: odex through the same air column with the curve moved by ±u(Re) (sphereColumnFall.ts).
      const up = sphereColumnFallTime(column, 2, 0.25, predicted.height_m, moved(1));
      const down = sphereColumnFallTime(column, 2, 0.25, predicted.height_m, moved(-1));
      expect(Math.abs(predicted.time_standard_uncertainty_s / ((up - down) / 2) - 1)).toBeLessThan(2e-3);
    }
    const [low, high] = result.prediction.heights!;
    expect(low!.drag_coefficient_relative_standard_uncertainty).toBeGreaterThan(0.05);
    expect(low!.drag_coefficient_relative_standard_uncertainty).toBeLessThanOrEqual(0.1);
    expect(high!.drag_coefficient_relative_standard_uncertainty).toBeGreaterThan(0.4);
    // The result's own figure is the largest; near 50 % of C_d a 30 m fall of this ball moves by about 20 ms, ten
    // times the 8 m fall's.
    expect(result.prediction.drag_coefficient_relative_standard_uncertainty).toBe(high!.drag_coefficient_relative_standard_uncertainty);
    expect(high!.time_standard_uncertainty_s).toBeGreaterThan(0.01);
    expect(high!.time_standard_uncertainty_s).toBeGreaterThan(5 * low!.time_standard_uncertainty_s);
    expect(result.warnings.map((w) => w.code)).toContain('outside-sphere-correlation-range');
  });

  it('warn of the drag crisis only for a sphere, not for a box, a disc or a custom shape at the same Reynolds number', () => {
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
    // A custom shape is not known to be smooth and round.
    const custom: SpecimenInput = { shape: 'custom', mass_kg: 2, area_m2: 0.049, volume_m3: 0.008 };
    const customResult = analyzeSeries({ ...request(custom, 0.3, [30, 30, 30]), uncertainty: shapeFree });
    expect(customResult.drops[0]!.reynolds_number).toBeGreaterThan(2e5);
    expect(customResult.warnings.map((w) => w.code)).not.toContain('near-drag-crisis');
  });
});
