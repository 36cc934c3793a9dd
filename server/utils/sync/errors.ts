const RETRYABLE = new Set(['ER_LOCK_DEADLOCK', 'ER_LOCK_WAIT_TIMEOUT'])
const UNAVAILABLE = new Set(['ECONNREFUSED', 'ECONNRESET', 'PROTOCOL_CONNECTION_LOST', 'ETIMEDOUT', 'ER_CON_COUNT_ERROR', 'EPIPE', 'ENOTFOUND', 'ER_SERVER_SHUTDOWN'])

function code(error: unknown): string | undefined {
  let e = error as { code?: string, cause?: unknown } | undefined
  for (let i = 0; e && i < 5; i++) {
    if (e.code) return e.code
    e = e.cause as typeof e
  }
  return undefined
}

export const isRetryable = (error: unknown) => RETRYABLE.has(code(error) ?? '')
export const isUnavailable = (error: unknown) => UNAVAILABLE.has(code(error) ?? '') || isRetryable(error)

/** Run a transaction, retrying deadlocks; a database that is down answers 503 and changes nothing. */
export async function withRetry<T>(fn: () => Promise<T>): Promise<T> {
  for (let attempt = 0; ; attempt++) {
    try {
      return await fn()
    }
    catch (error) {
      if (isRetryable(error) && attempt < 4) {
        await new Promise(r => setTimeout(r, 5 + Math.random() * 20 * (attempt + 1)))
        continue
      }
      if (isUnavailable(error)) throw createError({ statusCode: 503, message: 'The shop server cannot reach its database. Your changes stay on the device.' })
      throw error
    }
  }
}
