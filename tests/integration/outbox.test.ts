import { createClient } from '@libsql/client'
import { expect, it } from 'vitest'
import { ApiClient } from '../support/client'
import { registerCoach } from '../support/team'
import { useStack } from '../support/hooks'

const running = useStack()

async function outboxRows(to: string) {
  const db = createClient({ url: running.stack.databaseUrl })
  try {
    const result = await db.execute({ sql: 'select status, attempts, last_error from email_outbox where "to" = ?', args: [to] })
    return result.rows as unknown as { status: string, attempts: number, last_error: string | null }[]
  }
  finally {
    db.close()
  }
}

it('keeps messages while the mail server is down and delivers each exactly once when it returns', async () => {
  const { email } = await registerCoach(running.stack)
  await running.stack.mail.stop()

  expect((await new ApiClient(running.stack.url).post('/api/auth/password-reset', { email })).status).toBe(202)

  // Wait until the worker has tried and failed at least once.
  const deadline = Date.now() + 10_000
  let rows = await outboxRows(email)
  while (Date.now() < deadline && !((rows[0]?.attempts ?? 0) >= 1 && rows[0]?.status === 'pending')) {
    await new Promise(resolve => setTimeout(resolve, 100))
    rows = await outboxRows(email)
  }
  expect(rows).toHaveLength(1)
  expect(rows[0]).toMatchObject({ status: 'pending' })
  expect(rows[0]!.attempts).toBeGreaterThanOrEqual(1)
  expect(rows[0]!.last_error).toBeTruthy()

  await running.stack.mail.start()
  const mail = await running.stack.mail.waitFor(email, /Reset your Switchback password/, 15_000)
  expect(mail.text).toContain('/reset/')

  // Give the worker several more rounds: nothing is sent a second time.
  await new Promise(resolve => setTimeout(resolve, 1500))
  expect(running.stack.mail.to(email)).toHaveLength(1)
  expect((await outboxRows(email))[0]).toMatchObject({ status: 'sent' })
})
