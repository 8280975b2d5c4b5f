/** A message for people from any error the core, the store or the sync layer throws. */
export function describeError(error: unknown): string {
  if (error && typeof error === 'object') {
    const e = error as { message?: string; problems?: Array<{ message?: string }>; code?: string };
    if (Array.isArray(e.problems) && e.problems.length) {
      return e.problems.map((p) => p.message ?? String(p)).join(' ');
    }
    if (typeof e.message === 'string') return e.message;
  }
  return String(error);
}
