import { describe, expect, it } from 'vitest'
import { ApiClient, uniqueEmail, type FieldError } from '../support/client'
import { linkIn } from '../support/mail-catcher'
import { countRows, insertRoutine, outboxSettled } from '../support/planner'
import { addAthlete, PASSWORD, registerCoach } from '../support/team'
import { createRoutine, insertHistory, insertPainFlag, openTestDatabase } from '../support/insights-data'
import { addDays, todayIn } from '../../shared/utils/dates'
import { useStack } from '../support/hooks'

// Plan-change notices wait a moment for more changes; short here so the test sees them.
const running = useStack({ PLAN_NOTICE_DELAY_MS: '600' })

/** Invites someone as a coach of the head coach's team and signs them in through the e-mailed link. */
async function addCoach(head: ApiClient, email = uniqueEmail('coach'), password = PASSWORD) {
  const invite = await head.post('/api/invites', { email, role: 'coach' })
  expect(invite.status).toBe(201)
  const mail = await running.stack.mail.waitFor(email, /invited you/)
  const token = linkIn(mail, /\/join\/[\w-]+/).split('/').pop()!
  const coach = new ApiClient(running.stack.url)
  const accepted = await coach.post<{ user: { id: number } }>(`/api/invites/${token}/accept`, { name: 'Idris Fenn', password })
  expect(accepted.status).toBe(201)
  return { coach, email, userId: accepted.data.user.id }
}

async function rows<T>(sql: string, args: (string | number)[] = []) {
  return (await running.db.execute({ sql, args })).rows as unknown as T[]
}

describe('head coach and coach', () => {
  it('refuses every head-coach route to a plain coach with 403, and lets the head coach through', async () => {
    const { coach: head, teamId } = await registerCoach(running.stack, 'Larchford Fell Club')
    const { coach, userId: coachId } = await addCoach(head)
    const { coach: second, userId: secondId } = await addCoach(head)
    const pendingCoach = await head.post<{ id: number }>('/api/invites', { email: uniqueEmail('later'), role: 'coach' })

    const refused = await Promise.all([
      coach.patch('/api/team', { name: 'Renamed by a coach' }),
      coach.patch('/api/team', { emergencyNumber: '999' }),
      coach.patch('/api/team', { timezone: 'Europe/London' }),
      coach.request('DELETE', '/api/team', { confirmName: 'Larchford Fell Club' }),
      coach.patch(`/api/team/members/${secondId}`, { role: 'head_coach' }),
      coach.delete(`/api/team/members/${secondId}`),
      coach.post('/api/invites', { email: uniqueEmail('sneaky'), role: 'coach' }),
      coach.post(`/api/team/invites/${pendingCoach.data.id}/resend`),
      coach.post(`/api/team/invites/${pendingCoach.data.id}/revoke`),
    ])
    expect(refused.map(response => response.status)).toEqual(refused.map(() => 403))
    // Nothing changed.
    const [team] = await rows<{ name: string, emergency_number: string | null }>('select name, emergency_number from teams where id = ?', [teamId])
    expect(team).toMatchObject({ name: 'Larchford Fell Club', emergency_number: null })
    expect(await rows('select 1 from memberships where team_id = ? and user_id = ?', [teamId, secondId])).toHaveLength(1)

    // A plain coach still runs the coaching side: athletes, library, home.
    expect((await coach.post('/api/invites', { email: uniqueEmail('athlete'), role: 'athlete' })).status).toBe(201)
    expect((await coach.get('/api/coach/home')).status).toBe(200)
    expect((await coach.get('/api/exercises')).status).toBe(200)

    const settings = await head.patch<{ name: string, emergencyNumber: string, timezone: string }>('/api/team', { name: 'Larchford Fell & Road', emergencyNumber: '+44 1632 960000', timezone: 'Europe/London' })
    expect(settings.status).toBe(200)
    expect(settings.data).toMatchObject({ name: 'Larchford Fell & Road', emergencyNumber: '+44 1632 960000', timezone: 'Europe/London' })
    const badZone = await head.patch<FieldError>('/api/team', { timezone: 'Mars/Olympus' })
    expect(badZone.status).toBe(400)
    expect(badZone.data.data?.fields?.timezone).toBeTruthy()

    expect((await head.patch(`/api/team/members/${coachId}`, { role: 'head_coach' })).status).toBe(200)
    // Now a head coach, the former plain coach may rename the team.
    expect((await coach.patch('/api/team', { name: 'Larchford Fell Club' })).status).toBe(200)
    expect((await head.delete(`/api/team/members/${secondId}`)).status).toBe(204)
    expect((await second.get('/api/me')).status).toBe(401)
  })

  it('keeps one head coach, and deletes the team only after its name is typed', async () => {
    const { coach: head, userId: headId, teamId } = await registerCoach(running.stack, 'Brackenmoor Striders')
    const demote = await head.patch<FieldError>(`/api/team/members/${headId}`, { role: 'coach' })
    expect(demote.status).toBe(409)
    const { userId: athleteId } = await addAthlete(running.stack, head)
    expect((await head.patch<FieldError>(`/api/team/members/${athleteId}`, { role: 'coach' })).status).toBe(400)
    const leave = await head.delete(`/api/me/teams/${teamId}`)
    expect(leave.status).toBe(409)

    const wrong = await head.request<FieldError>('DELETE', '/api/team', { confirmName: 'Brackenmoor' })
    expect(wrong.status).toBe(400)
    expect(wrong.data.data?.fields?.confirmName).toMatch(/exactly/)
    const routineId = await insertRoutine(running.db, teamId, { title: 'Hill reps' })
    expect((await head.post('/api/assignments', { routineId, athleteIds: [athleteId], dates: ['2030-01-07'] })).status).toBe(201)
    const deleted = await head.request('DELETE', '/api/team', { confirmName: 'Brackenmoor Striders' })
    expect(deleted.status).toBe(204)
    expect(await rows('select 1 from teams where id = ?', [teamId])).toHaveLength(0)
    expect(await rows('select 1 from assignments where team_id = ?', [teamId])).toHaveLength(0)
    expect((await head.get('/api/me')).status).toBe(401)
  })
})

