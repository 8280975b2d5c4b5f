// Self-contained field widgets (Lit custom elements). Importing this module defines them.
export { QuantityInput, type QuantityChangeDetail } from './quantity-input';
export { PlotChart, niceTicks, type PlotLine, type PlotMark } from './plot-chart';
export { BarChart, type Bar } from './bar-chart';
export { TimerPad, type TimeCapturedDetail, type TimerMode } from './timer-pad';
export * from './units';
