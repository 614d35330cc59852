/** The slice of autocannon 8 the service benchmark uses (the package ships no types). */
declare module 'autocannon' {
  export interface Stats { p50: number; p90: number; p97_5: number; p99: number; average: number; max: number }
  export interface Result { latency: Stats; requests: Stats; non2xx: number; errors: number; timeouts: number }
  interface Options { url: string; connections?: number; duration?: number; headers?: Record<string, string> }
  function autocannon(options: Options): Promise<Result>;
  export default autocannon;
}
