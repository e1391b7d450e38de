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
})
