// Chart geometry, pure: what a chart draws, as numbers and strings. The app's Lit widgets and the printed
// report draw from the same functions, so the two never differ.
export { niceTicks } from './nice-ticks';
export { plotGeometry, tickLabel, PLOT_WIDTH, PLOT_HEIGHT, type PlotGeometry, type PlotInput, type PlotLine, type PlotMark, type Tick, type LineStyle, type LineTone } from './plot-geometry';
export { seriesPlots, METRES, type LengthDisplay, type SeriesPlots } from './series-plots';
export { budgetBars, barWidths, type Bar } from './budget-bars';
export { marksPlots, type MarksFit, type MarksPlots } from './marks-plots';
