import { brotliCompressSync, constants, gzipSync } from 'node:zlib'
import { appendResponseHeader, getRequestHeader, setResponseHeader } from 'h3'

// Rendered pages go out compressed when the browser accepts it (scripts, styles and fonts are compressed at
// build time). On a phone's connection the page's HTML (~50 KB for a session) is most of what comes before the
// first paint; brotli at a low quality costs about as much CPU as gzip and is smaller. A proxy in front that
// compresses as well sees `Content-Encoding` and leaves the body alone. See docs/performance.md.
const SMALLEST_WORTH_IT = 1024

function pickEncoding(acceptEncoding: string | undefined): 'br' | 'gzip' | null {
  const accepted = (acceptEncoding ?? '').toLowerCase()
  if (/\bbr\b/.test(accepted)) return 'br'
  if (/\bgzip\b/.test(accepted)) return 'gzip'
  return null
}

export default defineNitroPlugin((nitroApp) => {
  nitroApp.hooks.hook('render:response', (response, { event }) => {
    const body: unknown = response.body
    if (typeof body !== 'string' || body.length < SMALLEST_WORTH_IT) return
    appendResponseHeader(event, 'vary', 'Accept-Encoding')
    const encoding = pickEncoding(getRequestHeader(event, 'accept-encoding'))
    if (!encoding) return
    const compressed = encoding === 'br'
      ? brotliCompressSync(body, { params: { [constants.BROTLI_PARAM_QUALITY]: 4 } })
      : gzipSync(body, { level: 6 })
    // The renderer sends whatever body the hook leaves; h3 sends a Buffer as it is.
    Object.assign(response, { body: compressed })
    setResponseHeader(event, 'content-encoding', encoding)
  })
})
