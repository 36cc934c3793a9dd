/** A button's busy flag and the words of its last failure; `act` answers whether the action went through. */
export function useAction() {
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
      problem.value = problemOf(e)
      return false
    }
    finally {
      busy.value = false
    }
  }
  return { busy, problem, act }
}
