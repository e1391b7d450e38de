/** How many pain reports wait for a coach: fetched for coaches only, again on each page change. */
export function useOpenPainFlagCount() {
  return useCoachWaitingCount('open-pain-flag-count', '/api/pain-flags/open-count')
}
