/** A short, readable rendering of an offending value for messages: numbers as written, text quoted, long values cut
 *  (a refusal quotes an excerpt, never the megabyte a hostile file may hold). */
export function formatValue(value: unknown): string {
  if (typeof value === 'number') return String(value);
  if (typeof value === 'string') return value.length > 80 ? `${JSON.stringify(value.slice(0, 77))}... (${value.length} characters)` : JSON.stringify(value);
  if (value === undefined) return '(missing)';
  try {
    const text = JSON.stringify(value);
    if (text === undefined) return String(value);
    return text.length > 80 ? `${text.slice(0, 77)}...` : text;
  } catch {
    // A cycle, a BigInt, or nesting too deep for the engine's stack: say what kind of value it was, without
    // walking it again (String() of a deeply nested list recurses as deep as JSON did).
    if (Array.isArray(value)) return `a list of ${value.length}`;
    if (value !== null && typeof value === 'object') return 'an object';
    return String(value);
  }
}
