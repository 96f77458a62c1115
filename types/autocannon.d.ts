// The part of autocannon 9 that bench/load.ts uses (the package ships no types).
declare module 'autocannon' {
  export interface Options {
    url: string;
    connections?: number;
    duration?: number;
    method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
    headers?: Record<string, string>;
    body?: string;
    timeout?: number;
  }
  export interface Histogram {
    average: number;
    mean: number;
    stddev: number;
    min: number;
    max: number;
    p50: number;
    p90: number;
    p97_5: number;
    p99: number;
    [percentile: string]: number;
  }
  export interface Result {
    url: string;
    duration: number;
    errors: number;
    timeouts: number;
    non2xx: number;
    mismatches: number;
    '1xx': number;
    '2xx': number;
    '3xx': number;
    '4xx': number;
    '5xx': number;
    latency: Histogram;
    requests: Histogram & { total: number };
    throughput: Histogram & { total: number };
  }
  function autocannon(options: Options): Promise<Result>;
  export default autocannon;
}
