import { plural } from '#shared/utils/vocabulary'
import type { Component } from 'vue'
import { CalendarCheck, CalendarDays, CalendarRange, ChartLine, Clapperboard, LayoutDashboard, Library, ListOrdered, NotebookPen, TrendingUp, UserRound, Users } from 'lucide-vue-next'

export interface NavLink {
  to: string
  label: string
  /** A count shown beside the label, with words for screen readers. */
  badge?: { count: number, label: string }
  icon: Component
}

/** The main navigation for the signed-in role. */
export function useNav() {
  const { session, loggedIn } = useUserSession()
  const openPainFlags = useOpenPainFlagCount()
  const openReviews = useOpenReviewCount()
  const route = useRoute()
  const isCoach = computed(() => isCoachRole(session.value?.role))
  const links = computed<NavLink[]>(() => {
    if (!loggedIn.value) return []
    if (isCoach.value) {
      return [
        { to: '/coach', label: 'Overview', icon: LayoutDashboard },
        { to: '/exercises', label: 'Library', icon: Library },
        { to: '/routines', label: 'Routines', icon: ListOrdered },
        { to: '/planner', label: 'Planner', icon: CalendarDays },
        { to: '/blocks', label: 'Blocks', icon: CalendarRange },
        { to: '/insights', label: 'Insights', icon: ChartLine, badge: openPainFlags.value ? { count: openPainFlags.value, label: plural(openPainFlags.value, 'open pain report') } : undefined },
        { to: '/reviews', label: 'Reviews', icon: Clapperboard, badge: openReviews.value ? { count: openReviews.value, label: plural(openReviews.value, 'clip waiting for an answer', 'clips waiting for an answer') } : undefined },
        { to: '/team', label: 'Team', icon: Users },
      ]
    }
    return [
      { to: '/today', label: 'Today', icon: CalendarCheck },
      { to: '/logbook', label: 'Logbook', icon: NotebookPen },
      { to: '/progress', label: 'Progress', icon: TrendingUp },
      { to: '/reviews', label: 'Reviews', icon: Clapperboard },
      { to: '/profile', label: 'Profile', icon: UserRound },
    ]
  })
  const isCurrent = (link: NavLink) => route.path === link.to || route.path.startsWith(`${link.to}/`)
  /**
   * On phones athletes get a bar at the bottom (five destinations fit under the thumb) and coaches a
   * menu (eight do not). A running session keeps the whole bottom edge for its own controls.
   */
  const phoneStyle = computed<'bar' | 'menu' | 'none'>(() => {
    if (!links.value.length) return 'none'
    if (isCoach.value) return 'menu'
    return route.path.startsWith('/session/') ? 'none' : 'bar'
  })
  return { links, isCurrent, phoneStyle }
}
