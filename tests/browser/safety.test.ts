import { beforeAll, describe, expect, it } from 'vitest'
import type { BrowserContext, Page } from 'playwright-core'
import type { AssignmentSnapshot } from '../../shared/types/domain'
import { newContext, screenshotPath, signInByRequest } from '../support/browser'
import { addAthlete, registerCoach } from '../support/team'
import { useBrowserStack } from '../support/hooks'

const running = useBrowserStack({ env: { NUXT_PUBLIC_PLAYER_SPEED_PARAM: 'true' } })
let team: Awaited<ReturnType<typeof registerCoach>>
let athlete: Awaited<ReturnType<typeof addAthlete>>
let hills: AssignmentSnapshot
let routineId: number

// Stored keys that must never reach the screen as they are; step ids of the test routine are in the list too.
const internalKeys = [/\bwarmup\b/i, /\bcooldown\b/i, /\blower_back\b/, /\bhigh_pain\b/, /\bnew_area\b/, /\bhead_coach\b/, /\bpercent1rm\b/, /\bfiveK\b/, /\btenK\b/, /\bquad\b/, /\boverdue\b/i, /\bclimb-k7\b/, /\bback-k7\b/]

beforeAll(async () => {
  team = await registerCoach(running.stack)
  athlete = await addAthlete(running.stack, team.coach, { name: 'Tamsin Rook' })
  await running.fixtures.injuryNote(team.teamId, athlete.userId, 'achilles', 'Stiff in the mornings after hill sessions')
  await running.fixtures.injuryNote(team.teamId, athlete.userId, 'lower_back', 'Old niggle', 'resolved')
  const bounds = await running.fixtures.exercise(team.teamId, { name: 'Straight-leg bounds', category: 'plyometric', cautions: [{ text: 'Stop when landings get heavy.', bodyAreas: ['achilles', 'knee', 'foot'] }] })
  hills = {
    title: 'Eight uphill reps',
    category: 'hills',
    description: 'One-minute climbs, jog back down',
    exercises: [bounds],
    steps: [
      { id: 'start-k7', type: 'block', kind: 'warmup', measure: { by: 'time', seconds: 20 } },
      { id: 'reps-k7', type: 'repeat', times: 8, steps: [
        { id: 'climb-k7', type: 'block', kind: 'work', measure: { by: 'time', seconds: 60 }, grade: 0.06, target: { type: 'pace', zone: 'fiveK' } },
        { id: 'back-k7', type: 'block', kind: 'recovery', measure: { by: 'time', seconds: 90 } },
      ] },
      { id: 'bounds-k7', type: 'block', kind: 'work', exerciseId: bounds.id, measure: { by: 'reps', reps: 10 } },
      { id: 'end-k7', type: 'block', kind: 'cooldown', measure: { by: 'time', seconds: 20 } },
    ],
  }
  routineId = await running.fixtures.routine(team.teamId, { title: hills.title, category: hills.category, description: hills.description, steps: hills.steps })
})

function signIn(context: BrowserContext, email: string) {
  return signInByRequest(context, running.stack.url, email)
}

async function currentStep(page: Page) {
  return (await page.getByTestId('current-step').textContent())?.trim()
}

