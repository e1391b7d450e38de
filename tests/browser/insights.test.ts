import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Database } from '../../server/db/client'
import { addDays, todayIn } from '../../shared/utils/dates'
import { newContext, screenshotPath, viewports, signInThroughPage } from '../support/browser'
import { createRoutine, insertHistory, insertPainFlag, openTestDatabase } from '../support/insights-data'
import { addAthlete, registerCoach } from '../support/team'
import { useBrowserStack } from '../support/hooks'

const running = useBrowserStack()
let db: Database

beforeAll(async () => {
  db = await openTestDatabase(running.stack.databaseUrl)
})

afterAll(async () => {
  db?.$client.close()
})

describe.each(Object.keys(viewports) as (keyof typeof viewports)[])('insights at %s width', (size) => {
  it('a coach opens an athlete with a pain flag, sees the load chart and acknowledges the flag', async () => {
    const { teamId, email, coach } = await registerCoach(running.stack, 'Larchford Ridge Runners')
    const athlete = await addAthlete(running.stack, coach, { name: 'Ffion Aske' })
    const today = todayIn('UTC')
    const routine = await createRoutine(db, teamId, 'Ridge hill reps')
    const sessions = await insertHistory(db, {
      teamId,
      athleteId: athlete.userId,
      today,
      routine,
      days: Array.from({ length: 45 }, (_, daysAgo) => ({
        daysAgo,
        done: daysAgo % 3 !== 2,
        load: daysAgo < 7 ? 420 : 260,
        pain: daysAgo === 1 ? 7 : undefined,
        painArea: daysAgo === 1 ? 'knee' : undefined,
        note: daysAgo === 1 ? 'Outside of the knee ached on the descent' : undefined,
        sets: daysAgo % 7 === 0 ? [{ kg: 60, reps: 8 }, { kg: 65, reps: 6 }] : undefined,
      })),
    })
    await insertPainFlag(db, { teamId, athleteId: athlete.userId, sessionId: sessions.find(s => s.day === addDays(today, -1))!.id, pain: 7, area: 'knee' })

    const context = await newContext(running.browser, size)
    const page = await signInThroughPage(context, running.stack.url, email)
    await page.waitForURL(/\/coach$/)

    await page.goto(`${running.stack.url}/insights`)
    await page.getByRole('heading', { name: 'Insights', exact: true }).waitFor()
    await page.getByRole('heading', { name: 'Open pain flags (1)' }).waitFor()
    // This week's load jumped, so the ratio is marked with a word, not only a colour.
    await page.getByText('above the cited range').first().waitFor()
    expect(await page.getByText('not a safe zone').isVisible()).toBe(true)
    await page.screenshot({ path: screenshotPath(`insights-team-${size}`), fullPage: true })

    await page.getByRole('row', { name: /Ffion Aske/ }).getByRole('link', { name: 'Ffion Aske' }).click()
    await page.waitForURL(new RegExp(`/insights/athletes/${athlete.userId}$`))
    await page.getByRole('heading', { name: 'Ffion Aske' }).waitFor()
    const chart = page.getByRole('img', { name: /Weekly load for 12 weeks/ })
    await chart.waitFor()
    expect(await chart.locator('rect.fill-pine-400').count()).toBe(12)
    // The accessible table behind the chart holds the same weeks.
    await page.getByText('Weekly load as a table').click()
    expect(await page.getByRole('table').filter({ hasText: 'Week of' }).locator('tbody tr').count()).toBe(12)
    await page.getByText('Outside of the knee ached on the descent').first().waitFor()

    const flag = page.getByRole('article', { name: /Pain flag/ })
    await flag.getByLabel(/Reply to Ffion Aske/).fill('Thanks, Ffion. Flat easy runs until Friday, and see the physio if it is still there.')
    await page.screenshot({ path: screenshotPath(`insights-athlete-${size}`), fullPage: true })
    await flag.getByRole('button', { name: 'Acknowledge' }).click()
    await page.getByText('Morwen Tay replied:').waitFor()
    expect(await page.getByRole('button', { name: 'Acknowledge' }).count()).toBe(0)

    await page.goto(`${running.stack.url}/insights`)
    await page.getByText('No open pain flags.').waitFor()
    await context.close()

    // The athlete reads the reply on their progress page.
    const athleteContext = await newContext(running.browser, size)
    const athletePage = await signInThroughPage(athleteContext, running.stack.url, athlete.email)
    await athletePage.waitForURL(/\/today$/)
    await athletePage.goto(`${running.stack.url}/progress`)
    await athletePage.getByRole('heading', { name: 'Replies from your coach' }).waitFor()
    await athletePage.getByText('Flat easy runs until Friday').first().waitFor()
    await athletePage.getByRole('img', { name: /Weekly load for 12 weeks/ }).waitFor()
    await athletePage.screenshot({ path: screenshotPath(`insights-progress-${size}`), fullPage: true })
    await athleteContext.close()
  })
})