describe('more than one team', () => {
  it('lets one account join a second team, switch between them, see only the chosen team, and leave', async () => {
    const a = await registerCoach(running.stack, 'Larchford Ridge Runners')
    const b = await registerCoach(running.stack, 'Combe Valley Harriers')
    const { athlete, email, userId } = await addAthlete(running.stack, a.coach, { name: 'Cai Penhallow' })
    const routineA = await insertRoutine(running.db, a.teamId, { title: 'Ridge hill reps' })
    const routineB = await insertRoutine(running.db, b.teamId, { title: 'Valley strides' })
    expect((await a.coach.post('/api/assignments', { routineId: routineA, athleteIds: [userId], dates: ['2030-02-04'] })).status).toBe(201)

    // An invitation to the same e-mail joins the existing account to the second team.
    expect((await b.coach.post('/api/invites', { email, role: 'athlete' })).status).toBe(201)
    const mail = await running.stack.mail.waitFor(email, /Combe Valley/)
    const token = linkIn(mail, /\/join\/[\w-]+/).split('/').pop()!
    const wrongPassword = await new ApiClient(running.stack.url).post<FieldError>(`/api/invites/${token}/accept`, { name: 'Cai', password: 'not-the-password' })
    expect(wrongPassword.status).toBe(401)
    const joined = await new ApiClient(running.stack.url).post<{ user: { id: number } }>(`/api/invites/${token}/accept`, { name: 'Cai Penhallow', password: PASSWORD })
    expect(joined.status).toBe(201)
    expect(joined.data.user.id).toBe(userId)
    expect(await rows('select 1 from users where email = ?', [email])).toHaveLength(1)
    expect((await b.coach.post('/api/assignments', { routineId: routineB, athleteIds: [userId], dates: ['2030-02-04'] })).status).toBe(201)

    const teams = await athlete.get<{ id: number, name: string, active: boolean }[]>('/api/me/teams')
    expect(teams.data.map(team => team.name).sort()).toEqual(['Combe Valley Harriers', 'Larchford Ridge Runners'])
    expect(teams.data.find(team => team.active)?.id).toBe(a.teamId)

    type Plan = { assignments: { title: string }[] }
    const inA = await athlete.get<Plan>('/api/me/assignments?from=2030-02-01&to=2030-02-10')
    expect(inA.data.assignments.map(item => item.title)).toEqual(['Ridge hill reps'])

    const switched = await athlete.post<{ team: { id: number } }>('/api/me/team', { teamId: b.teamId })
    expect(switched.status).toBe(200)
    expect((await athlete.get<{ team: { name: string } }>('/api/me')).data.team.name).toBe('Combe Valley Harriers')
    const inB = await athlete.get<Plan>('/api/me/assignments?from=2030-02-01&to=2030-02-10')
    expect(inB.data.assignments.map(item => item.title)).toEqual(['Valley strides'])

    // Not a member: the same 404 as a team that does not exist; bad input is a 400.
    const outsider = await registerCoach(running.stack, 'Elsewhere AC')
    expect((await athlete.post('/api/me/team', { teamId: outsider.teamId })).status).toBe(404)
    expect((await athlete.post('/api/me/team', { teamId: 'two' })).status).toBe(400)

    // Each coach sees only their own team's work.
    const planA = await a.coach.get<Plan>('/api/assignments?from=2030-02-01&to=2030-02-10')
    expect(planA.data.assignments.map(item => item.title)).toEqual(['Ridge hill reps'])
    const planB = await b.coach.get<Plan>('/api/assignments?from=2030-02-01&to=2030-02-10')
    expect(planB.data.assignments.map(item => item.title)).toEqual(['Valley strides'])

    // Leaving the active team moves the session to the other one; the team keeps the history.
    const left = await athlete.delete<{ team: { id: number } | null }>(`/api/me/teams/${b.teamId}`)
    expect(left.status).toBe(200)
    expect(left.data.team?.id).toBe(a.teamId)
    expect((await athlete.get<{ team: { id: number } }>('/api/me')).data.team.id).toBe(a.teamId)
    expect(await countRows(running.db, 'assignments', b.teamId)).toBe(1)
    const membersB = await b.coach.get<{ members: { id: number }[] }>('/api/team')
    expect(membersB.data.members.map(member => member.id)).not.toContain(userId)
  })

  it('lets a coach of two teams switch, scoping the team page to the chosen one', async () => {
    const a = await registerCoach(running.stack, 'North Ridge Runners')
    const b = await registerCoach(running.stack, 'South Ridge Runners')
    const password = 'shared-coach-password'
    const { coach, email } = await addCoach(a.coach, uniqueEmail('twoteams'), password)
    expect((await b.coach.post('/api/invites', { email, role: 'coach' })).status).toBe(201)
    const mail = await running.stack.mail.waitFor(email, /South Ridge/)
    const token = linkIn(mail, /\/join\/[\w-]+/).split('/').pop()!
    expect((await coach.post(`/api/invites/${token}/accept`, { name: 'Idris Fenn', password })).status).toBe(201)
    // Accepting signs in to the new team.
    expect((await coach.get<{ team: { name: string } }>('/api/team')).data.team.name).toBe('South Ridge Runners')
    expect((await coach.post('/api/me/team', { teamId: a.teamId })).status).toBe(200)
    expect((await coach.get<{ team: { name: string } }>('/api/team')).data.team.name).toBe('North Ridge Runners')
  })

  it('keeps a removed athlete\'s sessions with the team, and clears their notes when asked', async () => {
    const { coach, teamId } = await registerCoach(running.stack, 'Anonymous Hill Club')
    const { userId } = await addAthlete(running.stack, coach)
    const routineId = await insertRoutine(running.db, teamId, { title: 'Stairs' })
    await coach.post('/api/assignments', { routineId, athleteIds: [userId], dates: ['2030-03-02'] })
    await running.db.execute({ sql: 'insert into injury_notes (team_id, athlete_id, body_area, note) values (?, ?, ?, ?)', args: [teamId, userId, 'knee', 'Sore after downhill'] })
    const removed = await coach.delete(`/api/team/members/${userId}?anonymise=true`)
    expect(removed.status).toBe(204)
    expect(await countRows(running.db, 'assignments', teamId)).toBe(1)
    expect(await rows('select 1 from injury_notes where team_id = ? and athlete_id = ?', [teamId, userId])).toHaveLength(0)
    expect((await coach.delete(`/api/team/members/${userId}?anonymise=maybe`)).status).toBe(400)
  })
})

