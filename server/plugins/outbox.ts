// The background sender: every few seconds it picks up due messages (new ones are also kicked at once).
// Its claims are atomic, so every process runs it; a graceful stop lets the pass in flight finish.
export default defineNitroPlugin((nitro) => {
  const timer = setInterval(() => {
    processOutbox().catch(error => logJob('outbox', { ok: false, error: errorSummary(error) }))
  }, useServerConfig().outboxIntervalMs)
  timer.unref()
  nitro.hooks.hook('close', async () => {
    clearInterval(timer)
    await stopOutbox()
  })
})
