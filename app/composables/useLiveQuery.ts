import { liveQuery, type Subscription } from 'dexie'
import type { Ref, WatchSource } from 'vue'

/**
 * A Dexie query as a Vue ref that follows the database (this tab and others). The query is
 * re-subscribed whenever `deps` change (for example the signed-in user or the active shop).
 */
export function useLiveQuery<T>(query: () => T | Promise<T>, deps: WatchSource | WatchSource[], initial: T): Ref<T> {
  const result = shallowRef(initial) as Ref<T>
  let sub: Subscription | undefined
  watch(deps, () => {
    sub?.unsubscribe()
    sub = liveQuery(query).subscribe({
      next: (value) => {
        result.value = value
      },
      error: (e: unknown) => console.error('on-device query failed', e),
    })
  }, { immediate: true })
  onScopeDispose(() => sub?.unsubscribe())
  return result
}
