import { resolve } from 'node:path'
import { ListObjectsV2Command } from '@aws-sdk/client-s3'
import type { Client } from '@libsql/client'
import { createObjectStoreClient, objectStoreSettingsFromEnv } from '../server/utils/object-store-client'

/** The file behind a `file:` database URL; a libSQL server is backed up with its own tools. */
export function localDatabaseFile(url: string) {
  if (!url.startsWith('file:')) {
    console.error(`${url} is not a local file. A libSQL server keeps its own backups (see docs/operations.md).`)
    process.exit(2)
  }
  return resolve(url.slice('file:'.length))
}

export function timestampForFile(date: Date) {
  return date.toISOString().replace(/[-:]/g, '').replace(/\.\d+Z$/, 'Z')
}

export async function checkIntegrity(client: Client) {
  const rows = (await client.execute('pragma integrity_check')).rows
  return rows.map(row => String(Object.values(row)[0])).join('; ')
}

export function storeSettings() {
  return objectStoreSettingsFromEnv()
}

/** Every object in the bucket (key, size, ETag), page by page. */
export async function listStoredObjects() {
  const settings = storeSettings()
  const store = createObjectStoreClient(settings)
  const objects: { key: string, size: number, etag: string | null }[] = []
  let token: string | undefined
  do {
    const page = await store.send(new ListObjectsV2Command({ Bucket: settings.bucket, ContinuationToken: token }))
    for (const item of page.Contents ?? []) objects.push({ key: item.Key!, size: item.Size ?? 0, etag: item.ETag ?? null })
    token = page.IsTruncated ? page.NextContinuationToken : undefined
  } while (token)
  store.destroy()
  return objects
}
