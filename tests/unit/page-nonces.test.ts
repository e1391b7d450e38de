import { readFileSync } from 'node:fs'
import { resolve } from 'node:path'
import { describe, expect, it } from 'vitest'
import { withNonce } from '../../server/utils/page-nonces'

// nuxt-security's own injection, read from its plugin file (the file itself imports Nitro's virtual modules).
function moduleInjection(): (html: string, nonce: string) => string {
  const source = readFileSync(resolve(import.meta.dirname, '../../node_modules/nuxt-security/dist/runtime/nitro/plugins/40-cspSsrNonce.js'), 'utf8')
  const start = source.indexOf('const LINK_RE')
  const end = source.indexOf('export default')
  if (start < 0 || end < start || !source.includes('function injectNonceToTags(')) {
    throw new Error('nuxt-security\'s nonce injection moved: compare server/utils/page-nonces.ts with its new code')
  }
  return new Function(`${source.slice(start, end)}\nreturn injectNonceToTags`)() as (html: string, nonce: string) => string
}

const NONCE = 'n0nce+/='

describe('page nonces', () => {
  const theirs = moduleInjection()

  it('puts the nonce on script, style and link tags, and nowhere else', () => {
    expect(withNonce('<script type="module" src="/_nuxt/a.js" crossorigin></script>', NONCE))
      .toBe(`<script nonce="${NONCE}" type="module" src="/_nuxt/a.js" crossorigin></script>`)
    expect(withNonce('<link rel="modulepreload" href="/b.js"><STYLE>p{}</STYLE>', NONCE))
      .toBe(`<link nonce="${NONCE}" rel="modulepreload" href="/b.js"><style nonce="${NONCE}">p{}</STYLE>`)
    const markup = '<main><p title="a <script> in an attribute">Text &lt;script&gt;</p></main>'
    expect(withNonce(markup, NONCE)).toBe(markup)
    const payload = '<script type="application/json" id="__NUXT_DATA__">["<script>x</script>",{"a":"\\"<style>"}]</script>'
    expect(withNonce(payload, NONCE)).toBe(`<script nonce="${NONCE}" type="application/json" id="__NUXT_DATA__">["<script>x</script>",{"a":"\\"<style>"}]</script>`)
  })

  it('gives exactly what nuxt-security\'s injection gives, odd markup included', () => {
    const pieces = ['<link', '<script', '<style', '<LINK', '<Script', '>', '"', '\\', ' ', 'a', 'nonce="x"', '__QUOTE_PLACEHOLDER_1__',
      '</script>', '<scripts', '=', '\'', '<', '<link a="b" c>', '"x>y"']
    let seed = 20261203
    const random = () => (seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648
    for (let round = 0; round < 20_000; round++) {
      let html = ''
      for (let count = 1 + Math.floor(random() * 16); count > 0; count--) html += pieces[Math.floor(random() * pieces.length)]
      expect(withNonce(html, NONCE), html).toBe(theirs(html, NONCE))
    }
  })
})
