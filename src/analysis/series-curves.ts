// Curves of distance fallen against time for the series chart: the fitted C_d, the prediction, no air.
import {
  fallBodyOf,
  fallDistance,
  fallParameters,
  fallWithVariableDrag,
  morrisonSphereDragCoefficient,
  sphereScaleBodyOf,
  standardSphereDragCoefficient,
  type AnalysisRequest,
  type AnalysisResult,
  type VariableDragBody,
} from '../physics';

export type Curve = Array<[number, number]>;

function bodyFor(result: AnalysisResult, cd: number) {
  return fallParameters(fallBodyOf(result, cd));
}

function sampled(tEnd: number, distance: (t: number) => number, n = 40): Curve {
  const out: Curve = [];
  for (let i = 0; i <= n; i++) {
    const t = (tEnd * i) / n;
    out.push([t, distance(t)]);
  }
  return out;
}

export function seriesCurves(request: AnalysisRequest, result: AnalysisResult): { fitted: Curve | null; predicted: Curve | null; vacuum: Curve } {
  const hMax = Math.max(...request.drops.map((d) => d.height_m));
  const tMax = Math.max(...request.drops.map((d) => d.time_s)) * 1.05;
  const vacuum = bodyFor(result, 0);
  const tVac = Math.min(tMax, Math.sqrt((2 * hMax * 1.05) / result.gravity_m_s2));
  const vacuumCurve = sampled(tVac, (t) => fallDistance(t, vacuum));
  const scale = result.drag_law === 'scaled_sphere' ? result.drag_law_details.scale_factor : null;
  let fittedCurve: Curve | null = null;
  if (result.drag_coefficient !== null && scale !== null) {
    // The scaled sphere curve: the fall the series was fitted with, not a constant C_d.
    fittedCurve = heightCurve(hMax, { ...variableDragBody(result), dragCoefficient: (re) => scale * standardSphereDragCoefficient(re) });
  } else if (result.drag_coefficient !== null) {
    const fitted = bodyFor(result, result.drag_coefficient);
    fittedCurve = sampled(tMax, (t) => fallDistance(t, fitted));
  }
  let predicted: Curve | null = null;
  if (result.prediction.method === 'reference-drag-coefficient' && result.prediction.reference_drag_coefficient !== null) {
    const p = bodyFor(result, result.prediction.reference_drag_coefficient);
    predicted = sampled(tMax, (t) => fallDistance(t, p));
  } else if (result.prediction.method === 'standard-sphere-drag-curve' || result.prediction.method === 'morrison-sphere-correlation') {
    predicted = heightCurve(hMax, {
      ...variableDragBody(result),
      // The same sphere curve the prediction used.
      dragCoefficient: result.prediction.method === 'standard-sphere-drag-curve' ? standardSphereDragCoefficient : morrisonSphereDragCoefficient,
    });
  }
  return { fitted: fittedCurve, predicted, vacuum: vacuumCurve };
}

function variableDragBody(result: AnalysisResult): Omit<VariableDragBody, 'dragCoefficient'> {
  return sphereScaleBodyOf(result);
}

/** Points of a speed-dependent fall's curve. */
const HEIGHT_CURVE_POINTS = 24;

/**
 * A speed-dependent fall as (time, height) points up to 5 % past the highest drop. The heights are spaced as the
 * square of their index, so the points are about evenly spaced in time: a fall starts as h = g·t²/2, and heights
 * spaced evenly drew the first stretch as one straight chord, visibly above the curve near the release.
 */
function heightCurve(hMax: number, body: VariableDragBody): Curve {
  const curve: Curve = [[0, 0]];
  for (let i = 1; i <= HEIGHT_CURVE_POINTS; i++) {
    const h = hMax * 1.05 * (i / HEIGHT_CURVE_POINTS) ** 2;
    try {
      curve.push([fallWithVariableDrag(h, body, 1e-8).time_s, h]);
    } catch {
      break;
    }
  }
  return curve;
}
