import { describe, expect, it } from 'vitest'
import { ApiClient, uniqueEmail, type FieldError } from '../support/client'
import { linkIn } from '../support/mail-catcher'
import { addAthlete, PASSWORD, registerCoach } from '../support/team'
import { useStack } from '../support/hooks'

const running = useStack()

describe('registration and sign-in', () => {
  it('registers a head coach, signs them in, and answers me', async () => {
    const client = new ApiClient(running.stack.url)
    const email = uniqueEmail('head')
    const registered = await client.post<{ role: string, team: { name: string } }>('/api/auth/register', { name: 'Ilse Marr', email, password: PASSWORD, teamName: 'Brackenmoor Road Runners' })
    expect(registered.status).toBe(201)
    expect(registered.data.role).toBe('head_coach')
    const me = await client.get<{ user: { email: string }, team: { name: string }, role: string }>('/api/me')
    expect(me.status).toBe(200)
    expect(me.data).toMatchObject({ user: { email }, team: { name: 'Brackenmoor Road Runners' }, role: 'head_coach' })
  })

  it('refuses a duplicate e-mail with 409', async () => {
    const email = uniqueEmail('dup')
    const body = { name: 'A Person', email, password: PASSWORD, teamName: 'First Club' }
    expect((await new ApiClient(running.stack.url).post('/api/auth/register', body)).status).toBe(201)
    const again = await new ApiClient(running.stack.url).post<FieldError>('/api/auth/register', { ...body, email: email.toUpperCase() })
    expect(again.status).toBe(409)
    expect(again.data.data?.fields?.email).toMatch(/already exists/)
  })

  it('refuses a weak password with a field message', async () => {
    const response = await new ApiClient(running.stack.url).post<FieldError>('/api/auth/register', { name: 'Short', email: uniqueEmail(), password: 'short', teamName: 'Club' })
    expect(response.status).toBe(400)
    expect(response.data.data?.fields?.password).toMatch(/at least 10/)
  })

  it('answers malformed, missing and oversized bodies with 4xx, never 500', async () => {
    const client = new ApiClient(running.stack.url)
    const malformed = await client.request<FieldError>('POST', '/api/auth/register', undefined, { raw: '{"name": "x",' })
    expect(malformed.status).toBe(400)
    const empty = await client.post<FieldError>('/api/auth/register', {})
    expect(empty.status).toBe(400)
    expect(Object.keys(empty.data.data?.fields ?? {})).toEqual(expect.arrayContaining(['name', 'email', 'password', 'teamName']))
    const wrongTypes = await client.post<FieldError>('/api/auth/login', { email: 42, password: ['x'] })
    expect(wrongTypes.status).toBe(400)
    const huge = await client.post('/api/auth/register', { name: 'x'.repeat(2_000_000), email: uniqueEmail(), password: PASSWORD, teamName: 'Club' })
    expect(huge.status).toBe(413)
    const longName = await client.post<FieldError>('/api/auth/register', { name: 'x'.repeat(5000), email: uniqueEmail(), password: PASSWORD, teamName: 'Club' })
    expect(longName.status).toBe(400)
    expect(longName.data.data?.fields?.name).toMatch(/at most 100/)
    expect(longName.text).not.toMatch(/at .*\.mjs:\d+/)
  })

  it('logs in and out; a wrong password is a generic 401', async () => {
    const { email } = await registerCoach(running.stack)
    const client = new ApiClient(running.stack.url)
    const wrong = await client.post<FieldError>('/api/auth/login', { email, password: 'not-the-password' })
    expect(wrong.status).toBe(401)
    const unknown = await client.post<FieldError>('/api/auth/login', { email: uniqueEmail('nobody'), password: 'not-the-password' })
    expect(unknown.status).toBe(401)
    expect(unknown.data.message).toBe(wrong.data.message)
    const login = await client.post('/api/auth/login', { email, password: PASSWORD })
    expect(login.status).toBe(200)
    expect((await client.get('/api/me')).status).toBe(200)
    expect((await client.post('/api/auth/logout')).status).toBe(204)
    expect((await client.get('/api/me')).status).toBe(401)
  })

  it('throttles repeated failures for one e-mail with 429', async () => {
    const { email } = await registerCoach(running.stack)
    const client = new ApiClient(running.stack.url)
    const statuses: number[] = []
    for (let attempt = 0; attempt < 6; attempt++) {
      statuses.push((await client.post('/api/auth/login', { email, password: 'wrong-password-again' })).status)
    }
    expect(statuses.slice(0, 5)).toEqual([401, 401, 401, 401, 401])
    expect(statuses[5]).toBe(429)
    // Even the right password waits out the window.
    expect((await client.post('/api/auth/login', { email, password: PASSWORD })).status).toBe(429)
  })

  it('answers a signed-out call with 401', async () => {
    expect((await new ApiClient(running.stack.url).get('/api/team')).status).toBe(401)
    expect((await new ApiClient(running.stack.url).post('/api/invites', { email: uniqueEmail(), role: 'athlete' })).status).toBe(401)
  })
})

