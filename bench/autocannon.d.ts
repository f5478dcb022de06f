// autocannon ships no types; this is the part of its API the benchmark uses.
declare module 'autocannon' {
  import type { EventEmitter } from 'node:events';

  type Options = {
    url: string;
    connections?: number;
    duration?: number;
    amount?: number;
    pipelining?: number;
    timeout?: number;
    headers?: Record<string, string>;
  };
  type Result = {
    requests: { average: number; total: number };
    latency: { p50: number; p90: number; p99: number; average: number; max: number };
    throughput: { average: number };
    errors: number;
    timeouts: number;
    non2xx: number;
    duration: number;
  };
  interface Instance extends EventEmitter {
    on(
      event: 'response',
      listener: (
        client: unknown,
        statusCode: number,
        resBytes: number,
        responseTime: number,
      ) => void,
    ): this;
    on(event: string, listener: (...args: unknown[]) => void): this;
  }
  function autocannon(
    options: Options,
    done?: (err: Error | null, result: Result) => void,
  ): Instance;
  export default autocannon;
  export type { Result };
}
