import { connect } from 'node:net'
import { beforeAll, describe, expect, it } from 'vitest'
import type { AssignmentSnapshot } from '../../shared/types/domain'
import { ApiClient, uniqueEmail, type FieldError } from '../support/client'
import { addAthlete, PASSWORD, registerCoach } from '../support/team'
import { useStack } from '../support/hooks'

// TRUST_PROXY lets the tests speak from several client addresses through X-Forwarded-For.
const running = useStack({ S3_PUBLIC_ENDPOINT: 'http://media.larchford.test:9000', TRUST_PROXY: 'true' })
let team: Awaited<ReturnType<typeof registerCoach>>
let athlete: Awaited<ReturnType<typeof addAthlete>>

beforeAll(async () => {
  team = await registerCoach(running.stack)
  athlete = await addAthlete(running.stack, team.coach, { name: 'Ffion Aske' })
})

async function count(table: string) {
  const [row] = await running.fixtures.rows<{ n: number }>(`select count(*) as n from ${table}`)
  return Number(row!.n)
}

/** A form post as another site's page would send it, carrying the signed-in coach's cookie. */
async function formPost(client: ApiClient, type: string, body: string, headers: Record<string, string>) {
  const cookie = (await client.get('/api/me')).status === 200 ? client.cookieHeader() : ''
  const response = await fetch(`${running.stack.url}/api/invites`, { method: 'POST', headers: { 'content-type': type, 'cookie': cookie, ...headers }, body, redirect: 'manual' })
  return response.status
}

describe('cross-site requests', () => {
  it('refuses a form post from another site with 403 and creates nothing', async () => {
    const before = await count('invites')
    const cookie = team.coach.copy()
    const forms = [
      { type: 'application/x-www-form-urlencoded', body: `email=${encodeURIComponent(uniqueEmail())}&role=coach` },
      { type: 'multipart/form-data; boundary=x', body: '--x\r\nContent-Disposition: form-data; name="email"\r\n\r\nmallory@example.test\r\n--x--\r\n' },
      { type: 'text/plain', body: JSON.stringify({ email: uniqueEmail(), role: 'coach' }) },
    ]
    for (const form of forms) {
      const crossSite = await formPost(cookie, form.type, form.body, { 'origin': 'https://elsewhere.example', 'sec-fetch-site': 'cross-site' })
      expect(crossSite, form.type).toBe(403)
      // Without the browser's origin headers, a non-JSON body is still refused.
      expect(await formPost(cookie, form.type, form.body, {}), form.type).toBe(403)
    }
    const json = await cookie.request('POST', '/api/invites', { email: uniqueEmail(), role: 'coach' }, { headers: { origin: 'https://elsewhere.example' } })
    expect(json.status).toBe(403)
    expect(await count('invites')).toBe(before)
  })

  it('refuses a cross-site sign-in and registration, and accepts same-origin JSON', async () => {
    const visitor = new ApiClient(running.stack.url)
    expect((await visitor.request('POST', '/api/auth/login', { email: team.email, password: PASSWORD }, { headers: { 'sec-fetch-site': 'cross-site' } })).status).toBe(403)
    expect((await visitor.request('POST', '/api/auth/register', { name: 'Mallory', email: uniqueEmail(), password: PASSWORD, teamName: 'Fakes' }, { headers: { origin: 'http://evil.example' } })).status).toBe(403)
    expect((await visitor.request('POST', '/api/auth/login', { email: team.email, password: PASSWORD }, { headers: { 'origin': running.stack.url, 'sec-fetch-site': 'same-origin' } })).status).toBe(200)
    // A write with no body at all needs no content type.
    expect((await visitor.request('POST', '/api/auth/logout', undefined, { headers: { origin: running.stack.url } })).status).toBe(204)
  })
})

