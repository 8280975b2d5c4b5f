// Self-contained field widgets (Lit custom elements). Importing this module defines them.
// The units helpers are in ./units, a face of their own that defines no element.
export { QuantityInput, type QuantityChangeDetail } from './quantity-input';
export { PlotChart, niceTicks, type PlotLine, type PlotMark } from './plot-chart';
export { BarChart, type Bar } from './bar-chart';
export { TimerPad, type TimeCapturedDetail, type TimerMode } from './timer-pad';
