// Lets Preact screens use <pl-timer-pad> as a JSX element with typed properties and events.
// Preact sets a prop as a property when the element has it (every Lit property below), and takes a prop
// starting with "on" as a listener for the event named by the rest: ontime-captured → "time-captured".
import type { HTMLAttributes } from 'preact';
import type { TimeCapturedDetail, TimerMode, TimerPad } from './timer-pad';

type TimerPadProps = 'label' | 'mode' | 'releaseDistance' | 'landingDistance' | 'airTemperature' | 'releaseHeight' | 'disabled' | 'decimalComma' | 'units';

declare module 'preact' {
  namespace JSX {
    interface IntrinsicElements {
      'pl-timer-pad': Omit<HTMLAttributes<TimerPad>, TimerPadProps> &
        Partial<Pick<TimerPad, TimerPadProps>> & {
          'ontime-captured'?: (event: CustomEvent<TimeCapturedDetail>) => void;
          'onmode-change'?: (event: CustomEvent<{ mode: TimerMode }>) => void;
        };
    }
  }
}