describe('an anonymised former athlete', () => {
  it('shows under a stable "Former athlete N" wherever the team sees their history, and their name and e-mail nowhere', async () => {
    const { coach, teamId } = await registerCoach(running.stack, 'Anonymised Ridge Club')
    const wren = await addAthlete(running.stack, coach, { name: 'Wren Calder' })
    const oriel = await addAthlete(running.stack, coach, { name: 'Oriel Banks' })
    const piran = await addAthlete(running.stack, coach, { name: 'Piran Hale' })
    const today = todayIn('UTC')
    const history = await openTestDatabase(running.stack.databaseUrl)
    const routine = await createRoutine(history, teamId, 'Quarry hill reps')
    const sessions = new Map<number, { id: number }[]>()
    for (const [person, word] of [[wren, 'heather'], [oriel, 'bracken'], [piran, 'gorse']] as const) {
      const logged = await insertHistory(history, { teamId, athleteId: person.userId, today, routine, days: [
        { daysAgo: 9, done: true, load: 200, note: `Calf tight on the last rep (${word})` },
        { daysAgo: 2, done: true, load: 240, pain: 6, painArea: 'calf', note: `Calf again (${word})` },
        { daysAgo: -2, done: false },
      ] })
      sessions.set(person.userId, logged)
      await insertPainFlag(history, { teamId, athleteId: person.userId, sessionId: logged[1]!.id, pain: 6, area: 'calf' })
    }
    history.$client.close()
    // A form-review clip Wren sent before leaving: it shows her, so anonymising deletes it.
    const clip = await running.db.execute({ sql: 'insert into media_objects (team_id, key, content_type, size, status) values (?, ?, \'video/webm\', 10, \'ready\') returning id', args: [teamId, `teams/${teamId}/reviews/${wren.userId}/left.webm`] })
    await running.db.execute({ sql: 'insert into form_reviews (team_id, athlete_id, clip_id, question) values (?, ?, ?, ?)', args: [teamId, wren.userId, Number(clip.rows[0]!.id), 'Is my knee drifting in?'] })

    // Wren is removed and anonymised by the coach; Oriel leaves and asks for it herself; Piran is removed by name.
    expect((await coach.delete(`/api/team/members/${wren.userId}?anonymise=true`)).status).toBe(204)
    expect((await oriel.athlete.delete(`/api/me/teams/${teamId}?anonymise=perhaps`)).status).toBe(400)
    expect((await oriel.athlete.delete(`/api/me/teams/${teamId}?anonymise=true`)).status).toBe(200)
    expect((await coach.delete(`/api/team/members/${piran.userId}`)).status).toBe(204)

    const hidden = ['Wren Calder', wren.email, 'Oriel Banks', oriel.email, 'heather', 'bracken']
    const reads = {
      flags: await coach.get<{ id: number, athleteId: number, athleteName: string, formerAthlete: boolean, note: string }[]>('/api/pain-flags?status=all'),
      home: await coach.get<{ painFlags: { athleteId: number, athleteName: string }[] }>('/api/coach/home'),
      team: await coach.get<{ rows: { name: string }[] }>('/api/insights/team'),
      sessionsCsv: await coach.get<string>(`/exports/logs.csv?from=${addDays(today, -30)}&to=${today}`),
      weeksCsv: await coach.get<string>(`/exports/logs.csv?kind=weeks&from=${addDays(today, -30)}&to=${today}`),
      planner: await coach.get<{ assignments: { athleteId: number, athleteName: string }[] }>(`/api/assignments?from=${addDays(today, -30)}&to=${addDays(today, 7)}`),
      reviews: await coach.get<{ items: { athleteId: number, athleteName: string }[] }>('/api/reviews?status=all'),
    }
    for (const [name, read] of Object.entries(reads)) {
      expect(read.status, name).toBe(200)
      for (const secret of hidden) expect(read.text, `${name} shows ${secret}`).not.toContain(secret)
    }
    const labelOf = (rows: { athleteId: number, athleteName: string }[], athleteId: number) => [...new Set(rows.filter(row => row.athleteId === athleteId).map(row => row.athleteName))]

    // Pain flags (the list the insights page shows): labels in the order the people were anonymised.
    expect(labelOf(reads.flags.data, wren.userId)).toEqual(['Former athlete 1'])
    expect(labelOf(reads.flags.data, oriel.userId)).toEqual(['Former athlete 2'])
    expect(labelOf(reads.flags.data, piran.userId)).toEqual(['Piran Hale'])
    expect(reads.flags.data.every(flag => flag.formerAthlete)).toBe(true)
    expect(labelOf(reads.home.data.painFlags, wren.userId)).toEqual(['Former athlete 1'])
    // The team table lists members only; a former athlete's report is not reachable.
    expect(reads.team.data.rows).toEqual([])
    expect((await coach.get(`/api/insights/athletes/${wren.userId}`)).status).toBe(404)
    expect((await coach.get(`/exports/logs.csv?athleteId=${wren.userId}`)).status).toBe(404)
    // The team's exports keep the history under the labels; the anonymised notes are gone.
    const sessionLines = reads.sessionsCsv.text.trim().split(/\r?\n/)
    expect(sessionLines.filter(line => line.startsWith('Former athlete 1,'))).toHaveLength(2)
    expect(sessionLines.filter(line => line.startsWith('Former athlete 2,'))).toHaveLength(2)
    expect(sessionLines.filter(line => line.startsWith('Piran Hale,') && line.includes('gorse'))).toHaveLength(2)
    expect(reads.weeksCsv.text).toMatch(/^Former athlete 1,/m)
    expect(reads.weeksCsv.text).toMatch(/^Former athlete 2,/m)
    expect(reads.weeksCsv.text).toMatch(/^Piran Hale,/m)
    // The planner's history (and the session still planned) and the review queue.
    expect(labelOf(reads.planner.data.assignments, wren.userId)).toEqual(['Former athlete 1'])
    expect(reads.planner.data.assignments.filter(row => row.athleteId === wren.userId)).toHaveLength(3)
    expect(reads.reviews.data.items.filter(item => item.athleteId === wren.userId)).toEqual([])
    expect(await rows('select 1 from form_reviews where team_id = ? and athlete_id = ?', [teamId, wren.userId])).toHaveLength(0)
    expect(await rows('select status from media_objects where id = ?', [Number(clip.rows[0]!.id)])).toEqual([expect.objectContaining({ status: 'deleted' })])

    // The label is stable: another athlete anonymised later takes the next number.
    const sorrel = await addAthlete(running.stack, coach, { name: 'Sorrel Vane' })
    expect((await coach.delete(`/api/team/members/${sorrel.userId}?anonymise=true`)).status).toBe(204)
    const [label] = await rows<{ number: number }>('select number from anonymised_members where team_id = ? and user_id = ?', [teamId, sorrel.userId])
    expect(Number(label!.number)).toBe(3)
    const again = await coach.get<{ athleteId: number, athleteName: string }[]>('/api/pain-flags?status=all')
    expect(labelOf(again.data, wren.userId)).toEqual(['Former athlete 1'])

    // Closing a former athlete's flag with a reply sends them nothing.
    const flag = reads.flags.data.find(item => item.athleteId === wren.userId)!
    const acknowledged = await coach.post<{ id: number }>(`/api/pain-flags/${flag.id}/acknowledge`, { reply: 'Hope the calf settled.' })
    expect(acknowledged.status).toBe(200)
    expect(await rows('select 1 from email_outbox where "to" = ? and template = \'pain_flag_reply\'', [wren.email])).toHaveLength(0)
    // Someone who comes back is a member again, shown by name; their number stays theirs.
    const invitations = () => running.stack.mail.to(wren.email).filter(mail => /invited you/.test(mail.subject ?? ''))
    const before = invitations().length
    expect((await coach.post('/api/invites', { email: wren.email, role: 'athlete' })).status).toBe(201)
    await expect.poll(() => invitations().length, { timeout: 10_000 }).toBeGreaterThan(before)
    const back = linkIn(invitations().at(-1)!, /\/join\/[\w-]+/).split('/').pop()!
    expect((await new ApiClient(running.stack.url).post(`/api/invites/${back}/accept`, { name: 'Wren Calder', password: PASSWORD })).status).toBe(201)
    const rejoined = await coach.get<{ athleteId: number, athleteName: string }[]>('/api/pain-flags?status=all')
    expect(labelOf(rejoined.data, wren.userId)).toEqual(['Wren Calder'])
    expect(labelOf(rejoined.data, oriel.userId)).toEqual(['Former athlete 2'])
    expect(await rows('select number from anonymised_members where team_id = ? and user_id = ?', [teamId, wren.userId])).toEqual([expect.objectContaining({ number: 1 })])
    // Another team never sees the label table of this one.
    const other = await registerCoach(running.stack, 'Unrelated Harriers')
    expect((await other.coach.get<unknown[]>('/api/pain-flags?status=all')).data).toEqual([])
  })
})

