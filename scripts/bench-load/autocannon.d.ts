// The part of autocannon's programmatic API the load benchmark uses (the package ships no types).
declare module "autocannon" {
  import type { EventEmitter } from "node:events";

  export type Request = {
    method?: "GET" | "POST";
    path: string;
    headers?: Record<string, string>;
    body?: string;
    /** Called before each send of this request; returns the request to send. */
    setupRequest?: (request: Request, context: Record<string, unknown>) => Request;
    onResponse?: (status: number, body: string, context: Record<string, unknown>, headers: Record<string, string>) => void;
  };

  export interface Client extends EventEmitter {
    setRequests(requests: Request[]): void;
    on(event: "response", listener: (status: number, bytes: number, durationMs: number) => void): this;
    /** The connection failed; the client connects again and moves on to its next request. */
    on(event: "connError", listener: (error: NodeJS.ErrnoException) => void): this;
    on(event: string, listener: (...args: unknown[]) => void): this;
  }

  export type Options = {
    url: string;
    connections: number;
    duration: number;
    pipelining?: number;
    timeout?: number;
    connectionRate?: number;
    setupClient?: (client: Client) => void;
  };

  export type Result = {
    requests: { average: number; total: number };
    errors: number;
    timeouts: number;
    duration: number;
    non2xx: number;
  };

  export default function autocannon(options: Options): Promise<Result> & { stop(): void };
}
