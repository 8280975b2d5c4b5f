import { describe, expect, it } from 'vitest';
import { seriesCurves } from '../../src/analysis/series-curves';
import { analyzeSeries } from '../../src/physics/analyzeSeries';
import { scaledSphereFallTime } from '../../src/physics/dragLaw';
import { particleRequest } from '../physics/particleSeries';

/** A 1 mm bead, exact times of the standard curve scaled by 1.15 (invented scenario, test/physics/particleSeries.ts),
 *  analysed under the scaled law: the request, the result, its fitted factor and the body it was fitted on. */
function fittedBead() {
  const request = particleRequest({ scale: 1.15, heights: [0.3, 1, 3], drag_law: 'scaled_sphere' });
  const result = analyzeSeries(request);
  const rho = result.air.density_kg_m3;
  const body = {
    effective_gravity_m_s2: result.model.effective_gravity_m_s2,
    drag_constant_per_unit_cd_per_m: (rho * result.model.area_m2) / (2 * result.model.effective_mass_kg),
    reynolds_per_speed_s_m: (rho * result.model.characteristic_length_m) / result.air.dynamic_viscosity_Pa_s,
  };
  return { request, result, s: result.drag_law_details.scale_factor!, body };
}

describe('the series chart curves', () => {
  it('draw the fitted fall with the scaled sphere curve when the series was fitted with it', () => {
    const { request, result, s, body } = fittedBead();
    const { fitted } = seriesCurves(request, result);
    expect(fitted!.length).toBeGreaterThan(10);
    for (const [t, h] of fitted!.slice(1)) expect(Math.abs(t / scaledSphereFallTime(h, body, s) - 1)).toBeLessThan(1e-6);
    // A constant C_d at the reported (terminal) value would draw a different fall: the bead's drag is higher early on.
    const constantCurve = seriesCurves(request, { ...result, drag_law: 'constant' }).fitted!;
    const atEnd = constantCurve[constantCurve.length - 1]!;
    expect(Math.abs(atEnd[1] / 3.15 - 1)).toBeGreaterThan(0.01);
  });

  it('draw the curve with straight pieces that stay within 0.5 % of its height everywhere, the release included', () => {
    // Between two points the chart draws a straight line: at each piece's middle time, the true height (found by
    // bisection on the fall time) and the line's must agree.
    const { request, result, s, body } = fittedBead();
    const heightAt = (t: number) => {
      let lo = 0;
      let hi = 4;
      for (let i = 0; i < 80; i++) {
        const mid = (lo + hi) / 2;
        if (scaledSphereFallTime(mid, body, s) < t) lo = mid;
        else hi = mid;
      }
      return lo;
    };
    const fitted = seriesCurves(request, result).fitted!;
    const top = fitted[fitted.length - 1]![1];
    for (let i = 1; i < fitted.length; i++) {
      const [[t0, h0], [t1, h1]] = [fitted[i - 1]!, fitted[i]!];
      expect(Math.abs((h0 + h1) / 2 - heightAt((t0 + t1) / 2)) / top, `piece ${i}`).toBeLessThan(0.005);
    }
  });
});
