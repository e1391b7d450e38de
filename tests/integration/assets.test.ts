import { request } from 'node:http'
import { brotliDecompressSync, gunzipSync } from 'node:zlib'
import { describe, expect, it } from 'vitest'
import { useStack } from '../support/hooks'

const running = useStack()

describe('static assets', () => {
  it('go out pre-compressed, by what the browser accepts, and cached for a year', async () => {
    const page = await (await fetch(`${running.stack.url}/login`)).text()
    const scripts = [...page.matchAll(/\/_nuxt\/[\w.-]+\.js/g)].map(match => match[0])
    expect(scripts.length).toBeGreaterThan(0)
    const script = scripts[0]!
    for (const [accept, encoding] of [['br, gzip', 'br'], ['gzip', 'gzip']] as const) {
      const response = await fetch(`${running.stack.url}${script}`, { headers: { 'accept-encoding': accept } })
      expect(response.status).toBe(200)
      expect(response.headers.get('content-encoding')).toBe(encoding)
      expect(response.headers.get('cache-control')).toMatch(/max-age=31536000.*immutable/)
    }
  })

  it('rendered pages fetch their module scripts and preloads at low priority, after the markup, styles and fonts', async () => {
    const page = await (await fetch(`${running.stack.url}/login`)).text()
    const moduleTags = [...page.matchAll(/<(?:link\b[^>]*\brel="modulepreload"|script\b[^>]*\btype="module")[^>]*>/g)].map(match => match[0])
    expect(moduleTags.length).toBeGreaterThan(1)
    for (const tag of moduleTags) expect(tag).toMatch(/\bfetchpriority="low"/)
    expect(page).not.toMatch(/<link\b[^>]*\brel="stylesheet"[^>]*\bfetchpriority=/)
  })

  it('rendered pages go out compressed by what the browser accepts, and plain to a client that asks for nothing', async () => {
    // node:http, not fetch: fetch would undo the compression and always ask for it.
    const get = (acceptEncoding?: string) => new Promise<{ encoding?: string, vary: string, body: Buffer }>((resolve, reject) => {
      const outgoing = request(`${running.stack.url}/login`, { headers: acceptEncoding ? { 'accept-encoding': acceptEncoding } : {} }, (incoming) => {
        const chunks: Buffer[] = []
        incoming.on('data', chunk => chunks.push(chunk))
        incoming.on('end', () => resolve({ encoding: incoming.headers['content-encoding'], vary: String(incoming.headers.vary ?? ''), body: Buffer.concat(chunks) }))
        incoming.on('error', reject)
      })
      outgoing.on('error', reject)
      outgoing.end()
    })
    const plain = await get()
    expect(plain.encoding).toBeUndefined()
    expect(plain.body.toString()).toContain('</html>')
    expect(plain.vary.toLowerCase()).toContain('accept-encoding')

    const brotli = await get('gzip, deflate, br')
    expect(brotli.encoding).toBe('br')
    expect(brotli.body.length).toBeLessThan(plain.body.length / 2)
    expect(brotliDecompressSync(brotli.body).toString()).toContain('</html>')

    const gzip = await get('gzip')
    expect(gzip.encoding).toBe('gzip')
    expect(gunzipSync(gzip.body).toString()).toContain('</html>')
  })
})
