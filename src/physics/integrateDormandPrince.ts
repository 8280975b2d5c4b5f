/**
 * Adaptive explicit Runge–Kutta integration with the Dormand–Prince 5(4) pair
 * (J. R. Dormand, P. J. Prince, "A family of embedded Runge-Kutta formulae", J. Comput. Appl.
 * Math. 6 (1980) 19–26; step control as in Hairer, Nørsett, Wanner, Solving Ordinary
 * Differential Equations I, 2nd ed., section II.4). Local extrapolation: the 5th-order
 * solution is propagated, the 4th-order one only estimates the error.
 *
 * An optional event g(t, y) stops the integration where g first changes sign from negative
 * to non-negative; its time is found by re-taking one step of a shorter length from the last
 * accepted point (so the located point is as accurate as any accepted step), and solving for
 * that length with the Illinois variant of regula falsi, which always keeps a bracket.
 */
import { PhysicsInputError } from './physicsInputError';

export type OdeRightHandSide = (t: number, y: Float64Array, dydt: Float64Array) => void;

export interface DormandPrinceOptions {
  relativeTolerance?: number;
  absoluteTolerance?: number;
  /** First trial step; a rough guess is fine, it is adapted at once. */
  initialStep?: number;
  maxStep?: number;
  maxSteps?: number;
}

export interface DormandPrinceResult {
  t: number;
  y: Float64Array;
  acceptedSteps: number;
  rejectedSteps: number;
  evaluations: number;
  /** True when the event stopped the integration before tEnd. */
  eventFound: boolean;
}

// Butcher tableau of DOPRI5.
const C2 = 1 / 5, C3 = 3 / 10, C4 = 4 / 5, C5 = 8 / 9;
const A21 = 1 / 5;
const A31 = 3 / 40, A32 = 9 / 40;
const A41 = 44 / 45, A42 = -56 / 15, A43 = 32 / 9;
const A51 = 19372 / 6561, A52 = -25360 / 2187, A53 = 64448 / 6561, A54 = -212 / 729;
const A61 = 9017 / 3168, A62 = -355 / 33, A63 = 46732 / 5247, A64 = 49 / 176, A65 = -5103 / 18656;
const A71 = 35 / 384, A73 = 500 / 1113, A74 = 125 / 192, A75 = -2187 / 6784, A76 = 11 / 84;
// Error weights: 5th-order weights minus the embedded 4th-order ones.
const E1 = 71 / 57600, E3 = -71 / 16695, E4 = 71 / 1920, E5 = -17253 / 339200, E6 = 22 / 525, E7 = -1 / 40;

class Stepper {
  readonly n: number;
  readonly k1: Float64Array;
  readonly k2: Float64Array;
  readonly k3: Float64Array;
  readonly k4: Float64Array;
  readonly k5: Float64Array;
  readonly k6: Float64Array;
  readonly k7: Float64Array;
  readonly tmp: Float64Array;
  evaluations = 0;

  constructor(readonly f: OdeRightHandSide, n: number) {
    this.n = n;
    this.k1 = new Float64Array(n);
    this.k2 = new Float64Array(n);
    this.k3 = new Float64Array(n);
    this.k4 = new Float64Array(n);
    this.k5 = new Float64Array(n);
    this.k6 = new Float64Array(n);
    this.k7 = new Float64Array(n);
    this.tmp = new Float64Array(n);
  }

  /**
   * One step of length h from (t, y) whose derivative is already in k1. Writes the 5th-order
   * solution to yOut, its derivative to k7, and returns the scaled RMS error estimate.
   */
  step(t: number, y: Float64Array, h: number, yOut: Float64Array, rtol: number, atol: number): number {
    const { n, k1, k2, k3, k4, k5, k6, k7, tmp, f } = this;
    for (let i = 0; i < n; i++) tmp[i] = y[i]! + h * A21 * k1[i]!;
    f(t + C2 * h, tmp, k2);
    for (let i = 0; i < n; i++) tmp[i] = y[i]! + h * (A31 * k1[i]! + A32 * k2[i]!);
    f(t + C3 * h, tmp, k3);
    for (let i = 0; i < n; i++) tmp[i] = y[i]! + h * (A41 * k1[i]! + A42 * k2[i]! + A43 * k3[i]!);
    f(t + C4 * h, tmp, k4);
    for (let i = 0; i < n; i++) tmp[i] = y[i]! + h * (A51 * k1[i]! + A52 * k2[i]! + A53 * k3[i]! + A54 * k4[i]!);
    f(t + C5 * h, tmp, k5);
    for (let i = 0; i < n; i++) {
      tmp[i] = y[i]! + h * (A61 * k1[i]! + A62 * k2[i]! + A63 * k3[i]! + A64 * k4[i]! + A65 * k5[i]!);
    }
    f(t + h, tmp, k6);
    for (let i = 0; i < n; i++) {
      yOut[i] = y[i]! + h * (A71 * k1[i]! + A73 * k3[i]! + A74 * k4[i]! + A75 * k5[i]! + A76 * k6[i]!);
    }
    f(t + h, yOut, k7);
    this.evaluations += 6;
    let sum = 0;
    for (let i = 0; i < n; i++) {
      const err = h * (E1 * k1[i]! + E3 * k3[i]! + E4 * k4[i]! + E5 * k5[i]! + E6 * k6[i]! + E7 * k7[i]!);
      const scale = atol + rtol * Math.max(Math.abs(y[i]!), Math.abs(yOut[i]!));
      const r = err / scale;
      sum += r * r;
    }
    return Math.sqrt(sum / n);
  }
}

/**
 * Integrate y' = f(t, y) from t0 to tEnd (tEnd > t0), or until `event` turns non-negative.
 */
