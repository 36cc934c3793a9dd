// Whatever clears a session cookie (sign-out, a new sign-in on the device, a refused cookie, the
// module's own DELETE /api/_auth/session) also deletes its row, so a copy of the cookie is dead too.
export default defineNitroPlugin(() => {
  sessionHooks.hook('clear', async (session) => {
    await deleteSessionRow(session.secure?.sid)
  })
})
