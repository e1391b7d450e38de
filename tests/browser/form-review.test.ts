import { mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser, BrowserContext } from 'playwright-core'
import { makeDemoClip } from '../../seeds/clip'
import { launchBrowser, newContext, screenshotPath } from '../support/browser'
import { startStack, type Stack } from '../support/stack'
import { addAthlete, PASSWORD, registerCoach } from '../support/team'

let stack: Stack
let browser: Browser
let folder: string
let clipFile: string

beforeAll(async () => {
  stack = await startStack()
  browser = await launchBrowser()
  folder = mkdtempSync(join(tmpdir(), 'switchback-review-'))
  clipFile = join(folder, 'my-a-skips.webm')
  writeFileSync(clipFile, await makeDemoClip({ seconds: 4, framesPerSecond: 10, motion: 'run' }))
})

afterAll(async () => {
  await browser?.close()
  await stack?.stop()
  if (folder) rmSync(folder, { recursive: true, force: true })
})

async function signIn(context: BrowserContext, email: string) {
  const response = await context.request.post(`${stack.url}/api/auth/login`, { data: { email, password: PASSWORD } })
  expect(response.status()).toBe(200)
}

describe('form review', () => {
  it('an athlete sends a clip, a coach comments at 0:02 and answers, and the athlete jumps to the comment', async () => {
    const team = await registerCoach(stack)
    const athlete = await addAthlete(stack, team.coach, { name: 'Ffion Aske' })

    const athleteContext = await newContext(browser, 'phone')
    await signIn(athleteContext, athlete.email)
    const page = await athleteContext.newPage()
    await page.goto(`${stack.url}/reviews`)
    await page.getByLabel('Or pick a video file').setInputFiles(clipFile)
    await page.getByLabel('Your question (optional)').fill('Is my knee drive high enough?')
    await page.getByRole('button', { name: 'Send for review' }).click()
    await page.waitForURL(/\/reviews\/\d+$/)
    const reviewUrl = page.url()
    await page.getByText('No comments yet.').waitFor()

    const coachContext = await newContext(browser, 'desktop')
    await signIn(coachContext, team.email)
    const coachPage = await coachContext.newPage()
    await coachPage.goto(`${stack.url}/reviews`)
    await coachPage.getByRole('heading', { name: 'Clips to review (1 open)' }).waitFor()
    await coachPage.getByRole('link', { name: /Ffion Aske/ }).click()
    await coachPage.waitForURL(reviewUrl)
    const clip = coachPage.getByTestId('review-clip')
    await clip.evaluate((element: HTMLVideoElement) => new Promise<void>((resolve) => {
      const go = () => {
        element.addEventListener('seeked', () => resolve(), { once: true })
        element.currentTime = 2
      }
      if (element.readyState >= 1) go()
      else element.addEventListener('loadedmetadata', go, { once: true })
    }))
    await coachPage.getByLabel('Comment at 0:02.0').fill('Knee higher here')
    await coachPage.getByRole('button', { name: 'Add the comment here' }).click()
    await coachPage.getByTestId('review-comment').getByText('Knee higher here').waitFor()
    await coachPage.getByRole('button', { name: 'Mark answered' }).click()
    await coachPage.getByText('Answered', { exact: true }).waitFor()
    await stack.mail.waitFor(athlete.email, /answered your form review/)
    await coachContext.close()

    await page.reload()
    await page.getByRole('button', { name: 'Jump to 0:02.0: Knee higher here' }).click()
    const at = await page.getByTestId('review-clip').evaluate((element: HTMLVideoElement) => element.currentTime)
    expect(at).toBeCloseTo(2, 1)
    await page.screenshot({ path: screenshotPath('form-review-athlete-phone'), fullPage: true })
    await athleteContext.close()
  })
})
