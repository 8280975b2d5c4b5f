import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  distanceToTerminalFraction,
  fallDistance,
  fallParameters,
  fallSpeedAtHeight,
  fallSpeedAtTime,
  fallTime,
  fallTimeDragDerivative,
  fallTimeFactor,
  fallTimeFactorDerivative,
  logCosh,
  terminalVelocity,
  timeBetweenHeights,
  type FallParameters,
} from '../../src/physics/fallModel';
import { PhysicsInputError } from '../../src/physics/physicsInputError';
import { odexSolver } from './odexSolver';

const params = (g: number, k: number): FallParameters => ({ effective_gravity_m_s2: g, drag_constant_per_m: k, effective_mass_kg: 1 });

/** Integrate dy/dt = v, dv/dt = g − s·k·v² with odex (s = −1 reverses the drag). */
function odexFall(g: number, k: number, tEnd: number, sign = 1): { y: number; v: number } {
  const solver = odexSolver(2, 1e-14);
  const result = solver.solve((_t, [, v]) => [v!, g - sign * k * v! * v!], 0, [0, 0], tEnd);
  return { y: result.y[0]!, v: result.y[1]! };
}

// Drag constants from 1e-7 to 1 per metre and heights from 0.3 to 300 m, log-uniform, cover
// a steel ball dropped a metre (k·h ≈ 1e-5) up to a paper cone falling at terminal speed (k·h ≈ 100).
const fallCase = fc.record({
  g: fc.double({ min: 9.6, max: 9.9, noNaN: true }),
  logK: fc.double({ min: -7, max: 0, noNaN: true }),
  logH: fc.double({ min: Math.log10(0.3), max: Math.log10(300), noNaN: true }),
});

