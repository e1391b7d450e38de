import { describe, expect, it } from 'vitest'
import type { BrowserContext } from 'playwright-core'
import { useBrowserStack, useDemoClipFile } from '../support/hooks'
import { newContext, screenshotPath, signInByRequest } from '../support/browser'
import { addAthlete, registerCoach } from '../support/team'

const running = useBrowserStack()
const demoClip = useDemoClipFile('my-a-skips.webm', { seconds: 4, framesPerSecond: 10, motion: 'run' })

function signIn(context: BrowserContext, email: string) {
  return signInByRequest(context, running.stack.url, email)
}

describe('form review', () => {
  it('an athlete sends a clip, a coach comments at 0:02 and answers, and the athlete jumps to the comment', async () => {
    const team = await registerCoach(running.stack)
    const athlete = await addAthlete(running.stack, team.coach, { name: 'Ffion Aske' })

    const athleteContext = await newContext(running.browser, 'phone')
    await signIn(athleteContext, athlete.email)
    const page = await athleteContext.newPage()
    await page.goto(`${running.stack.url}/reviews`)
    await page.getByLabel('Or pick a video file').setInputFiles(demoClip.path)
    await page.getByLabel('Your question (optional)').fill('Is my knee drive high enough?')
    await page.getByRole('button', { name: 'Send for review' }).click()
    await page.waitForURL(/\/reviews\/\d+$/)
    const reviewUrl = page.url()
    await page.getByText('No comments yet.').waitFor()

    const coachContext = await newContext(running.browser, 'desktop')
    await signIn(coachContext, team.email)
    const coachPage = await coachContext.newPage()
    await coachPage.goto(`${running.stack.url}/reviews`)
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
    await running.stack.mail.waitFor(athlete.email, /answered your form review/)
    await coachContext.close()

    await page.reload()
    await page.getByRole('button', { name: 'Jump to 0:02.0: Knee higher here' }).click()
    const at = await page.getByTestId('review-clip').evaluate((element: HTMLVideoElement) => element.currentTime)
    expect(at).toBeCloseTo(2, 1)
    await page.screenshot({ path: screenshotPath('form-review-athlete-phone'), fullPage: true })
    await athleteContext.close()
  })
})
