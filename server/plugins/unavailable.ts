import { isUnavailable } from '../utils/transactions'

// A route that meets a database that is down (or a pool that cannot get a connection) would
// otherwise answer a bare 500. Every such error becomes one 503 with a sentence, before the
// usual error handler writes it, so the app can say "try again" and devices keep their changes.
export const UNAVAILABLE_MESSAGE = 'The shop server cannot reach its database. Try again in a moment; changes on this device are kept.'

export default defineNitroPlugin((nitroApp) => {
  const next = nitroApp.h3App.options.onError
  nitroApp.h3App.options.onError = (error, event) => {
    if (error.statusCode >= 500 && error.statusCode !== 503 && isUnavailable(error)) {
      setResponseHeader(event, 'retry-after', 5)
      error = createError({ statusCode: 503, statusMessage: 'Service Unavailable', message: UNAVAILABLE_MESSAGE })
    }
    return next?.(error, event)
  }
})
