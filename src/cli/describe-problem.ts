/**
 * How the office command prints a coded error for people: its message, then where, what and which rule, one per
 * line, so a person reads the sentence and a script can pick the lines. Values are shown as JSON, cut at 80
 * characters (a hostile file's value is never echoed whole).
 */
import { PlummetError } from '../errors';

export const shownValue = (value: unknown): string => {
  const text = JSON.stringify(value) ?? 'undefined';
  return text.length > 80 ? `${text.slice(0, 77)}...` : text;
};

/** The error as printed: the message, then field, value, rule (or allowed) and code, each on its own line. */
export function describeProblem(error: PlummetError, prefix = '', ruleLabel: 'rule' | 'allowed' = 'allowed'): string {
  return (
    `${prefix}${error.message}\n  field: ${error.field ?? '(none)'}\n  value: ${shownValue(error.value)}\n` +
    `  ${ruleLabel}: ${error.allowed ?? '(none)'}\n  code: ${error.code}\n`
  );
}

/** The stack overflows only on input nested deeper than any check walks; said as such, never as a stack trace. */
export const isStackOverflow = (error: unknown): boolean => error instanceof RangeError && /call stack/i.test(error.message);

/** A fault of our own as printed (exit 2): its message; the stack only when PLUMMET_DEBUG is set. */
export function describeFault(what: string, error: unknown): string {
  const debug = Boolean(process.env['PLUMMET_DEBUG']);
  const reason = error instanceof Error ? (debug ? (error.stack ?? error.message) : `${error.name}: ${error.message}`) : String(error);
  return `internal error while ${what}: ${reason}\n(this is a fault of the office command; set PLUMMET_DEBUG=1 for its stack)\n`;
}
