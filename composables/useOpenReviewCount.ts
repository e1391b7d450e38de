/** How many form-review clips wait for a coach's answer: fetched for coaches only, again on each page change. */
export function useOpenReviewCount() {
  return useCoachWaitingCount('open-review-count', '/api/reviews/open-count')
}
