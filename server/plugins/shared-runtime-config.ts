// Nitro's useRuntimeConfig(event) copies the whole runtime config and applies every NUXT_* variable again
// on each request (and on each internal fetch of a server-rendered page): about 5 % of a rendered page's
// CPU in the profile. The environment does not change while the server runs, so each request is handed
// the config built at start instead. Nothing in the app writes to the runtime config.
export default defineNitroPlugin((nitroApp) => {
  const shared = useRuntimeConfig()
  nitroApp.hooks.hook('request', (event) => {
    event.context.nitro ??= { errors: [] }
    event.context.nitro.runtimeConfig ??= shared
  })
})
