import { describe, expect, it } from 'vitest';
import { analyzeSeries } from '../../src/physics/analyzeSeries';
import type { AnalysisRequest } from '../../src/physics/analysisTypes';
import { chooseDragLaw, fitSphereScale, scaledSphereFallTime, scaledSphereTerminalVelocity } from '../../src/physics/dragLaw';
import { fallWithVariableDrag } from '../../src/physics/fallWithVariableDrag';
import { STANDARD_SPHERE_DRAG_PIECE_LIMITS, standardSphereDragCoefficient } from '../../src/physics/standardSphereDrag';
import { odexSolver } from './odexSolver';
import { particleBody, particleRequest, PARTICLE } from './particleSeries';

describe('the scaled standard sphere curve', () => {
  it('integrates the same fall as odex, a general-purpose integrator, to 1e-9', () => {
    // The 1 mm glass bead from 1 m: Re runs from 0 through the Stokes range to several hundred.
    const body = particleBody();
    const s = 1.15;
    const t = scaledSphereFallTime(1, body, s);
    const drag = (v: number) => (v > 0 ? body.drag_constant_per_unit_cd_per_m * s * standardSphereDragCoefficient(body.reynolds_per_speed_s_m * v) * v * v : 0);
    const reference = odexSolver(2, 1e-12).solve((_t, [, v]) => [v!, body.effective_gravity_m_s2 - drag(v!)], 0, [0, 0], t);
    expect(Math.abs(reference.y[0]! - 1)).toBeLessThan(1e-9);
    // And our adaptive Dormand–Prince, for a near-settling fall of a light bead too (10 m, v close to v_T).
    for (const [h, scale] of [[1, 1.15], [10, 1], [0.2, 0.7]] as const) {
      const own = fallWithVariableDrag(h, { ...body, dragCoefficient: (re) => scale * standardSphereDragCoefficient(re) }, 1e-12).time_s;
      expect(Math.abs(scaledSphereFallTime(h, body, scale) / own - 1)).toBeLessThan(1e-9);
    }
    const light = { ...body, drag_constant_per_unit_cd_per_m: 30 * body.drag_constant_per_unit_cd_per_m };
    const own = fallWithVariableDrag(5, { ...light, dragCoefficient: standardSphereDragCoefficient }, 1e-12).time_s;
    expect(Math.abs(scaledSphereFallTime(5, light, 1) / own - 1)).toBeLessThan(1e-9);
    // A fall long past settling (a 30 µm bead settles within millimetres): the time is the settling speed's, plus
    // the lag of the start, to the same 1e-9.
    const dust = { ...body, drag_constant_per_unit_cd_per_m: 33 * body.drag_constant_per_unit_cd_per_m, reynolds_per_speed_s_m: 0.03 * body.reynolds_per_speed_s_m };
    const settling = fallWithVariableDrag(2, { ...dust, dragCoefficient: standardSphereDragCoefficient }, 1e-12).time_s;
    expect(Math.abs(scaledSphereFallTime(2, dust, 1) / settling - 1)).toBeLessThan(1e-9);
  });

  it('knows every Reynolds number where the curve changes piece (the fall is integrated piece by piece)', () => {
    // Between the listed limits the curve is smooth: on a grid of 2e-4 in ln Re its second difference in ln C_d stays
    // below 1e-5 (curvature alone gives about 1e-7; in the drag crisis, 3.38e5–4e5, where C_d = 29.78 − 5.3·log10 Re
    // falls to 0.09, about 3e-5, so 1e-4 there); a jump or kink anywhere else (a piece the list misses) shows as
    // 1e-4 or more, as each listed limit does (checked too, so the check can fail), but the first: at Re 0.01 the
    // Oseen piece meets the next one smoothly (standardSphereDrag.test.ts), listed all the same.
    const step = 2e-4;
    const lnC = (x: number) => Math.log(standardSphereDragCoefficient(Math.exp(x)));
    const limits = STANDARD_SPHERE_DRAG_PIECE_LIMITS.map(Math.log);
    const crisis = (x: number) => x > Math.log(3.38e5) && x < Math.log(4e5);
    let worst = 0;
    for (let x = Math.log(1e-3); x < Math.log(1e7); x += step) {
      if (limits.some((l) => Math.abs(l - x) < 2 * step)) continue;
      worst = Math.max(worst, Math.abs(lnC(x + step) - 2 * lnC(x) + lnC(x - step)) / (crisis(x) ? 10 : 1));
    }
    expect(worst).toBeLessThan(1e-5);
    for (const l of limits.slice(1)) {
      // The second differences over a grid that straddles the limit: a jump or a kink there shows in them.
      const [a, b, c, d] = [l - 1.5 * step, l - 0.5 * step, l + 0.5 * step, l + 1.5 * step].map(lnC) as [number, number, number, number];
      const across = Math.max(Math.abs(a - 2 * b + c), Math.abs(b - 2 * c + d));
      expect(across, `Re ${Math.exp(l).toPrecision(3)}`).toBeGreaterThan(1e-5);
    }
  });

  it('fits the factor, and a timing offset beside it, back out of exact times', () => {
    const body = particleBody();
    const heights = [0.5, 1, 2, 3];
    const times = heights.map((h) => scaledSphereFallTime(h, body, 1.3));
    const fit = fitSphereScale(body, heights, times, [3, 3, 3, 3], false, 1);
    expect(fit.converged).toBe(true);
    expect(fit.scale).toBeCloseTo(1.3, 8);
    const late = times.map((t) => t + 0.012);
    const withOffset = fitSphereScale(body, heights, late, [3, 3, 3, 3], true, 1);
    expect(withOffset.scale).toBeCloseTo(1.3, 6);
    expect(withOffset.offset_s).toBeCloseTo(0.012, 8);
  });

  it('settles at the Stokes speed for a 10 µm bead (Stokes 1851: v = (ρ_p − ρ)·g·d²/(18μ))', () => {
    const d = 10e-6;
    const rhoP = 2500;
    const rho = 1.2;
    const mu = 1.81e-5;
    const g = 9.81;
    const m = (rhoP * Math.PI * d ** 3) / 6;
    const V = (Math.PI * d ** 3) / 6;
    // Terminal speed does not depend on added mass (no acceleration): g_e·m_e = (m − ρV)·g.
    const mEff = m + 0.5 * rho * V;
    const body = { effective_gravity_m_s2: (g * (m - rho * V)) / mEff, drag_constant_per_unit_cd_per_m: (rho * Math.PI * d * d) / 4 / (2 * mEff), reynolds_per_speed_s_m: (rho * d) / mu };
    const stokes = ((rhoP - rho) * g * d * d) / (18 * mu);
    // At Re ≈ 0.005 the curve's Oseen term (3/16 beside 24/Re) adds Re/128 ≈ 4e-5 to the drag.
    expect(Math.abs(scaledSphereTerminalVelocity(body, 1) / stokes - 1)).toBeLessThan(1e-3);
    // And a long fall approaches it.
    const fall = fallWithVariableDrag(0.5, { ...body, dragCoefficient: standardSphereDragCoefficient });
    expect(Math.abs(fall.impact_speed_m_s / scaledSphereTerminalVelocity(body, 1) - 1)).toBeLessThan(1e-6);
  });

  it('chooses the law by the rule: the curve\'s change across the Reynolds range against the series\' uncertainty', () => {
    // Standard curve (standardSphereDrag.ts): C_d(250) = 0.80, C_d(500) = 0.56: a 43 % change.
    expect(chooseDragLaw('auto', 'sphere', [500], 0.03).law).toBe('scaled_sphere');
    // Re 4e4 to 8e4 (0.464 to 0.496 on the curve): Newton's regime, where the curve's shape is within the spread of
    // measured curves; a ball keeps a constant C_d even in a 2 % series.
    expect(chooseDragLaw('auto', 'sphere', [8e4], 0.02).law).toBe('constant');
    expect(chooseDragLaw('auto', 'sphere', [8e4], 0.02).sphere_curve_change).toBe(0);
    // Impacts at Re 1000 and 8000: the range 500–8000 counts up to 2000 only (C_d 0.555 to 0.421, 32 %).
    expect(chooseDragLaw('auto', 'sphere', [1000, 8000], 0.02).sphere_curve_change).toBeCloseTo(0.5549 / 0.4211 - 1, 3);
    // Re 250 to 500 against a series known to only 50 %: the series cannot tell.
    expect(chooseDragLaw('auto', 'sphere', [500], 0.5).law).toBe('constant');
    expect(chooseDragLaw('auto', 'box', [500], 0.03).law).toBe('constant');
    expect(chooseDragLaw('constant', 'sphere', [500], 0.03).law).toBe('constant');
  });
});

