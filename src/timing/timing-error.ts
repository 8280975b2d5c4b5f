/**
 * The one error type the timing code throws or reports for a capture it cannot use.
 *
 * Like the physics core's errors, every instance names the field the value came from ("timestamps_ms[1]",
 * "distance_to_landing_m"), the offending value and the allowed range as text, so the timer pad can tell the
 * crew exactly what went wrong. Screens and tests match on `code`, never on the message.
 */
import { formatValue, PlummetError, type PlummetErrorOptions } from '../errors';

export type TimingErrorCode =
  /** A number that is NaN or infinite. */
  | 'not-finite'
  /** Not the number of taps or onsets a fall time needs (two). */
  | 'wrong-count'
  /** The impact came before the release. */
  | 'out-of-order'
  /** Shorter than any fall this app can time. */
  | 'too-short'
  /** Longer than any fall this app can time. */
  | 'too-long'
  /** A number outside its allowed range (a distance, a temperature). */
  | 'out-of-range'
  /** Distances no real placement of the phone can have. */
  | 'impossible-geometry'
  /** The audio stack inserted or lost samples between the two onsets, so the interval is not the true one. */
  | 'spans-gap';

export interface TimingErrorDetails extends PlummetErrorOptions<TimingErrorCode> {
  field: string;
  allowed: string;
  /** What is wrong, in plain words; defaults to a sentence built from the code. */
  reason?: string;
}

export class TimingError extends PlummetError<TimingErrorCode> {
  declare readonly field: string;
  declare readonly allowed: string;
  /** The plain-words part of the message, without field and range (for short notices). */
  readonly reason: string;

  constructor(details: TimingErrorDetails) {
    const reason = details.reason ?? defaultReason(details.code);
    super({ ...details, message: details.message ?? `${details.field} = ${formatValue(details.value)}: ${reason}; allowed: ${details.allowed}` });
    this.name = 'TimingError';
    this.reason = reason;
  }
}

function defaultReason(code: TimingErrorCode): string {
  switch (code) {
    case 'not-finite':
      return 'not a finite number';
    case 'wrong-count':
      return 'a fall time needs exactly two marks, release and impact';
    case 'out-of-order':
      return 'the impact is before the release';
    case 'too-short':
      return 'too short for a fall';
    case 'too-long':
      return 'too long for a fall';
    case 'out-of-range':
      return 'out of range';
    case 'impossible-geometry':
      return 'no placement of the phone gives these distances';
    case 'spans-gap':
      return 'the audio had a gap (inserted silence) between release and impact, so this interval is not the fall time';
  }
}