describe('fallModel closed forms', () => {
  it('agree with the odex integrator to 1e-9 relative over a wide range of specimens', () => {
    // odex: Hairer & Wanner's GBS extrapolation code, an independent general-purpose integrator.
    fc.assert(
      fc.property(fallCase, ({ g, logK, logH }) => {
        const k = 10 ** logK;
        const h = 10 ** logH;
        const p = params(g, k);
        const t = fallTime(h, p);
        const reference = odexFall(g, k, t);
        expect(Math.abs(reference.y / h - 1)).toBeLessThan(1e-9);
        expect(Math.abs(reference.v / fallSpeedAtHeight(h, p) - 1)).toBeLessThan(1e-9);
        // And at a time of odex's choosing: the distance and speed closed forms.
        const half = 0.5 * t;
        const mid = odexFall(g, k, half);
        expect(Math.abs(fallDistance(half, p) / mid.y - 1)).toBeLessThan(1e-9);
        expect(Math.abs(fallSpeedAtTime(half, p) / mid.v - 1)).toBeLessThan(1e-9);
      }),
      { numRuns: 60, seed: 4242 },
    );
  }, 60_000);

  it('tend to the vacuum results as C_d → 0, without cancellation', () => {
    const g = 9.80665;
    const h = 10;
    const vacuum = Math.sqrt((2 * h) / g);
    for (const k of [1e-300, 1e-20, 1e-12, 1e-9, 1e-7]) {
      const p = params(g, k);
      const x = k * h;
      // Series t = √(2h/g)·(1 + x/6 + x²/120 + …), exact to far below 1e-16 for these x.
      expect(fallTime(h, p) / (vacuum * (1 + x / 6 + (x * x) / 120)) - 1).toBeCloseTo(0, 15);
      // v(h)/√(2gh) = √(R(2x)), R(y) = 1 − y/2 + y²/6 − y³/24 …; y(t0)/h = 1 − x/3 + 8x²/45 …
      const y2 = 2 * x;
      expect(fallSpeedAtHeight(h, p) / (Math.sqrt(2 * g * h) * Math.sqrt(1 - y2 / 2 + (y2 * y2) / 6 - y2 ** 3 / 24)) - 1).toBeCloseTo(0, 15);
      expect(fallDistance(vacuum, p) / (h * (1 - x / 3 + (8 * x * x) / 45)) - 1).toBeCloseTo(0, 15);
    }
    expect(fallTime(h, params(g, 0))).toBe(vacuum);
    // The textbook form τ·arccosh(e^{kh}) loses about half the digits at k = 1e-9, where ours does not.
    const k = 1e-9;
    const naive = (1 / Math.sqrt(g * k)) * Math.acosh(Math.exp(k * h));
    const exact = vacuum * (1 + (k * h) / 6);
    expect(Math.abs(naive / exact - 1)).toBeGreaterThan(1e-10);
    expect(Math.abs(fallTime(h, params(g, k)) / exact - 1)).toBeLessThan(1e-15);
  });

  it('handle very long falls without overflowing cosh or exp', () => {
    const g = 9.81;
    const k = 2; // v_t ≈ 2.2 m/s
    const h = 1e6; // k·h = 2e6, e^{kh} would overflow
    const p = params(g, k);
    expect(Math.cosh(k * h)).toBe(Infinity);
    // Asymptotically arccosh(e^x) = x + ln 2 − e^{−2x}/4 …: t = (kh + ln 2)/√(gk) exactly here.
    expect(fallTime(h, p) / ((k * h + Math.LN2) / Math.sqrt(g * k)) - 1).toBeCloseTo(0, 14);
    expect(fallSpeedAtHeight(h, p)).toBeCloseTo(terminalVelocity(p), 12);
    const t = 1e5;
    const s = t * Math.sqrt(g * k);
    expect(fallDistance(t, p) / ((s - Math.LN2) / k) - 1).toBeCloseTo(0, 14);
    expect(fallSpeedAtTime(t, p)).toBe(terminalVelocity(p));
  });

  it('invert each other: distance after the fall time is the height, speeds agree', () => {
    fc.assert(
      fc.property(fallCase, ({ g, logK, logH }) => {
        const p = params(g, 10 ** logK);
        const h = 10 ** logH;
        const t = fallTime(h, p);
        expect(Math.abs(fallDistance(t, p) / h - 1)).toBeLessThan(1e-12);
        expect(Math.abs(fallSpeedAtTime(t, p) / fallSpeedAtHeight(h, p) - 1)).toBeLessThan(1e-12);
      }),
      { numRuns: 200, seed: 7 },
    );
  });

  it('with buoyancy and added mass switched off reproduce the textbook closed form exactly', () => {
    // Textbook quadratic drag from rest: k = ρC_dA/(2m), v_t = √(g/k), τ = v_t/g,
    // t(h) = τ·arccosh(e^{kh}), v(h) = v_t·√(1 − e^{−2kh}), y(t) = ln(cosh(t/τ))/k.
    // Where that form is numerically sound (0.01 ≤ kh ≤ 50), ours must match it to rounding.
    fc.assert(
      fc.property(
        fc.record({
          mass: fc.double({ min: 0.001, max: 5, noNaN: true }),
          diameter: fc.double({ min: 0.005, max: 0.3, noNaN: true }),
          cd: fc.double({ min: 0.05, max: 2, noNaN: true }),
          rho: fc.double({ min: 0.8, max: 1.3, noNaN: true }),
          h: fc.double({ min: 0.5, max: 200, noNaN: true }),
        }),
        ({ mass, diameter, cd, rho, h }) => {
          const area = (Math.PI * diameter * diameter) / 4;
          const p = fallParameters({
            mass_kg: mass,
            area_m2: area,
            volume_m3: (Math.PI * diameter ** 3) / 6,
            drag_coefficient: cd,
            density_kg_m3: rho,
            gravity_m_s2: 9.81,
            buoyancy: false,
            added_mass_coefficient: 0,
          });
          const k = (rho * cd * area) / (2 * mass);
          fc.pre(k * h >= 0.01 && k * h <= 50);
          expect(p.effective_gravity_m_s2).toBe(9.81);
          expect(p.drag_constant_per_m).toBeCloseTo(k, 15);
          const vt = Math.sqrt(9.81 / k);
          const tau = vt / 9.81;
          const t = tau * Math.acosh(Math.exp(k * h));
          expect(Math.abs(fallTime(h, p) / t - 1)).toBeLessThan(1e-13);
          expect(Math.abs(fallSpeedAtHeight(h, p) / (vt * Math.sqrt(1 - Math.exp(-2 * k * h))) - 1)).toBeLessThan(1e-13);
          expect(Math.abs(fallDistance(t, p) / (Math.log(Math.cosh(t / tau)) / k) - 1)).toBeLessThan(1e-12);
        },
      ),
      { numRuns: 300, seed: 11 },
    );
  });

  it('never shorten a fall when the drag grows (to within one rounding)', () => {
    const ulp = 2 ** -52;
    fc.assert(
      fc.property(fallCase, fc.double({ min: 1, max: 10, noNaN: true }), ({ g, logK, logH }, factor) => {
        const h = 10 ** logH;
        const less = params(g, 10 ** logK);
        const more = params(g, 10 ** logK * factor);
        expect(fallTime(h, more)).toBeGreaterThanOrEqual(fallTime(h, less) * (1 - ulp));
        expect(fallSpeedAtHeight(h, more)).toBeLessThanOrEqual(fallSpeedAtHeight(h, less) * (1 + ulp));
      }),
      { numRuns: 300, seed: 3 },
    );
  });

  it('give the time between two light gates as the difference of the two fall times', () => {
    const p = params(9.81, 0.004);
    expect(timeBetweenHeights(2, 12, p)).toBeCloseTo(fallTime(12, p) - fallTime(2, p), 15);
    // Checked against integrating from the first gate's state with odex.
    const t1 = fallTime(2, p);
    const t2 = t1 + timeBetweenHeights(2, 12, p);
    expect(odexFall(9.81, 0.004, t2).y).toBeCloseTo(12, 9);
    expect(() => timeBetweenHeights(5, 2, p)).toThrow(RangeError);
  });

  it('put 95 % and 99 % of terminal velocity at −ln(1 − f²)/(2k)', () => {
    const p = params(9.81, 0.01);
    for (const f of [0.95, 0.99]) {
      const d = distanceToTerminalFraction(f, p);
      expect(fallSpeedAtHeight(d, p) / terminalVelocity(p)).toBeCloseTo(f, 13);
    }
  });
});

