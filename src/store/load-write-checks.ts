type WriteChecks = typeof import('./write-checks');

let loading: Promise<WriteChecks> | null = null;

/** The write checks (write-checks.ts), loaded once; awaited before a write transaction opens, never inside one. */
export function loadWriteChecks(): Promise<WriteChecks> {
  loading ??= import('./write-checks');
  return loading;
}

/**
 * Starts loading the write checks without waiting for them: the page calls this once it is idle, so the first
 * write does not need the network (the service worker precaches the chunk too, but a page it does not control
 * yet, or a page without it, would otherwise fail its first write offline).
 */
export function preloadWriteChecks(): void {
  void loadWriteChecks().catch(() => {
    loading = null;
  });
}