describe('a series analysed with speed-dependent drag', () => {
  it('reports for a 1 mm bead C_d at the terminal Reynolds number, at impact, the factor and the settling speed', () => {
    const result = analyzeSeries(particleRequest({ scale: 1, heights: [1, 1, 1, 1, 1] }));
    expect(result.drag_law).toBe('scaled_sphere');
    const d = result.drag_law_details;
    expect(d.scale_factor).toBeCloseTo(1, 6);
    const body = particleBody();
    const vT = scaledSphereTerminalVelocity(body, 1);
    expect(result.terminal_velocity_m_s).toBeCloseTo(vT, 6);
    expect(result.drag_coefficient).toBeCloseTo(standardSphereDragCoefficient(body.reynolds_per_speed_s_m * vT), 6);
    expect(d.terminal_reynolds_number).toBeCloseTo(body.reynolds_per_speed_s_m * vT, 4);
    // The constant C_d of the same times lies above both: it stands for the slower, draggier part of the fall.
    expect(d.constant_drag_coefficient).toBeGreaterThan(1.05 * d.drag_coefficient_at_max_impact!);
    expect(d.drag_coefficient_at_max_impact!).toBeGreaterThan(d.drag_coefficient_at_terminal!);
    const [low, high] = result.drag_coefficient_interval_95;
    expect(low).toBeLessThan(result.drag_coefficient!);
    expect(high).toBeGreaterThan(result.drag_coefficient!);
    expect(d.reynolds_range[1]).toBeGreaterThan(d.reynolds_range[0]);
  });

  it('uses a constant C_d when asked to', () => {
    const result = analyzeSeries(particleRequest({ scale: 1, heights: [1, 1, 1, 1, 1], drag_law: 'constant' }));
    expect(result.drag_law).toBe('constant');
    expect(result.drag_law_details.requested).toBe('constant');
    expect(result.drag_law_details.scale_factor).toBeNull();
  });

  it('warns when the chosen law does not fit the heights, and not when it does', () => {
    const heights = [0.3, 0.3, 0.3, 1, 1, 1, 3, 3, 3];
    const constant = analyzeSeries(particleRequest({ scale: 1, heights, drag_law: 'constant' }));
    expect(constant.warnings.map((w) => w.code)).toContain('drag-law-misfit');
    expect(Math.abs(constant.drag_law_details.trend_z!)).toBeGreaterThan(2);
    const scaled = analyzeSeries(particleRequest({ scale: 1, heights }));
    expect(scaled.drag_law).toBe('scaled_sphere');
    expect(scaled.warnings.map((w) => w.code)).not.toContain('drag-law-misfit');
    expect(Math.abs(scaled.drag_law_details.trend_z!)).toBeLessThan(1e-3);
  });

  it('refuses an unknown drag law, naming the field and the choices', () => {
    const request = particleRequest({ scale: 1, heights: [1, 1, 1] });
    const hostile = { ...request, options: { ...request.options, drag_law: 'quadratic' } } as unknown as AnalysisRequest;
    expect(() => analyzeSeries(hostile)).toThrow(/options\.drag_law/);
  });

  it('names the bead it uses', () => {
    expect(PARTICLE.diameter_m).toBe(0.001);
  });
});

