// Comfort only: sends signed-out visitors to the sign-in page. The server enforces access itself.
const publicPages = new Set(['/sign-in', '/sign-up', '/about'])

export default defineNuxtRouteMiddleware(async (to) => {
  const session = useSessionStore()
  if (!session.loaded) {
    try {
      await session.refresh()
    } catch {
      session.apply({ user: null })
    }
  }
  // pages opened from an e-mail link (invitation, password reset) work signed in or out
  if (to.meta.linkPage) return
  if (publicPages.has(to.path)) {
    if (session.signedIn && to.path !== '/about') return navigateTo('/')
    return
  }
  if (!session.signedIn) return navigateTo({ path: '/sign-in', query: to.fullPath !== '/' ? { next: to.fullPath } : {} })
})
