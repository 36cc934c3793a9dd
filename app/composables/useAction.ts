export const NEEDS_CONNECTION = 'This needs a connection to the shop server. Your other work stays on this device.'

/**
 * What went wrong, in words: no answer from the server (offline) says so; the server's message
 * or a local refusal's own sentence otherwise.
 */
export function wordsOf(e: unknown, offline = NEEDS_CONNECTION): string {
  const fromFetch = !!e && typeof e === 'object' && ((e as Error).name === 'FetchError' || 'statusCode' in e)
  if (fromFetch && statusOf(e) === undefined) return offline
  return messageOf(e) || (e instanceof Error ? e.message : '') || 'Something went wrong. Try again.'
}

/** A button's busy flag and the words of its last failure; `act` answers whether the action went through. */
export function useAction(opts: { offline?: string } = {}) {
  const busy = ref(false)
  const problem = ref('')
  async function act(fn: () => Promise<unknown>): Promise<boolean> {
    problem.value = ''
    busy.value = true
    try {
      await fn()
      return true
    }
    catch (e) {
      problem.value = wordsOf(e, opts.offline)
      return false
    }
    finally {
      busy.value = false
    }
  }
  return { busy, problem, act }
}
