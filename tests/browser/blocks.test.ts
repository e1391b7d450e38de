import { describe, expect, it } from 'vitest'
import { addDays, todayIn, weekdayNames, weekdayOf } from '../../shared/utils/dates'
import { newContext, signInThroughPage, screenshotPath } from '../support/browser'
import { hillSteps, insertRoutine } from '../support/planner'
import { addAthlete, registerCoach } from '../support/team'
import { useBrowserStack } from '../support/hooks'

const running = useBrowserStack()

async function signIn(context: Awaited<ReturnType<typeof newContext>>, email: string) {
  return signInThroughPage(context, running.stack.url, email)
}

describe('training blocks in Chromium', () => {
  it('a coach builds an 8-week hill block from 6 to 10 reps, previews and plans it; the athlete sees week 2 with 7 reps', async () => {
    const team = await registerCoach(running.stack)
    const { email: athleteEmail } = await addAthlete(running.stack, team.coach, { name: 'Tamsin Rook' })
    const db = running.db
    await insertRoutine(db, team.teamId, { title: 'Ridge road hill reps', category: 'hills', steps: hillSteps(undefined, 6) })

    // The block started 7 days ago on today's weekday, so today's session is week 2's.
    const today = todayIn('UTC')
    const start = addDays(today, -7)
    const coachContext = await newContext(running.browser, 'desktop')
    const page = await signIn(coachContext, team.email)
    await page.goto(`${running.stack.url}/blocks`)
    await page.getByRole('link', { name: 'New block' }).click()
    await page.getByRole('heading', { name: 'New training block' }).waitFor()

    await page.getByLabel('Block name').fill('Spring hills')
    await page.getByLabel('First day').fill(start)
    await page.getByLabel('Weeks (1–26)').fill('8')
    await page.getByLabel('Tamsin Rook').check()
    await page.getByLabel('Routine', { exact: true }).selectOption({ label: 'Ridge road hill reps' })
    await page.getByLabel('Weekday').selectOption({ label: weekdayNames[weekdayOf(today) - 1] })
    const addChange = page.getByRole('button', { name: 'Add a change' })
    await expect.poll(() => addChange.isEnabled()).toBe(true)
    await addChange.click()
    await page.getByLabel('Step', { exact: true }).selectOption('reps')
    await expect.poll(() => page.getByLabel('What changes').inputValue()).toBe('rounds')
    await page.locator('#rule-0-0-by').fill('1')
    await page.getByLabel('Up to (cap)').fill('10')

    await page.getByLabel('Lighter weeks').check()
    await page.getByLabel('Which weeks').selectOption('chosen')
    await page.getByLabel('Weeks (e.g. 4, 8)').fill('4')
    await page.locator('#lighter-percent').fill('60')
    await page.getByLabel('Taper before the goal race').check()
    await page.getByLabel('Taper weeks (1–3)').selectOption('1')
    await page.locator('#taper-percent').fill('60')

    await page.getByRole('button', { name: 'Preview the weeks' }).click()
    const preview = page.getByTestId('block-preview')
    await preview.waitFor()
    // 6 + 1 a week up to 10; week 4 lighter (9 × 0.6 → 5); week 8 taper (10 × 0.6 → 6).
    await expect.poll(() => preview.getByTestId('block-week-1').innerText()).toContain('6 rounds')
    expect(await preview.getByTestId('block-week-2').innerText()).toContain('7 rounds')
    expect(await preview.getByTestId('block-week-2').innerText()).toContain('+1 round')
    expect(await preview.getByTestId('block-week-4').innerText()).toMatch(/lighter week[\s\S]*5 rounds/)
    expect(await preview.getByTestId('block-week-5').innerText()).toContain('10 rounds')
    expect(await preview.getByTestId('block-week-8').innerText()).toMatch(/taper week[\s\S]*6 rounds/)
    await page.getByText('Show the numbers as a table').click()
    await page.screenshot({ path: screenshotPath('block-preview-desktop'), fullPage: true })

    await page.getByRole('button', { name: 'Save the block' }).click()
    await page.waitForURL(/\/blocks\/\d+$/)
    await page.getByRole('button', { name: 'Plan the block' }).click()
    await page.getByRole('status').filter({ hasText: 'Planned 8 sessions for 1 athlete' }).waitFor()
    await page.getByText('Planned: 8 sessions').waitFor()
    await page.getByRole('heading', { name: 'Planned against done' }).waitFor()

    // Week 3 by hand: 9 rounds instead of the rule's 8; its session and week 4's (for "what changed") follow at once.
    await page.getByRole('button', { name: /Set week 3 by hand/ }).click()
    await page.getByLabel(/: Rounds$/).fill('9')
    await page.getByRole('button', { name: 'Save week 3' }).click()
    await page.getByRole('status').filter({ hasText: 'Week 3 set by hand; 2 planned sessions updated.' }).waitFor()
    await expect.poll(() => page.getByTestId('block-week-3').innerText()).toMatch(/9 rounds[\s\S]*set by hand/)

    const phoneCoach = await newContext(running.browser, 'phone')
    const phonePage = await signIn(phoneCoach, team.email)
    await phonePage.goto(page.url())
    await phonePage.getByTestId('block-preview').waitFor()
    await phonePage.screenshot({ path: screenshotPath('block-phone'), fullPage: true })

    // The athlete: today's session is week 2 of 8, one round more than last week.
    const athleteContext = await newContext(running.browser, 'phone')
    const athletePage = await signIn(athleteContext, athleteEmail)
    await athletePage.goto(`${running.stack.url}/today`)
    const todays = athletePage.locator('section[aria-labelledby="today-heading"]')
    await todays.getByText('Week 2 of 8').waitFor()
    expect(await todays.getByTestId('block-week').innerText()).toContain('+1 round from last week')
    await athletePage.screenshot({ path: screenshotPath('block-today-phone'), fullPage: true })

    await todays.getByRole('link', { name: /Ridge road hill reps/ }).click()
    await athletePage.getByRole('heading', { name: 'Ridge road hill reps' }).waitFor()
    expect(await athletePage.getByTestId('block-week').innerText()).toContain('Week 2 of 8')
    await athletePage.getByText('Round 1 of 7').first().waitFor()
    expect(await athletePage.getByText('Round 7 of 7').count()).toBeGreaterThan(0)

    await athletePage.getByTestId('block-week').getByRole('link', { name: 'Spring hills' }).click()
    await athletePage.getByRole('heading', { name: 'Spring hills' }).waitFor()
    await athletePage.getByText('Week 2 of 8 ·').waitFor()
    expect(await athletePage.locator('li[aria-current="step"]').innerText()).toContain('7 rounds')
    await athletePage.screenshot({ path: screenshotPath('block-athlete-phone'), fullPage: true })
  })
})
