/**
 * How many things of one kind wait for a coach (`GET url` answers `{ open }`): fetched in the browser for
 * coaches only, again on each page change, so a badge follows what the coach just did.
 */
export function useCoachWaitingCount(key: string, url: string) {
  const { session, loggedIn } = useUserSession()
  const route = useRoute()
  const isCoach = computed(() => loggedIn.value && isCoachRole(session.value?.role))
  const { data } = useAsyncData(
    key,
    () => (isCoach.value ? $fetch<{ open: number }>(url) : Promise.resolve({ open: 0 })),
    { server: false, default: () => ({ open: 0 }), watch: [isCoach, () => route.path] },
  )
  return computed(() => data.value?.open ?? 0)
}
