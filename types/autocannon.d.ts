// autocannon 9 ships no types; the part scripts/bench-load.ts uses.
declare module 'autocannon' {
  interface Options {
    url: string
    connections?: number
    duration?: number
    method?: string
    headers?: Record<string, string>
  }
  interface Result {
    'requests': { total: number, average: number }
    'errors': number
    'timeouts': number
    'non2xx': number
    '2xx': number
    '3xx'?: number
    'latency': { max: number }
  }
  interface Instance {
    on(event: 'response', listener: (client: unknown, statusCode: number, resBytes: number, responseTime: number) => void): void
    then: Promise<Result>['then']
  }
  function autocannon(options: Options): Instance
  export default autocannon
}
