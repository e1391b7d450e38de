import nodemailer, { type Transporter } from 'nodemailer'
import { and, eq, inArray, lte, or, sql } from 'drizzle-orm'
import { emailOutbox } from '../db/schema'
import type { Database } from '../db/client'
import { renderEmail } from './email-templates'

const MAX_ATTEMPTS = 8
const LOCK_MS = 60_000

type Writer = Pick<Database, 'insert'>

/** Queues a message; the outbox worker sends it. Pass a transaction to queue it atomically with other writes. */
export async function enqueueEmail(db: Writer, message: { to: string, template: string, payload: Record<string, unknown>, teamId?: number | null }) {
  renderEmail(message.template, message.payload)
  await db.insert(emailOutbox).values({ to: message.to, template: message.template, payload: message.payload, teamId: message.teamId ?? null })
  kickOutbox()
}

let transport: Transporter | undefined

export function useTransport() {
  if (!transport) {
    const url = new URL(useServerConfig().smtpUrl)
    const loopback = ['127.0.0.1', 'localhost', '[::1]'].includes(url.hostname)
    transport = nodemailer.createTransport({
      host: url.hostname,
      port: Number(url.port) || (url.protocol === 'smtps:' ? 465 : 587),
      secure: url.protocol === 'smtps:',
      ignoreTLS: url.searchParams.get('ignoreTLS') === 'true' || loopback,
      auth: url.username ? { user: decodeURIComponent(url.username), pass: decodeURIComponent(url.password) } : undefined,
      connectionTimeout: 5000,
      greetingTimeout: 5000,
      socketTimeout: 10_000,
    })
  }
  return transport
}

function backoffMs(attempts: number) {
  const base = useServerConfig().outboxBackoffMs
  return Math.min(base * 2 ** (attempts - 1), 3_600_000)
}

let running: Promise<number> | undefined

/** Claims due messages in one statement (safe with several app replicas), sends them, records the outcome. */
export function processOutbox(): Promise<number> {
  if (stopping) return running ?? Promise.resolve(0)
  running ??= (async () => {
    try {
      const db = await useDb()
      const now = Date.now()
      const due = (most: number) => db.select({ id: emailOutbox.id }).from(emailOutbox).where(or(
        and(eq(emailOutbox.status, 'pending'), lte(emailOutbox.nextAttemptAt, new Date(now))),
        and(eq(emailOutbox.status, 'sending'), lte(emailOutbox.lockedUntil, new Date(now))),
      )).orderBy(emailOutbox.id).limit(most)
      // An UPDATE takes the write lock even when it matches nothing: look first, so that a quiet outbox
      // never competes with the athletes' writes (or another replica's) for it.
      if (!(await due(1)).length) return 0
      const claimed = await db.update(emailOutbox)
        .set({ status: 'sending', lockedUntil: new Date(now + LOCK_MS), attempts: sql`${emailOutbox.attempts} + 1` })
        .where(inArray(emailOutbox.id, due(20)))
        .returning()
      const { mailFrom } = useServerConfig()
      for (const message of claimed) {
        try {
          const rendered = renderEmail(message.template, message.payload)
          await useTransport().sendMail({ from: mailFrom, to: message.to, ...rendered })
          await db.update(emailOutbox).set({ status: 'sent', sentAt: new Date(), lockedUntil: null, lastError: null }).where(eq(emailOutbox.id, message.id))
        }
        catch (error) {
          const failed = message.attempts >= MAX_ATTEMPTS
          await db.update(emailOutbox).set({
            status: failed ? 'failed' : 'pending',
            lastError: String((error as Error).message ?? error).slice(0, 500),
            nextAttemptAt: new Date(Date.now() + backoffMs(message.attempts)),
            lockedUntil: null,
          }).where(eq(emailOutbox.id, message.id))
        }
      }
      return claimed.length
    }
    finally {
      running = undefined
    }
  })()
  return running
}

let kick: ReturnType<typeof setTimeout> | undefined
let stopping = false

/**
 * For a graceful stop: no new passes, and the pass in flight finishes, so every message this process
 * claimed is either sent or handed back as pending before it exits.
 */
export async function stopOutbox() {
  stopping = true
  if (kick) clearTimeout(kick)
  kick = undefined
  await running?.catch(() => undefined)
}

export function kickOutbox() {
  if (kick || stopping) return
  kick = setTimeout(() => {
    kick = undefined
    processOutbox().catch(error => console.error('Outbox run failed:', error))
  }, 50)
}
