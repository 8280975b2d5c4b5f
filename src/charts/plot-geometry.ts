// Where everything of a line-and-point chart goes, as numbers and SVG strings: scales, ticks, polylines, marks and
// error bars in the chart's own coordinates (a 360 × 240 view box). The app's <pl-plot> widget and the printed
// report both draw from this, so a chart on the phone and on paper are the same chart.
import { niceTicks } from './nice-ticks';

export type LineStyle = 'solid' | 'dash' | 'dot';
export type LineTone = 'brand' | 'accent' | 'ink' | 'soft';

export interface PlotLine {
  label: string;
  points: ReadonlyArray<readonly [number, number]>;
  /** Each line also differs by stroke pattern, so colour is never the only cue. */
  style?: LineStyle;
  tone?: LineTone;
}

export interface PlotMark {
  label: string;
  x: number;
  y: number;
  /** Hollow marks for points left out of the fit (excluded drops). */
  hollow?: boolean;
  /** An error bar half-height in y units. */
  yError?: number;
}

export interface PlotInput {
  lines: readonly PlotLine[];
  marks: readonly PlotMark[];
  /** Draw the line y = 0 (residual charts) and keep 0 inside the y range. */
  zeroLine?: boolean;
}

export interface Tick {
  value: number;
  /** The value as printed beside the axis (three significant digits). */
  label: string;
  /** Its position along the axis, in view-box units. */
  at: number;
}

export interface PlotGeometry {
  width: number;
  height: number;
  /** The plotting area's edges in view-box units. */
  left: number;
  right: number;
  top: number;
  bottom: number;
  xTicks: Tick[];
  yTicks: Tick[];
  /** The y of the zero line, or null when none is drawn. */
  zeroY: number | null;
  /** Each line as an SVG points list ("x,y x,y …", one decimal), non-finite points left out. */
  lines: { label: string; tone: LineTone; style: LineStyle; points: string }[];
  marks: { label: string; cx: number; cy: number; hollow: boolean; errorBar: { y1: number; y2: number } | null }[];
  /** Where the x label's middle sits, and the rotated y label's. */
  xLabelAt: { x: number; y: number };
  yLabelAt: { x: number; y: number };
}

export const PLOT_WIDTH = 360;
export const PLOT_HEIGHT = 240;
const PAD = { left: 52, right: 12, top: 12, bottom: 40 };

/** The printed form of a tick value: three significant digits, no trailing zeros. */
export function tickLabel(v: number): string {
  return String(Number(v.toPrecision(3)));
}

/** The chart's geometry, or null when there is nothing finite to plot. */
export function plotGeometry(input: PlotInput): PlotGeometry | null {
  const { lines, marks, zeroLine = false } = input;
  const finite = (a: number[]) => a.filter(Number.isFinite);
  const fx = finite([...lines.flatMap((l) => l.points.map((p) => p[0])), ...marks.map((m) => m.x)]);
  const fy = finite([
    ...lines.flatMap((l) => l.points.map((p) => p[1])),
    ...marks.flatMap((m) => [m.y - (m.yError ?? 0), m.y + (m.yError ?? 0)]),
    ...(zeroLine ? [0] : []),
  ]);
  if (fx.length === 0 || fy.length === 0) return null;
  const W = PLOT_WIDTH;
  const H = PLOT_HEIGHT;
  let [x0, x1] = [Math.min(0, ...fx), Math.max(...fx)];
  let [y0, y1] = [Math.min(...fy), Math.max(...fy)];
  if (x1 === x0) x1 = x0 + 1;
  if (y1 === y0) {
    y0 -= Math.abs(y0) * 0.1 || 1;
    y1 += Math.abs(y1) * 0.1 || 1;
  }
  const yPad = (y1 - y0) * 0.06;
  y0 -= zeroLine || y0 !== 0 ? yPad : 0;
  y1 += yPad;
  const sx = (x: number) => PAD.left + ((x - x0) / (x1 - x0)) * (W - PAD.left - PAD.right);
  const sy = (y: number) => H - PAD.bottom - ((y - y0) / (y1 - y0)) * (H - PAD.top - PAD.bottom);
  return {
    width: W,
    height: H,
    left: PAD.left,
    right: W - PAD.right,
    top: PAD.top,
    bottom: H - PAD.bottom,
    xTicks: niceTicks(x0, x1).map((value) => ({ value, label: tickLabel(value), at: sx(value) })),
    yTicks: niceTicks(y0, y1).map((value) => ({ value, label: tickLabel(value), at: sy(value) })),
    zeroY: zeroLine ? sy(0) : null,
    lines: lines.map((l) => ({
      label: l.label,
      tone: l.tone ?? 'brand',
      style: l.style ?? 'solid',
      points: l.points
        .filter((p) => Number.isFinite(p[0]) && Number.isFinite(p[1]))
        .map((p) => `${sx(p[0]).toFixed(1)},${sy(p[1]).toFixed(1)}`)
        .join(' '),
    })),
    marks: marks.map((m) => ({
      label: m.label,
      cx: sx(m.x),
      cy: sy(m.y),
      hollow: m.hollow ?? false,
      errorBar: m.yError ? { y1: sy(m.y - m.yError), y2: sy(m.y + m.yError) } : null,
    })),
    xLabelAt: { x: (PAD.left + W - PAD.right) / 2, y: H - 6 },
    yLabelAt: { x: 13, y: (PAD.top + H - PAD.bottom) / 2 },
  };
}
