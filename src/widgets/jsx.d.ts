// Lets Preact screens use the Lit widgets as JSX elements with typed properties.
// Preact treats any prop starting with "on" as an event listener, so no widget property starts with "on".
import type { HTMLAttributes } from 'preact';
import type { QuantityInput } from './quantity-input';
import type { PlotChart } from './plot-chart';
import type { BarChart } from './bar-chart';

type WidgetProps<E, P extends keyof E> = Omit<HTMLAttributes<E>, P | 'value' | 'label' | 'min' | 'max'> & Partial<Pick<E, P>>;

declare module 'preact' {
  namespace JSX {
    interface IntrinsicElements {
      'pl-quantity': WidgetProps<
        QuantityInput,
        'label' | 'quantity' | 'unit' | 'value' | 'text' | 'min' | 'max' | 'minExclusive' | 'required' | 'delta' | 'hint' | 'decimalComma' | 'compact' | 'hemispheres' | 'enterHint'
      > & { 'onquantity-change'?: (event: CustomEvent) => void; 'onquantity-enter'?: (event: CustomEvent) => void };
      'pl-plot': WidgetProps<PlotChart, 'lines' | 'marks' | 'xLabel' | 'yLabel' | 'summary' | 'zeroLine'>;
      'pl-bars': WidgetProps<BarChart, 'bars' | 'heading'>;
    }
  }
}