describe('a series under the scaled sphere curve takes its fit, times and budget from that law', () => {
  // A 1 mm bead from three heights, exact times of the curve scaled by 1.15 (invented scenario, particleSeries.ts).
  const heights = [0.3, 0.3, 1, 1, 3, 3];
  const scaled = analyzeSeries(particleRequest({ scale: 1.15, heights, drag_law: 'scaled_sphere' }));
  const constant = analyzeSeries(particleRequest({ scale: 1.15, heights, drag_law: 'constant' }));

  it('gives each drop the fitted time of the scaled law, as odex integrates its equation of motion', () => {
    expect(scaled.drag_law).toBe('scaled_sphere');
    const s = scaled.drag_law_details.scale_factor!;
    expect(s).toBeCloseTo(1.15, 5);
    const rho = scaled.air.density_kg_m3;
    const g = scaled.model.effective_gravity_m_s2;
    const c = (rho * scaled.model.area_m2) / (2 * scaled.model.effective_mass_kg);
    const rps = (rho * scaled.model.characteristic_length_m) / scaled.air.dynamic_viscosity_Pa_s;
    // Reference: odex driving dv/dt = g_e − (ρA/2m_e)·s·C_d,std(ρLv/μ)·v² to the fitted time; the distance it
    // reaches must be the drop's height.
    const solver = odexSolver(2, 1e-12);
    const rhs = (_t: number, [, v]: number[]): number[] => [v!, v! > 0 ? g - c * s * standardSphereDragCoefficient(rps * v!) * v! * v! : g];
    for (const drop of scaled.drops) {
      const reached = solver.solve(rhs, 0, [0, 0], drop.fitted_time_s).y[0]!;
      expect(Math.abs(reached / drop.height_m - 1)).toBeLessThan(1e-6);
      expect(drop.residual_s).toBe(drop.time_s - drop.fitted_time_s);
      // Exact times of this law: the scaled law leaves no residual, the constant one does.
      expect(Math.abs(drop.residual_s)).toBeLessThan(1e-6 * drop.time_s);
    }
    const constantWorst = Math.max(...constant.drops.map((d) => Math.abs(d.residual_s) / d.time_s));
    expect(constantWorst).toBeGreaterThan(1e-4);
  });

  it('states its budget, its GUM interval and its impact speeds in the scaled law', () => {
    const rows = Math.sqrt(scaled.budget.reduce((sum, row) => sum + row.contribution ** 2, 0));
    expect(rows / scaled.drag_coefficient_standard_uncertainty - 1).toBeCloseTo(0, 9);
    expect(scaled.gum.combined_standard_uncertainty / scaled.drag_coefficient_standard_uncertainty - 1).toBeCloseTo(0, 12);
    const [low, high] = scaled.gum.interval_95;
    expect((low + high) / 2 / scaled.drag_coefficient! - 1).toBeCloseTo(0, 12);
    // The constant law's budget is a different one: its u_c belongs to the constant C_d.
    expect(Math.abs(constant.gum.combined_standard_uncertainty / scaled.gum.combined_standard_uncertainty - 1)).toBeGreaterThan(0.01);
    // Impact speed: the scaled curve's fall (fallWithVariableDrag, itself checked against odex above).
    const body = { effective_gravity_m_s2: scaled.model.effective_gravity_m_s2, drag_constant_per_unit_cd_per_m: (scaled.air.density_kg_m3 * scaled.model.area_m2) / (2 * scaled.model.effective_mass_kg), reynolds_per_speed_s_m: (scaled.air.density_kg_m3 * 0.001) / scaled.air.dynamic_viscosity_Pa_s };
    const s = scaled.drag_law_details.scale_factor!;
    const v = fallWithVariableDrag(3, { ...body, dragCoefficient: (re) => s * standardSphereDragCoefficient(re) }).impact_speed_m_s;
    expect(scaled.drops[5]!.impact_speed_m_s / v - 1).toBeCloseTo(0, 6);
  });
});