export function integrateDormandPrince(
  f: OdeRightHandSide,
  t0: number,
  y0: ArrayLike<number>,
  tEnd: number,
  options: DormandPrinceOptions = {},
  event?: (t: number, y: Float64Array) => number,
): DormandPrinceResult {
  const rtol = options.relativeTolerance ?? 1e-10;
  const atol = options.absoluteTolerance ?? 1e-12;
  const maxSteps = options.maxSteps ?? 100_000;
  const span = tEnd - t0;
  // Contract check, plain on purpose: callers pass values the request validation already checked, so this is a bug, not bad input.
  if (!(span > 0)) throw new RangeError(`integrateDormandPrince needs tEnd > t0, got ${t0} → ${tEnd}`);
  const maxStep = options.maxStep ?? span;
  const n = y0.length;
  const stepper = new Stepper(f, n);
  let y = Float64Array.from(y0);
  let yNew = new Float64Array(n);
  let t = t0;
  f(t, y, stepper.k1);
  stepper.evaluations++;
  let h = Math.min(options.initialStep ?? initialStepGuess(stepper, t, y, rtol, atol, span), maxStep);
  let accepted = 0;
  let rejected = 0;
  let gOld = event ? event(t, y) : -1;
  let lastFailed = false;

  while (t < tEnd) {
    if (accepted + rejected >= maxSteps) {
      throw new PhysicsInputError({ code: 'solver-failed', field: 'tEnd', value: tEnd, allowed: `an end reached within ${maxSteps} steps`, reason: `more than ${maxSteps} integration steps` });
    }
    let last = false;
    if (t + h >= tEnd) {
      h = tEnd - t;
      last = true;
    }
    const err = stepper.step(t, y, h, yNew, rtol, atol);
    if (!(err <= 1)) {
      rejected++;
      // A NaN error (e.g. a step that left the domain of f) shrinks hard, like a big error.
      const factor = Number.isFinite(err) ? Math.max(0.2, 0.9 * Math.pow(err, -0.2)) : 0.1;
      h *= lastFailed ? Math.min(factor, 0.5) : factor;
      lastFailed = true;
      if (h < 1e-14 * Math.max(1, Math.abs(t))) throw new PhysicsInputError({ code: 'solver-failed', field: 't', value: t, allowed: 'a step above 1e-14·|t|', reason: 'step size underflow' });
      continue;
    }
    lastFailed = false;
    if (event) {
      const gNew = event(t + h, yNew);
      if (gOld < 0 && gNew >= 0) {
        const result = locateEvent(stepper, event, t, y, h, gOld, gNew, rtol, atol);
        return {
          t: result.t,
          y: result.y,
          acceptedSteps: accepted + 1,
          rejectedSteps: rejected,
          evaluations: stepper.evaluations,
          eventFound: true,
        };
      }
      gOld = gNew;
    }
    accepted++;
    t = last ? tEnd : t + h;
    const swap = y;
    y = yNew;
    yNew = swap;
    stepper.k1.set(stepper.k7); // FSAL: the last stage is the next step's first
    const factor = err === 0 ? 5 : Math.min(5, Math.max(0.2, 0.9 * Math.pow(err, -0.2)));
    h = Math.min(h * factor, maxStep);
  }
  return { t, y, acceptedSteps: accepted, rejectedSteps: rejected, evaluations: stepper.evaluations, eventFound: false };
}

function initialStepGuess(stepper: Stepper, t: number, y: Float64Array, rtol: number, atol: number, span: number): number {
  // Hairer–Nørsett–Wanner's starting step (II.4), first part: h ≈ 0.01·‖y‖/‖y'‖.
  let d0 = 0;
  let d1 = 0;
  for (let i = 0; i < stepper.n; i++) {
    const scale = atol + rtol * Math.abs(y[i]!);
    d0 += (y[i]! / scale) ** 2;
    d1 += (stepper.k1[i]! / scale) ** 2;
  }
  d0 = Math.sqrt(d0 / stepper.n);
  d1 = Math.sqrt(d1 / stepper.n);
  const h = d0 < 1e-5 || d1 < 1e-5 ? 1e-6 * span : (0.01 * d0) / d1;
  return Math.min(h, span);
}

function locateEvent(
  stepper: Stepper,
  event: (t: number, y: Float64Array) => number,
  t: number,
  y: Float64Array,
  h: number,
  gLeft: number,
  gRight: number,
  rtol: number,
  atol: number,
): { t: number; y: Float64Array } {
  // Keep k1 (the derivative at t): every trial step starts from the same point.
  const k1 = Float64Array.from(stepper.k1);
  const trial = new Float64Array(stepper.n);
  let a = 0;
  let b = h;
  let ga = gLeft;
  let gb = gRight;
  let side = 0;
  let best = h;
  for (let iteration = 0; iteration < 100; iteration++) {
    let c = (a * gb - b * ga) / (gb - ga);
    if (!(c > a && c < b)) c = 0.5 * (a + b);
    stepper.k1.set(k1);
    stepper.step(t, y, c, trial, rtol, atol);
    const gc = event(t + c, trial);
    best = c;
    if (gc === 0 || b - a <= 4 * Number.EPSILON * Math.max(Math.abs(t), Math.abs(t + h))) break;
    if (gc < 0) {
      a = c;
      ga = gc;
      if (side === -1) gb /= 2; // Illinois: halve the stale end's value
      side = -1;
    } else {
      b = c;
      gb = gc;
      if (side === 1) ga /= 2;
      side = 1;
    }
    if (Math.abs(gc) <= 1e-15 * (Math.abs(gLeft) + Math.abs(gRight))) break;
  }
  stepper.k1.set(k1);
  const yEvent = new Float64Array(stepper.n);
  stepper.step(t, y, best, yEvent, rtol, atol);
  return { t: t + best, y: yEvent };
}
