/** The part of autocannon's programmatic API the load bench uses (the package ships no types). */
declare module 'autocannon' {
  interface Histogram {
    average: number;
    p50: number;
    p99: number;
    total: number;
  }
  interface Result {
    requests: Histogram;
    latency: Histogram;
    throughput: Histogram;
    errors: number;
    timeouts: number;
    non2xx: number;
  }
  interface Options {
    url: string;
    connections?: number;
    duration?: number;
    headers?: Record<string, string>;
  }
  function autocannon(options: Options): Promise<Result>;
  export default autocannon;
}
