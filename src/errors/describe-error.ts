/**
 * A message for people from anything thrown: our coded errors (a record refused for several reasons lists every
 * one), a platform error, or a thrown value that is not an error at all.
 */
const LISTED = 10;

export function describeError(error: unknown): string {
  if (error && typeof error === 'object') {
    const e = error as { message?: unknown; problems?: Array<{ message?: string }> };
    if (Array.isArray(e.problems) && e.problems.length) {
      // Every problem, up to a readable few: a hostile file can hold thousands.
      const shown = e.problems.slice(0, LISTED).map((p) => p.message ?? String(p));
      if (e.problems.length > LISTED) shown.push(`(and ${e.problems.length - LISTED} more)`);
      return shown.join(' ');
    }
    // A PlummetError's message already names the field, the value and the allowed range.
    if (typeof e.message === 'string') return e.message;
  }
  return String(error);
}
