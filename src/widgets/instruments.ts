// The series screen's instruments: the timer pad and the charts. Importing this module defines them; the app
// loads it with the series screen (loadInstruments in index.ts), so forms elsewhere do not carry them.
export { PlotChart, niceTicks, type PlotLine, type PlotMark } from './plot-chart';
export { BarChart, type Bar } from './bar-chart';
export { TimerPad, type TimeCapturedDetail, type TimerMode } from './timer-pad';
