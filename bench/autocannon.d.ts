// The part of autocannon 9's API the benchmarks use (the package ships no types).
declare module "autocannon" {
  interface Histogram {
    average: number;
    mean: number;
    stddev: number;
    min: number;
    max: number;
    p50: number;
    p90: number;
    p97_5: number;
    p99: number;
    p99_9: number;
    total: number;
  }
  interface RawRequest {
    method?: string;
    path?: string;
    headers?: Record<string, string>;
    body?: string;
  }
  interface Options {
    url: string;
    connections?: number;
    duration?: number;
    overallRate?: number;
    timeout?: number;
    headers?: Record<string, string>;
    requests?: { method?: string; path?: string; setupRequest?: (req: RawRequest) => RawRequest }[];
  }
  interface Result {
    requests: Histogram;
    latency: Histogram;
    throughput: Histogram;
    errors: number;
    timeouts: number;
    non2xx: number;
    duration: number;
    "2xx": number;
  }
  function autocannon(opts: Options): Promise<Result>;
  export default autocannon;
}
