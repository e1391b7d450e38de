/** How many pain reports wait for a coach: fetched for coaches only, again on each page change. */
export function useOpenPainFlagCount() {
  const { session, loggedIn } = useUserSession()
  const route = useRoute()
  const isCoach = computed(() => loggedIn.value && (session.value?.role === 'coach' || session.value?.role === 'head_coach'))
  const { data } = useAsyncData(
    'open-pain-flag-count',
    () => (isCoach.value ? $fetch<{ open: number }>('/api/pain-flags/open-count') : Promise.resolve({ open: 0 })),
    { server: false, default: () => ({ open: 0 }), watch: [isCoach, () => route.path] },
  )
  return computed(() => data.value?.open ?? 0)
}
