import { beforeAll, describe, expect, it } from 'vitest'
import type { BrowserContext, Page } from 'playwright-core'
import type { AssignmentSnapshot } from '../../shared/types/domain'
import { newContext, screenshotPath, viewports, readScheduledBeeps, readStepTimings, watchStepChanges, signInByRequest } from '../support/browser'
import { addAthlete, registerCoach } from '../support/team'
import { useBrowserStack } from '../support/hooks'
import type { Logbook } from '../../types/api'

const running = useBrowserStack({ env: { NUXT_PUBLIC_PLAYER_SPEED_PARAM: 'true' } })
let team: Awaited<ReturnType<typeof registerCoach>>
let athlete: Awaited<ReturnType<typeof addAthlete>>
let circuit: AssignmentSnapshot

beforeAll(async () => {
  team = await registerCoach(running.stack)
  athlete = await addAthlete(running.stack, team.coach, { name: 'Ffion Aske' })
  await running.fixtures.injuryNote(team.teamId, athlete.userId, 'knee', 'Outside of the right knee aches on descents')
  const squat = await running.fixtures.exercise(team.teamId, {
    name: 'Goblet squat',
    cues: ['Elbows inside the knees', 'Sit between the heels'],
    equipment: ['Kettlebell'],
    cautions: [{ text: 'Keep the knees over the toes and stop on sharp knee pain.', bodyAreas: ['knee'] }],
  })
  const plank = await running.fixtures.exercise(team.teamId, { name: 'Front plank', equipment: ['Mat'], cues: ['Long line from head to heel'] })
  const stepUp = await running.fixtures.exercise(team.teamId, { name: 'Step-up', equipment: ['Box'] })
  circuit = {
    title: 'Ridge gym circuit',
    category: 'strength',
    description: 'Legs and trunk for the hills',
    exercises: [squat, plank, stepUp],
    steps: [
      { id: 'warm', type: 'block', kind: 'warmup', measure: { by: 'time', seconds: 30 } },
      { id: 'squat', type: 'sets', exerciseId: squat.id, sets: 2, perSet: { by: 'reps', reps: 8 }, restSeconds: 30, target: { type: 'load', kg: 16 } },
      { id: 'plank', type: 'sets', exerciseId: plank.id, sets: 2, perSet: { by: 'time', seconds: 40 }, restSeconds: 20 },
      { id: 'step', type: 'block', kind: 'work', exerciseId: stepUp.id, measure: { by: 'time', seconds: 40 } },
      { id: 'cool', type: 'block', kind: 'cooldown', measure: { by: 'time', seconds: 30 } },
    ],
  }
})

function signIn(context: BrowserContext) {
  return signInByRequest(context, running.stack.url, athlete.email)
}

async function currentStep(page: Page) {
  return (await page.getByTestId('current-step').textContent())?.trim()
}

async function waitForStep(page: Page, name: string) {
  await expect.poll(() => currentStep(page), { timeout: 30_000 }).toBe(name)
}

async function logbookFor(assignmentId: number) {
  const response = await athlete.athlete.get<Logbook>('/api/me/logbook')
  return response.data.sessions.find(session => session.assignmentId === assignmentId)
}

