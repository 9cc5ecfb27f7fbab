/** Types for scripts/serve.mjs (so TypeScript tests can start the server in-process). */
export interface StartServerOptions {
  /** Port to listen on; 0 picks a free one. Default 4173. */
  port?: number;
  /** Folder to serve. Default: the repository's dist/. */
  root?: string;
  /** Interface to bind. Default 127.0.0.1. */
  host?: string;
  /** Called with each request's path (including any query string) as it arrives. */
  onRequest?: (path: string) => void;
}

export interface RunningServer {
  /** Base URL with a trailing slash, e.g. http://127.0.0.1:4173/ */
  url: string;
  port: number;
  close(): Promise<void>;
}

export function startServer(opts?: StartServerOptions): Promise<RunningServer>;
