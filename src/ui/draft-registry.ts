/** Forms register how to save their unsaved input at once, so an update or a navigation never drops it. */
const flushers = new Set<() => Promise<void> | void>();

export function registerDraftFlusher(flush: () => Promise<void> | void): () => void {
  flushers.add(flush);
  return () => flushers.delete(flush);
}

export async function flushAllDrafts(): Promise<void> {
  await Promise.allSettled([...flushers].map((f) => f()));
}
