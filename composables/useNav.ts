import { plural } from '#shared/utils/vocabulary'

export interface NavLink {
  to: string
  label: string
  /** A count shown beside the label, with words for screen readers. */
  badge?: { count: number, label: string }
}

/** The main navigation for the signed-in role. */
export function useNav() {
  const { session, loggedIn } = useUserSession()
  const openPainFlags = useOpenPainFlagCount()
  const links = computed<NavLink[]>(() => {
    if (!loggedIn.value) return []
    const role = session.value?.role
    if (role === 'coach' || role === 'head_coach') {
      return [
        { to: '/coach', label: 'Overview' },
        { to: '/exercises', label: 'Library' },
        { to: '/routines', label: 'Routines' },
        { to: '/planner', label: 'Planner' },
        { to: '/blocks', label: 'Blocks' },
        { to: '/insights', label: 'Insights', badge: openPainFlags.value ? { count: openPainFlags.value, label: plural(openPainFlags.value, 'open pain report') } : undefined },
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
