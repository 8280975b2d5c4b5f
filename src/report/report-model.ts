// The day report as data: every section, table and chart of a printed report, with each number both as the text
// printed and as the core's own value (so a test can hold the page against the analysis). Pure: the office
// command renders it to one HTML file (report-html.ts), the app draws it with Preact; neither computes anything.
import type { PlotGeometry } from '../charts';
import type { Bar } from '../charts';

/** One table cell: the text printed and, for a figure of the analysis, its exact value and what it is. */
export interface Cell {
  text: string;
  value?: number;
  field?: string;
}

export interface Table {
  caption: string;
  headers: string[];
  rows: Cell[][];
  /** Said instead of an empty table. */
  empty: string;
}

export interface Figure {
  label: string;
  cell: Cell;
}

export interface ChartView {
  title: string;
  summary: string;
  xLabel: string;
  yLabel: string;
  geometry: PlotGeometry | null;
  /** The legend entries: each line (by tone and stroke pattern), then the kinds of mark present. */
  legend: LegendEntry[];
}

export type LegendEntry = { kind: 'line'; label: string; tone: string; style: string } | { kind: 'mark'; label: string; hollow: boolean };

export interface Flag {
  severity: 'warning' | 'info';
  code: string;
  message: string;
}

export interface SeriesSection {
  id: string;
  title: string;
  /** 'ready' when the series computed; otherwise why not, in `verdict`. */
  state: 'ready' | 'missing' | 'error';
  verdict: string;
  /** True when the relative uncertainty met the series' target. */
  targetMet: boolean | null;
  figures: Figure[];
  charts: ChartView[];
  drops: Table;
  budget: Table;
  bars: Bar[];
  flags: Flag[];
}

export interface DaySection {
  id: string;
  date: string;
  heading: string;
  siteFigures: Figure[];
  crew: string[];
  notes: string;
  readings: Table;
  specimens: Table;
  series: SeriesSection[];
  history: Table;
}

export interface MethodNote {
  topic: string;
  text: string;
  source: string;
}

export interface DayReport {
  title: string;
  /** When it was made, ISO 8601 (passed in: the core reads no clock). */
  generatedAt: string;
  days: DaySection[];
  methods: MethodNote[];
  /** The safety note every printed report carries. */
  caution: string;
}