describe('the starter set', () => {
  it('copies the library with clips and the starter routines into the new team only, once', async () => {
    const head = new ApiClient(running.stack.url)
    const registered = await head.post<{ team: { id: number }, starterSet: { exercisesAdded: number, routinesAdded: number, clipsCopied: number, clipsMissing: number } }>('/api/auth/register', {
      name: 'Morwen Tay', email: uniqueEmail('starter'), password: PASSWORD, teamName: 'Starter Club', starterSet: true,
    })
    expect(registered.status).toBe(201)
    const teamId = registered.data.team.id
    const first = registered.data.starterSet
    expect(first.exercisesAdded).toBeGreaterThan(20)
    expect(first.routinesAdded).toBeGreaterThan(2)
    expect(first.clipsCopied).toBe(6)
    expect(first.clipsMissing).toBe(0)

    const again = await head.post<typeof first>('/api/team/starter-set')
    expect(again.status).toBe(200)
    expect(again.data).toEqual({ exercisesAdded: 0, routinesAdded: 0, clipsCopied: 0, clipsMissing: 0 })
    const [count] = await rows<{ n: number }>('select count(*) as n from exercises where team_id = ?', [teamId])
    expect(Number(count!.n)).toBe(first.exercisesAdded)

    // The clips are the team's own objects, under its prefix in the store, and they play.
    const media = await rows<{ key: string, exercise_id: number }>('select key, exercise_id from media_objects where team_id = ? and status = \'ready\'', [teamId])
    expect(media).toHaveLength(6)
    for (const object of media) expect(object.key.startsWith(`teams/${teamId}/exercises/${object.exercise_id}/`)).toBe(true)
    const clip = await head.get<{ url: string }>(`/api/exercises/${media[0]!.exercise_id}/clip`)
    const played = await fetch(clip.data.url)
    expect(played.status).toBe(200)
    const bytes = new Uint8Array(await played.arrayBuffer())
    expect([...bytes.subarray(0, 4)]).toEqual([0x1A, 0x45, 0xDF, 0xA3]) // the WebM (EBML) signature

    // Starter routines are marked and editable; their exercises are this team's copies.
    const routines = await rows<{ id: number, starter_key: string, steps: string }>('select id, starter_key, steps from routines where team_id = ?', [teamId])
    expect(routines.every(routine => routine.starter_key)).toBe(true)
    const ids = new Set((await rows<{ id: number }>('select id from exercises where team_id = ?', [teamId])).map(row => Number(row.id)))
    const used = [...routines.flatMap(routine => routine.steps.match(/"exerciseId":(\d+)/g) ?? [])].map(match => Number(match.split(':')[1]))
    expect(used.length).toBeGreaterThan(0)
    expect(used.every(id => ids.has(id))).toBe(true)

    // Another team, and a team that chose to start empty, have none of it.
    const empty = await registerCoach(running.stack, 'Empty Club')
    expect(await rows('select 1 from exercises where team_id = ?', [empty.teamId])).toHaveLength(0)
    // Adding it later gives that team copies of its own (its own rows and clips under its own prefix),
    // and leaves the first team's as they were.
    const later = await empty.coach.post<typeof first>('/api/team/starter-set')
    expect(later.data).toMatchObject({ exercisesAdded: first.exercisesAdded, routinesAdded: first.routinesAdded, clipsCopied: 6 })
    const laterMedia = await rows<{ key: string }>('select key from media_objects where team_id = ? and status = \'ready\'', [empty.teamId])
    expect(laterMedia.every(object => object.key.startsWith(`teams/${empty.teamId}/`))).toBe(true)
    const [firstAgain] = await rows<{ n: number }>('select count(*) as n from exercises where team_id = ?', [teamId])
    expect(Number(firstAgain!.n)).toBe(first.exercisesAdded)
    // A plain athlete cannot add it.
    const { athlete } = await addAthlete(running.stack, head)
    expect((await athlete.post('/api/team/starter-set')).status).toBe(403)
  })
})

