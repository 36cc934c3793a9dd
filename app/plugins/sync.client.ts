// Starts the on-device store, background sync and the photo queue once the first screen is up:
// the sync engine, Dexie and the stores load in their own chunk, so no page waits for them.
export default defineNuxtPlugin((nuxtApp) => {
  const started = useState('sync-started', () => false)
  const idle = (fn: () => void) => ('requestIdleCallback' in window ? window.requestIdleCallback(fn, { timeout: 1500 }) : setTimeout(fn, 200))
  nuxtApp.hook('app:mounted', () => {
    idle(() => {
      void import('~/utils/sync/start').then(({ startSync }) => {
        startSync()
        started.value = true
      })
    })
  })
})
