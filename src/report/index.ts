// The day report: a pure model built from a log's records (every figure from the analysis core, charts from
// src/charts), the one stylesheet, and the self-contained HTML document the office command writes.
export { dayReport, dayRecords, type DayReportOptions } from './day-report';
export { reportHtml, plotSvg, escapeHtml } from './report-html';
export { REPORT_CSS } from './report-style';
export { METHOD_NOTES, REPORT_CAUTION } from './methods';
export type { Cell, ChartView, DayReport, DaySection, Figure, Flag, LegendEntry, MethodNote, SeriesSection, Table } from './report-model';
