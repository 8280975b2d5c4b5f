/**
 * Least-squares fit of the drag coefficient (and optionally a constant timing offset δ) to the mean fall times of
 * drops from one or more heights, for a fall with no closed form (air along the fall, moving air):
 *
 *   minimise  Σ_j n_j·( t̄_j − T_j(C_d) − δ )²
 *
 * Gauss–Newton on C_d alone with δ eliminated exactly (the weighted mean residual, as in fitDragConstant.ts); the
 * slope ∂T_j/∂C_d by a forward difference of 1e-5·C_d, far above the integrator's tolerance (1e-11), so the
 * slope is good to about 1e-5 and the iteration converges at once from a close start. A step is halved while it
 * does not lower the sum of squares. Ends when the step moves no model time by more than 1e-11 of the longest.
 */
export interface ColumnDragFit {
  status: 'ok' | 'not-converged';
  drag_coefficient: number;
  offset_s: number;
  iterations: number;
}

export function fitDragInColumn(
  timeAt: (j: number, cd: number) => number,
  meanTimes_s: ArrayLike<number>,
  counts: ArrayLike<number>,
  fitOffset: boolean,
  startCd: number,
  /**
   * Slopes ∂T_j/∂C_d from an earlier fit at nearby inputs: when given (and filled) they are used instead of new
   * differences (a quasi-Newton iteration with a fixed slope: each step costs one fall per height); the first fit
   * fills them.
   */
  slopeCache?: Float64Array,
): ColumnDragFit {
  const J = meanTimes_s.length;
  let total = 0;
  let timeScale = 0;
  for (let j = 0; j < J; j++) {
    total += counts[j]!;
    timeScale = Math.max(timeScale, meanTimes_s[j]!);
  }
  const model = new Float64Array(J);
  const slope = new Float64Array(J);
  let cd = startCd;
  let offset = 0;
  const sumOfSquares = (c: number): { S: number; offset: number } => {
    let sumR = 0;
    for (let j = 0; j < J; j++) {
      model[j] = timeAt(j, c);
      sumR += counts[j]! * (meanTimes_s[j]! - model[j]!);
    }
    const o = fitOffset ? sumR / total : 0;
    let S = 0;
    for (let j = 0; j < J; j++) S += counts[j]! * (meanTimes_s[j]! - model[j]! - o) ** 2;
    return { S, offset: o };
  };
  let current = sumOfSquares(cd);
  offset = current.offset;
  for (let iteration = 1; iteration <= 50; iteration++) {
    const h = 1e-5 * Math.max(Math.abs(cd), 1e-3);
    let meanSlope = 0;
    const base = Float64Array.from(model);
    // A stale slope that has not converged within a few steps is replaced by fresh differences.
    const cached = iteration <= 4 && slopeCache !== undefined && slopeCache.length === J && Number.isFinite(slopeCache[0]!);
    for (let j = 0; j < J; j++) {
      slope[j] = cached ? slopeCache[j]! : (timeAt(j, cd + h) - base[j]!) / h;
      meanSlope += counts[j]! * slope[j]!;
    }
    if (!cached && iteration === 1 && slopeCache !== undefined && slopeCache.length === J) slopeCache.set(slope);
    meanSlope = fitOffset ? meanSlope / total : 0;
    let num = 0;
    let den = 0;
    for (let j = 0; j < J; j++) {
      const d = slope[j]! - meanSlope;
      num += counts[j]! * d * (meanTimes_s[j]! - base[j]! - offset);
      den += counts[j]! * d * d;
    }
    if (!(den > 0)) return { status: 'not-converged', drag_coefficient: cd, offset_s: offset, iterations: iteration };
    let step = num / den;
    let maxSlope = 0;
    for (let j = 0; j < J; j++) maxSlope = Math.max(maxSlope, Math.abs(slope[j]! - meanSlope));
    // The step moves no model time by more than 1e-11 of the longest, or C_d by 1e-8 of itself (ten thousand times
    // below the budget's smallest difference steps; the sum of squares is flat to rounding there): take it and stop.
    if (Math.abs(step) * maxSlope <= 1e-11 * timeScale || Math.abs(step) <= 1e-8 * Math.max(Math.abs(cd), 1e-6)) {
      return { status: 'ok', drag_coefficient: cd + step, offset_s: offset - meanSlope * step, iterations: iteration };
    }
    let accepted = false;
    for (let halving = 0; halving < 30; halving++) {
      const trial = sumOfSquares(cd + step);
      if (trial.S <= current.S * (1 + 1e-12) + 1e-30) {
        if (Math.abs(step) <= 1e-8 * Math.max(Math.abs(cd), 1e-6)) {
          // Only a step within the sum of squares' rounding was accepted: the minimum is reached.
          return { status: 'ok', drag_coefficient: cd + step, offset_s: trial.offset, iterations: iteration };
        }
        cd += step;
        current = trial;
        offset = trial.offset;
        accepted = true;
        break;
      }
      step *= 0.5;
    }
    if (!accepted) {
      sumOfSquares(cd);
      return { status: 'ok', drag_coefficient: cd, offset_s: offset, iterations: iteration };
    }
  }
  return { status: 'not-converged', drag_coefficient: cd, offset_s: offset, iterations: 50 };
}
