// Any method on an /api path no route file answers. Answered here rather than thrown, so a
// browser asking for HTML still gets JSON, never the app's shell or error page.
export default defineEventHandler((event) => {
  setResponseStatus(event, 404, 'Not Found')
  setResponseHeader(event, 'content-type', 'application/json')
  return { statusCode: 404, statusMessage: 'Not Found', message: 'No such API route', url: event.path }
})
