import { describe, expect, it } from 'vitest'
import { createObjectStoreClient, OBJECT_STORE_DEFAULTS, objectStoreClientConfig, objectStoreSettingsFromEnv } from '../../server/utils/object-store-client'

describe('object store client settings', () => {
  it('falls back to the local s3rver when no variable is set, and empty values count as unset', () => {
    expect(objectStoreSettingsFromEnv({})).toEqual(OBJECT_STORE_DEFAULTS)
    expect(objectStoreSettingsFromEnv({ S3_BUCKET: '' }).bucket).toBe('switchback-media')
  })

  it('reads every S3_* variable', () => {
    expect(objectStoreSettingsFromEnv({
      S3_ENDPOINT: 'http://store.larchford.test:9000',
      S3_REGION: 'eu-north-1',
      S3_BUCKET: 'clips',
      S3_ACCESS_KEY_ID: 'id',
      S3_SECRET_ACCESS_KEY: 'secret',
    })).toEqual({ endpoint: 'http://store.larchford.test:9000', region: 'eu-north-1', bucket: 'clips', accessKeyId: 'id', secretAccessKey: 'secret' })
  })

  it('always asks for path-style addresses and checksums only when required', () => {
    const config = objectStoreClientConfig(OBJECT_STORE_DEFAULTS)
    expect(config).toMatchObject({ forcePathStyle: true, requestChecksumCalculation: 'WHEN_REQUIRED', responseChecksumValidation: 'WHEN_REQUIRED', endpoint: OBJECT_STORE_DEFAULTS.endpoint })
    expect(config.maxAttempts).toBeUndefined()
    expect(config.requestHandler).toBeUndefined()
  })

  it('passes tries and time limits through when given', () => {
    const config = objectStoreClientConfig(OBJECT_STORE_DEFAULTS, { maxAttempts: 2, connectionTimeoutMs: 3000, requestTimeoutMs: 15_000 })
    expect(config.maxAttempts).toBe(2)
    expect(config.requestHandler).toEqual({ connectionTimeout: 3000, requestTimeout: 15_000 })
  })

  it('builds a client that signs for the given region', async () => {
    const client = createObjectStoreClient({ ...OBJECT_STORE_DEFAULTS, region: 'eu-north-1' })
    expect(await client.config.region()).toBe('eu-north-1')
    expect(await client.config.forcePathStyle).toBe(true)
    client.destroy()
  })
})
