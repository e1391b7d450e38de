import { describe, expect, it } from 'vitest'
import { addDays, startOfWeek, todayIn } from '../../shared/utils/dates'
import { newContext, signInThroughPage, screenshotPath } from '../support/browser'
import { insertRoutine } from '../support/planner'
import { addAthlete, registerCoach } from '../support/team'
import { useBrowserStack } from '../support/hooks'

const running = useBrowserStack()

async function signIn(context: Awaited<ReturnType<typeof newContext>>, email: string) {
  return signInThroughPage(context, running.stack.url, email)
}

describe('planner in Chromium', () => {
  it('a coach plans hill reps for a squad on Tuesdays and Fridays for 10 weeks; the athlete sees them under Upcoming', async () => {
    const team = await registerCoach(running.stack)
    const squad = await team.coach.post<{ id: number }>('/api/squads', { name: 'Ridge group' })
    const athlete = await addAthlete(running.stack, team.coach, { squadId: squad.data.id, name: 'Tamsin Rook' })
    const db = running.db
    await insertRoutine(db, team.teamId, { title: 'Ridge road hill reps', category: 'hills' })

    const nextMonday = addDays(startOfWeek(todayIn('UTC')), 7)
    const coachContext = await newContext(running.browser, 'desktop')
    const page = await signIn(coachContext, team.email)
    await page.goto(`${running.stack.url}/planner`)
    await page.getByRole('heading', { name: 'Planner' }).waitFor()

    const form = page.locator('form[aria-labelledby="assign-heading"]')
    await form.getByLabel('Routine').selectOption({ label: 'Ridge road hill reps (Hills)' })
    await form.getByLabel('A squad').check()
    await form.getByLabel('Squad', { exact: true }).selectOption({ label: 'Ridge group' })
    await form.getByLabel('Every week on set days').check()
    await form.getByLabel('First day of the block').fill(nextMonday)
    await form.getByLabel('Weeks').fill('10')
    await form.getByLabel('Tuesday').check()
    await form.getByLabel('Friday').check()
    await expect.poll(() => form.getByTestId('assign-preview').innerText()).toContain('20 days × 1 athlete = 20 sessions')
    await page.screenshot({ path: screenshotPath('planner-assign-desktop'), fullPage: true })

    await form.getByRole('button', { name: 'Plan 20 sessions' }).click()
    await page.getByRole('status').filter({ hasText: 'Planned 20 sessions of Ridge road hill reps for 1 athlete' }).waitFor()

    // The next week shows Tuesday's session; drag it to Wednesday.
    await page.getByRole('button', { name: 'Next week' }).click()
    const tuesday = page.locator(`[data-day="${addDays(nextMonday, 1)}"]`)
    const wednesday = page.locator(`[data-day="${addDays(nextMonday, 2)}"]`)
    await tuesday.getByText('Ridge road hill reps').waitFor()
    await page.screenshot({ path: screenshotPath('planner-week-desktop'), fullPage: true })
    await tuesday.locator('[data-assignment-id]').dragTo(wednesday)
    await wednesday.getByText('Ridge road hill reps').waitFor()
    await expect.poll(() => tuesday.locator('[data-assignment-id]').count()).toBe(0)

    await page.getByRole('button', { name: 'Month', exact: true }).click()
    await page.getByRole('table').waitFor()
    await page.screenshot({ path: screenshotPath('planner-month-desktop'), fullPage: true })

    const phoneCoach = await newContext(running.browser, 'phone')
    const phonePage = await signIn(phoneCoach, team.email)
    await phonePage.goto(`${running.stack.url}/planner`)
    await phonePage.getByRole('heading', { name: 'Planner' }).waitFor()
    await phonePage.screenshot({ path: screenshotPath('planner-phone'), fullPage: true })
    await phoneCoach.close()
    await coachContext.close()

    const athleteContext = await newContext(running.browser, 'phone')
    const athletePage = await signIn(athleteContext, athlete.email)
    await athletePage.goto(`${running.stack.url}/today`)
    const upcoming = athletePage.getByRole('region', { name: 'Upcoming' })
    await upcoming.getByText('Ridge road hill reps').first().waitFor()
    const links = upcoming.getByRole('link', { name: /Ridge road hill reps/ })
    // Four weeks ahead: the moved Wednesday, then Fridays and Tuesdays.
    expect(await links.count()).toBeGreaterThanOrEqual(7)
    expect(await links.first().getAttribute('href')).toMatch(/^\/session\/\d+$/)
    await athletePage.screenshot({ path: screenshotPath('today-phone'), fullPage: true })

    await athletePage.getByRole('button', { name: 'Make my calendar link' }).click()
    const feedUrl = await athletePage.getByLabel('Calendar link').inputValue()
    expect(feedUrl).toMatch(/\/calendar\/[\w-]{40,}\.ics$/)
    expect((await fetch(feedUrl)).status).toBe(200)
    await athletePage.getByLabel('E-mail me when my coach plans new training').uncheck()
    await athletePage.getByText('No more e-mails about new training.').waitFor()
    const notices = await athlete.athlete.get<{ notifyByEmail: boolean }>('/api/me/notifications')
    expect(notices.data.notifyByEmail).toBe(false)
    await athleteContext.close()

    const desktopAthlete = await newContext(running.browser, 'desktop')
    const desktopPage = await signIn(desktopAthlete, athlete.email)
    await desktopPage.goto(`${running.stack.url}/today`)
    await desktopPage.getByRole('region', { name: 'Upcoming' }).getByText('Ridge road hill reps').first().waitFor()
    await desktopPage.screenshot({ path: screenshotPath('today-desktop'), fullPage: true })
    await desktopAthlete.close()
  })
})