describe('planning the same thing twice', () => {
  it('skips a duplicate routine/athlete/day unless confirmed, and an idempotency key makes a double click harmless', async () => {
    const { coach, teamId } = await registerCoach(running.stack, 'Duplicate Checkers')
    const { userId: first } = await addAthlete(running.stack, coach)
    const { userId: second } = await addAthlete(running.stack, coach, { name: 'Oren Blythe' })
    const routineId = await insertRoutine(running.db, teamId, { title: 'Hill reps' })
    type Batch = { created: number, ids: number[], skipped: { athleteId: number, date: string }[], repeated: boolean }

    const planned = await coach.post<Batch>('/api/assignments', { routineId, athleteIds: [first], dates: ['2030-04-01', '2030-04-03'] })
    expect(planned.data.created).toBe(2)
    const again = await coach.post<Batch>('/api/assignments', { routineId, athleteIds: [first, second], dates: ['2030-04-01', '2030-04-03'] })
    expect(again.status).toBe(201)
    expect(again.data.created).toBe(2)
    expect(again.data.skipped.map(item => [item.athleteId, item.date])).toEqual([[first, '2030-04-01'], [first, '2030-04-03']])
    expect(await countRows(running.db, 'assignments', teamId)).toBe(4)
    const confirmed = await coach.post<Batch>('/api/assignments', { routineId, athleteIds: [first], dates: ['2030-04-01'], confirmDuplicates: true })
    expect(confirmed.data.created).toBe(1)
    expect(await countRows(running.db, 'assignments', teamId)).toBe(5)

    const body = { routineId, athleteIds: [second], dates: ['2030-04-08'], idempotencyKey: 'batch-0a1b2c3d' }
    const [one, two] = await Promise.all([coach.post<Batch>('/api/assignments', body), coach.post<Batch>('/api/assignments', body)])
    expect([one.status, two.status]).toContain(201)
    // The other one either waited and got the first answer back, or met the claimed key: never a 5xx.
    expect([one.status, two.status].every(status => [200, 201, 409].includes(status))).toBe(true)
    expect(await countRows(running.db, 'assignments', teamId)).toBe(6)
    const three = await coach.post<Batch>('/api/assignments', body)
    expect(three.data.repeated).toBe(true)
    expect(three.data.ids).toEqual((one.status === 201 ? one : two).data.ids)
    expect(await countRows(running.db, 'assignments', teamId)).toBe(6)
    expect((await coach.post<FieldError>('/api/assignments', { ...body, idempotencyKey: 'no spaces allowed' })).status).toBe(400)
    await outboxSettled(running.db)
  })
})