describe('headers', () => {
  it('sends the security headers on pages, with the object store allowed for media', async () => {
    const page = await fetch(`${running.stack.url}/login`)
    const csp = page.headers.get('content-security-policy') ?? ''
    expect(csp).toContain('frame-ancestors \'none\'')
    expect(csp).toMatch(/media-src [^;]*http:\/\/media\.larchford\.test:9000/)
    expect(csp).toMatch(/connect-src [^;]*http:\/\/media\.larchford\.test:9000/)
    expect(csp).toMatch(/script-src 'self' 'strict-dynamic' 'nonce-[\w+/=-]+'/)
    expect(csp).not.toContain('upgrade-insecure-requests')
    expect(page.headers.get('x-content-type-options')).toBe('nosniff')
    expect(page.headers.get('referrer-policy')).toBe('no-referrer')
    expect(page.headers.get('x-frame-options')).toBe('DENY')
    expect(page.headers.get('x-powered-by')).toBeNull()
    // Over plain HTTP there is no HSTS (it is sent when APP_URL is https).
    expect(page.headers.get('strict-transport-security')).toBeNull()
    expect(page.headers.get('cross-origin-embedder-policy')).toBeNull()
    const html = await page.text()
    const nonce = /'nonce-([^']+)'/.exec(csp)![1]
    for (const tag of html.match(/<script\b[^>]*>/g) ?? []) expect(tag).toContain(`nonce="${nonce}"`)
  })

  it('marks private API answers no-store', async () => {
    const profile = await athlete.athlete.get('/api/me/profile')
    expect(profile.status).toBe(200)
    expect(profile.headers.get('cache-control')).toBe('no-store')
    expect(profile.headers.get('x-content-type-options')).toBe('nosniff')
    expect((await athlete.athlete.get('/api/me/logbook')).headers.get('cache-control')).toBe('no-store')
  })
})

describe('limits', () => {
  it('refuses a chunked body over 1 MB with 413 while reading it', async () => {
    // A raw socket: the request keeps sending chunks until the answer arrives, as a real upload would.
    const status = await new Promise<number>((resolve, reject) => {
      const socket = connect(Number(new URL(running.stack.url).port), '127.0.0.1')
      let answer = ''
      let sent = 0
      socket.on('data', (data) => {
        answer += data.toString('latin1')
        const match = /^HTTP\/1\.1 (\d{3})/.exec(answer)
        if (match) {
          socket.destroy()
          resolve(Number(match[1]))
        }
      })
      socket.on('error', () => undefined)
      socket.on('close', () => reject(new Error(`closed without an answer after ${sent} bytes`)))
      const chunk = Buffer.alloc(64 * 1024, 0x20)
      const framed = Buffer.concat([Buffer.from(`${chunk.length.toString(16)}\r\n`), chunk, Buffer.from('\r\n')])
      socket.write('POST /api/auth/login HTTP/1.1\r\nHost: 127.0.0.1\r\nContent-Type: application/json\r\nTransfer-Encoding: chunked\r\n\r\n')
      const pump = () => {
        while (sent < 100 * 1024 * 1024 && !socket.destroyed) {
          sent += chunk.length
          if (!socket.write(framed)) return void socket.once('drain', pump)
        }
      }
      pump()
    })
    expect(status).toBe(413)
    // The server is still answering.
    expect((await fetch(`${running.stack.url}/api/health`)).status).toBe(200)
  })

  it('limits password-reset mails per recipient with 429, and queues nothing over the limit', async () => {
    const visitor = new ApiClient(running.stack.url)
    const statuses: number[] = []
    for (let i = 0; i < 8; i++) statuses.push((await visitor.post('/api/auth/password-reset', { email: team.email })).status)
    expect(statuses.slice(0, 5)).toEqual([202, 202, 202, 202, 202])
    expect(statuses.slice(5)).toEqual([429, 429, 429])
    const refused = await visitor.post<FieldError>('/api/auth/password-reset', { email: team.email })
    expect(refused.data.message).toMatch(/Too many e-mails to this address/)
    await new Promise(r => setTimeout(r, 500))
    const [row] = await running.fixtures.rows<{ n: number }>('select count(*) as n from email_outbox where "to" = ? and template = ?', [team.email, 'password_reset'])
    expect(Number(row!.n)).toBe(5)
  })

  it('limits invitation mails per recipient, counting resends', async () => {
    const email = uniqueEmail('invitee')
    const invite = await team.coach.post<{ id: number }>('/api/invites', { email, role: 'athlete' })
    expect(invite.status).toBe(201)
    const statuses: number[] = []
    for (let i = 0; i < 5; i++) statuses.push((await team.coach.post(`/api/team/invites/${invite.data.id}/resend`)).status)
    expect(statuses).toEqual([200, 200, 200, 200, 429])
  })

  it('throttles by account and address together: a stranger elsewhere cannot lock the real person out', async () => {
    const { email } = await registerCoach(running.stack)
    const stranger = new ApiClient(running.stack.url, { 'x-forwarded-for': '203.0.113.9' })
    for (let i = 0; i < 5; i++) expect((await stranger.post('/api/auth/login', { email, password: 'wrong-password!' })).status).toBe(401)
    expect((await stranger.post('/api/auth/login', { email, password: PASSWORD })).status).toBe(429)
    const owner = new ApiClient(running.stack.url, { 'x-forwarded-for': '198.51.100.7' })
    expect((await owner.post('/api/auth/login', { email, password: PASSWORD })).status).toBe(200)
  })

  it('answers an unknown e-mail like a wrong password', async () => {
    const visitor = new ApiClient(running.stack.url)
    const unknown = await visitor.post<FieldError>('/api/auth/login', { email: uniqueEmail('nobody'), password: 'whatever-password' })
    expect(unknown.status).toBe(401)
    expect(unknown.data.message).toBe('E-mail or password is wrong')
  })
})

