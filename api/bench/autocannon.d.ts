// The few parts of autocannon 8 the load benchmarks use (the package ships no types).
declare module 'autocannon' {
  interface Histogram {
    average: number;
    mean: number;
    p50: number;
    p90: number;
    p99: number;
    max: number;
  }
  interface Request {
    method?: string;
    path: string;
    headers?: Record<string, string>;
  }
  interface Options {
    url: string;
    connections?: number;
    duration?: number;
    amount?: number;
    pipelining?: number;
    headers?: Record<string, string>;
    requests?: Request[];
  }
  interface Result {
    requests: Histogram & { total: number };
    latency: Histogram;
    errors: number;
    timeouts: number;
    non2xx: number;
    '2xx': number;
  }
  function autocannon(options: Options): Promise<Result>;
  export = autocannon;
}
