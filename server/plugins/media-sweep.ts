// Clears abandoned clip uploads now and then (every 10 minutes unless MEDIA_SWEEP_INTERVAL_MS says otherwise).
export default defineNitroPlugin((nitro) => {
  const interval = useServerConfig().mediaSweepIntervalMs
  const timer = setInterval(() => {
    sweepAbandonedUploads().catch(error => console.error('Media sweep failed:', error))
  }, interval)
  timer.unref()
  nitro.hooks.hook('close', () => clearInterval(timer))
})
