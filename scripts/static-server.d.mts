export interface StaticServer {
  url: string;
  port: number;
  setRoot(dir: string): void;
  close(): Promise<void>;
}
export function startStaticServer(options: { root: string; port?: number; host?: string }): Promise<StaticServer>;
