// Server throughput with autocannon: 50 connections for 10 s against one route, beside
// GET /api/health (one `select 1`) measured in the same run. p95 comes from every response's time.
import autocannon from 'autocannon'

export interface LoadFigures { rps: number, p95: number, requests: number, errors: number, non2xx: number }

interface Req { method?: string, path?: string, headers?: Record<string, string>, body?: string }
interface Options {
  url: string
  headers?: Record<string, string>
  /** Builds each request; `conn` is one object per connection (its own state). */
  next?: (conn: Record<string, unknown>) => Req
  connections?: number
  duration?: number
}

export async function load({ url, headers = {}, next, connections = 50, duration = 10 }: Options): Promise<LoadFigures> {
  const times: number[] = []
  const instance = autocannon({
    url,
    connections,
    duration,
    headers,
    // A slow answer counts in p95 instead of being dropped as an error.
    timeout: 30,
    requests: next ? [{ setupRequest: (req: Req, context: Record<string, unknown>) => ({ ...req, ...next(context) }) }] : undefined,
  })
  instance.on('response', (_client: unknown, status: number, _bytes: number, responseTime: number) => {
    if (status < 400) times.push(responseTime)
  })
  const result = await instance
  times.sort((a, b) => a - b)
  return {
    rps: result.requests.total / (result.duration || duration),
    p95: times.length ? times[Math.min(times.length - 1, Math.floor(times.length * 0.95))]! : Number.NaN,
    requests: result.requests.total,
    errors: result.errors + result.timeouts,
    non2xx: result.non2xx,
  }
}
