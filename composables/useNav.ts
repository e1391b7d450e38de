export interface NavLink {
  to: string
  label: string
}

/** The main navigation for the signed-in role. */
export function useNav() {
  const { session, loggedIn } = useUserSession()
  const links = computed<NavLink[]>(() => {
    if (!loggedIn.value) return []
    if (isCoachRole(session.value?.role)) {
      return [
        { to: '/coach', label: 'Overview' },
        { to: '/exercises', label: 'Library' },
        { to: '/routines', label: 'Routines' },
        { to: '/planner', label: 'Planner' },
        { to: '/insights', label: 'Insights' },
        { to: '/team', label: 'Team' },
      ]
    }
    return [
      { to: '/today', label: 'Today' },
      { to: '/logbook', label: 'Logbook' },
      { to: '/progress', label: 'Progress' },
      { to: '/profile', label: 'Profile' },
    ]
  })
  return { links }
}
