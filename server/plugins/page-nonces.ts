import { withNonce } from '../utils/page-nonces'

// nuxt-security puts the page's nonce on its tags by rewriting every piece of a rendered page whole: the app's
// markup and its data payload, masking each of their quoted strings (3 % of /today's CPU, 7 % of /exercises').
// The markup holds no such tag and the payload one or two, so this hook (which runs before the module's) gives
// the same tags the same nonce by inserting it where they are, then marks the page done so the module does not
// do it again. The module's SRI hook still runs after this one, so each `integrity` now comes before the nonce
// instead of after it (the same attributes; tests/unit/page-nonces.test.ts compares the two injections).
export default defineNitroPlugin((nitroApp) => {
  nitroApp.hooks.hook('render:html', (html, { event }) => {
    const security = event.context.security
    const rules = security?.rules
    const nonce = security?.nonce
    if (!rules?.enabled || !rules.headers || !rules.headers.contentSecurityPolicy || !rules.nonce || !nonce) return
    for (const section of ['body', 'bodyAppend', 'bodyPrepend', 'head'] as const) {
      html[section] = html[section].map(piece => typeof piece === 'string' ? withNonce(piece, nonce) : piece)
    }
    rules.nonce = false
  })
})
