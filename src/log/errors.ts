/**
 * Errors of the record model. Each has a stable `code`, the offending `value` and, where there is one, the
 * `field` it came from, so a screen can point at the input and a log line can be searched for.
 */
import { PlummetError, type PlummetErrorOptions } from '../errors';

export type LogErrorCode =
  | 'record-invalid'
  | 'reason-required'
  | 'raw-immutable'
  | 'record-deleted'
  | 'id-missing'
  | 'device-mismatch'
  /** The random source handed in did not fill the bytes asked for. */
  | 'random-source-invalid';

export class LogError extends PlummetError<LogErrorCode> {
  constructor(options: PlummetErrorOptions<LogErrorCode>) {
    super(options);
    this.name = 'LogError';
  }
}

/** One thing wrong with a record: where, what it was, and the rule it broke. */
export interface Problem {
  /** Dotted path inside the record body, e.g. "shape.diameter_m" or "raw.timestamps_ms[1]". */
  path: string;
  value: unknown;
  /** The rule in plain words, e.g. "must be > 0 and ≤ 1000 kg". */
  rule: string;
  /** The whole sentence for a person: "mass_kg: 0 is out of range: must be > 0 and ≤ 1000 kg". */
  message: string;
}

/** How many problems a message lists; the rest are counted (all are in `problems`). */
const MESSAGE_PROBLEMS = 10;

/** A record refused before any write, with every problem found (not just the first); `field`, `value` and `allowed`
 *  are those of the first. */
export class LogValidationError extends LogError {
  constructor(
    readonly problems: Problem[],
    readonly kind: string,
  ) {
    super({
      code: 'record-invalid',
      field: problems[0]?.path ?? null,
      value: problems[0]?.value,
      allowed: problems[0]?.rule ?? null,
      message: `invalid ${kind}: ${problems.slice(0, MESSAGE_PROBLEMS).map((p) => p.message).join('; ')}${problems.length > MESSAGE_PROBLEMS ? `; and ${problems.length - MESSAGE_PROBLEMS} more` : ''}`,
    });
    this.name = 'LogValidationError';
  }
}