describe('notices of moved and removed sessions', () => {
  it('gathers one athlete\'s changes of a day in one e-mail, tells both athletes of a hand-over, and respects the opt-out', async () => {
    const { coach, teamId } = await registerCoach(running.stack, 'Notice Harriers')
    const tamsin = await addAthlete(running.stack, coach, { name: 'Tamsin Rook' })
    const oren = await addAthlete(running.stack, coach, { name: 'Oren Blythe' })
    const quiet = await addAthlete(running.stack, coach, { name: 'Wren Calder' })
    expect((await quiet.athlete.patch('/api/me/notifications', { notifyByEmail: false })).status).toBe(200)
    const routineId = await insertRoutine(running.db, teamId, { title: 'Ridge hill reps' })
    const plan = await coach.post<{ ids: number[] }>('/api/assignments', { routineId, athleteIds: [tamsin.userId, quiet.userId], dates: ['2030-05-06', '2030-05-08', '2030-05-10'] })
    await outboxSettled(running.db)
    const [ids] = [await rows<{ id: number, athlete_id: number, date: string }>('select id, athlete_id, date from assignments where team_id = ? order by athlete_id, date', [teamId])]
    const tamsins = ids.filter(row => Number(row.athlete_id) === tamsin.userId)
    const quiets = ids.filter(row => Number(row.athlete_id) === quiet.userId)
    expect(plan.data.ids).toHaveLength(6)

    expect((await coach.patch(`/api/assignments/${tamsins[0]!.id}`, { date: '2030-05-07' })).status).toBe(200)
    expect((await coach.delete(`/api/assignments/${tamsins[1]!.id}`)).status).toBe(204)
    expect((await coach.patch(`/api/assignments/${tamsins[2]!.id}`, { athleteId: oren.userId })).status).toBe(200)
    expect((await coach.patch(`/api/assignments/${quiets[0]!.id}`, { date: '2030-05-07' })).status).toBe(200)
    expect((await coach.delete(`/api/assignments/${quiets[1]!.id}`)).status).toBe(204)
    const outsider = await registerCoach(running.stack, 'Not Notice Harriers')
    const stranger = await addAthlete(running.stack, outsider.coach)
    expect((await coach.patch<FieldError>(`/api/assignments/${quiets[2]!.id}`, { athleteId: stranger.userId })).status).toBe(400)

    const mail = await running.stack.mail.waitFor(tamsin.email, /Your plan changed/)
    expect(mail.subject).toBe('Your plan changed (3 changes)')
    expect(mail.text).toMatch(/"Ridge hill reps" moved from .*6.* to .*7/)
    expect(mail.text).toMatch(/removed/)
    const toOren = await running.stack.mail.waitFor(oren.email, /Your plan changed/)
    expect(toOren.text).toMatch(/added on/)
    await outboxSettled(running.db)
    expect(running.stack.mail.to(tamsin.email).filter(message => /plan changed/.test(message.subject ?? ''))).toHaveLength(1)
    expect(running.stack.mail.to(quiet.email).filter(message => /plan changed/.test(message.subject ?? ''))).toHaveLength(0)
  })
})

