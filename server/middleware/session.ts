// A session cookie is only as good as its row in `sessions`: signed out, ended by a password
// change, expired or from before sessions were kept, it is dropped here and the route sees no user.
export default defineEventHandler(async (event) => {
  if (event.path.startsWith('/api/')) await dropEndedSession(event)
})
