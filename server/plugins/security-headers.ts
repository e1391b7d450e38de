// Run-time parts of the security headers (nuxt.config.ts `security` holds the rest): the object store's
// public origin for clips, posters and direct uploads, and HSTS plus upgrade-insecure-requests only
// when the app is served over HTTPS. Read from the environment at start, never baked into the build.
export default defineNitroPlugin((nitroApp) => {
  const config = useServerConfig()
  const storeOrigin = new URL(config.s3PublicEndpoint ?? config.s3Endpoint).origin
  const https = new URL(config.appUrl).protocol === 'https:'
  nitroApp.hooks.hook('nuxt-security:routeRules', (rules) => {
    const global = rules['/**'] ?? {}
    const headers = global.headers || {}
    const csp = typeof headers.contentSecurityPolicy === 'object' ? headers.contentSecurityPolicy : {}
    const withStore = (sources: unknown) => [...new Set([...(Array.isArray(sources) ? sources as string[] : []), storeOrigin])]
    rules['/**'] = {
      ...global,
      headers: {
        ...headers,
        contentSecurityPolicy: {
          ...csp,
          'media-src': withStore(csp['media-src']),
          'img-src': withStore(csp['img-src']),
          'connect-src': withStore(csp['connect-src']),
          'upgrade-insecure-requests': https,
        },
        strictTransportSecurity: https ? { maxAge: 31_536_000, includeSubdomains: true } : false,
      },
    }
  })
})
