// The background sender: every few seconds it picks up due messages (new ones are also kicked at once).
export default defineNitroPlugin((nitro) => {
  const timer = setInterval(() => {
    processOutbox().catch(error => console.error('Outbox run failed:', error))
  }, useServerConfig().outboxIntervalMs)
  timer.unref()
  nitro.hooks.hook('close', () => clearInterval(timer))
})
