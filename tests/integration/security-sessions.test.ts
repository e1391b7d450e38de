import { createClient } from '@libsql/client'
import { describe, expect, it } from 'vitest'
import { ApiClient, type FieldError } from '../support/client'
import { linkIn } from '../support/mail-catcher'
import { addAthlete, PASSWORD, registerCoach } from '../support/team'
import { useStack } from '../support/hooks'

const running = useStack()

async function signInAgain(email: string, password = PASSWORD) {
  const client = new ApiClient(running.stack.url)
  const response = await client.post('/api/auth/login', { email, password })
  expect(response.status).toBe(200)
  return client
}

async function resetLink(email: string, nth: number) {
  const deadline = Date.now() + 10_000
  while (running.stack.mail.to(email).length < nth && Date.now() < deadline) await new Promise(r => setTimeout(r, 50))
  const mail = running.stack.mail.to(email)[nth - 1]
  expect(mail, `reset mail ${nth} to ${email}`).toBeDefined()
  return linkIn(mail!, /\/reset\/[\w-]+/).split('/').pop()!
}

describe('server-side sessions', () => {
  it('logging out ends the session on the server: a copied cookie stops working', async () => {
    const { coach } = await registerCoach(running.stack)
    const stolen = coach.copy()
    const stolenToo = coach.copy()
    expect((await stolen.get('/api/me')).status).toBe(200)
    expect((await coach.post('/api/auth/logout')).status).toBe(204)
    expect((await stolen.get('/api/me')).status).toBe(401)
    // The client's own session check reports the ended session as signed out too.
    expect((await stolenToo.get('/api/_auth/session')).status).toBe(401)
  })

  it('a password reset ends every session of that person and spends their other reset links', async () => {
    const { coach, email } = await registerCoach(running.stack)
    const laptop = await signInAgain(email)
    const visitor = new ApiClient(running.stack.url)
    expect((await visitor.post('/api/auth/password-reset', { email })).status).toBe(202)
    const older = await resetLink(email, 1)
    expect((await visitor.post('/api/auth/password-reset', { email })).status).toBe(202)
    const newer = await resetLink(email, 2)
    expect(newer).not.toBe(older)
    expect((await visitor.post(`/api/auth/password-reset/${newer}`, { password: 'a-brand-new-password' })).status).toBe(200)
    expect((await visitor.post(`/api/auth/password-reset/${older}`, { password: 'yet-another-password' })).status).toBe(410)
    expect((await coach.get('/api/me')).status).toBe(401)
    expect((await laptop.get('/api/me')).status).toBe(401)
    await signInAgain(email, 'a-brand-new-password')
  })

  it('changing the password needs the current one, keeps this session and ends the others', async () => {
    const { coach, email } = await registerCoach(running.stack)
    const phone = await signInAgain(email)
    const wrong = await coach.post<FieldError>('/api/me/password', { currentPassword: 'not-my-password', newPassword: 'a-changed-password' })
    expect(wrong.status).toBe(400)
    expect(wrong.data.data?.fields?.currentPassword).toMatch(/current password/)
    const short = await coach.post<FieldError>('/api/me/password', { currentPassword: PASSWORD, newPassword: 'short' })
    expect(short.status).toBe(400)
    expect(short.data.data?.fields?.newPassword).toBeTruthy()
    expect((await phone.get('/api/me')).status).toBe(200)
    const changed = await coach.post<{ endedSessions: number }>('/api/me/password', { currentPassword: PASSWORD, newPassword: 'a-changed-password' })
    expect(changed.status).toBe(200)
    expect(changed.data.endedSessions).toBe(1)
    expect((await coach.get('/api/me')).status).toBe(200)
    expect((await phone.get('/api/me')).status).toBe(401)
    expect((await new ApiClient(running.stack.url).post('/api/auth/login', { email, password: PASSWORD })).status).toBe(401)
    await signInAgain(email, 'a-changed-password')
  })

  it('signing out on all devices ends every session, this one included', async () => {
    const { coach, email } = await registerCoach(running.stack)
    const phone = await signInAgain(email)
    const ended = await phone.post<{ endedSessions: number }>('/api/me/sign-out-everywhere')
    expect(ended.status).toBe(200)
    expect(ended.data.endedSessions).toBe(2)
    expect((await coach.get('/api/me')).status).toBe(401)
    expect((await phone.get('/api/me')).status).toBe(401)
  })

  it('a session the server read a moment ago counts as ended at once when another device ends it', async () => {
    const { coach, email } = await registerCoach(running.stack)
    const phone = await signInAgain(email)
    // Read twice: the second read finds the cookie already unsealed (server/plugins/unsealed-sessions.ts).
    expect((await coach.get('/api/_auth/session')).status).toBe(200)
    const before = await coach.get<{ user?: { email: string } }>('/api/_auth/session')
    expect(before.status).toBe(200)
    expect(before.data.user?.email).toBe(email)
    expect((await phone.post('/api/me/sign-out-everywhere')).status).toBe(200)
    expect((await coach.get('/api/_auth/session')).status).toBe(401)
  })

  it('removing a member from a team ends their sessions there', async () => {
    const { coach, teamId } = await registerCoach(running.stack)
    const { athlete, userId } = await addAthlete(running.stack, coach)
    expect((await athlete.get('/api/me')).status).toBe(200)
    const db = createClient({ url: running.stack.databaseUrl })
    try {
      const live = async () => Number((await db.execute({ sql: 'SELECT count(*) AS n FROM auth_sessions WHERE user_id = ? AND team_id = ?', args: [userId, teamId] })).rows[0]!.n)
      expect(await live()).toBe(1)
      await db.execute('PRAGMA foreign_keys = ON')
      await db.execute({ sql: 'DELETE FROM memberships WHERE user_id = ? AND team_id = ?', args: [userId, teamId] })
      expect(await live()).toBe(0)
      expect((await athlete.get('/api/me/profile')).status).toBe(401)
    }
    finally {
      db.close()
    }
  })

  it('a cookie sealed before server-side sessions existed (no session id) is refused', async () => {
    const { coach } = await registerCoach(running.stack)
    expect((await coach.get('/api/me')).status).toBe(200)
    const forged = new ApiClient(running.stack.url, { cookie: 'nuxt-session=not-a-sealed-value' })
    expect((await forged.get('/api/me')).status).toBe(401)
  })
})
