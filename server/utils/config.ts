import { z } from 'zod'
import { OBJECT_STORE_DEFAULTS } from './object-store-client'

const configSchema = z.object({
  databaseUrl: z.string().min(1).default('file:.data/switchback.db'),
  appUrl: z.string().url().default('http://localhost:3000'),
  smtpUrl: z.string().default('smtp://127.0.0.1:1025'),
  mailFrom: z.string().default('Switchback <no-reply@switchback.local>'),
  s3Endpoint: z.string().default(OBJECT_STORE_DEFAULTS.endpoint),
  s3PublicEndpoint: z.string().optional(),
  s3Region: z.string().default(OBJECT_STORE_DEFAULTS.region),
  s3Bucket: z.string().default(OBJECT_STORE_DEFAULTS.bucket),
  s3AccessKeyId: z.string().default(OBJECT_STORE_DEFAULTS.accessKeyId),
  s3SecretAccessKey: z.string().default(OBJECT_STORE_DEFAULTS.secretAccessKey),
  outboxIntervalMs: z.coerce.number().int().positive().default(2000),
  outboxBackoffMs: z.coerce.number().int().positive().default(5000),
  mediaSweepIntervalMs: z.coerce.number().int().positive().default(10 * 60_000),
  healthCheckIntervalMs: z.coerce.number().int().positive().default(10_000),
  // How long a notice of moved or removed sessions waits for more changes before it is sent.
  planNoticeDelayMs: z.coerce.number().int().min(0).default(600_000),
  // How long a read route's answer is kept while nothing is written (server/utils/answer-cache.ts); 0 keeps none.
  answerCacheMs: z.coerce.number().int().min(0).max(300_000).default(30_000),
  databaseAuthToken: z.string().optional(),
  migrationsDir: z.string().optional(),
  trustProxy: z.enum(['true', 'false']).default('false').transform(value => value === 'true'),
  sessionPassword: z.string().default(''),
  production: z.boolean(),
})

export type AppConfig = z.infer<typeof configSchema>

let cached: AppConfig | undefined

/**
 * The one place the server reads its environment, at run time (never baked into the build).
 * Handlers, plugins and utils ask `useServerConfig()`; every variable is in the README's table.
 */
export function useServerConfig(): AppConfig {
  cached ??= configSchema.parse({
    databaseUrl: process.env.DATABASE_URL || undefined,
    appUrl: process.env.APP_URL || undefined,
    smtpUrl: process.env.SMTP_URL || undefined,
    mailFrom: process.env.MAIL_FROM || undefined,
    s3Endpoint: process.env.S3_ENDPOINT || undefined,
    s3PublicEndpoint: process.env.S3_PUBLIC_ENDPOINT || undefined,
    s3Region: process.env.S3_REGION || undefined,
    s3Bucket: process.env.S3_BUCKET || undefined,
    s3AccessKeyId: process.env.S3_ACCESS_KEY_ID || undefined,
    s3SecretAccessKey: process.env.S3_SECRET_ACCESS_KEY || undefined,
    outboxIntervalMs: process.env.OUTBOX_INTERVAL_MS || undefined,
    outboxBackoffMs: process.env.OUTBOX_BACKOFF_MS || undefined,
    mediaSweepIntervalMs: process.env.MEDIA_SWEEP_INTERVAL_MS || undefined,
    healthCheckIntervalMs: process.env.HEALTH_CHECK_INTERVAL_MS || undefined,
    planNoticeDelayMs: process.env.PLAN_NOTICE_DELAY_MS || undefined,
    answerCacheMs: process.env.ANSWER_CACHE_MS || undefined,
    databaseAuthToken: process.env.DATABASE_AUTH_TOKEN || undefined,
    migrationsDir: process.env.MIGRATIONS_DIR || undefined,
    trustProxy: process.env.TRUST_PROXY || undefined,
    sessionPassword: process.env.NUXT_SESSION_PASSWORD || undefined,
    production: process.env.NODE_ENV === 'production',
  })
  return cached
}
