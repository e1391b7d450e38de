import { createClient } from '@libsql/client'
import { HeadObjectCommand, S3Client } from '@aws-sdk/client-s3'
import { expect, it } from 'vitest'
import { registerCoach } from '../support/team'
import { useStack } from '../support/hooks'

const running = useStack({ MEDIA_SWEEP_INTERVAL_MS: '200' })

it('deletes objects of uploads that were never confirmed once their URL has long expired, and keeps fresh ones', async () => {
  const { coach } = await registerCoach(running.stack)
  const created = await coach.post<{ id: number }>('/api/exercises', { name: 'Hill bounding', category: 'plyometric' })
  expect(created.status).toBe(201)
  const ask = (size: number) => coach.post<{ url: string, key: string }>(`/api/exercises/${created.data.id}/clip/upload-url`, { contentType: 'video/webm', size })
  const [old, fresh] = [await ask(4), await ask(4)]
  expect(old.status).toBe(200)
  for (const { url } of [old.data, fresh.data]) {
    expect((await fetch(url, { method: 'PUT', headers: { 'content-type': 'video/webm' }, body: new Uint8Array([0x1A, 0x45, 0xDF, 0xA3]) })).status).toBe(200)
  }

  const db = createClient({ url: running.stack.databaseUrl })
  await db.execute({ sql: 'update media_objects set created_at = ? where key = ?', args: [Date.now() - 3 * 3600_000, old.data.key] })

  const s3 = new S3Client({ endpoint: running.stack.s3.endpoint, region: 'us-east-1', forcePathStyle: true, credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' } })
  const exists = (key: string) => s3.send(new HeadObjectCommand({ Bucket: running.stack.s3.bucket, Key: key })).then(() => true, () => false)
  const statusOf = async (key: string) => (await db.execute({ sql: 'select status from media_objects where key = ?', args: [key] })).rows[0]?.status

  await expect.poll(() => statusOf(old.data.key), { timeout: 10_000 }).toBe('deleted')
  expect(await exists(old.data.key)).toBe(false)
  expect(await statusOf(fresh.data.key)).toBe('pending')
  expect(await exists(fresh.data.key)).toBe(true)

  db.close()
})
