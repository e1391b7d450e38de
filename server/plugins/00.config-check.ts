// Fail fast in production rather than run with sessions that anyone could forge.
export default defineNitroPlugin(() => {
  const config = useServerConfig()
  if (config.production && config.sessionPassword.length < 32) {
    console.error('NUXT_SESSION_PASSWORD must be set to a secret of at least 32 characters in production.')
    process.exit(1)
  }
})
