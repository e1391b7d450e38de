import type { H3Event } from 'h3'
import type { NuxtRenderHTMLContext } from 'nuxt/app'
import { KeptAnswers } from '../utils/answer-cache'
import { cachedCaller } from '../utils/caller-cache'
import { sessionCookieName } from '../utils/auth'

// Rendered pages kept like the read routes' answers (server/utils/answer-cache.ts): until anything is written to
// the database or 30 s pass. Rendering a page is the same for the same request as long as the data is the same:
// it depends on the address, the cookies (the sign-in, the time zone), the browser's languages and the host,
// which together are the key. What differs between two renders is the CSP nonce; a kept page gets this
// request's nonce in place of the old one, and its CSP header is made by nuxt-security's own hooks as for a
// render. Only plain 200 pages whose data all arrived (plugins/kept-pages.server.ts) and that set no cookie are
// kept, and a signed-in page only while the sign-in is known to be live here: a sign-out, a revocation or a
// role change is a write, so it ends every kept page.
// Named 01 so that it sees the page before compress-pages.ts does. See docs/performance.md.
interface PageExtra { nonce: string | undefined, statusMessage: string | undefined, headers: Record<string, string> }

const pages = new KeptAnswers<PageExtra>(32 * 1024 * 1024, 1024 * 1024)

interface PageLookup { key: string, mark: string, hit: boolean }

function pageKey(event: H3Event) {
  const header = (name: string) => getRequestHeader(event, name) ?? ''
  return [header('host'), event.path, header('cookie'), header('accept-language')].join('\n')
}

/** Whether the sign-in this request carries, if any, is one this process has checked and not seen end. */
function signInKnownLive(event: H3Event) {
  const cookie = getCookie(event, sessionCookieName())
  return !cookie || cachedCaller(cookie) !== undefined
}

export default defineNitroPlugin((nitroApp) => {
  nitroApp.hooks.hook('render:before', async (context) => {
    const event = context.event
    if (event.method !== 'GET' || event.path.startsWith('/__nuxt')) return
    const mark = await KeptAnswers.currentMark()
    if (!mark) return
    const lookup: PageLookup = { key: pageKey(event), mark, hit: false }
    event.context.keptPage = lookup
    const hit = signInKnownLive(event) ? pages.get(lookup.key, mark) : undefined
    if (!hit) return
    lookup.hit = true
    // nuxt-security's render:html hooks put this request's nonce into its CSP header; the page has no parts
    // for them to change here, it is already whole.
    const empty = { island: false, htmlAttrs: [], head: [], bodyAttrs: [], bodyPrepend: [], body: [], bodyAppend: [] }
    await nitroApp.hooks.callHook('render:html', empty as unknown as NuxtRenderHTMLContext, { event })
    const nonce = (event.context.security as { nonce?: string } | undefined)?.nonce
    context.response = {
      body: hit.extra.nonce && nonce ? hit.body.replaceAll(hit.extra.nonce, nonce) : hit.body,
      statusCode: 200,
      statusMessage: hit.extra.statusMessage,
      headers: { ...hit.extra.headers },
    }
  })

  nitroApp.hooks.hook('render:response', (response, { event }) => {
    const lookup = event.context.keptPage as PageLookup | undefined
    // pageNotKept: some of the page's data failed (plugins/kept-pages.server.ts).
    if (!lookup || lookup.hit || event.context.pageNotKept || typeof response.body !== 'string') return
    if ((response.statusCode ?? 200) !== 200 || event.node.res.statusCode !== 200) return
    if (event.node.res.getHeader('set-cookie') !== undefined || !signInKnownLive(event)) return
    const nonce = (event.context.security as { nonce?: string } | undefined)?.nonce
    pages.set(lookup.key, lookup.mark, response.body, { nonce, statusMessage: response.statusMessage, headers: { ...response.headers } })
  })
})