describe('safety in the session player', () => {
  it('shows the injury banner on an uphill step, urgent help at every step, and urgent guidance first for severe pain', async () => {
    const { id } = await running.fixtures.assignment(team.teamId, athlete.userId, hills, { routineId })
    const context = await newContext(running.browser, 'phone')
    await signIn(context, athlete.email)
    const page = await context.newPage()
    page.on('dialog', dialog => void dialog.accept())
    // speed=10: each second of the routine takes 100 ms, so the climbs can be watched.
    await page.goto(`${running.stack.url}/session/${id}?speed=10`)
    await page.getByRole('heading', { name: 'Eight uphill reps' }).waitFor()
    const briefing = page.getByTestId('injury-cautions')
    await briefing.waitFor()
    expect(await briefing.textContent()).toMatch(/Uphill efforts · Achilles/)
    expect(await briefing.textContent()).toMatch(/Jumps and bounds · Achilles/)

    await page.getByRole('checkbox', { name: /I have read the cautions/ }).check()
    await page.getByRole('button', { name: 'Start session' }).click()
    await expect.poll(() => currentStep(page), { timeout: 30_000 }).toBe('Main effort')
    const banner = page.getByTestId('step-caution')
    await banner.waitFor()
    expect(await banner.textContent()).toMatch(/Your injury note: Climbing loads the Achilles and calves/)
    await page.screenshot({ path: screenshotPath('safety-uphill-step-phone'), fullPage: true })

    // The urgent guidance is one tap away, and the clock pauses while it is open.
    await page.getByTestId('urgent-help-button').click()
    const urgent = page.getByRole('dialog', { name: 'Urgent help' })
    await urgent.waitFor()
    expect(await urgent.getByTestId('urgent-guidance').textContent()).toMatch(/your local emergency number/)
    expect(await page.getByTestId('pause-button').textContent()).toMatch(/Resume/)
    await urgent.getByRole('button', { name: 'Close' }).click()
    await expect.poll(() => urgent.isVisible()).toBe(false)

    await page.getByRole('button', { name: 'End session' }).click()
    await page.getByRole('dialog', { name: 'End the session now?' }).getByRole('button', { name: 'End session' }).click()
    await page.getByRole('heading', { name: 'Well done — how did it go?' }).waitFor()
    await page.getByRole('radio', { name: /^7/ }).first().check()
    await page.locator('input[name="pain"][value="8"]').check({ force: true })
    await page.getByTestId('urgent-guidance').waitFor()
    await page.getByLabel('Where?').selectOption({ label: 'Achilles' })
    await page.getByRole('button', { name: 'Save session' }).click()
    const first = page.getByRole('heading', { level: 1 }).first()
    await expect.poll(() => first.textContent()).toMatch(/Stop training now/)
    expect(await page.getByTestId('urgent-guidance').textContent()).toMatch(/unable to bear weight/)
    await page.getByRole('heading', { name: 'Session saved' }).waitFor()
    await page.screenshot({ path: screenshotPath('safety-urgent-guidance-phone'), fullPage: true })
    await context.close()
  })
})

describe('words on screen', () => {
  it('shows no internal key in the main flows of a coach and an athlete', async () => {
    const seen: { path: string, key: string }[] = []
    const scan = async (page: Page, path: string) => {
      await page.goto(`${running.stack.url}${path}`)
      await page.waitForLoadState('networkidle')
      const text = await page.evaluate(() => document.body.innerText)
      for (const key of internalKeys) if (key.test(text)) seen.push({ path, key: String(key) })
    }

    const coach = await newContext(running.browser, 'desktop')
    await signIn(coach, team.email)
    const coachPage = await coach.newPage()
    for (const path of ['/coach', '/exercises', '/routines', `/routines/${routineId}`, `/routines/${routineId}/print`, '/planner', '/insights', `/insights/athletes/${athlete.userId}`, '/team']) {
      await scan(coachPage, path)
    }
    // The builder's preview for the athlete, with the step-derived caution.
    await coachPage.goto(`${running.stack.url}/routines/${routineId}`)
    await coachPage.getByLabel('Athlete', { exact: true }).selectOption({ label: 'Tamsin Rook' })
    const matched = coachPage.getByTestId('matched-cautions')
    await matched.waitFor()
    expect(await matched.textContent()).toMatch(/Uphill efforts:/)
    for (const key of internalKeys) expect(key.test(await coachPage.evaluate(() => document.body.innerText))).toBe(false)
    // The pain report from the first test is waiting on the coach's home and in the navigation.
    await coachPage.goto(`${running.stack.url}/coach`)
    await coachPage.getByRole('heading', { name: 'Open pain flags (1)' }).waitFor()
    await expect.poll(() => coachPage.getByTestId('nav-badge').textContent()).toMatch(/1/)
    await coach.close()

    const own = await newContext(running.browser, 'phone')
    await signIn(own, athlete.email)
    const athletePage = await own.newPage()
    const { id } = await running.fixtures.assignment(team.teamId, athlete.userId, hills, { routineId })
    for (const path of ['/today', '/logbook', '/progress', '/profile', `/session/${id}`]) {
      await scan(athletePage, path)
    }
    await own.close()
    expect(seen).toEqual([])
  })
})
