import { S3Client, type S3ClientConfig } from '@aws-sdk/client-s3'

// The S3 client settings, built in one place. Plain Node (no Nitro or Nuxt globals), so the server
// (server/utils/storage.ts), the seeds (seeds/exercises.ts) and the backup scripts share it.

export interface ObjectStoreSettings {
  endpoint: string
  region: string
  bucket: string
  accessKeyId: string
  secretAccessKey: string
}

/** What an unset variable means: the local s3rver of the demo and the tests. */
export const OBJECT_STORE_DEFAULTS: ObjectStoreSettings = {
  endpoint: 'http://127.0.0.1:4569',
  region: 'us-east-1',
  bucket: 'switchback-media',
  accessKeyId: 'S3RVER',
  secretAccessKey: 'S3RVER',
}

/**
 * The store's settings from S3_* variables, for scripts and seeds that run outside the server
 * (the server reads the same variables through `useServerConfig()`).
 */
export function objectStoreSettingsFromEnv(env: Record<string, string | undefined> = process.env): ObjectStoreSettings {
  return {
    endpoint: env.S3_ENDPOINT || OBJECT_STORE_DEFAULTS.endpoint,
    region: env.S3_REGION || OBJECT_STORE_DEFAULTS.region,
    bucket: env.S3_BUCKET || OBJECT_STORE_DEFAULTS.bucket,
    accessKeyId: env.S3_ACCESS_KEY_ID || OBJECT_STORE_DEFAULTS.accessKeyId,
    secretAccessKey: env.S3_SECRET_ACCESS_KEY || OBJECT_STORE_DEFAULTS.secretAccessKey,
  }
}

export interface ObjectStoreClientOptions {
  /** How many tries a call gets (the SDK's `maxAttempts`); unset keeps the SDK's own. */
  maxAttempts?: number
  connectionTimeoutMs?: number
  requestTimeoutMs?: number
}

/** The S3 client options every part of Switchback uses, for one endpoint. */
export function objectStoreClientConfig(settings: Omit<ObjectStoreSettings, 'bucket'>, options: ObjectStoreClientOptions = {}): S3ClientConfig {
  const config: S3ClientConfig = {
    endpoint: settings.endpoint,
    region: settings.region,
    credentials: { accessKeyId: settings.accessKeyId, secretAccessKey: settings.secretAccessKey },
    forcePathStyle: true,
    // Without these, s3rver stores streamed uploads with chunk framing inside the object and
    // presigned URLs carry the checksum of an empty body.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  }
  if (options.maxAttempts !== undefined) config.maxAttempts = options.maxAttempts
  if (options.connectionTimeoutMs !== undefined || options.requestTimeoutMs !== undefined) {
    config.requestHandler = { connectionTimeout: options.connectionTimeoutMs, requestTimeout: options.requestTimeoutMs }
  }
  return config
}

export function createObjectStoreClient(settings: Omit<ObjectStoreSettings, 'bucket'>, options?: ObjectStoreClientOptions) {
  return new S3Client(objectStoreClientConfig(settings, options))
}