describe('the session player', () => {
  it('shows the steps whether the briefing came from the server or was drawn after following a link from Today', async () => {
    const { id } = await running.fixtures.assignment(team.teamId, athlete.userId, { ...circuit, title: 'Quarry steps circuit' })
    const context = await newContext(running.browser, 'phone')
    await signIn(context)
    const page = await context.newPage()
    const steps = page.getByRole('region', { name: 'Steps' })
    // From the server: the table is in the page's HTML and stays as it was (it is never hydrated).
    await page.goto(`${running.stack.url}/session/${id}`)
    await page.getByRole('button', { name: 'Start session' }).waitFor()
    await page.waitForLoadState('networkidle')
    expect(await steps.getByRole('row').count()).toBeGreaterThan(5)
    expect(await steps.textContent()).toContain('Goblet squat')
    // Drawn in the browser: Today's link navigates without a page load, and the table loads its own code.
    await page.goto(`${running.stack.url}/today`)
    await page.waitForLoadState('networkidle')
    await page.getByRole('link', { name: /Quarry steps circuit/ }).first().click()
    await page.waitForURL(`**/session/${id}`)
    await expect.poll(() => steps.getByRole('row').count(), { timeout: 15_000 }).toBeGreaterThan(5)
    expect(await steps.textContent()).toContain('Front plank')
    await context.close()
  })

  it('runs a gym circuit on a phone, shows the knee caution, and keeps every set through an offline spell', async () => {
    const { id } = await running.fixtures.assignment(team.teamId, athlete.userId, circuit)
    const context = await newContext(running.browser, 'phone')
    await signIn(context)
    const page = await context.newPage()
    // speed=20: each second of the routine takes 50 ms.
    await page.goto(`${running.stack.url}/session/${id}?speed=20`)
    await page.getByRole('heading', { name: 'Ridge gym circuit' }).waitFor()
    const injury = page.getByTestId('injury-cautions')
    await injury.waitFor()
    expect(await injury.textContent()).toContain('Keep the knees over the toes and stop on sharp knee pain.')
    expect(await injury.textContent()).toMatch(/check with your coach or a clinician/)
    expect(await page.getByText('Box, Kettlebell, Mat').isVisible()).toBe(true)
    await page.screenshot({ path: screenshotPath('session-briefing-phone'), fullPage: true })

    const start = page.getByRole('button', { name: 'Start session' })
    expect(await start.isDisabled()).toBe(true)
    await page.getByRole('checkbox', { name: /I have read the cautions/ }).check()
    await start.click()

    // The warm-up runs out by itself; the squats wait for Done.
    await waitForStep(page, 'Goblet squat')
    // The controls stay on screen under the thumb, below the set's fields, and the change is announced.
    const controls = (await page.getByTestId('player-controls').boundingBox())!
    expect(controls.y + controls.height).toBeLessThanOrEqual(viewports.phone.height)
    expect(controls.y).toBeGreaterThan(viewports.phone.height / 2)
    expect(await page.getByTestId('step-announcement').textContent()).toMatch(/Step \d+ of \d+: Goblet squat/)
    expect(await page.getByTestId('step-caution').textContent()).toMatch(/Your injury note: Keep the knees/)
    expect(await page.getByTestId('next-step').textContent()).toMatch(/Rest/)
    await page.screenshot({ path: screenshotPath('session-running-phone'), fullPage: true })
    await page.getByRole('button', { name: 'Cues and demo clip' }).click()
    const panel = page.getByRole('dialog', { name: 'Goblet squat' })
    await panel.getByText('Elbows inside the knees').waitFor()
    await panel.getByText('No demo clip yet').waitFor()
    await panel.getByRole('button', { name: 'Close' }).click()
    await panel.waitFor({ state: 'hidden' })
    await page.getByLabel('Reps').fill('7')
    await page.getByLabel('Load (kg)').fill('18')
    await page.getByTestId('done-button').click()
    await waitForStep(page, 'Rest')
    await expect.poll(async () => (await logbookFor(id))?.entries.length, { timeout: 10_000 }).toBe(1)

    // The gym's signal drops for the rest of the session.
    await context.setOffline(true)
    await waitForStep(page, 'Goblet squat')
    await page.getByTestId('done-button').click()
    await waitForStep(page, 'Front plank')
    await page.getByText(/Offline: \d+ logs? (is|are) kept on this phone/).waitFor()
    // Two timed plank sets, the step-ups and the cool-down run out by themselves.
    await page.getByRole('heading', { name: 'Well done — how did it go?' }).waitFor({ timeout: 30_000 })
    await page.getByRole('radio', { name: /6/ }).first().check()
    await page.getByRole('button', { name: 'Save session' }).click()
    await page.getByRole('heading', { name: 'Session saved' }).waitFor()
    expect(await page.getByTestId('logged-entry').count()).toBe(5)
    expect(await page.getByTestId('sync-status').getAttribute('data-pending')).not.toBe('0')
    const whileOffline = await logbookFor(id)
    expect(whileOffline?.entries.length).toBe(1)
    expect(whileOffline?.finishedAt).toBeNull()

    await context.setOffline(false)
    await expect.poll(() => page.getByTestId('sync-status').getAttribute('data-pending'), { timeout: 30_000 }).toBe('0')
    const stored = (await logbookFor(id))!
    expect(stored.finishedAt).not.toBeNull()
    expect(stored.sessionRpe).toBe(6)
    const sets = stored.entries.map(entry => [entry.stepId, entry.set, entry.reps, entry.kg])
    // The second set started from the load logged for the first, not the prescribed 16 kg.
    expect(sets).toEqual([['squat', 1, 7, 18], ['squat', 2, 8, 18], ['plank', 1, null, null], ['plank', 2, null, null], ['step', null, null, null]])
    for (const entry of stored.entries.filter(item => item.stepId !== 'squat')) expect(entry.seconds).toBeCloseTo(40, 0)
    const [assignment] = await running.fixtures.rows<{ status: string }>('select status from assignments where id = ?', [id])
    expect(assignment!.status).toBe('done')
    await page.screenshot({ path: screenshotPath('session-saved-phone'), fullPage: true })
    await context.close()
  })

  it('on a desktop, answers the keyboard and resumes paused after leaving mid-session', async () => {
    const { id } = await running.fixtures.assignment(team.teamId, athlete.userId, circuit)
    const context = await newContext(running.browser, 'desktop')
    await signIn(context)
    const page = await context.newPage()
    await page.goto(`${running.stack.url}/session/${id}?speed=10`)
    await page.getByRole('checkbox', { name: /I have read the cautions/ }).check()
    await page.getByRole('button', { name: 'Start session' }).click()
    await page.getByTestId('current-step').waitFor()
    await page.locator('body').click({ position: { x: 5, y: 5 } })
    await page.keyboard.press('ArrowRight')
    await waitForStep(page, 'Goblet squat')
    await page.keyboard.press('Enter')
    await waitForStep(page, 'Rest')
    await page.keyboard.press('Space')
    await page.getByText('Paused', { exact: true }).waitFor()
    await page.keyboard.press('ArrowLeft')
    await waitForStep(page, 'Goblet squat')
    await page.screenshot({ path: screenshotPath('session-running-desktop'), fullPage: true })

    // Leave and come back: the same step, paused, the acknowledgement kept.
    await page.reload()
    await page.getByText(/Welcome back: the session is paused/).waitFor()
    await waitForStep(page, 'Goblet squat')
    await page.keyboard.press('Space')
    expect(await page.getByTestId('pause-button').textContent()).toMatch(/Pause/)
    // Once resumed, the welcome-back note has done its job.
    await page.getByText(/Welcome back: the session is paused/).waitFor({ state: 'detached' })
    await page.keyboard.press('Enter')
    await waitForStep(page, 'Rest')
    // The repeated set 1 went through the same idempotency key: one row on the server.
    await expect.poll(async () => (await logbookFor(id))?.entries.filter(entry => entry.stepId === 'squat' && entry.set === 1).length, { timeout: 10_000 }).toBe(1)

    // Ending early asks in our own dialog: focus starts on the safe choice, Escape keeps going and gives
    // focus back to the button, and confirming goes on to the finish form.
    await page.keyboard.press('Space')
    const end = page.getByRole('button', { name: 'End session' })
    await end.focus()
    await page.keyboard.press('Enter')
    const dialog = page.getByRole('dialog', { name: 'End the session now?' })
    await dialog.waitFor()
    expect(await page.evaluate(() => document.activeElement?.textContent?.trim())).toBe('Keep going')
    await page.keyboard.press('Tab')
    await page.keyboard.press('Tab')
    expect(await page.evaluate(() => document.activeElement?.closest('dialog') !== null)).toBe(true)
    await page.keyboard.press('Escape')
    await dialog.waitFor({ state: 'hidden' })
    expect(await page.evaluate(() => document.activeElement?.textContent?.trim())).toBe('End session')
    await end.click()
    await dialog.getByRole('button', { name: 'End session' }).click()
    await page.getByRole('heading', { name: 'Well done — how did it go?' }).waitFor()
    await context.close()
  })

  /** A session of timed blocks (work and recovery in turn), opened on a desktop with its cautions read. */
  async function openTimedBlocks(title: string, durations: number[]) {
    const snapshot: AssignmentSnapshot = {
      title,
      category: 'drills',
      description: '',
      exercises: [],
      steps: durations.map((seconds, index) => ({ id: `b${index}`, type: 'block' as const, kind: index % 2 ? 'recovery' as const : 'work' as const, measure: { by: 'time' as const, seconds } })),
    }
    const { id } = await running.fixtures.assignment(team.teamId, athlete.userId, snapshot)
    const context = await newContext(running.browser, 'desktop')
    await signIn(context)
    const page = await context.newPage()
    await page.goto(`${running.stack.url}/session/${id}`)
    await page.getByRole('checkbox', { name: /I have read the cautions/ }).check()
    return { context, page }
  }

  it('measures how far step changes land from their schedule in real time', async () => {
    const durations = [2, 3, 2, 3, 2, 3]
    const { context, page } = await openTimedBlocks('Timing check', durations)
    // Note the moment each step's name reaches the page, independently of the player's own record.
    await watchStepChanges(page)
    await page.getByRole('button', { name: 'Start session' }).click()
    await page.getByRole('heading', { name: 'Well done — how did it go?' }).waitFor({ timeout: 30_000 })
    const result = await readStepTimings(page)
    expect(result.timings).toHaveLength(durations.length)
    // Each change was due exactly one segment after the previous (the schedule itself never drifts).
    const gaps = result.timings.slice(1).map((timing, index) => timing.scheduledAt - result.timings[index]!.scheduledAt)
    expect(gaps).toEqual(durations.slice(1).map(seconds => seconds * 1000))
    const lateness = result.timings.map(timing => timing.shownAt - timing.scheduledAt)
    const start = result.timings[0]!.scheduledAt - durations[0]! * 1000
    let due = start
    const domLateness = result.seen.filter(item => item.index > 0).map((item) => {
      due = start + durations.slice(0, item.index).reduce((sum, seconds) => sum + seconds * 1000, 0)
      return item.at - due
    })
    const stats = (values: number[]) => ({ max: Math.max(...values).toFixed(1), mean: (values.reduce((sum, value) => sum + value, 0) / values.length).toFixed(1) })
    console.log(`Step changes vs schedule over ${durations.length} changes, ms: rendered by the player max ${stats(lateness).max} mean ${stats(lateness).mean}; seen in the page's DOM max ${stats(domLateness).max} mean ${stats(domLateness).mean}`)
    // Sanity only: every change happened, none before its time, none absurdly late.
    expect(lateness.every(value => value >= 0 && value < 2000)).toBe(true)
    // Each boundary's beep was put on the audio clock ahead of it, for that boundary's moment, and kept.
    const beeps = await readScheduledBeeps(page)
    const changeBeeps = result.timings.map(timing => beeps.find(beep => beep.kind === 'change' && beep.boundary === timing.index - 1 && !beep.cancelled))
    expect(changeBeeps.every(beep => beep !== undefined)).toBe(true)
    expect(changeBeeps.map(beep => beep!.boundaryAt)).toEqual(result.timings.map(timing => timing.scheduledAt))
    const offsets = changeBeeps.filter(beep => beep!.heardAt !== undefined).map(beep => beep!.heardAt! - beep!.boundaryAt)
    if (offsets.length) console.log(`Beeps vs their boundaries over ${offsets.length} changes, ms: max ${Math.max(...offsets.map(Math.abs)).toFixed(1)} mean ${(offsets.reduce((sum, value) => sum + value, 0) / offsets.length).toFixed(1)}`)
    await context.close()
  })

  it('takes the scheduled beeps off the audio clock on pause and schedules them again on resume', async () => {
    const { context, page } = await openTimedBlocks('Beep check', [20, 20])
    await page.getByRole('button', { name: 'Start session' }).click()
    const live = async (key: string) => (await readScheduledBeeps(page)).filter(beep => beep.key === key && !beep.cancelled)
    // The first step's countdown and end are on the audio clock well before they are due.
    await expect.poll(async () => (await live('0:0')).length).toBe(1)
    expect((await live('0:3')).length).toBe(1)
    const [first] = await live('0:0')
    await page.getByTestId('pause-button').click()
    await expect.poll(async () => (await readScheduledBeeps(page)).filter(beep => !beep.cancelled).length).toBe(0)
    expect((await readScheduledBeeps(page)).find(beep => beep.key === '0:0')!.cancelled).toBe(true)
    await page.waitForTimeout(500)
    await page.getByTestId('pause-button').click()
    await expect.poll(async () => (await live('0:0')).length).toBe(1)
    const [again] = await live('0:0')
    // The same boundary, moved later by the pause.
    expect(again!.boundaryAt - first!.boundaryAt).toBeGreaterThanOrEqual(500)
    expect(again!.audioAt).toBeGreaterThan(first!.audioAt)
    await context.close()
  })
})

