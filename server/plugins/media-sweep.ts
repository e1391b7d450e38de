// Clears abandoned clip uploads now and then (every 10 minutes unless MEDIA_SWEEP_INTERVAL_MS says
// otherwise). With several app processes on one database, a lease lets one of them run each interval.
export default defineNitroPlugin((nitro) => {
  const stop = scheduleLeasedJob('media-sweep', useServerConfig().mediaSweepIntervalMs, async () => ({ uploads: await sweepAbandonedUploads(), reviews: await sweepExpiredReviews() }))
  nitro.hooks.hook('close', stop)
})
