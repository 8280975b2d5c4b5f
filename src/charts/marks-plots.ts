// A series' drops with marks as plot inputs: every mark's distance fallen against its time with each drop's fitted
// curve through its marks, and each mark's residual against its distance. Until a result carries the marks' fit
// (DropResult.marks), the marks are drawn alone and there is no residual chart.
import type { DropRecord } from '../log';
import type { PlotInput, PlotLine, PlotMark } from './plot-geometry';
import { METRES, type LengthDisplay } from './series-plots';

/** The marks' fit of one drop, joined to it by id (the shape of the physics' DropResult.marks). */
export interface MarksFit {
  id?: string;
  marks?: readonly { distance_m: number; time_s: number; fitted_time_s: number; residual_s: number }[];
}

export interface MarksPlots {
  distanceTime: PlotInput & { xLabel: string; yLabel: string; summary: string };
  /** Null until the result carries the marks' fitted times. */
  residuals: (PlotInput & { xLabel: string; yLabel: string; summary: string }) | null;
}

/** The plots of the drops' marks, or null when no live drop has marks. */
export function marksPlots(drops: readonly DropRecord[], fits: readonly MarksFit[], length: LengthDisplay = METRES): MarksPlots | null {
  const L = length.fromMetres;
  const withMarks = drops.filter((d) => !d.deleted && d.marks !== undefined);
  if (withMarks.length === 0) return null;
  const fitOf = new Map(fits.filter((f) => f.id !== undefined && f.marks).map((f) => [f.id!, f.marks!]));
  const marks: PlotMark[] = [];
  const lines: PlotLine[] = [];
  const residuals: PlotMark[] = [];
  for (const drop of withMarks) {
    const fit = drop.excluded ? undefined : fitOf.get(drop.id);
    drop.marks!.forEach((m, i) => {
      marks.push({
        label: `drop ${drop.seq}, mark ${i + 1}: ${m.time_s.toFixed(4)} s at ${L(m.distance_m).toFixed(3)} ${length.symbol}${drop.excluded ? ' (excluded)' : ''}`,
        x: m.time_s,
        y: L(m.distance_m),
        hollow: drop.excluded,
      });
    });
    if (!fit) continue;
    // The fitted times include the drop's release shift and the offset: the curve passes where the fit puts each mark.
    lines.push({ label: `drop ${drop.seq} fitted`, points: fit.map((f) => [f.fitted_time_s, L(f.distance_m)] as const), tone: 'brand', style: 'solid' });
    for (const [i, f] of fit.entries()) {
      residuals.push({ label: `drop ${drop.seq}, mark ${i + 1}: ${(f.residual_s * 1000).toFixed(2)} ms at ${L(f.distance_m).toFixed(3)} ${length.symbol}`, x: L(f.distance_m), y: f.residual_s * 1000, hollow: false });
    }
  }
  return {
    distanceTime: {
      lines,
      marks,
      xLabel: 'time from release (s)',
      yLabel: `distance fallen (${length.symbol})`,
      summary: `Chart of ${marks.length} marks of ${withMarks.length} drops, distance fallen against time${lines.length > 0 ? ", with each drop's fitted curve" : ''}; the CSV marks table lists the same values.`,
    },
    residuals:
      residuals.length > 0
        ? {
            lines: [],
            zeroLine: true,
            marks: residuals,
            xLabel: `distance fallen (${length.symbol})`,
            yLabel: 'residual (ms)',
            summary: "Each mark's measured minus fitted time against its distance fallen.",
          }
        : null,
  };
}
