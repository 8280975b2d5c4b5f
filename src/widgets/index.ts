// Self-contained field widgets (Lit custom elements). Importing this module defines the quantity field, which
// every form uses; the series screen's instruments (timer pad, charts) are defined by loadInstruments(), so a
// screen with forms alone does not download them. The units helpers are in ./units, a face of their own that
// defines no element.
export { QuantityInput, type QuantityChangeDetail } from './quantity-input';
export type { PlotChart, PlotLine, PlotMark, BarChart, Bar, TimerPad, TimeCapturedDetail, TimerMode } from './instruments';

/** Defines the timer pad and the charts; resolves with their module once they are defined. */
export function loadInstruments(): Promise<typeof import('./instruments')> {
  return import('./instruments');
}
