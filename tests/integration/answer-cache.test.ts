import { beforeAll, describe, expect, it } from 'vitest'
import type { ApiClient } from '../support/client'
import { addAthlete, addCoach, registerCoach } from '../support/team'
import { useStack } from '../support/hooks'
import type { ApiResponse, ExerciseList, MyAssignments } from '../../types/api'

type CoachHome = ApiResponse<'/api/coach/home'>

// The busiest read routes and the rendered pages keep their answers until the database changes
// (server/utils/answer-cache.ts, server/plugins/01.kept-pages.ts): these check that a kept answer is never one
// the caller should not see, never survives a write made through the app or straight into the file by someone
// else, and that a kept page still gets a fresh CSP nonce.
const running = useStack()
let head: ApiClient
let teamId: number
let athlete: ApiClient
let athleteId: number

beforeAll(async () => {
  const registered = await registerCoach(running.stack, 'Larchford Ridge Runners')
  head = registered.coach
  teamId = registered.teamId
  const added = await addAthlete(running.stack, head, { name: 'Tamsin Rook' })
  athlete = added.athlete
  athleteId = added.userId
})

async function names(client: ApiClient) {
  const response = await client.get<ExerciseList>('/api/exercises?pageSize=100')
  expect(response.status, response.text).toBe(200)
  expect(response.headers.get('content-type')).toMatch(/^application\/json/)
  return response.data.items.map(item => item.name).sort()
}

describe('kept answers', () => {
  it('shows a change written by another process at once', async () => {
    const { id } = await running.fixtures.exercise(teamId, { name: 'Walking lunge', category: 'strength' })
    expect(await names(head)).toContain('Walking lunge')
    expect(await names(head)).toContain('Walking lunge')
    await running.fixtures.rows('update exercises set name = ? where id = ?', ['Reverse lunge', id])
    const after = await names(head)
    expect(after).toContain('Reverse lunge')
    expect(after).not.toContain('Walking lunge')
  })

  it('shows a change made through the app at once', async () => {
    const before = await names(head)
    const created = await head.post('/api/exercises', { name: 'Calf raise', category: 'strength', summary: '', cues: [], equipment: [], cautions: [] })
    expect(created.status, created.text).toBe(201)
    expect(await names(head)).toEqual([...before, 'Calf raise'].sort())
  })

  it('keeps each caller\'s answer apart: an athlete never gets the coach\'s library', async () => {
    const coachNames = await names(head)
    expect(coachNames.length).toBeGreaterThan(1)
    // The athlete sees only exercises of their own assignments: none yet.
    expect(await names(athlete)).toEqual([])
    const [lunge] = await running.fixtures.rows<{ id: number }>('select id from exercises where team_id = ? and name = ?', [teamId, 'Reverse lunge'])
    await running.fixtures.assignment(teamId, athleteId, {
      title: 'Lunge circuit', category: 'strength', description: '', steps: [],
      exercises: [{ id: Number(lunge!.id), name: 'Reverse lunge', category: 'strength', summary: '', cues: [], equipment: [], cautions: [] }],
    })
    expect(await names(athlete)).toEqual(['Reverse lunge'])
    expect(await names(head)).toEqual(coachNames)
  })

  it('answers each address on its own (the query string is part of what is kept)', async () => {
    const hills = await head.get<ExerciseList>('/api/exercises?category=hill')
    const strength = await head.get<ExerciseList>('/api/exercises?category=strength')
    expect(hills.data.items).toEqual([])
    expect(strength.data.items.map(item => item.name)).toContain('Calf raise')
  })

  it('shows an athlete a new assignment at once', async () => {
    const first = await athlete.get<MyAssignments>('/api/me/assignments')
    expect(first.status, first.text).toBe(200)
    const count = first.data.assignments.length
    await running.fixtures.assignment(teamId, athleteId, { title: 'Hill reps', category: 'hill', description: '', steps: [], exercises: [] })
    const second = await athlete.get<MyAssignments>('/api/me/assignments')
    expect(second.data.assignments.length).toBe(count + 1)
    expect(second.data.assignments.map(row => row.title)).toContain('Hill reps')
  })

  it('gives each coach of a team their own answer, and none to a coach whose role was taken away', async () => {
    const { coach, userId } = await addCoach(running.stack, head, { name: 'Idris Fenn' })
    const home = await coach.get<CoachHome>('/api/coach/home')
    expect(home.status, home.text).toBe(200)
    expect((await coach.get<CoachHome>('/api/coach/home')).status).toBe(200)
    await running.fixtures.rows('update memberships set role = ? where team_id = ? and user_id = ?', ['athlete', teamId, userId])
    expect((await coach.get('/api/coach/home')).status).toBe(403)
    expect((await coach.get('/api/exercises?pageSize=100')).data).toMatchObject({ items: [] })
  })
})

