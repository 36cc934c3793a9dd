const BACKOFF_FIRST_MS = 2_000
const BACKOFF_MAX_MS = 5 * 60_000

/** Exponential backoff, jittered over its upper half so many devices do not retry in step. */
export function backoffDelay(attempt: number, random = Math.random) {
  const ceiling = Math.min(BACKOFF_MAX_MS, BACKOFF_FIRST_MS * 2 ** Math.max(0, attempt - 1))
  return Math.round(ceiling * (0.5 + random() * 0.5))
}
