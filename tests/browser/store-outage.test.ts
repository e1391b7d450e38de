import { mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser } from 'playwright-core'
import { makeDemoClip } from '../../seeds/clip'
import { launchBrowser, newContext, screenshotPath, signInThroughPage } from '../support/browser'
import { Fixtures } from '../support/fixtures'
import { startStack, type Stack } from '../support/stack'
import { registerCoach } from '../support/team'

let stack: Stack
let browser: Browser
let folder: string
let clipFile: string

beforeAll(async () => {
  stack = await startStack()
  browser = await launchBrowser()
  folder = mkdtempSync(join(tmpdir(), 'switchback-outage-'))
  clipFile = join(folder, 'calf-raise.webm')
  writeFileSync(clipFile, await makeDemoClip({ seconds: 2, motion: 'climb' }))
})

afterAll(async () => {
  await browser?.close()
  await stack?.stop()
  if (folder) rmSync(folder, { recursive: true, force: true })
})

describe('the clip store goes down during an upload', () => {
  it('says so plainly, records nothing, and the upload succeeds on "try again" once the store is back', async () => {
    const team = await registerCoach(stack)
    const fixtures = new Fixtures(stack)
    const exercise = await fixtures.exercise(team.teamId, { name: 'Single-leg calf raise' })
    const context = await newContext(browser, 'phone')
    const page = await signInThroughPage(context, stack.url, team.email)

    await stack.s3.stop()
    await page.goto(`${stack.url}/exercises/${exercise.id}`)
    await page.getByTestId('clip-file').setInputFiles(clipFile)
    // The message carries the request's reference, as the server's log line does.
    await page.getByText(/clip store cannot be reached.*\(reference [\w-]{8}\)/i).waitFor({ timeout: 30_000 })
    const retry = page.getByRole('button', { name: 'Try the upload again' })
    await retry.waitFor({ timeout: 30_000 })
    await page.screenshot({ path: screenshotPath('store-outage-phone'), fullPage: true })
    const pending = await fixtures.rows<{ n: number }>('select count(*) as n from media_objects where exercise_id = ?', [exercise.id])
    expect(Number(pending[0]!.n)).toBe(0)

    await stack.s3.start()
    await retry.click()
    await page.getByText(/Clip uploaded and checked/).waitFor({ timeout: 60_000 })
    const ready = await fixtures.rows<{ status: string }>('select status from media_objects where exercise_id = ? and purpose = \'clip\'', [exercise.id])
    expect(ready.map(row => row.status)).toEqual(['ready'])
    fixtures.close()
    await context.close()
  })
})