async function page(client: ApiClient, path: string) {
  const response = await client.request('GET', path, undefined, { headers: { accept: 'text/html' } })
  const csp = response.headers.get('content-security-policy') ?? ''
  const nonce = /'nonce-([^']+)'/.exec(csp)?.[1]
  return { status: response.status, location: response.headers.get('location'), html: response.text, nonce }
}

describe('kept pages', () => {
  it('answers a repeated page with the same markup and a fresh nonce in both the header and the page', async () => {
    const first = await page(athlete, '/today')
    const second = await page(athlete, '/today')
    expect(first.status).toBe(200)
    expect(second.status).toBe(200)
    expect(first.nonce).toBeDefined()
    expect(second.nonce).toBeDefined()
    expect(second.nonce).not.toBe(first.nonce)
    expect(second.html).not.toContain(first.nonce!)
    expect(second.html).toContain(`nonce="${second.nonce}"`)
    expect(second.html.replaceAll(second.nonce!, 'N')).toBe(first.html.replaceAll(first.nonce!, 'N'))
  })

  it('shows a change written by another process on the next render', async () => {
    expect((await page(athlete, '/today')).html).not.toContain('Stride drills by the river')
    await page(athlete, '/today')
    await running.fixtures.assignment(teamId, athleteId, { title: 'Stride drills by the river', category: 'drills', description: '', steps: [], exercises: [] })
    expect((await page(athlete, '/today')).html).toContain('Stride drills by the river')
  })

  it('renders each person their own page', async () => {
    const { athlete: other } = await addAthlete(running.stack, head, { name: 'Oren Vale' })
    // Both sign-ins checked first, so that either page could be kept and answered to the other.
    expect((await other.get('/api/me')).status).toBe(200)
    expect((await athlete.get('/api/me')).status).toBe(200)
    const mine = await page(athlete, '/today')
    const theirs = await page(other, '/today')
    expect(mine.html).toContain('Stride drills by the river')
    expect(theirs.status).toBe(200)
    expect(theirs.html).not.toContain('Stride drills by the river')
  })

  it('renders again a page whose data failed, and keeps one whose data arrived', async () => {
    // Each render fetches the team's insights inside the server, and each fetch writes a log line.
    const fetchesOf = (status: number) => running.stack.log().split('\n')
      .filter(line => line.includes('"route":"/api/insights/team"') && line.includes(`"status":${status}`)).length
    const waitForLog = () => new Promise(resolve => setTimeout(resolve, 100))
    const failing = '/insights?squadId=999999'
    const failedBefore = fetchesOf(404)
    expect((await page(head, failing)).status).toBe(200)
    expect((await page(head, failing)).status).toBe(200)
    await waitForLog()
    expect(fetchesOf(404) - failedBefore).toBe(2)
    const okBefore = fetchesOf(200)
    expect((await page(head, '/insights')).status).toBe(200)
    expect((await page(head, '/insights')).status).toBe(200)
    await waitForLog()
    expect(fetchesOf(200) - okBefore).toBe(1)
  })

  it('never answers a signed-out cookie with the page it was shown before', async () => {
    const copy = athlete.copy()
    expect((await page(copy, '/today')).status).toBe(200)
    expect((await page(copy, '/today')).status).toBe(200)
    expect((await athlete.post('/api/auth/logout')).status).toBe(204)
    const after = await page(copy, '/today')
    expect(after.status).toBe(302)
    expect(after.location).toMatch(/^\/login/)
  })
})
