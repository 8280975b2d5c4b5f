import { PhysicsInputError } from './physicsInputError';

/**
 * Guards shared by every entry point: a number must be finite and inside its range, and the
 * error names the field, the value and the range.
 */
export interface NumberRange {
  /** Lower limit; `minExclusive` makes it strict. */
  min?: number;
  max?: number;
  minExclusive?: boolean;
  maxExclusive?: boolean;
  /** How the range reads to a person, e.g. "0 to 100 %". */
  text: string;
}

export function checkNumber(field: string, value: unknown, range: NumberRange): number {
  if (value === undefined || value === null) {
    throw new PhysicsInputError({ code: 'missing-field', field, value, allowed: range.text });
  }
  if (typeof value !== 'number') {
    throw new PhysicsInputError({ code: 'wrong-type', field, value, allowed: `a number, ${range.text}` });
  }
  if (!Number.isFinite(value)) {
    throw new PhysicsInputError({ code: 'not-finite', field, value, allowed: range.text });
  }
  const belowMin =
    range.min !== undefined && (range.minExclusive === true ? value <= range.min : value < range.min);
  const aboveMax =
    range.max !== undefined && (range.maxExclusive === true ? value >= range.max : value > range.max);
  if (belowMin || aboveMax) {
    throw new PhysicsInputError({ code: 'out-of-range', field, value, allowed: range.text });
  }
  return value;
}

export function checkOptionalNumber(field: string, value: unknown, range: NumberRange): number | undefined {
  if (value === undefined) return undefined;
  return checkNumber(field, value, range);
}