describe('bad input gets a 4xx, never a 500', () => {
  it('injury note PATCH with nothing or only unknown keys is a 400', async () => {
    const id = await running.fixtures.injuryNote(team.teamId, athlete.userId, 'knee', 'Sore on descents')
    expect((await athlete.athlete.patch(`/api/injury-notes/${id}`, {})).status).toBe(400)
    const unknown = await athlete.athlete.patch<FieldError>(`/api/injury-notes/${id}`, { colour: 'red' })
    expect(unknown.status).toBe(400)
    expect(unknown.data.message).toMatch(/colour/)
    expect((await athlete.athlete.patch(`/api/injury-notes/${id}`, { status: 'resolved' })).status).toBe(200)
  })

  it('refuses routine steps nested a thousand deep before validating them', async () => {
    let steps: unknown = { id: 'leaf', type: 'block', kind: 'work', measure: { by: 'time', seconds: 30 } }
    for (let i = 0; i < 1000; i++) steps = { id: `r${i}`, type: 'repeat', times: 2, steps: [steps] }
    const response = await team.coach.post<FieldError>('/api/routines', { title: 'Deep', category: 'hills', steps: [steps] })
    expect(response.status).toBe(400)
    expect(response.data.message).toMatch(/nested deeper/)
  })

  it('refuses a repeated athlete id in squad members', async () => {
    const squad = await team.coach.post<{ id: number }>('/api/squads', { name: 'Tuesday hills' })
    const response = await team.coach.put<FieldError>(`/api/squads/${squad.data.id}/members`, { athleteIds: [athlete.userId, athlete.userId] })
    expect(response.status).toBe(400)
    expect(response.data.data?.fields?.athleteIds).toMatch(/only once/)
  })

  it('a squad PATCH with only a name keeps the description', async () => {
    const squad = await team.coach.post<{ id: number }>('/api/squads', { name: 'Ridge group', description: 'Thursday ridge repeats' })
    const renamed = await team.coach.patch<{ name: string, description: string }>(`/api/squads/${squad.data.id}`, { name: 'Ridge runners' })
    expect(renamed.status).toBe(200)
    expect(renamed.data).toMatchObject({ name: 'Ridge runners', description: 'Thursday ridge repeats' })
    expect((await team.coach.patch(`/api/squads/${squad.data.id}`, {})).status).toBe(400)
  })

  it('two registrations with one e-mail at the same moment: one 201, the rest 409', async () => {
    const email = uniqueEmail('twin')
    const responses = await Promise.all(Array.from({ length: 4 }, () => new ApiClient(running.stack.url).post('/api/auth/register', { name: 'Twin', email, password: PASSWORD, teamName: 'Twin Harriers' })))
    const statuses = responses.map(response => response.status).sort()
    expect(statuses).toEqual([201, 409, 409, 409])
  })

  it('refuses an implausible benchmark, and reads tolerate one stored earlier', async () => {
    for (const benchmark of [{ benchmarkDistanceM: 250_000, benchmarkTimeS: 30 }, { benchmarkDistanceM: 400, benchmarkTimeS: 48 * 3600 }]) {
      const response = await athlete.athlete.patch<FieldError>('/api/me/profile', benchmark)
      expect(response.status).toBe(400)
      expect(response.data.data?.fields?.benchmarkTimeS).toBeTruthy()
    }
    await running.fixtures.rows('update athlete_profiles set benchmark_distance_m = 250000, benchmark_time_s = 30 where user_id = ?', [athlete.userId])
    const snapshot: AssignmentSnapshot = { title: 'Strides', category: 'drills', description: '', exercises: [], steps: [{ id: 's', type: 'block', kind: 'work', measure: { by: 'time', seconds: 20 }, target: { type: 'pace', zone: 'mile' } }] }
    const { id } = await running.fixtures.assignment(team.teamId, athlete.userId, snapshot)
    expect((await athlete.athlete.get(`/api/assignments/${id}/plan`)).status).toBe(200)
    expect((await athlete.athlete.get('/api/me/profile')).status).toBe(200)
    expect((await team.coach.get(`/api/athletes/${athlete.userId}/profile`)).status).toBe(200)
    await running.fixtures.rows('update athlete_profiles set benchmark_distance_m = null, benchmark_time_s = null where user_id = ?', [athlete.userId])
  })

  it('keeps plan dates within five years, and the calendar feed skips a bad stored row', async () => {
    const routineId = await running.fixtures.routine(team.teamId, { title: 'Hills', category: 'hills', steps: [{ id: 'w', type: 'block', kind: 'work', measure: { by: 'time', seconds: 60 } }] })
    const far = await team.coach.post<FieldError>('/api/assignments', { routineId, athleteIds: [athlete.userId], dates: ['9999-12-31'] })
    expect(far.status).toBe(400)
    const today = new Date().toISOString().slice(0, 10)
    const made = await team.coach.post('/api/assignments', { routineId, athleteIds: [athlete.userId], dates: [today] })
    expect(made.status).toBe(201)
    const [row] = await running.fixtures.rows<{ id: number }>('select id from assignments where athlete_id = ? and date = ? order by id desc limit 1', [athlete.userId, today])
    expect((await team.coach.patch(`/api/assignments/${row!.id}`, { date: '9999-12-31' })).status).toBe(400)
    const feed = await athlete.athlete.post<{ url: string }>('/api/me/calendar-feed')
    await running.fixtures.rows('update assignments set date = ? where id = ?', ['2026-02-30', row!.id])
    const ics = await fetch(feed.data.url.replace(/^https?:\/\/[^/]+/, running.stack.url))
    expect(ics.status).toBe(200)
    expect(await ics.text()).toContain('BEGIN:VCALENDAR')
  })

  it('parses path ids strictly', async () => {
    for (const id of ['0x10', '1e1', '%201', '1.0', '-1', '0', '99999999999999999999']) {
      expect((await team.coach.get(`/api/routines/${id}`)).status, id).toBe(400)
    }
  })

  it('takes entries for a finished session within the edit window and works out its status again', async () => {
    const snapshot: AssignmentSnapshot = { title: 'Two strides', category: 'drills', description: '', exercises: [], steps: [{ id: 'st', type: 'repeat', times: 2, steps: [{ id: 'go', type: 'block', kind: 'work', measure: { by: 'time', seconds: 20 } }] }] }
    const { id } = await running.fixtures.assignment(team.teamId, athlete.userId, snapshot)
    const session = await athlete.athlete.post<{ id: number }>(`/api/assignments/${id}/sessions`, { clientId: 'late-entries' })
    const plan = await athlete.athlete.get<{ plan: { segments: { stepId: string, round: number | null, set: number | null, loggable: boolean }[] } }>(`/api/assignments/${id}/plan`)
    const loggable = plan.data.plan.segments.filter(segment => segment.loggable)
    expect(loggable.length).toBe(2)
    const entry = (segment: typeof loggable[number], n: number) => ({ idempotencyKey: `late-entry-${n}`, stepId: segment.stepId, ...(segment.round ? { round: segment.round } : {}), ...(segment.set ? { set: segment.set } : {}), seconds: 20 })
    const first = await athlete.athlete.post(`/api/sessions/${session.data.id}/entries`, entry(loggable[0]!, 1))
    expect(first.status, `${JSON.stringify(loggable)} ${first.text}`).toBe(201)
    const finished = await athlete.athlete.post<{ status: string }>(`/api/sessions/${session.data.id}/finish`, { sessionRpe: 5 })
    expect(finished.data.status).toBe('partial')
    expect((await athlete.athlete.post(`/api/sessions/${session.data.id}/entries`, entry(loggable[1]!, 2))).status).toBe(201)
    const [row] = await running.fixtures.rows<{ status: string }>('select status from assignments where id = ?', [id])
    expect(row!.status).toBe('done')
  })
})
