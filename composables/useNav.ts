export interface NavLink {
  to: string
  label: string
}

/** The main navigation for the signed-in role. */
export function useNav() {
  const { session, loggedIn } = useUserSession()
  const links = computed<NavLink[]>(() => {
    if (!loggedIn.value) return []
    const role = session.value?.role
    if (role === 'coach' || role === 'head_coach') {
      return [
        { to: '/coach', label: 'Overview' },
        { to: '/exercises', label: 'Library' },
        { to: '/routines', label: 'Routines' },
        { to: '/planner', label: 'Planner' },
        { to: '/insights', label: 'Insights' },
        { to: '/reviews', label: 'Reviews' },
        { to: '/team', label: 'Team' },
      ]
    }
    return [
      { to: '/today', label: 'Today' },
      { to: '/logbook', label: 'Logbook' },
      { to: '/progress', label: 'Progress' },
      { to: '/reviews', label: 'Reviews' },
      { to: '/profile', label: 'Profile' },
    ]
  })
  return { links }
}