describe('fallTimeFactor Φ(kh) = t/√(2h/g)', () => {
  it('is smooth across the switch from its series to the closed form, on both sides of zero', () => {
    for (const edge of [0.5, -0.5]) {
      const xBelow = edge * (1 - 1e-9);
      const xAbove = edge * (1 + 1e-9);
      const jump = fallTimeFactor(xAbove) - fallTimeFactor(xBelow) - fallTimeFactorDerivative(edge) * (xAbove - xBelow);
      expect(Math.abs(jump)).toBeLessThan(4e-16);
      // Φ′ by its closed form loses about one digit to cancellation near x = ½.
      const dBelow = fallTimeFactorDerivative(edge * (1 - 1e-13));
      const dAbove = fallTimeFactorDerivative(edge * (1 + 1e-13));
      expect(Math.abs(dAbove / dBelow - 1)).toBeLessThan(1e-13);
    }
  });

  it('uses a series that equals the closed forms where those are accurate (0.05 ≤ |kh| ≤ 0.5)', () => {
    for (let x = 0.05; x <= 0.5; x += 0.0137) {
      expect(Math.abs(fallTimeFactor(x) / (Math.acosh(Math.exp(x)) / Math.sqrt(2 * x)) - 1)).toBeLessThan(1e-13);
      expect(Math.abs(fallTimeFactor(-x) / (Math.acos(Math.exp(-x)) / Math.sqrt(2 * x)) - 1)).toBeLessThan(1e-13);
    }
  });

  it('has the derivative its finite differences show', () => {
    for (const x of [-3, -0.3, -1e-3, 1e-4, 5e-3, 0.2, 2, 40, 1e4]) {
      const h = 1e-5 * Math.max(Math.abs(x), 1e-2);
      const numeric = (fallTimeFactor(x + h) - fallTimeFactor(x - h)) / (2 * h);
      expect(Math.abs(fallTimeFactorDerivative(x) / numeric - 1)).toBeLessThan(1e-6);
    }
  });

  it('continues to negative k as the fall with the drag sign reversed (checked with odex)', () => {
    // dv/dt = g + q·v² (a push instead of drag): t(h) = arccos(e^{−qh})/√(gq).
    const g = 9.81;
    const q = 0.02;
    const h = 15;
    const t = fallTime(h, params(g, -q));
    expect(t).toBeLessThan(Math.sqrt((2 * h) / g));
    expect(odexFall(g, q, t, -1).y).toBeCloseTo(h, 8);
  });

  it('gives ∂t/∂k consistent with a finite difference of the fall time', () => {
    const p = params(9.8, 0.003);
    const dk = 1e-8;
    const numeric = (fallTime(20, params(9.8, 0.003 + dk)) - fallTime(20, params(9.8, 0.003 - dk))) / (2 * dk);
    expect(fallTimeDragDerivative(20, p) / numeric).toBeCloseTo(1, 6);
  });
});

describe('logCosh', () => {
  it('matches ln(cosh s) where that is safe and stays finite where it is not', () => {
    for (const s of [1e-6, 0.3, 1, 5, 30]) expect(logCosh(s)).toBeCloseTo(Math.log(Math.cosh(s)), 13);
    expect(logCosh(1e-8)).toBeCloseTo(5e-17, 30); // s²/2: Math.log(Math.cosh(1e-8)) gives 0
    expect(logCosh(1000)).toBeCloseTo(1000 - Math.LN2, 12);
  });
});

describe('fallParameters', () => {
  it('subtracts buoyancy from the weight and adds the added mass to the inertia', () => {
    const body = { mass_kg: 0.2, area_m2: 0.007, volume_m3: 4.5e-4, drag_coefficient: 0.47, density_kg_m3: 1.2, gravity_m_s2: 9.81 };
    const p = fallParameters({ ...body, buoyancy: true, added_mass_coefficient: 0.5 });
    const displaced = 1.2 * 4.5e-4;
    expect(p.effective_mass_kg).toBeCloseTo(0.2 + 0.5 * displaced, 15);
    expect(p.effective_gravity_m_s2).toBeCloseTo((9.81 * (0.2 - displaced)) / (0.2 + 0.5 * displaced), 14);
    expect(p.drag_constant_per_m).toBeCloseTo((1.2 * 0.47 * 0.007) / (2 * (0.2 + 0.5 * displaced)), 15);
  });

  it('refuses a specimen no heavier than the air it displaces', () => {
    // A 1 g balloon of 10 litres displaces 12 g of air.
    expect(() =>
      fallParameters({ mass_kg: 0.001, area_m2: 0.05, volume_m3: 0.01, drag_coefficient: 0.5, density_kg_m3: 1.2, gravity_m_s2: 9.81 }),
    ).toThrow(PhysicsInputError);
  });
});