describe('invitations', () => {
  it('invites an athlete by e-mail; the link signs the new athlete in once', async () => {
    const { coach } = await registerCoach(running.stack, 'Fellgate Striders')
    const squad = await coach.post<{ id: number }>('/api/squads', { name: 'Hill group' })
    const email = uniqueEmail('invitee')
    const invite = await coach.post<{ expiresAt: string }>('/api/invites', { email, role: 'athlete', squadId: squad.data.id })
    expect(invite.status).toBe(201)
    const days = (new Date(invite.data.expiresAt).getTime() - Date.now()) / 86_400_000
    expect(days).toBeGreaterThan(6.9)
    expect(days).toBeLessThanOrEqual(7)

    const mail = await running.stack.mail.waitFor(email, /invited you to Fellgate Striders/)
    expect(mail.html).toContain('Accept the invitation')
    const link = linkIn(mail, /http:\/\/127\.0\.0\.1:\d+\/join\/[\w-]+/)
    const token = link.split('/').pop()!

    const visitor = new ApiClient(running.stack.url)
    const details = await visitor.get<{ teamName: string, inviterName: string, role: string }>(`/api/invites/${token}`)
    expect(details.data).toMatchObject({ teamName: 'Fellgate Striders', inviterName: 'Morwen Tay', role: 'athlete' })

    const accepted = await visitor.post(`/api/invites/${token}/accept`, { name: 'Cai Penhallow', password: PASSWORD })
    expect(accepted.status).toBe(201)
    const me = await visitor.get<{ role: string, user: { name: string } }>('/api/me')
    expect(me.data).toMatchObject({ role: 'athlete', user: { name: 'Cai Penhallow' } })

    const team = await coach.get<{ squads: { id: number, memberIds: number[] }[], members: { email: string }[] }>('/api/team')
    expect(team.data.members.map(member => member.email)).toContain(email)
    expect(team.data.squads.find(s => s.id === squad.data.id)?.memberIds).toHaveLength(1)

    const reused = await new ApiClient(running.stack.url).post('/api/invites/' + token + '/accept', { name: 'Someone Else', password: PASSWORD })
    expect(reused.status).toBe(410)
    expect((await new ApiClient(running.stack.url).get(`/api/invites/${token}`)).status).toBe(410)
  })

  it('refuses an expired or withdrawn invitation with 410', async () => {
    const { coach } = await registerCoach(running.stack)
    const email = uniqueEmail('late')
    const invite = await coach.post<{ id: number }>('/api/invites', { email, role: 'athlete' })
    const mail = await running.stack.mail.waitFor(email, /invited you/)
    const token = linkIn(mail, /\/join\/[\w-]+/).split('/').pop()!
    const { createClient } = await import('@libsql/client')
    const db = createClient({ url: running.stack.databaseUrl })
    await db.execute({ sql: 'update invites set expires_at = ? where id = ?', args: [Date.now() - 1000, invite.data.id] })
    db.close()
    expect((await new ApiClient(running.stack.url).post(`/api/invites/${token}/accept`, { name: 'Too Late', password: PASSWORD })).status).toBe(410)

    const other = uniqueEmail('withdrawn')
    const second = await coach.post<{ id: number }>('/api/invites', { email: other, role: 'coach' })
    const secondMail = await running.stack.mail.waitFor(other, /invited you/)
    expect((await coach.post(`/api/team/invites/${second.data.id}/revoke`)).status).toBe(204)
    const secondToken = linkIn(secondMail, /\/join\/[\w-]+/).split('/').pop()!
    expect((await new ApiClient(running.stack.url).get(`/api/invites/${secondToken}`)).status).toBe(410)
  })

  it('keeps athletes out of coach routes (403) and other teams out of ids (404)', async () => {
    const { coach } = await registerCoach(running.stack, 'Team One')
    const { athlete } = await addAthlete(running.stack, coach)
    const athleteInvite = await athlete.post('/api/invites', { email: uniqueEmail(), role: 'athlete' })
    expect(athleteInvite.status).toBe(403)
    expect((await athlete.get('/api/team')).status).toBe(403)

    const squad = await coach.post<{ id: number }>('/api/squads', { name: 'Mine' })
    const { coach: rival } = await registerCoach(running.stack, 'Team Two')
    expect((await rival.patch(`/api/squads/${squad.data.id}`, { name: 'Taken' })).status).toBe(404)
    expect((await rival.delete(`/api/squads/${squad.data.id}`)).status).toBe(404)
    const invite = await coach.post<{ id: number }>('/api/invites', { email: uniqueEmail(), role: 'athlete' })
    expect((await rival.post(`/api/team/invites/${invite.data.id}/revoke`)).status).toBe(404)
    expect((await rival.post('/api/invites', { email: uniqueEmail(), role: 'athlete', squadId: squad.data.id })).status).toBe(400)
  })
})

describe('password reset', () => {
  it('sends a one-hour, single-use link and changes the password', async () => {
    const { email } = await registerCoach(running.stack)
    const visitor = new ApiClient(running.stack.url)
    expect((await visitor.post('/api/auth/password-reset', { email })).status).toBe(202)
    expect((await visitor.post('/api/auth/password-reset', { email: uniqueEmail('nobody') })).status).toBe(202)
    const mail = await running.stack.mail.waitFor(email, /Reset your Switchback password/)
    const token = linkIn(mail, /\/reset\/[\w-]+/).split('/').pop()!
    expect((await visitor.post<FieldError>(`/api/auth/password-reset/${token}`, { password: 'short' })).status).toBe(400)
    expect((await visitor.post(`/api/auth/password-reset/${token}`, { password: 'a-brand-new-password' })).status).toBe(200)
    expect((await visitor.post(`/api/auth/password-reset/${token}`, { password: 'another-new-password' })).status).toBe(410)
    expect((await visitor.post('/api/auth/login', { email, password: PASSWORD })).status).toBe(401)
    expect((await visitor.post('/api/auth/login', { email, password: 'a-brand-new-password' })).status).toBe(200)
  })
})
