type WriteChecks = typeof import('./write-checks');

let loading: Promise<WriteChecks> | null = null;

/** The write checks (write-checks.ts), loaded once; awaited before a write transaction opens, never inside one. */
export function loadWriteChecks(): Promise<WriteChecks> {
  loading ??= import('./write-checks');
  return loading;
}
