// Just the parts of autocannon 8 the Tally's benchmark uses (the package ships no types).
declare module 'autocannon' {
  interface Request {
    method?: string;
    path?: string;
    headers?: Record<string, string>;
    body?: string;
    setupRequest?: (req: Request, context: Record<string, unknown>) => Request;
  }
  interface Histogram {
    average: number;
    mean: number;
    p50: number;
    p90: number;
    p97_5: number;
    p99: number;
    max: number;
    total: number;
  }
  interface Result {
    requests: Histogram;
    latency: Histogram;
    errors: number;
    timeouts: number;
    non2xx: number;
    '2xx': number;
  }
  interface Options {
    url: string;
    connections?: number;
    duration?: number;
    amount?: number;
    requests?: Request[];
  }
  function autocannon(options: Options): Promise<Result>;
  export default autocannon;
}
