// Nitro's graceful stop (SIGTERM/SIGINT) stops taking connections, lets requests in flight finish
// (up to NITRO_SHUTDOWN_TIMEOUT), then runs the `close` hooks: the jobs' hooks (registered by the
// plugins before this one) wait for their runs; this last one closes the database and says so.
export default defineNitroPlugin((nitro) => {
  nitro.hooks.hook('close', async () => {
    await closeDb()
    logLine({ kind: 'shutdown', pid: process.pid })
  })
})
