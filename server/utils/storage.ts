import { randomBytes } from 'node:crypto'
import {
  CopyObjectCommand,
  DeleteObjectCommand,
  GetObjectCommand,
  HeadBucketCommand,
  HeadObjectCommand,
  PutObjectCommand,
  type S3Client,
} from '@aws-sdk/client-s3'
import { getSignedUrl } from '@aws-sdk/s3-request-presigner'
import { mediaExtensions } from '#shared/schemas/exercise'

export const UPLOAD_URL_SECONDS = 10 * 60
export const PLAYBACK_URL_SECONDS = 15 * 60

let clients: { server: S3Client, presign: S3Client } | undefined

function clientFor(endpoint: string) {
  const config = useServerConfig()
  return createObjectStoreClient(
    { endpoint, region: config.s3Region, accessKeyId: config.s3AccessKeyId, secretAccessKey: config.s3SecretAccessKey },
    { maxAttempts: 2, connectionTimeoutMs: 3000, requestTimeoutMs: 15_000 },
  )
}

/**
 * The S3 clients: one for the server's own calls, one that signs the URLs the browser uses
 * (the same store, but possibly reached at another address from outside).
 */
export function useObjectStore() {
  if (!clients) {
    const config = useServerConfig()
    const server = clientFor(config.s3Endpoint)
    const presign = config.s3PublicEndpoint ? clientFor(config.s3PublicEndpoint) : server
    clients = { server, presign }
  }
  return { ...clients, bucket: useServerConfig().s3Bucket }
}

function unavailable(): never {
  refuse(503, 'The clip store cannot be reached right now, so clips cannot be uploaded or changed. Everything else in the library still works; try again in a few minutes.', { _: 'The clip store cannot be reached right now; try again in a few minutes.' })
}

function statusOf(error: unknown): number | undefined {
  return (error as { $metadata?: { httpStatusCode?: number } })?.$metadata?.httpStatusCode
}

function isMissing(error: unknown) {
  const name = (error as { name?: string })?.name
  return name === 'NotFound' || name === 'NoSuchKey' || statusOf(error) === 404
}

/** Runs a storage call; a store that cannot be reached (or fails on its side) becomes a clear 503. */
async function guarded<T>(call: () => Promise<T>): Promise<T> {
  try {
    return await call()
  }
  catch (error) {
    if (isMissing(error)) throw error
    console.warn('[storage]', (error as Error)?.message ?? error)
    unavailable()
  }
}

/** 503 unless the bucket answers: checked before handing out an upload URL that could never work. */
export async function assertStorageReachable() {
  const { server, bucket } = useObjectStore()
  try {
    await server.send(new HeadBucketCommand({ Bucket: bucket }))
  }
  catch (error) {
    console.warn('[storage] bucket check failed:', (error as Error)?.message ?? error)
    unavailable()
  }
}

export function exercisePrefix(teamId: number, exerciseId: number) {
  return `teams/${teamId}/exercises/${exerciseId}/`
}

export function newExerciseKey(teamId: number, exerciseId: number, contentType: string) {
  const extension = mediaExtensions[contentType] ?? 'bin'
  return `${exercisePrefix(teamId, exerciseId)}${randomBytes(12).toString('hex')}.${extension}`
}

/** A PUT URL whose signature fixes the content type and the exact size of the upload. */
export async function presignUpload(key: string, contentType: string, size: number) {
  const { presign, bucket } = useObjectStore()
  const url = await getSignedUrl(presign, new PutObjectCommand({ Bucket: bucket, Key: key, ContentType: contentType, ContentLength: size }), {
    expiresIn: UPLOAD_URL_SECONDS,
    signableHeaders: new Set(['content-type', 'content-length']),
  })
  return { url, expiresAt: new Date(Date.now() + UPLOAD_URL_SECONDS * 1000).toISOString() }
}

export async function presignPlayback(key: string) {
  const { presign, bucket } = useObjectStore()
  const url = await getSignedUrl(presign, new GetObjectCommand({ Bucket: bucket, Key: key }), { expiresIn: PLAYBACK_URL_SECONDS })
  return { url, expiresAt: new Date(Date.now() + PLAYBACK_URL_SECONDS * 1000).toISOString() }
}

