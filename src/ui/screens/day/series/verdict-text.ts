import { warningText } from '../../../unit-text';
// The words of a series' verdict, its flags and its advice, in the crew's units: one wording for the series
// screen, the day's list and the end-of-day summary, so they never read differently.
import type { MessageKind, SeriesAdvice, SeriesFlag, SeriesVerdict, TooFastTime } from '../../../../analysis';
import type { QuantityKind } from '../../../../widgets/units';

export type Format = (valueSI: number | null | undefined, kind: QuantityKind, decimals?: number) => string;

/** The Notice tone of each kind of message: three looks, the same everywhere. */
export const TONE_OF: Readonly<Record<MessageKind, 'bad' | 'warn' | 'info'>> = { problem: 'bad', warning: 'warn', info: 'info' };

export function plural(n: number, one: string, many = `${one}s`): string {
  return `${n} ${n === 1 ? one : many}`;
}

const pct = (x: number): string => `${(100 * x).toFixed(1)} %`;

/** The verdict in one line, for the top of the series screen and the day's rows. */
export function verdictLine(v: SeriesVerdict): string {
  const s = v.verdict;
  switch (s.state) {
    case 'blocked':
      return 'No result yet';
    case 'too-few':
      return `Verdict after ${s.drops_needed} drops (${s.drops_used} so far)`;
    case 'met':
      return `Target met: ${pct(s.relative_uncertainty)} of ${pct(s.target)}`;
    case 'not-met':
      return `Target not met yet: ${pct(s.relative_uncertainty)} of ${pct(s.target)}`;
    case 'unresolved':
      return `Target not met: drag not resolved`;
  }
}

/** The look of the verdict: met is good news, not met a warning, the rest information. */
export function verdictTone(v: SeriesVerdict): 'good' | 'warn' | 'info' | 'bad' {
  const s = v.verdict.state;
  return s === 'met' ? 'good' : s === 'not-met' || s === 'unresolved' ? 'warn' : s === 'blocked' ? 'bad' : 'info';
}

/** One flag in plain words. */
export function flagText(flag: SeriesFlag, format: Format): string {
  switch (flag.code) {
    case 'set-aside': {
      const { drop, vacuum_time_s, message } = flag.setAside;
      return vacuum_time_s !== null
        ? `Drop ${drop.seq} is left out: ${format(drop.time_s, 'time')} is shorter than a fall in vacuum (${format(vacuum_time_s, 'time')}). Check its time and its height.`
        : `Drop ${drop.seq} is left out: ${message ?? 'faster than a fall without drag'}.`;
    }
    case 'possible-outlier':
      return `Drop ${flag.seq ?? '?'}${flag.time_s !== null ? ` (${format(flag.time_s, 'time')})` : ''} from ${format(flag.height_m, 'length', 2)} stands apart from the others at that height, more than chance explains at 95 % confidence (Grubbs’ test: ${flag.statistic.toFixed(2)} against ${flag.critical_value.toFixed(2)}). It stays in: look at it, and leave it out only with a reason.`;
    case 'physics':
      // The physics writes SI sentences: shown in the crew's units.
      return warningText(flag.warning, format);
  }
}

/** A short title for a flag's box. */
export function flagTitle(flag: SeriesFlag): string | undefined {
  return flag.code === 'possible-outlier' ? 'A drop stands apart' : flag.code === 'set-aside' ? 'A time no fall can make' : undefined;
}

/** The advice in the crew's units, with counts that agree with their nouns. */
export function adviceText(advice: SeriesAdvice, format: Format): string {
  switch (advice.kind) {
    case 'more':
      return `${plural(advice.more, 'more drop')} from ${format(advice.height_m, 'length', 1)} ${advice.more === 1 ? 'reaches' : 'reach'} the target.`;
    case 'scatter':
      return `By the declared timing, the drops made so far should already reach the target: they scatter more than expected. Look at the timing and at any drop standing apart before adding more.`;
    case 'elsewhere':
      return `This height and timing cannot reach the target in a practical number of drops. ${plural(advice.drops, 'drop')} from ${format(advice.height_m, 'length', 1)} or higher can.`;
    case 'cannot':
      return advice.floor !== null
        ? `No height can reach the target: the size, mass, height and air uncertainties alone give ${pct(advice.floor)}, whatever the number of drops.`
        : 'No height the crew can reach gets there with this timing: time more precisely.';
  }
}

/** Why a typed time is refused at entry: the drop, the vacuum time, and what to check. */
export function tooFastText(t: TooFastTime, format: Format): string {
  return `Drop ${t.seq}: ${format(t.time_s, 'time')} is shorter than a fall in vacuum from ${format(t.height_m, 'length', 2)} (${format(t.vacuum_time_s, 'time')}), so it cannot be right. Check the time as typed (a lost digit?), this drop's release height, and that the timer started at the release.`;
}
