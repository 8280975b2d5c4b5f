/**
 * odex (E. Hairer and G. Wanner's ODEX, Gragg–Bulirsch–Stoer extrapolation, ported to
 * JavaScript) as an independent reference integrator.
 *
 * Loaded with require() on purpose: the package's "main" sits next to its TypeScript source,
 * which the compiler would otherwise pull into our type check (and which does not pass our
 * strict settings). The few members used here are typed below.
 */
import { createRequire } from 'node:module';

export interface OdexSolution {
  y: number[];
  outcome: number;
  nStep: number;
  xEnd: number;
  nEval: number;
}

export interface OdexSolver {
  absoluteTolerance: number;
  relativeTolerance: number;
  maxSteps: number;
  initialStepSize: number;
  solve(f: (x: number, y: number[]) => number[], x0: number, y0: number[], xEnd: number): OdexSolution;
}

const odex = createRequire(import.meta.url)('odex') as { Solver: new (n: number) => OdexSolver };

/** A solver for an n-dimensional system, at tight tolerances. */
export function odexSolver(n: number, tolerance = 1e-13): OdexSolver {
  const solver = new odex.Solver(n);
  solver.absoluteTolerance = tolerance;
  solver.relativeTolerance = tolerance;
  solver.maxSteps = 1_000_000;
  return solver;
}
