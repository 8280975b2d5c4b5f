export const BUDGETS: { initialJsGzip: number; cssGzip: number; precache: number };
export function measure(
  dist: string,
  budgets?: Partial<typeof BUDGETS>,
): { figures: typeof BUDGETS; over: string[]; precacheRaw: number; files: { initialJs: string[]; styles: string[]; precached: string[] } };