describe('an athlete\'s first visit', () => {
  it('saves the answers given, records a skip, and refuses bad input field by field', async () => {
    const { coach } = await registerCoach(running.stack, 'Welcome Wanderers')
    const { athlete } = await addAthlete(running.stack, coach)
    expect((await athlete.get<{ user: { welcomed: boolean } }>('/api/me')).data.user.welcomed).toBe(false)
    const badZone = await athlete.post<FieldError>('/api/me/welcome', { timezone: 'Nowhere/Town' })
    expect(badZone.status).toBe(400)
    expect(badZone.data.data?.fields?.timezone).toMatch(/time zone/)
    const halfResult = await athlete.post<FieldError>('/api/me/welcome', { benchmarkDistanceM: 5000 })
    expect(halfResult.status).toBe(400)
    expect(halfResult.data.data?.fields?.benchmarkTimeS).toMatch(/both/)
    expect((await athlete.post<FieldError>('/api/me/welcome', { injury: { bodyArea: 'elbow' } })).status).toBe(400)
    expect((await coach.post('/api/me/welcome', { skip: true })).status).toBe(403)
    expect((await athlete.get<{ user: { welcomed: boolean } }>('/api/me')).data.user.welcomed).toBe(false)

    const saved = await athlete.post('/api/me/welcome', { benchmarkDistanceM: 10000, benchmarkTimeS: 2580, units: 'mi', timezone: 'Europe/London', injury: { bodyArea: 'achilles', note: 'Stiff in the mornings' } })
    expect(saved.status).toBe(200)
    const me = await athlete.get<{ user: { welcomed: boolean, timezone: string } }>('/api/me')
    expect(me.data.user).toMatchObject({ welcomed: true, timezone: 'Europe/London' })
    const profile = await athlete.get<{ profile: { benchmarkDistanceM: number, units: string }, injuryNotes: { bodyArea: string, status: string }[] }>('/api/me/profile')
    expect(profile.data.profile).toMatchObject({ benchmarkDistanceM: 10000, units: 'mi' })
    expect(profile.data.injuryNotes).toEqual([expect.objectContaining({ bodyArea: 'achilles', status: 'active' })])

    const other = await addAthlete(running.stack, coach, { name: 'Juno Halloway' })
    expect((await other.athlete.post('/api/me/welcome', { skip: true, units: 'mi' })).status).toBe(200)
    expect((await other.athlete.get<{ user: { welcomed: boolean } }>('/api/me')).data.user.welcomed).toBe(true)
    expect((await other.athlete.get<{ profile: { units: string } }>('/api/me/profile')).data.profile.units).toBe('km')
  })
})

