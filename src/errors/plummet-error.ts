/**
 * The one error shape of the whole app. Every error we throw for input we cannot use says, for a program, a
 * stable `code` (screens, the office command and tests match on it, never on the message), the `field` the value
 * came from (a path such as "drops[2].time_s", or null when no single field is to blame), the offending `value`
 * and the `allowed` range in words (or null when no range applies, e.g. a server that did not answer); and, for
 * people, a `message` naming all three. Each layer has its own subclass with its own union of codes.
 */
import { formatValue } from './format-value';

export interface PlummetErrorOptions<C extends string = string> {
  code: C;
  /** Where the value came from, e.g. "drops[2].time_s"; null when no single field is to blame. */
  field: string | null;
  value: unknown;
  /** The allowed range or form in words, e.g. "> 0 s and ≤ 3600 s"; null when none applies. */
  allowed: string | null;
  /** The sentence for people; by default "field = value: not allowed; allowed: range". */
  message?: string;
  /** The error underneath (a platform error, a failed request), kept for debugging. */
  cause?: unknown;
}

/** What toJSON gives: only text and null, so it can go to stderr, a --json report or a stored sync state. */
export interface PlummetErrorJson {
  code: string;
  field: string | null;
  value: string;
  allowed: string | null;
  message: string;
}

export class PlummetError<C extends string = string> extends Error {
  readonly code: C;
  readonly field: string | null;
  readonly value: unknown;
  readonly allowed: string | null;

  constructor(options: PlummetErrorOptions<C>) {
    super(options.message ?? defaultMessage(options), options.cause === undefined ? undefined : { cause: options.cause });
    // Set by each subclass too: class names do not survive minification, and screens log `name`.
    this.name = 'PlummetError';
    this.code = options.code;
    this.field = options.field;
    this.value = options.value;
    this.allowed = options.allowed;
  }

  toJSON(): PlummetErrorJson {
    return { code: this.code, field: this.field, value: formatValue(this.value), allowed: this.allowed, message: this.message };
  }
}

function defaultMessage(o: PlummetErrorOptions): string {
  const allowed = o.allowed === null ? '' : `; allowed: ${o.allowed}`;
  return `${o.field ?? '(input)'} = ${formatValue(o.value)}: not allowed${allowed}`;
}