describe('the logbook and profile pages', () => {
  it('edits a logged set on a phone', async () => {
    const context = await newContext(running.browser, 'phone')
    await signIn(context)
    const page = await context.newPage()
    await page.goto(`${running.stack.url}/logbook`)
    const session = page.getByTestId('logbook-session').filter({ hasText: 'Ridge gym circuit' }).first()
    await session.waitFor()
    await page.screenshot({ path: screenshotPath('logbook-phone'), fullPage: true })
    await session.getByRole('button', { name: 'Edit sets' }).click()
    const reps = session.getByLabel('reps for Goblet squat set 1')
    await reps.fill('2000')
    await session.getByRole('button', { name: 'Save changes' }).click()
    await session.getByText('At most 1,000 reps').waitFor()
    await reps.fill('6')
    await session.getByRole('button', { name: 'Save changes' }).click()
    await page.getByText(/Saved 1 change/).waitFor()
    const { data } = await athlete.athlete.get<Logbook>('/api/me/logbook')
    const edited = data.sessions.flatMap(item => item.entries).filter(entry => entry.stepId === 'squat' && entry.set === 1 && entry.reps === 6)
    expect(edited).toHaveLength(1)
    await context.close()
  })

  it('names the HRmax estimate and adds an injury note on a desktop', async () => {
    const context = await newContext(running.browser, 'desktop')
    await signIn(context)
    const page = await context.newPage()
    await page.goto(`${running.stack.url}/profile`)
    // The form comes alive when the page's script has run: typed before that, the fields would be reset.
    await page.getByRole('button', { name: 'Save profile' }).and(page.locator(':enabled')).waitFor()
    await page.getByLabel('Race distance').selectOption({ label: '10K' })
    await page.getByLabel('Finish time').fill('41:30')
    await page.getByLabel('Birth year').fill('1987')
    await page.getByRole('button', { name: 'Save profile' }).click()
    await page.getByText(/Profile saved/).waitFor()
    const age = new Date().getUTCFullYear() - 1987
    expect(await page.getByTestId('hrmax').textContent()).toContain(`about ${Math.round(208 - 0.7 * age)} bpm — an estimate from your age`)
    await page.getByRole('cell', { name: '10K pace' }).waitFor()
    await page.getByLabel('Body area').selectOption({ label: 'Hamstring' })
    await page.getByLabel('What you notice').fill('Tight after strides')
    await page.getByRole('button', { name: 'Add note' }).click()
    await page.getByText('Tight after strides').waitFor()
    await page.screenshot({ path: screenshotPath('profile-desktop'), fullPage: true })
    const profile = await athlete.athlete.get<{ injuryNotes: { bodyArea: string, status: string }[], profile: { benchmarkTimeS: number } }>('/api/me/profile')
    expect(profile.data.profile.benchmarkTimeS).toBe(2490)
    expect(profile.data.injuryNotes).toEqual(expect.arrayContaining([expect.objectContaining({ bodyArea: 'hamstring', status: 'active' })]))
    await context.close()
  })
})
