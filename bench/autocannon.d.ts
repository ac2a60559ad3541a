// The part of autocannon 9's API the load test uses (the package ships no types).
declare module "autocannon" {
  interface Histogram {
    average: number;
    p50: number;
    p97_5: number;
    p99: number;
    max: number;
  }
  interface Client {
    setHeaders(headers: Record<string, string>): void;
  }
  interface Options {
    url: string;
    method?: string;
    connections?: number;
    duration?: number;
    maxOverallRequests?: number;
    timeout?: number;
    headers?: Record<string, string>;
    body?: string;
    setupClient?: (client: Client) => void;
  }
  interface Result {
    duration: number;
    errors: number;
    timeouts: number;
    non2xx: number;
    latency: Histogram;
    requests: Histogram;
  }
  interface Instance {
    on(event: "done", listener: (result: Result) => void): void;
    on(
      event: "response",
      listener: (client: Client, statusCode: number, resBytes: number, responseTime: number) => void,
    ): void;
  }
  function autocannon(options: Options): Instance;
  namespace autocannon {
    export type { Client, Instance, Options, Result };
  }
  export default autocannon;
}
