import { describe, expect, it } from 'vitest'
import { useBrowserStack, useDemoClipFile } from '../support/hooks'
import { newContext, screenshotPath, signInThroughPage } from '../support/browser'
import { registerCoach } from '../support/team'

const running = useBrowserStack()
const demoClip = useDemoClipFile('calf-raise.webm', { seconds: 2, motion: 'climb' })

describe('the clip store goes down during an upload', () => {
  it('says so plainly, records nothing, and the upload succeeds on "try again" once the store is back', async () => {
    const team = await registerCoach(running.stack)
    const exercise = await running.fixtures.exercise(team.teamId, { name: 'Single-leg calf raise' })
    const context = await newContext(running.browser, 'phone')
    const page = await signInThroughPage(context, running.stack.url, team.email)

    await running.stack.s3.stop()
    await page.goto(`${running.stack.url}/exercises/${exercise.id}`)
    await page.getByTestId('clip-file').setInputFiles(demoClip.path)
    // The message carries the request's reference, as the server's log line does.
    await page.getByText(/clip store cannot be reached.*\(reference [\w-]{8}\)/i).waitFor({ timeout: 30_000 })
    const retry = page.getByRole('button', { name: 'Try the upload again' })
    await retry.waitFor({ timeout: 30_000 })
    await page.screenshot({ path: screenshotPath('store-outage-phone'), fullPage: true })
    const pending = await running.fixtures.rows<{ n: number }>('select count(*) as n from media_objects where exercise_id = ?', [exercise.id])
    expect(Number(pending[0]!.n)).toBe(0)

    await running.stack.s3.start()
    await retry.click()
    await page.getByText(/Clip uploaded and checked/).waitFor({ timeout: 60_000 })
    const ready = await running.fixtures.rows<{ status: string }>('select status from media_objects where exercise_id = ? and purpose = \'clip\'', [exercise.id])
    expect(ready.map(row => row.status)).toEqual(['ready'])
    await context.close()
  })
})
