// Starts the on-device store, background sync and the photo queue once the first page is on
// screen and someone is signed in: the sync engine, Dexie and the stores load in their own
// chunks, so no page waits for them.
export default defineNuxtPlugin((nuxtApp) => {
  let asked = false
  const start = () => {
    if (asked) return
    asked = true
    // Signed out there is nothing to sync: the engine and Dexie load once someone signs in.
    const session = useSessionStore()
    const load = () => void import('~/utils/sync/start').then(({ startSync }) => startSync())
    if (session.signedIn) return load()
    const stop = watch(() => session.signedIn, (signedIn) => {
      if (!signedIn) return
      stop()
      load()
    })
  }
  const idle = (fn: () => void) => ('requestIdleCallback' in window ? window.requestIdleCallback(fn, { timeout: 1000 }) : setTimeout(fn, 100))
  // After the frame that shows the first page, when the browser has a moment.
  nuxtApp.hooks.hookOnce('page:finish', () => {
    requestAnimationFrame(() => idle(start))
  })
  // A first screen with no page (the error page) still gets its sync, a little later.
  nuxtApp.hook('app:mounted', () => {
    setTimeout(start, 3000)
  })
})
