// A series' two charts as plot inputs: distance fallen against time (the fitted, predicted and drag-free curves
// with every drop, excluded ones hollow) and the residuals against height. The series screen and the printed
// report both take them from here.
import { dropHeight, seriesCurves, type Curve, type SeriesOutcome } from '../analysis';
import type { DropRecord, SeriesRecord } from '../log';
import type { PlotInput, PlotLine, PlotMark } from './plot-geometry';

/** How lengths are shown: SI metres converted to the display unit, and its symbol. */
export interface LengthDisplay {
  symbol: string;
  fromMetres(m: number): number;
}

export const METRES: LengthDisplay = { symbol: 'm', fromMetres: (m) => m };

export interface SeriesPlots {
  heightTime: PlotInput & { xLabel: string; yLabel: string; summary: string };
  /** Null when every drop is from one height (residuals against height say nothing then). */
  residuals: (PlotInput & { xLabel: string; yLabel: string; summary: string }) | null;
}

export function seriesPlots(
  outcome: Extract<SeriesOutcome, { kind: 'ready' }>,
  drops: readonly DropRecord[],
  series: SeriesRecord,
  length: LengthDisplay = METRES,
): SeriesPlots {
  const L = length.fromMetres;
  const curves = seriesCurves(outcome.request, outcome.result);
  const conv = (c: Curve) => c.map(([t, y]) => [t, L(y)] as const);
  const lines: PlotLine[] = [];
  if (curves.fitted) lines.push({ label: `measured C_d ${outcome.result.drag_coefficient?.toFixed(3)}`, points: conv(curves.fitted), tone: 'brand', style: 'solid' });
  if (curves.predicted) lines.push({ label: 'predicted', points: conv(curves.predicted), tone: 'accent', style: 'dash' });
  lines.push({ label: 'no air', points: conv(curves.vacuum), tone: 'ink', style: 'dot' });
  const live = drops.filter((d) => !d.deleted);
  const marks: PlotMark[] = live.map((d) => ({
    label: `drop ${d.seq}: ${d.time_s.toFixed(3)} s from ${L(dropHeight(d, series)).toFixed(2)} ${length.symbol}${d.excluded ? ' (excluded)' : ''}`,
    x: d.time_s,
    y: L(dropHeight(d, series)),
    hollow: d.excluded,
  }));
  const r = outcome.result;
  const heights = new Set(outcome.request.drops.map((d) => d.height_m));
  return {
    heightTime: {
      lines,
      marks,
      xLabel: 'time (s)',
      yLabel: `distance fallen (${length.symbol})`,
      summary: `Chart of distance fallen against time: ${live.length} measured drops with the curve for the measured drag coefficient${curves.predicted ? ', the predicted curve' : ''} and the curve without air. The table lists the same values.`,
    },
    residuals:
      heights.size > 1
        ? {
            lines: [],
            zeroLine: true,
            marks: r.drops.map((d) => ({
              label: `${(d.residual_s * 1000).toFixed(1)} ms at ${L(d.height_m).toFixed(2)} ${length.symbol}`,
              x: L(d.height_m),
              y: d.residual_s * 1000,
              yError: series.u_time_s * 1000,
              hollow: false,
            })),
            xLabel: `height (${length.symbol})`,
            yLabel: 'residual (ms)',
            summary: 'Residuals of each drop against its height; the table lists the same values.',
          }
        : null,
  };
}