/** The stored object's type and size, or null when nothing is stored under the key. */
export async function headObject(key: string): Promise<{ contentType: string, size: number } | null> {
  const { server, bucket } = useObjectStore()
  try {
    const head = await guarded(() => server.send(new HeadObjectCommand({ Bucket: bucket, Key: key })))
    return { contentType: (head.ContentType ?? '').split(';')[0]!.trim().toLowerCase(), size: head.ContentLength ?? -1 }
  }
  catch (error) {
    if (isMissing(error)) return null
    throw error
  }
}

/** The first bytes of an object (a ranged GET), to check what the file really is. */
export async function readObjectStart(key: string, bytes = 64): Promise<Uint8Array> {
  const { server, bucket } = useObjectStore()
  const object = await guarded(() => server.send(new GetObjectCommand({ Bucket: bucket, Key: key, Range: `bytes=0-${bytes - 1}` })))
  return object.Body ? await object.Body.transformToByteArray() : new Uint8Array()
}

export async function deleteObject(key: string) {
  const { server, bucket } = useObjectStore()
  await guarded(() => server.send(new DeleteObjectCommand({ Bucket: bucket, Key: key })))
}

/** Deletes without failing the request: for clean-up after the database already moved on. */
export async function deleteObjectQuietly(key: string) {
  try {
    await deleteObject(key)
  }
  catch (error) {
    console.warn(`[storage] could not delete ${key}:`, (error as Error)?.message ?? error)
  }
}

export async function copyObject(fromKey: string, toKey: string) {
  const { server, bucket } = useObjectStore()
  await guarded(() => server.send(new CopyObjectCommand({ Bucket: bucket, Key: toKey, CopySource: `${bucket}/${encodeURIComponent(fromKey).replaceAll('%2F', '/')}` })))
}

export async function putObject(key: string, body: Uint8Array, contentType: string) {
  const { server, bucket } = useObjectStore()
  await guarded(() => server.send(new PutObjectCommand({ Bucket: bucket, Key: key, Body: body, ContentType: contentType, ContentLength: body.byteLength })))
}

/** Why a stored upload is not what was announced (type, size, container signature), or '' when it is. */
export async function uploadProblem(key: string, stored: { contentType: string, size: number }, announced: { contentType: string, size: number }) {
  if (stored.contentType !== announced.contentType) return `The stored file is ${stored.contentType || 'of no stated type'}, not ${announced.contentType}`
  if (stored.size !== announced.size) return `The stored file is ${stored.size} bytes, not the announced ${announced.size}`
  if (!looksLike(announced.contentType, await readObjectStart(key))) return `The stored file is not a real ${announced.contentType} file`
  return ''
}

function ascii(bytes: Uint8Array, start: number, end: number) {
  return String.fromCharCode(...bytes.subarray(start, end))
}

/** Whether a file's first bytes match the media type it was uploaded as (container signatures). */
export function looksLike(contentType: string, start: Uint8Array): boolean {
  switch (contentType) {
    case 'video/webm':
      return start[0] === 0x1A && start[1] === 0x45 && start[2] === 0xDF && start[3] === 0xA3
    case 'video/mp4':
    case 'video/quicktime':
      // ISO base media / QuickTime: a box size, then a box type such as ftyp, moov, mdat, free, wide.
      return ['ftyp', 'moov', 'mdat', 'free', 'wide', 'skip', 'pnot'].includes(ascii(start, 4, 8))
    case 'image/jpeg':
      return start[0] === 0xFF && start[1] === 0xD8 && start[2] === 0xFF
    case 'image/png':
      return start[0] === 0x89 && ascii(start, 1, 4) === 'PNG'
    case 'image/webp':
      return ascii(start, 0, 4) === 'RIFF' && ascii(start, 8, 12) === 'WEBP'
    default:
      return false
  }
}

/** Bytes `start` to `end - 1` of an object (a ranged GET), for reading a container's metadata in place. */
export async function readObjectRange(key: string, start: number, end: number): Promise<Uint8Array> {
  const { server, bucket } = useObjectStore()
  if (end <= start) return new Uint8Array()
  const object = await guarded(() => server.send(new GetObjectCommand({ Bucket: bucket, Key: key, Range: `bytes=${start}-${end - 1}` })))
  return object.Body ? await object.Body.transformToByteArray() : new Uint8Array()
}
