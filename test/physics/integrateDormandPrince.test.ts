import { describe, expect, it } from 'vitest';
import { integrateDormandPrince } from '../../src/physics/integrateDormandPrince';
import { odexSolver } from './odexSolver';

describe('integrateDormandPrince', () => {
  it('integrates y′ = y to e at t = 1 within the tolerance asked for', () => {
    const result = integrateDormandPrince((_t, y, dy) => (dy[0] = y[0]!), 0, [1], 1, { relativeTolerance: 1e-11, absoluteTolerance: 1e-14 });
    expect(Math.abs(result.y[0]! / Math.E - 1)).toBeLessThan(1e-10);
    expect(result.eventFound).toBe(false);
    expect(result.t).toBe(1);
  });

  it('keeps a harmonic oscillator on its exact solution over ten periods', () => {
    const result = integrateDormandPrince(
      (_t, y, dy) => {
        dy[0] = y[1]!;
        dy[1] = -y[0]!;
      },
      0,
      [1, 0],
      20 * Math.PI,
      { relativeTolerance: 1e-12, absoluteTolerance: 1e-14 },
    );
    expect(result.y[0]).toBeCloseTo(1, 9);
    expect(result.y[1]).toBeCloseTo(0, 9);
  });

  it('shows fifth-order convergence: a 32 times tighter tolerance costs about 2 times the steps', () => {
    const run = (tol: number): number =>
      integrateDormandPrince((t, y, dy) => (dy[0] = Math.cos(t) * y[0]!), 0, [1], 10, { relativeTolerance: tol, absoluteTolerance: tol }).acceptedSteps;
    // Error per step ∝ h⁵ ⇒ steps ∝ tol^(−1/5): 32^(1/5) = 2.
    const ratio = run(1e-10 / 32) / run(1e-10);
    expect(ratio).toBeGreaterThan(1.6);
    expect(ratio).toBeLessThan(2.5);
  });

  it('agrees with odex on a nonlinear problem (the Van der Pol oscillator, μ = 1)', () => {
    const mu = 1;
    const ours = integrateDormandPrince(
      (_t, y, dy) => {
        dy[0] = y[1]!;
        dy[1] = mu * (1 - y[0]! * y[0]!) * y[1]! - y[0]!;
      },
      0,
      [2, 0],
      10,
      { relativeTolerance: 1e-12, absoluteTolerance: 1e-13 },
    );
    const reference = odexSolver(2, 1e-13).solve((_t, [u, v]) => [v!, mu * (1 - u! * u!) * v! - u!], 0, [2, 0], 10);
    expect(ours.y[0]).toBeCloseTo(reference.y[0]!, 9);
    expect(ours.y[1]).toBeCloseTo(reference.y[1]!, 9);
  });

  it('stops at an event: a ball thrown up at 10 m/s lands again at t = 2·10/g', () => {
    const g = 9.81;
    const result = integrateDormandPrince(
      (_t, y, dy) => {
        dy[0] = y[1]!;
        dy[1] = -g;
      },
      0,
      [0, 10],
      10,
      { relativeTolerance: 1e-12, absoluteTolerance: 1e-14 },
      // Negative while in the air after the start, crossing zero on landing.
      (t, y) => (t > 1e-9 ? -y[0]! : -1),
    );
    expect(result.eventFound).toBe(true);
    expect(result.t).toBeCloseTo(20 / g, 12);
    expect(result.y[1]).toBeCloseTo(-10, 10);
  });

  it('refuses an empty interval', () => {
    expect(() => integrateDormandPrince((_t, _y, dy) => (dy[0] = 0), 1, [0], 1)).toThrow(RangeError);
  });
});