describe('the coach\'s home', () => {
  it('answers in one request with flags newest first, yesterday and today per squad, the week ahead, ratios outside 0.8–1.3, invitations and the checklist', async () => {
    const { coach, teamId } = await registerCoach(running.stack, 'Home Page Harriers')
    const squad = await coach.post<{ id: number }>('/api/squads', { name: 'Road squad' })
    const steady = await addAthlete(running.stack, coach, { name: 'Cai Penhallow', squadId: squad.data.id })
    const spiking = await addAthlete(running.stack, coach, { name: 'Ffion Aske' })
    const pendingEmail = uniqueEmail('pending')
    await coach.post('/api/invites', { email: pendingEmail, role: 'athlete' })
    const today = todayIn('UTC')
    const history = await openTestDatabase(running.stack.databaseUrl)
    const routine = await createRoutine(history, teamId)
    // Cai: the same load every day for five weeks (ratio 1.0), trained today, missed yesterday.
    const caiDays = Array.from({ length: 35 }, (_, daysAgo) => ({ daysAgo, done: daysAgo !== 1, load: 100 }))
    const cai = await insertHistory(history, { teamId, athleteId: steady.userId, today, routine, days: [...caiDays, { daysAgo: -3, done: false }] })
    // Ffion: light for four weeks, then three times the load this week. Rolling 7:28-day ratio (Hulin et al. 2014),
    // worked by hand: 300 / ((7 × 300 + 21 × 100) / 28) = 2.0, above the 0.8–1.3 band cited by Gabbett (2016).
    // Cai: 6 × 100 / 7 = 85.7 against 2700 / 28 = 96.4 → 0.89, inside it.
    const ffionDays = Array.from({ length: 35 }, (_, daysAgo) => ({ daysAgo, done: true, load: daysAgo < 7 ? 300 : 100 }))
    const ffion = await insertHistory(history, { teamId, athleteId: spiking.userId, today, routine, days: ffionDays })
    await insertPainFlag(history, { teamId, athleteId: steady.userId, sessionId: cai.find(session => session.day === addDays(today, -3))!.id, pain: 6, area: 'knee' })
    await insertPainFlag(history, { teamId, athleteId: spiking.userId, sessionId: ffion.find(session => session.day === today)!.id, pain: 7, area: 'shin' })
    history.$client.close()

    type Home = {
      today: string
      painFlags: { athleteName: string, day: string }[]
      squads: { squadName: string, yesterday: { name: string, planned: number, trained: boolean }[], today: { name: string, trained: boolean }[] }[]
      upcoming: { date: string, title: string, athletes: number }[]
      ratios: { name: string, band: string, ratio: number }[]
      invites: { email: string }[]
      checklist: { dismissed: boolean, steps: { key: string, done: boolean }[] }
    }
    const home = await coach.get<Home>('/api/coach/home')
    expect(home.status).toBe(200)
    expect(home.data.today).toBe(today)
    expect(home.data.painFlags.map(flag => flag.athleteName)).toEqual(['Ffion Aske', 'Cai Penhallow'])
    const road = home.data.squads.find(group => group.squadName === 'Road squad')!
    expect(road.yesterday).toEqual([expect.objectContaining({ name: 'Cai Penhallow', planned: 1, trained: false })])
    expect(road.today).toEqual([expect.objectContaining({ name: 'Cai Penhallow', trained: true })])
    expect(home.data.squads.find(group => group.squadName === 'No squad')!.today).toEqual([expect.objectContaining({ name: 'Ffion Aske', trained: true })])
    expect(home.data.upcoming).toEqual([{ date: addDays(today, 3), title: 'Hill strength circuit', athletes: 1 }])
    expect(home.data.ratios.map(row => [row.name, row.band])).toEqual([['Ffion Aske', 'high']])
    expect(home.data.invites.map(invite => invite.email)).toEqual([pendingEmail])
    const done = Object.fromEntries(home.data.checklist.steps.map(step => [step.key, step.done]))
    expect(done).toEqual({ coaches: false, athletes: true, squads: true, library: true, routine: true, plan: true })

    expect((await coach.post('/api/coach/checklist', { dismissed: true })).status).toBe(200)
    expect((await coach.get<Home>('/api/coach/home')).data.checklist.dismissed).toBe(true)
    expect((await coach.post<FieldError>('/api/coach/checklist', { dismissed: 'yes' })).status).toBe(400)
    expect((await steady.athlete.get('/api/coach/home')).status).toBe(403)
    // Another team's home shows none of it.
    const other = await registerCoach(running.stack, 'Quiet Club')
    const empty = await other.coach.get<Home>('/api/coach/home')
    expect(empty.data.painFlags).toEqual([])
    expect(empty.data.squads).toEqual([])
  })
})
