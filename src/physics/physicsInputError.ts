/**
 * The one error type the physics core throws for input it cannot use.
 *
 * Every instance names where the bad value came from (`field`, a JSON path such as
 * "air.relative_humidity_pct" or "drops[2].time_s"), the value itself and the allowed range
 * as text, so a screen or the command line can tell the user exactly what to fix.
 */
import { formatValue, PlummetError, type PlummetErrorOptions } from '../errors';

/** Stable codes: screens and tests match on these, never on the message text. */
export type PhysicsInputErrorCode =
  | 'missing-field'
  | 'wrong-type'
  | 'not-finite'
  | 'out-of-range'
  | 'unknown-field'
  | 'conflicting-fields'
  | 'dew-point-above-temperature'
  | 'vapour-pressure-above-total'
  | 'not-heavier-than-air'
  | 'faster-than-free-fall'
  | 'drag-unexplained'
  | 'offset-needs-three-heights'
  | 'missing-drag-coefficient'
  | 'solver-failed';

export interface PhysicsInputErrorDetails extends PlummetErrorOptions<PhysicsInputErrorCode> {
  field: string;
  allowed: string;
  /** What is wrong, in plain words; defaults to a sentence built from the code. */
  reason?: string;
}

export class PhysicsInputError extends PlummetError<PhysicsInputErrorCode> {
  declare readonly field: string;
  declare readonly allowed: string;

  constructor(details: PhysicsInputErrorDetails) {
    const reason = details.reason ?? defaultReason(details.code);
    super({ ...details, message: details.message ?? `${details.field} = ${formatValue(details.value)}: ${reason}; allowed: ${details.allowed}` });
    this.name = 'PhysicsInputError';
  }
}

function defaultReason(code: PhysicsInputErrorCode): string {
  switch (code) {
    case 'missing-field':
      return 'missing';
    case 'wrong-type':
      return 'wrong type';
    case 'not-finite':
      return 'not a finite number';
    case 'out-of-range':
      return 'out of range';
    case 'unknown-field':
      return 'not a field this request knows (a typo or a missing unit?)';
    case 'conflicting-fields':
      return 'conflicts with another field';
    case 'dew-point-above-temperature':
      return 'dew point above the air temperature is impossible';
    case 'vapour-pressure-above-total':
      return 'water vapour pressure would exceed the total pressure';
    case 'not-heavier-than-air':
      return 'the specimen is not heavier than the air it displaces, so it does not fall';
    case 'faster-than-free-fall':
      return 'faster than free fall: check the height and the timing';
    case 'drag-unexplained':
      return 'no finite drag explains this time: check the mass, the size and the timing';
    case 'offset-needs-three-heights':
      return 'a timing offset can only be fitted with drops from at least three distinct heights';
    case 'missing-drag-coefficient':
      return 'a drag coefficient is needed for this specimen';
    case 'solver-failed':
      return 'the solver did not converge';
  }
}
