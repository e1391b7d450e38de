// Shapes the experience only: the server checks every call on its own.
const publicPages = ['/login', '/register', '/reset', '/join']

export default defineNuxtRouteMiddleware((to) => {
  const { loggedIn, session } = useUserSession()
  const isPublic = publicPages.some(prefix => to.path === prefix || to.path.startsWith(`${prefix}/`)) || to.meta.public === true
  if (!loggedIn.value) {
    // `/` is the front page for signed-out visitors.
    if (isPublic || to.path === '/') return
    return navigateTo({ path: '/login', query: { next: to.fullPath } })
  }
  const isCoach = isCoachRole(session.value?.role)
  if (to.path === '/login' || to.path === '/register' || to.path === '/') return navigateTo(isCoach ? '/coach' : '/today')
  if (to.meta.coachOnly && !isCoach) return navigateTo('/today')
})
