/**
 * Gives the main thread back to the browser for a moment (to paint, or to answer a tap) and resumes after:
 * long start-up work split this way runs as several short tasks instead of one long one.
 */
export function yieldToBrowser(): Promise<void> {
  const scheduler = (globalThis as { scheduler?: { yield?: () => Promise<void> } }).scheduler
  if (scheduler?.yield) return scheduler.yield()
  return new Promise(resolve => setTimeout(resolve, 0))
}
