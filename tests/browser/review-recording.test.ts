import { describe, expect, it } from 'vitest'
import type { BrowserContext } from 'playwright-core'
import { ALL_FORMATS, BufferSource, Input } from 'mediabunny'
import { useBrowserStack, useDemoClipFile } from '../support/hooks'
import { fakeCameraArgs, newContext, screenshotPath, signInByRequest } from '../support/browser'
import { addAthlete, registerCoach } from '../support/team'
import type { FormReview } from '../../types/api'

// Recording in the page with Chromium's fake camera (a moving test picture, no prompt), the review queue's
// squad filter in the address, and the count of clips waiting in the coach's navigation.

const running = useBrowserStack({ browserArgs: fakeCameraArgs })
const demoClip = useDemoClipFile('hill-bounds.webm', { seconds: 3, framesPerSecond: 8, motion: 'run' })

async function signedIn(email: string, size: 'phone' | 'desktop') {
  const context = await newContext(running.browser, size)
  await context.grantPermissions(['camera', 'microphone'], { origin: running.stack.url })
  await signInByRequest(context, running.stack.url, email)
  return context
}

async function reviewOf(context: BrowserContext, url: string) {
  const response = await context.request.get(`${running.stack.url}/api${new URL(url).pathname}`)
  expect(response.status()).toBe(200)
  return await response.json() as FormReview
}

