import type { H3Event } from 'h3'

// Requests with bodies larger than this are refused, whether they say so up front (Content-Length)
// or only turn out to be large while the body is read (chunked transfer).
const MAX_BODY_BYTES = 1_000_000
const payloadMethods = new Set(['POST', 'PUT', 'PATCH', 'DELETE'])
const tooLarge = 'The request body is larger than 1 MB'

function tooLargeBody(): never {
  refuseField('_', tooLarge, 413)
}

/** Reads the whole body with a running count, so a chunked upload is cut off at the cap. */
function readCapped(event: H3Event): Promise<Buffer> {
  const request = event.node.req
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = []
    let size = 0
    const onData = (chunk: Buffer) => {
      size += chunk.length
      if (size > MAX_BODY_BYTES) {
        // Keep nothing more; the rest of the upload is read and dropped while the 413 goes out.
        request.off('data', onData)
        chunks.length = 0
        request.resume()
        reject(new Error('too large'))
        return
      }
      chunks.push(chunk)
    }
    request.on('data', onData)
    request.once('end', () => resolve(Buffer.concat(chunks)))
    request.once('error', reject)
  })
}

export default defineEventHandler(async (event) => {
  if (!event.path.startsWith('/api/')) return
  const length = Number(getRequestHeader(event, 'content-length') ?? 0)
  if (length > MAX_BODY_BYTES) tooLargeBody()
  const chunked = /\bchunked\b/i.test(getRequestHeader(event, 'transfer-encoding') ?? '')
  if (!chunked || !payloadMethods.has(event.method)) return
  try {
    // h3's readBody takes an already-read body from here instead of the stream.
    event._requestBody = new Uint8Array(await readCapped(event))
  }
  catch {
    tooLargeBody()
  }
})
