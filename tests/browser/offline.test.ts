import { beforeAll, describe, expect, it } from 'vitest'
import type { BrowserContext, Page } from 'playwright-core'
import type { AssignmentSnapshot } from '../../shared/types/domain'
import { addDays } from '../../shared/utils/dates'
import { makeDemoClip } from '../../seeds/clip'
import type { ApiClient } from '../support/client'
import { newContext, screenshotPath, signInByRequest } from '../support/browser'
import { addAthlete, registerCoach } from '../support/team'
import { useBrowserStack } from '../support/hooks'
import type { Logbook } from '../../types/api'

// The athlete side with no network: a real service worker in Chromium, the built server, the
// object store with a real clip. Everything is fetched ahead online, then the context goes offline.

const running = useBrowserStack({ env: { NUXT_PUBLIC_PLAYER_SPEED_PARAM: 'true' } })
let team: Awaited<ReturnType<typeof registerCoach>>
let snapshot: AssignmentSnapshot
let today: string

async function uploadClip(coach: ApiClient, exerciseId: number) {
  const body = await makeDemoClip({ seconds: 3, motion: 'climb' })
  const signed = await coach.post<{ url: string, key: string }>(`/api/exercises/${exerciseId}/clip/upload-url`, { contentType: 'video/webm', size: body.byteLength })
  expect(signed.status, signed.text).toBe(200)
  const put = await fetch(signed.data.url, { method: 'PUT', body: new Uint8Array(body), headers: { 'content-type': 'video/webm' } })
  expect(put.status).toBe(200)
  const confirmed = await coach.post(`/api/exercises/${exerciseId}/clip/confirm`, { key: signed.data.key })
  expect(confirmed.status, confirmed.text).toBe(200)
}

beforeAll(async () => {
  team = await registerCoach(running.stack)
  const squat = await running.fixtures.exercise(team.teamId, {
    name: 'Goblet squat',
    cues: ['Elbows inside the knees'],
    equipment: ['Kettlebell'],
    cautions: [{ text: 'Stop on sharp knee pain.', bodyAreas: ['knee'] }],
  })
  const stepUp = await running.fixtures.exercise(team.teamId, { name: 'Step-up', equipment: ['Box'] })
  await uploadClip(team.coach, squat.id)
  snapshot = {
    title: 'Basement circuit',
    category: 'strength',
    description: 'Legs for the hills',
    exercises: [squat, stepUp],
    steps: [
      { id: 'warm', type: 'block', kind: 'warmup', measure: { by: 'time', seconds: 20 } },
      { id: 'squat', type: 'sets', exerciseId: squat.id, sets: 2, perSet: { by: 'reps', reps: 8 }, restSeconds: 20, target: { type: 'load', kg: 16 } },
      { id: 'step', type: 'block', kind: 'work', exerciseId: stepUp.id, measure: { by: 'time', seconds: 30 } },
      { id: 'cool', type: 'block', kind: 'cooldown', measure: { by: 'time', seconds: 20 } },
    ],
  }
})

async function newAthlete(name: string) {
  const athlete = await addAthlete(running.stack, team.coach, { name })
  const mine = await athlete.athlete.get<{ today: string }>('/api/me/assignments')
  today = mine.data.today
  return athlete
}

function signIn(context: BrowserContext, email: string) {
  return signInByRequest(context, running.stack.url, email)
}

/** Waits until the service worker controls the page and the fetch-ahead has finished. */
async function waitUntilReadyOffline(page: Page, clips: number) {
  const status = page.getByTestId('offline-status')
  await expect.poll(() => status.getAttribute('data-worker'), { timeout: 60_000 }).toBe('ready')
  await expect.poll(() => page.evaluate(() => Boolean(navigator.serviceWorker.controller)), { timeout: 30_000 }).toBe(true)
  await expect.poll(async () => [await status.getAttribute('data-prefetch'), Number(await status.getAttribute('data-clips'))], { timeout: 60_000 }).toEqual(['done', clips])
}

async function cachedUrls(page: Page) {
  return page.evaluate(async () => {
    const found: Record<string, string[]> = {}
    for (const name of await caches.keys()) found[name] = (await (await caches.open(name)).keys()).map(request => request.url)
    return found
  })
}

async function currentStep(page: Page) {
  return (await page.getByTestId('current-step').textContent())?.trim()
}

