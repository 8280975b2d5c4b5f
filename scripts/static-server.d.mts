export interface StaticServer {
  url: string;
  port: number;
  setRoot(dir: string): void;
  close(): Promise<void>;
}
export const CSP_REPORT_PATH: string;
export function startStaticServer(options: {
  root: string;
  port?: number;
  host?: string;
  /** Office folder origins the page may connect to, beside itself and this computer. */
  folderOrigins?: readonly string[];
  /** Receives each Content-Security-Policy violation report the browser posts (by default it is printed). */
  onCspReport?: (report: unknown) => void;
}): Promise<StaticServer>;