describe('recording a clip in the page', () => {
  it('an athlete records about 2 s and sends it; the coach sees the count, filters by squad, records a reply and sets how long clips are kept', async () => {
    const team = await registerCoach(running.stack)
    const road = await team.coach.post<{ id: number }>('/api/squads', { name: 'Road' })
    const trail = await team.coach.post<{ id: number }>('/api/squads', { name: 'Trail' })
    const roadRunner = await addAthlete(running.stack, team.coach, { name: 'Cai Penhallow', squadId: road.data.id })
    const trailRunner = await addAthlete(running.stack, team.coach, { name: 'Wren Calder', squadId: trail.data.id })

    // The athlete on a phone records with the camera, watches it back and sends it.
    const athleteContext = await signedIn(roadRunner.email, 'phone')
    const page = await athleteContext.newPage()
    await page.goto(`${running.stack.url}/reviews`)
    await page.getByRole('button', { name: 'Record with the camera' }).click()
    await page.getByRole('timer').filter({ hasText: /Recording 0:0[2-9] of 1:00/ }).waitFor()
    await page.getByRole('button', { name: 'Stop recording' }).click()
    await page.getByTestId('recording-preview').waitFor()
    await page.getByRole('button', { name: 'Record again' }).waitFor()
    expect(await page.evaluate(() => document.activeElement?.textContent?.trim())).toBe('Record again')
    // The preview plays the recording back: about 2 s.
    const previewSeconds = await page.getByTestId('recording-preview').evaluate((element: HTMLVideoElement) => new Promise<number>((resolve) => {
      if (element.readyState >= 1) resolve(element.duration)
      else element.addEventListener('loadedmetadata', () => resolve(element.duration), { once: true })
    }))
    expect(previewSeconds).toBeGreaterThan(1.5)
    expect(previewSeconds).toBeLessThan(5)
    await page.screenshot({ path: screenshotPath('review-recorded-athlete-phone'), fullPage: true })
    await page.getByLabel('Your question (optional)').fill('Am I leaning from the ankles?')
    await page.getByRole('button', { name: 'Send for review' }).click()
    await page.waitForURL(/\/reviews\/\d+$/, { timeout: 30_000 })
    const recorded = await reviewOf(athleteContext, page.url())
    // The server read the length from the recorded WebM itself.
    expect(recorded.durationSeconds).toBeGreaterThan(1.5)
    expect(recorded.durationSeconds).toBeLessThan(5)
    // And the stored file carries its length in the header (Chromium's recorder writes none), so a player
    // reading it from the store in ranges knows how long it is.
    const stored = await fetch(recorded.clip.url)
    const header = new Input({ source: new BufferSource(await stored.arrayBuffer()), formats: ALL_FORMATS })
    const headerSeconds = await header.getDurationFromMetadata()
    header.dispose()
    expect(headerSeconds).toBeGreaterThan(1.5)
    expect(headerSeconds).toBeLessThan(5)
    await athleteContext.close()

    // Another athlete, in the other squad, picks a file.
    const trailContext = await signedIn(trailRunner.email, 'desktop')
    const trailPage = await trailContext.newPage()
    await trailPage.goto(`${running.stack.url}/reviews`)
    await trailPage.getByLabel('Or pick a video file').setInputFiles(demoClip.path)
    await trailPage.getByRole('button', { name: 'Send for review' }).click()
    await trailPage.waitForURL(/\/reviews\/\d+$/, { timeout: 30_000 })
    await trailContext.close()

    // The coach's navigation counts both; the queue narrows to the road squad and keeps it in the address.
    const coachContext = await signedIn(team.email, 'desktop')
    const coachPage = await coachContext.newPage()
    await coachPage.goto(`${running.stack.url}/team`)
    const reviewsLink = coachPage.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: /Reviews/ })
    await expect.poll(() => reviewsLink.textContent()).toMatch(/2\s*, 2 clips waiting for an answer/)
    await reviewsLink.click()
    await coachPage.getByRole('heading', { name: 'Clips to review (2 open)' }).waitFor()
    await coachPage.getByLabel('Squad').selectOption({ label: 'Road' })
    await coachPage.waitForURL(new RegExp(`[?&]squad=${road.data.id}`))
    await coachPage.getByRole('heading', { name: 'Clips to review (1 open)' }).waitFor()
    await coachPage.reload()
    await expect.poll(() => coachPage.getByLabel('Squad').inputValue()).toBe(String(road.data.id))
    const queue = coachPage.getByTestId('review-queue').getByRole('link')
    await expect.poll(() => queue.allTextContents()).toEqual([expect.stringContaining('Cai Penhallow')])

    // The recorded clip says how long it is and can be sought, so a comment can land at a moment in it.
    await queue.first().click()
    await coachPage.waitForURL(/\/reviews\/\d+$/)
    const seen = await coachPage.getByTestId('review-clip').evaluate((element: HTMLVideoElement) => new Promise<{ duration: number, at: number }>((resolve) => {
      const go = () => {
        element.addEventListener('seeked', () => resolve({ duration: element.duration, at: element.currentTime }), { once: true })
        element.currentTime = 1
      }
      if (element.readyState >= 1) go()
      else element.addEventListener('loadedmetadata', go, { once: true })
    }))
    expect(seen.duration).toBeGreaterThan(1.5)
    expect(seen.duration).toBeLessThan(5)
    expect(seen.at).toBeCloseTo(1, 1)

    // The coach records a reply with the fake camera; sending it answers the review and the count drops.
    await coachPage.getByRole('button', { name: 'Record with the camera' }).click()
    await coachPage.getByRole('timer').filter({ hasText: /Recording 0:0[2-9] of 1:00/ }).waitFor()
    await coachPage.getByRole('button', { name: 'Stop recording' }).click()
    await coachPage.getByRole('button', { name: 'Send the reply clip' }).click()
    await coachPage.getByLabel('The coach\'s reply clip').waitFor({ timeout: 30_000 })
    await expect.poll(() => reviewsLink.textContent()).toMatch(/1\s*, 1 clip waiting for an answer/)
    const answered = await reviewOf(coachContext, coachPage.url())
    expect(answered.status).toBe('answered')
    expect(answered.reply).not.toBeNull()
    await coachPage.screenshot({ path: screenshotPath('review-recorded-reply-desktop'), fullPage: true })
    await coachContext.close()

    // On a phone the folded menu's button carries the same count.
    const phoneContext = await signedIn(team.email, 'phone')
    const phonePage = await phoneContext.newPage()
    await phonePage.goto(`${running.stack.url}/team`)
    await expect.poll(() => phonePage.getByRole('button', { name: /Menu/ }).textContent()).toMatch(/1\s*, 1 waiting/)

    // The head coach sets how long clips are kept, on the team screen.
    const keep = phonePage.getByLabel('Keep form-review clips for (days)')
    await expect.poll(() => keep.inputValue()).toBe('180')
    await keep.fill('3')
    await phonePage.getByRole('button', { name: 'Save settings' }).click()
    await phonePage.getByRole('alert').filter({ hasText: 'Keep clips at least 7 days' }).waitFor()
    await keep.fill('90')
    await phonePage.getByRole('button', { name: 'Save settings' }).click()
    await phonePage.getByText('Team settings saved.').waitFor()
    const saved = await phoneContext.request.get(`${running.stack.url}/api/team`)
    expect((await saved.json() as { team: { reviewRetentionDays: number } }).team.reviewRetentionDays).toBe(90)
    await keep.scrollIntoViewIfNeeded()
    await phonePage.screenshot({ path: screenshotPath('team-review-retention-phone') })
    await phoneContext.close()
  })

  it('keeps "pick a file" where the camera is refused or the browser cannot record', async () => {
    const team = await registerCoach(running.stack)
    const athlete = await addAthlete(running.stack, team.coach)
    const context = await signedIn(athlete.email, 'phone')
    await context.addInitScript(() => {
      navigator.mediaDevices.getUserMedia = () => Promise.reject(new DOMException('Permission denied', 'NotAllowedError'))
    })
    const page = await context.newPage()
    await page.goto(`${running.stack.url}/reviews`)
    await page.getByRole('button', { name: 'Record with the camera' }).click()
    await page.getByRole('alert').filter({ hasText: 'The camera was not allowed' }).waitFor()
    await expect.poll(() => page.getByRole('button', { name: 'Record with the camera' }).count()).toBe(0)
    await page.getByLabel('Pick a video file').setInputFiles(demoClip.path)
    await page.getByRole('button', { name: 'Send for review' }).click()
    await page.waitForURL(/\/reviews\/\d+$/, { timeout: 30_000 })
    await context.close()

    const noRecorder = await signedIn(athlete.email, 'phone')
    await noRecorder.addInitScript(() => {
      delete (window as { MediaRecorder?: unknown }).MediaRecorder
    })
    const plain = await noRecorder.newPage()
    await plain.goto(`${running.stack.url}/reviews`)
    await plain.getByLabel('Pick a video file').waitFor()
    expect(await plain.getByRole('button', { name: 'Record with the camera' }).count()).toBe(0)
    await noRecorder.close()
  })
})
