export const BUDGETS: { firstScreenJs: number; cssGzip: number; precache: number };
export const CHROMIUM_ARGS: string[];
export function measureFiles(
  dist: string,
  budgets?: Partial<typeof BUDGETS>,
): { figures: { cssGzip: number; precache: number }; over: string[]; precacheRaw: number; files: { styles: string[]; precached: string[] } };
export interface ScriptFigure {
  file: string;
  /** gzip bytes received (the body as sent). */
  bytes: number;
  /** bytes on the wire, headers included. */
  wire: number;
}
export interface ScreenSpec {
  name: string;
  path?: string;
  seed?(page: unknown, baseUrl: string): Promise<string>;
  ready?(page: unknown): Promise<void>;
}
export interface ScreenFigures {
  name: string;
  path: string;
  scripts: ScriptFigure[];
  afterIdle: ScriptFigure[];
  total: number;
  wire: number;
  afterIdleTotal: number;
  idleMarked: boolean;
  over: boolean;
}
export const APP_SCREENS: ScreenSpec[];
export function measureFirstScreens(
  dist: string,
  options?: { chromiumPath?: string; screens?: ScreenSpec[]; budget?: number },
): Promise<{ screens: ScreenFigures[]; over: string[] }>;
