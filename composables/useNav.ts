import { plural } from '#shared/utils/vocabulary'
import { h, type Component, type FunctionalComponent } from 'vue'
import { CalendarCheck, CalendarRange, Clapperboard, NotebookPen, TrendingUp, UserRound } from 'lucide-vue-next'
import { LazyNavCoachIcon } from '#components'
import type { NavCoachIconName } from '~/components/nav/NavCoachIcon.vue'

export interface NavLink {
  to: string
  label: string
  /** A count shown beside the label, with words for screen readers. */
  badge?: { count: number, label: string }
  icon: Component
}

/** An icon of the coaches' navigation, loaded with the first coach page rather than with every athlete's page. */
export function coachNavIcon(name: NavCoachIconName): FunctionalComponent {
  const icon: FunctionalComponent = (_props, { attrs }) => h(LazyNavCoachIcon, { ...attrs, name })
  icon.inheritAttrs = false
  return icon
}
// Made once, so a link keeps the same icon component each time the list is worked out again.
const coachIcons = {
  overview: coachNavIcon('overview'),
  library: coachNavIcon('library'),
  routines: coachNavIcon('routines'),
  planner: coachNavIcon('planner'),
  insights: coachNavIcon('insights'),
  team: coachNavIcon('team'),
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
        { to: '/coach', label: 'Overview', icon: coachIcons.overview },
        { to: '/exercises', label: 'Library', icon: coachIcons.library },
        { to: '/routines', label: 'Routines', icon: coachIcons.routines },
        { to: '/planner', label: 'Planner', icon: coachIcons.planner },
        { to: '/blocks', label: 'Blocks', icon: CalendarRange },
        { to: '/insights', label: 'Insights', icon: coachIcons.insights, badge: openPainFlags.value ? { count: openPainFlags.value, label: plural(openPainFlags.value, 'open pain report') } : undefined },
        { to: '/reviews', label: 'Reviews', icon: Clapperboard, badge: openReviews.value ? { count: openReviews.value, label: plural(openReviews.value, 'clip waiting for an answer', 'clips waiting for an answer') } : undefined },
        { to: '/team', label: 'Team', icon: coachIcons.team },
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
