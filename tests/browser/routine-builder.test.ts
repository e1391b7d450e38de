import { describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { makeDemoClip } from '../../seeds/clip'
import { newContext, screenshotPath, viewports, signInThroughPage } from '../support/browser'
import { addAthlete, registerCoach } from '../support/team'
import { useBrowserStack } from '../support/hooks'

const running = useBrowserStack()

const rootOrder = (page: Page) => page.$$eval('ol[data-list-id="root"] > li > article', cards => cards.map(card => card.getAttribute('aria-label')))
const totalTime = (page: Page) => page.getByTestId('total-time').textContent()

/** A real pointer drag: press on the grip, move in small steps to the target, release. */
async function drag(page: Page, from: { x: number, y: number }, to: { x: number, y: number }) {
  await page.mouse.move(from.x, from.y)
  await page.mouse.down()
  await page.mouse.move(from.x + 4, from.y + 4, { steps: 4 })
  await page.mouse.move(to.x, to.y, { steps: 25 })
  await page.waitForTimeout(200)
  await page.mouse.up()
}

describe.each(Object.keys(viewports) as (keyof typeof viewports)[])('routine builder at %s width', (size) => {
  it('a coach composes a hill-rep routine, reorders it, saves, reloads and finds it intact', async () => {
    const { coach, email } = await registerCoach(running.stack)
    const exercise = await coach.post<{ id: number }>('/api/exercises', {
      name: 'Short hill sprints',
      category: 'hill',
      summary: 'Fast, short climbs.',
      cautions: [{ text: 'Walk back down to spare the knees', bodyAreas: ['knee'] }],
    })
    expect(exercise.status).toBe(201)
    // A demo clip for it, uploaded the way the library page does: presigned PUT, then confirm.
    const clip = await makeDemoClip({ seconds: 1, framesPerSecond: 8 })
    const signed = await coach.post<{ url: string, key: string }>(`/api/exercises/${exercise.data.id}/clip/upload-url`, { contentType: 'video/webm', size: clip.byteLength })
    expect((await fetch(signed.data.url, { method: 'PUT', body: new Uint8Array(clip), headers: { 'content-type': 'video/webm' } })).status).toBe(200)
    expect((await coach.post(`/api/exercises/${exercise.data.id}/clip/confirm`, { key: signed.data.key })).status).toBe(200)
    const { userId: athleteId } = await addAthlete(running.stack, coach, { name: 'Ffion Aske' })
    const sql = running.db
    await sql.execute({ sql: 'update athlete_profiles set benchmark_distance_m = 5000, benchmark_time_s = 1200 where user_id = ?', args: [athleteId] })
    await sql.execute({ sql: 'insert into injury_notes (team_id, athlete_id, body_area, status, note) select team_id, user_id, \'knee\', \'active\', \'Aches on descents\' from athlete_profiles where user_id = ?', args: [athleteId] })

    const context = await newContext(running.browser, size)
    const page = await signInThroughPage(context, running.stack.url, email, { next: '/routines/new' })
    await page.getByRole('heading', { name: 'New routine' }).waitFor()

    // Nothing is flagged on a fresh page; leaving the empty title flags it, typing one clears it.
    expect(await page.locator('.field-error').count()).toBe(0)
    await page.getByLabel('Title').focus()
    await page.keyboard.press('Tab')
    await expect.poll(() => page.locator('.field-error').count()).toBe(1)
    await page.getByLabel('Title').fill('Ridge Lane hill reps')
    await expect.poll(() => page.locator('.field-error').count()).toBe(0)
    await page.getByRole('button', { name: '+ Easy start' }).click()
    await expect.poll(() => totalTime(page)).toBe('10:00')
    // The cool-down goes in before the repeat on purpose: it is dragged into place below.
    await page.getByRole('button', { name: '+ Easy finish' }).click()
    await page.getByRole('button', { name: '+ Rounds', exact: true }).click()
    await expect.poll(() => totalTime(page)).toBe('30:00')

    const repeat = page.locator('article[aria-label$=" rounds"]')
    await repeat.getByLabel('Times', { exact: true }).fill('8')
    await expect.poll(() => totalTime(page)).toBe('40:00')
    // Undo and redo from the keyboard.
    await page.keyboard.press('Control+z')
    await expect.poll(() => totalTime(page)).toBe('30:00')
    await page.keyboard.press('Control+Shift+z')
    await expect.poll(() => totalTime(page)).toBe('40:00')

    // Inside the repeat: 60 s uphill at 5K effort, then 90 s jogging down.
    const effort = repeat.locator('article[aria-label^="Main effort"]')
    await effort.locator('button[aria-expanded]').first().click()
    await effort.getByLabel('Target').selectOption('pace')
    await effort.getByLabel('Pace', { exact: true }).selectOption('fiveK')
    await effort.getByLabel('Hill grade').fill('6')
    await effort.getByLabel('Exercise (optional)').fill('hill spr')
    await page.getByRole('option', { name: /Short hill sprints/ }).click()
    await effort.getByText('Walk back down to spare the knees').waitFor()
    await effort.getByTestId('exercise-clip').scrollIntoViewIfNeeded()
    await expect.poll(() => effort.getByTestId('exercise-clip').evaluate(video => (video as HTMLVideoElement).duration)).toBeGreaterThan(0)
    await effort.getByLabel('Note for the athlete').fill('Strong arms, even effort to the top')
    const recovery = repeat.locator('article[aria-label="Easy between efforts"]')
    await recovery.locator('button[aria-expanded]').first().click()
    await recovery.getByLabel('Note for the athlete').fill('Jog down gently')
    // Validation as you type: an impossible grade is flagged on the spot.
    await effort.getByLabel('Hill grade').fill('60')
    await effort.getByText('Grade must be between -45 % and +45 %').waitFor()
    await effort.getByLabel('Hill grade').fill('6')
    await expect.poll(() => effort.getByText('Grade must be between').count()).toBe(0)

    expect(await rootOrder(page)).toEqual(['Easy start', 'Easy finish', '8 rounds'])
    // Fold every card, as a coach does before rearranging, so the whole routine fits on screen.
    while (await page.locator('button[aria-expanded="true"]').count()) await page.locator('button[aria-expanded="true"]').first().click()
    await page.locator('ol[data-list-id="root"]').scrollIntoViewIfNeeded()
    if (size === 'desktop') {
      const grip = await repeat.locator('.step-handle').first().boundingBox()
      const coolDown = await page.locator('ol[data-list-id="root"] > li > article[aria-label="Easy finish"]').boundingBox()
      await drag(page, { x: grip!.x + grip!.width / 2, y: grip!.y + grip!.height / 2 }, { x: coolDown!.x + coolDown!.width / 2, y: coolDown!.y + coolDown!.height / 2 })
    }
    else {
      // On a phone the buttons do what the drag does.
      await page.getByRole('button', { name: 'Move 8 rounds up' }).click()
    }
    await expect.poll(() => rootOrder(page)).toEqual(['Easy start', '8 rounds', 'Easy finish'])
    await expect.poll(() => totalTime(page)).toBe('40:00')
    if (size === 'phone') {
      // Folded cards keep to their summaries; the totals stay in sight at the bottom; the buttons fit a thumb.
      const bar = (await page.getByTestId('totals-bar').boundingBox())!
      expect(bar.y + bar.height).toBeLessThanOrEqual(viewports.phone.height + 1)
      expect(await page.getByTestId('totals-bar').textContent()).toMatch(/Total\s*40:00/)
      const up = (await page.getByRole('button', { name: 'Move Easy finish up' }).boundingBox())!
      expect(Math.min(up.width, up.height)).toBeGreaterThanOrEqual(44)
      expect(await page.getByRole('button', { name: 'Remove Easy finish' }).isVisible()).toBe(false)
    }
    await page.screenshot({ path: screenshotPath(`routine-builder-${size}`), fullPage: true })

    // Leaving with unsaved work asks first; saying no keeps the draft.
    const questions: string[] = []
    page.once('dialog', (dialog) => {
      questions.push(dialog.message())
      void dialog.dismiss()
    })
    await page.getByRole('link', { name: '← All routines' }).click()
    await expect.poll(() => questions).toEqual([expect.stringMatching(/unsaved changes/)])
    expect(page.url()).toMatch(/\/routines\/new$/)

    await page.getByRole('button', { name: 'Save', exact: true }).click()
    await page.waitForURL(/\/routines\/\d+$/)
    await expect.poll(() => page.getByTestId('save-status').textContent()).toMatch(/Saved · version 1/)

    await page.reload()
    await page.getByRole('heading', { name: 'Ridge Lane hill reps' }).waitFor()
    await expect.poll(() => rootOrder(page)).toEqual(['Easy start', '8 rounds', 'Easy finish'])
    expect(await totalTime(page)).toBe('40:00')
    const saved = page.locator('article[aria-label$=" rounds"]')
    const savedSteps = await saved.locator('ol > li > article').evaluateAll(cards => cards.map(card => card.textContent ?? ''))
    expect(savedSteps).toHaveLength(2)
    expect(savedSteps[0]).toMatch(/Main effort: Short hill sprints\s*1:00 · 5K pace · \+6 % grade/)
    expect(savedSteps[1]).toMatch(/Easy between efforts\s*1:30/)
    await saved.locator('article[aria-label^="Main effort"] button[aria-expanded]').first().click()
    expect(await saved.getByLabel('Note for the athlete').first().inputValue()).toBe('Strong arms, even effort to the top')
    expect(await page.getByTestId('save-status').textContent()).toMatch(/Saved/)
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(viewports[size].width)

    // The preview fills in this athlete's paces and puts the caution about their sore knee first.
    await page.getByLabel('Athlete', { exact: true }).selectOption({ label: 'Ffion Aske' })
    const preview = page.getByTestId('routine-preview')
    await preview.getByTestId('matched-cautions').getByText('Walk back down to spare the knees').waitFor()
    await preview.getByText(/\/km on \+6 % grade \(same effort as \d+:\d\d \/km on the flat\)/).first().waitFor()
    await page.screenshot({ path: screenshotPath(`routine-builder-saved-${size}`), fullPage: true })

    const routineId = page.url().split('/').pop()

    // Someone saves from another tab; this tab's next save is refused with a way out.
    const current = await coach.get<{ title: string, category: string, description: string, steps: unknown[] }>(`/api/routines/${routineId}`)
    expect((await coach.put(`/api/routines/${routineId}`, { ...current.data, title: 'Ridge Lane hills, from the other tab', version: 1 })).status).toBe(200)
    await page.getByLabel('Title').fill('Ridge Lane hills, from this tab')
    await page.getByRole('button', { name: 'Save', exact: true }).click()
    await page.getByTestId('save-conflict').getByText('Someone else saved this routine after you opened it').waitFor()
    await page.getByRole('button', { name: 'Load the saved version' }).click()
    await page.getByRole('heading', { name: 'Ridge Lane hills, from the other tab' }).waitFor()
    await expect.poll(() => page.getByTestId('save-status').textContent()).toMatch(/Saved · version 2/)

    await page.goto(`${running.stack.url}/routines`)
    await page.getByRole('link', { name: 'Ridge Lane hills, from the other tab', exact: true }).waitFor()
    await page.getByLabel('Category').selectOption({ label: 'Strength' })
    await page.getByText('No routine matches.').waitFor()
    await page.getByLabel('Category').selectOption({ label: 'Hills' })
    await page.getByLabel('Search').fill('other tab')
    // A table on a desktop, cards on a phone: either way one visible routine, and nothing wider than the screen.
    await expect.poll(() => page.locator('[data-routine-id]:visible').count()).toBe(1)
    expect(await page.locator(size === 'phone' ? 'li[data-routine-id]' : 'tr[data-routine-id]').first().isVisible()).toBe(true)
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(viewports[size].width)
    await page.screenshot({ path: screenshotPath(`routine-list-${size}`), fullPage: true })
    await page.goto(`${running.stack.url}/routines/${routineId}/print`)
    await page.getByRole('heading', { name: 'Ridge Lane hills, from the other tab' }).waitFor()
    await expect.poll(() => page.getByTestId('routine-qr').evaluate(image => (image as HTMLImageElement).naturalWidth)).toBeGreaterThan(0)
    expect(await page.getByTestId('routine-qr').getAttribute('alt')).toBe(`QR code for ${running.stack.url}/session/routine/${routineId}`)
    await page.emulateMedia({ media: 'print' })
    await page.screenshot({ path: screenshotPath(`routine-card-${size}`), fullPage: true })
    await context.close()
  })
})
