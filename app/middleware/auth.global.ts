const PUBLIC = ['/signin', '/register']

export default defineNuxtRouteMiddleware(async (to) => {
  const session = useSessionStore()
  if (!session.checked) {
    // With a cached user, do not wait on the network (there may be none).
    if (session.signedIn) void session.refresh()
    else await session.refresh()
  }
  const isPublic = PUBLIC.includes(to.path) || to.path.startsWith('/invite/') || to.path.startsWith('/pay/')
  if (!session.signedIn && !isPublic) {
    return navigateTo({ path: '/signin', query: to.fullPath !== '/' ? { next: to.fullPath } : {} })
  }
  if (session.signedIn && (to.path === '/signin' || to.path === '/register')) return navigateTo('/')
})