async function waitForStep(page: Page, name: string) {
  await expect.poll(() => currentStep(page), { timeout: 30_000 }).toBe(name)
}

describe('the athlete side with no network', () => {
  it('opens Today and a session from cold offline, plays the kept clip, logs it all and sends each log once when back online', async () => {
    const athlete = await newAthlete('Wren Calder')
    await running.fixtures.injuryNote(team.teamId, athlete.userId, 'knee', 'Sore under the kneecap on stairs')
    const session = await running.fixtures.assignment(team.teamId, athlete.userId, snapshot, { date: today })
    const soon = await running.fixtures.assignment(team.teamId, athlete.userId, { ...snapshot, title: 'Hill strength, later this week' }, { date: addDays(today, 3) })
    const later = await running.fixtures.assignment(team.teamId, athlete.userId, { ...snapshot, title: 'Far-off circuit' }, { date: addDays(today, 20) })

    const context = await newContext(running.browser, 'phone')
    await signIn(context, athlete.email)
    const page = await context.newPage()
    await page.goto(`${running.stack.url}/today`)
    await page.getByRole('heading', { name: 'Today', exact: true }).waitFor()
    // Desktop Chromium does not tell the connection type, so clips wait for the athlete's say-so.
    await waitUntilReadyOffline(page, 0)

    await page.goto(`${running.stack.url}/profile`)
    const downloads = page.getByTestId('offline-downloads')
    await downloads.getByText(/Clips were not fetched: not on Wi-Fi/).waitFor()
    await downloads.getByRole('checkbox', { name: 'Also fetch clips over mobile data' }).check()
    await expect.poll(() => downloads.getByTestId('offline-usage').textContent(), { timeout: 30_000 }).toMatch(/Kept now: 1 clip \(\d+ KB\)/)
    await page.screenshot({ path: screenshotPath('offline-profile-downloads'), fullPage: true })

    const kept = await cachedUrls(page)
    const reads = kept['switchback-api-v1'] ?? []
    expect(reads).toContain(`${running.stack.url}/api/assignments/${session.id}/plan`)
    expect(reads).toContain(`${running.stack.url}/api/assignments/${soon.id}/plan`)
    expect(reads).not.toContain(`${running.stack.url}/api/assignments/${later.id}/plan`)
    expect(kept['switchback-clips-v1']).toHaveLength(1)
    expect(kept['switchback-clips-v1']![0]).toMatch(new RegExp(`^${running.stack.s3.endpoint}/${running.stack.s3.bucket}/teams/${team.teamId}/exercises/\\d+/[^?]+$`))

    // No signal from here on.
    await context.setOffline(true)
    await page.goto(`${running.stack.url}/today`)
    await page.getByRole('heading', { name: 'Today', exact: true }).waitFor()
    await page.getByText('Basement circuit').first().waitFor()
    await page.getByText('Hill strength, later this week').waitFor()
    const banner = page.getByTestId('offline-status').getByRole('status')
    await banner.getByText(/Offline — nothing is waiting to send; last in touch at/).waitFor()
    await page.screenshot({ path: screenshotPath('offline-today-phone'), fullPage: true })

    // A fresh page, as when the app is opened from the home screen.
    const cold = await context.newPage()
    await cold.goto(`${running.stack.url}/session/${session.id}?speed=20`)
    await cold.getByRole('heading', { name: 'Basement circuit' }).waitFor()
    expect(await cold.getByTestId('injury-cautions').textContent()).toContain('Stop on sharp knee pain.')
    await cold.getByRole('checkbox', { name: /I have read the cautions/ }).check()
    await cold.getByRole('button', { name: 'Start session' }).click()
    await waitForStep(cold, 'Goblet squat')

    await cold.getByRole('button', { name: 'Cues and demo clip' }).click()
    const panel = cold.getByRole('dialog', { name: 'Goblet squat' })
    await panel.getByText('Elbows inside the knees').waitFor()
    const video = panel.getByTestId('exercise-clip')
    await video.waitFor()
    expect(await video.getAttribute('src')).toMatch(/^\/offline-clip\?src=/)
    await expect.poll(() => video.evaluate((element: HTMLVideoElement) => element.readyState), { timeout: 15_000 }).toBeGreaterThanOrEqual(1)
    expect(await video.evaluate((element: HTMLVideoElement) => element.duration)).toBeCloseTo(3, 0)
    await video.evaluate((element: HTMLVideoElement) => element.play())
    await expect.poll(() => video.evaluate((element: HTMLVideoElement) => element.currentTime), { timeout: 15_000 }).toBeGreaterThan(0.2)
    await cold.screenshot({ path: screenshotPath('offline-clip-phone'), fullPage: true })
    await panel.getByRole('button', { name: 'Close' }).click()
    await panel.waitFor({ state: 'hidden' })

    await cold.getByLabel('Reps').fill('7')
    await cold.getByTestId('done-button').click()
    await waitForStep(cold, 'Rest')
    await waitForStep(cold, 'Goblet squat')
    await cold.getByTestId('done-button').click()
    await waitForStep(cold, 'Step-up')
    await cold.getByRole('heading', { name: 'Well done — how did it go?' }).waitFor({ timeout: 30_000 })
    await cold.getByRole('radio', { name: /6/ }).first().check()
    await cold.getByRole('button', { name: 'Save session' }).click()
    await cold.getByRole('heading', { name: 'Session saved' }).waitFor()
    expect(await cold.getByTestId('logged-entry').count()).toBe(3)
    // start, three entries and the finish wait on the phone; the server has nothing yet.
    await cold.getByTestId('offline-status').getByText(/5 logs are waiting to send/).waitFor()
    const [before] = await running.fixtures.rows<{ count: number }>('select count(*) as count from session_logs where assignment_id = ?', [session.id])
    expect(Number(before!.count)).toBe(0)

    // Both open pages hold the same queue and both try to send it when the network returns.
    await context.setOffline(false)
    await expect.poll(() => cold.getByTestId('sync-status').getAttribute('data-pending'), { timeout: 30_000 }).toBe('0')
    await expect.poll(() => page.evaluate(() => JSON.parse(localStorage.getItem('switchback.outbox.v1') ?? '{"queue":[]}').queue.length), { timeout: 30_000 }).toBe(0)
    await cold.reload()
    await cold.waitForLoadState('networkidle')

    const logs = await running.fixtures.rows<{ id: number, finished_at: number | null, session_rpe: number | null }>('select id, finished_at, session_rpe from session_logs where assignment_id = ?', [session.id])
    expect(logs).toHaveLength(1)
    expect(logs[0]!.finished_at).not.toBeNull()
    expect(logs[0]!.session_rpe).toBe(6)
    const entries = await running.fixtures.rows<{ step_id: string, set_number: number | null, reps: number | null }>('select * from entry_logs where session_id = ? order by id', [logs[0]!.id])
    expect(entries.map(entry => entry.step_id)).toEqual(['squat', 'squat', 'step'])
    const logbook = await athlete.athlete.get<Logbook>('/api/me/logbook')
    const stored = logbook.data.sessions.filter(item => item.assignmentId === session.id)
    expect(stored).toHaveLength(1)
    expect(stored[0]!.entries.map(entry => [entry.stepId, entry.set, entry.reps])).toEqual([['squat', 1, 7], ['squat', 2, 8], ['step', null, null]])
    const [assignment] = await running.fixtures.rows<{ status: string }>('select status from assignments where id = ?', [session.id])
    expect(assignment!.status).toBe('done')
    await context.close()
  })

  it('signing out offline leaves nothing of the athlete in the caches or storage, and the sign-out reaches the server later', async () => {
    const athlete = await newAthlete('Oren Blythe')
    const session = await running.fixtures.assignment(team.teamId, athlete.userId, snapshot, { date: today })
    const context = await newContext(running.browser, 'phone')
    await signIn(context, athlete.email)
    const page = await context.newPage()
    await page.goto(`${running.stack.url}/today`)
    await page.evaluate(() => localStorage.setItem('switchback.offline.clipsOnMobileData', 'true'))
    await page.reload()
    await waitUntilReadyOffline(page, 1)

    await context.setOffline(true)
    await page.goto(`${running.stack.url}/session/${session.id}?speed=20`)
    await page.getByRole('checkbox', { name: /I have read the cautions/ }).check()
    await page.getByRole('button', { name: 'Start session' }).click()
    await waitForStep(page, 'Goblet squat')
    await page.getByTestId('done-button').click()
    await waitForStep(page, 'Rest')
    const before = await page.evaluate(() => Object.keys(localStorage).filter(key => key.startsWith('switchback.')))
    expect(before).toEqual(expect.arrayContaining(['switchback.outbox.v1', `switchback.player.${session.id}.v1`]))

    page.once('dialog', dialog => void dialog.accept())
    await page.getByRole('button', { name: 'Sign out' }).click()
    await page.waitForURL(/\/login/)
    await page.getByRole('heading', { name: 'Sign in' }).waitFor()

    const left = await page.evaluate(async () => {
      const cached: string[] = []
      for (const name of await caches.keys()) {
        for (const request of await (await caches.open(name)).keys()) cached.push(`${name} ${request.url}`)
      }
      return {
        cacheNames: await caches.keys(),
        cached,
        local: Object.fromEntries(Object.entries(localStorage)),
        session: Object.fromEntries(Object.entries(sessionStorage)),
        databases: (await indexedDB.databases()).map(database => database.name),
      }
    })
    expect(left.cacheNames).not.toContain('switchback-api-v1')
    expect(left.cacheNames).not.toContain('switchback-clips-v1')
    // What stays is the app's own build (the precache) and the note that a sign-out is waiting.
    for (const entry of left.cached) expect(entry).toMatch(/^(workbox-precache-v2-\S+ \S+\/(_nuxt\/|icons\/|favicon\.svg|offline\.htm|offline-shell|manifest\.webmanifest)|switchback-meta-v1 \S+\/__switchback\/sign-out-pending$)/)
    // No read of the API and nothing from the object store (build file names are random, so look for addresses).
    const cachedText = left.cached.join(' ')
    expect(cachedText).not.toContain('/api/')
    expect(cachedText).not.toContain(running.stack.s3.endpoint)
    expect(cachedText).not.toContain('/teams/')
    expect(Object.keys(left.local).filter(key => key.startsWith('switchback.'))).toEqual([])
    const everything = JSON.stringify(left)
    expect(everything).not.toContain(athlete.email)
    expect(everything).not.toContain('Oren Blythe')
    expect(everything).not.toContain('Basement circuit')
    expect(left.databases).toEqual([])
    await page.screenshot({ path: screenshotPath('offline-signed-out-phone'), fullPage: true })

    // Back online, the next page sends the waiting sign-out before anything else: the cookie is dead.
    await context.setOffline(false)
    await page.goto(`${running.stack.url}/today`)
    await page.waitForURL(/\/login/)
    const me = await context.request.get(`${running.stack.url}/api/me`)
    expect(me.status()).toBe(401)
    expect(await page.evaluate(async () => (await caches.keys()).includes('switchback-meta-v1') && Boolean(await (await caches.open('switchback-meta-v1')).match('/__switchback/sign-out-pending')))).toBe(false)
    // Nothing of the unfinished session reached the server.
    const [logs] = await running.fixtures.rows<{ count: number }>('select count(*) as count from session_logs where assignment_id = ?', [session.id])
    expect(Number(logs!.count)).toBe(0)
    await context.close()
  })

  it('gives a coach a clear offline message instead of a blank page, and keeps none of the coach\'s reads', async () => {
    const context = await newContext(running.browser, 'desktop')
    await signIn(context, team.email)
    const page = await context.newPage()
    await page.goto(`${running.stack.url}/planner`)
    await expect.poll(() => page.getByTestId('offline-status').getAttribute('data-worker'), { timeout: 60_000 }).toBe('ready')
    await expect.poll(() => page.evaluate(() => Boolean(navigator.serviceWorker.controller)), { timeout: 30_000 }).toBe(true)

    await context.setOffline(true)
    // Moving inside the open app: the strip says what is going on.
    await page.getByRole('link', { name: 'Library' }).click()
    await page.getByTestId('offline-status').getByText(/Coach pages need a connection/).waitFor()
    // Opening a coach page from cold: the offline page, not an empty screen.
    await page.goto(`${running.stack.url}/insights`)
    await page.getByRole('heading', { name: 'You are offline' }).waitFor()
    expect(await page.getByRole('alert').textContent()).toMatch(/coach pages .* load fresh from the server/)
    await page.screenshot({ path: screenshotPath('offline-coach-desktop'), fullPage: true })
    const names = await page.evaluate(() => caches.keys())
    expect(names).not.toContain('switchback-api-v1')
    expect(names).not.toContain('switchback-clips-v1')
    await context.close()
  })
})
