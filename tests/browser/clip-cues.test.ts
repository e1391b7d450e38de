import { describe, expect, it } from 'vitest'
import type { BrowserContext, Locator } from 'playwright-core'
import { useBrowserStack, useDemoClipFile } from '../support/hooks'
import { newContext, screenshotPath, signInByRequest } from '../support/browser'
import { addAthlete, registerCoach } from '../support/team'
import type { ClipCue } from '../../types/api'

const running = useBrowserStack()
const demoClip = useDemoClipFile('a-skip-demo.webm', { seconds: 4, framesPerSecond: 12, motion: 'bounce' })

function signIn(context: BrowserContext, email: string) {
  return signInByRequest(context, running.stack.url, email)
}

/** Seeks the video and waits until it has got there. */
function seek(video: Locator, seconds: number) {
  return video.evaluate((element: HTMLVideoElement, to: number) => new Promise<void>((resolve, reject) => {
    const go = () => {
      element.pause()
      element.addEventListener('seeked', () => resolve(), { once: true })
      element.currentTime = to
    }
    if (element.readyState >= 1) go()
    else element.addEventListener('loadedmetadata', go, { once: true })
    element.addEventListener('error', () => reject(new Error(element.error?.message ?? 'video error')), { once: true })
  }), seconds)
}

describe('cues pinned to moments of a clip', () => {
  it('a coach uploads a clip and pins two cues; the athlete sees each caption at its moment in the player', async () => {
    const team = await registerCoach(running.stack)
    const created = await team.coach.post<{ id: number }>('/api/exercises', {
      name: 'A-skips',
      category: 'strength',
      cues: ['Knee drives up here', 'Heel stays down now'],
    })
    expect(created.status).toBe(201)
    const exerciseId = created.data.id

    const coachContext = await newContext(running.browser, 'desktop')
    await signIn(coachContext, team.email)
    const page = await coachContext.newPage()
    await page.goto(`${running.stack.url}/exercises/${exerciseId}`)
    await page.getByRole('heading', { name: 'A-skips' }).first().waitFor()
    await page.getByTestId('clip-file').setInputFiles(demoClip.path)
    await page.getByText(/Clip uploaded and checked/).waitFor({ timeout: 30_000 })
    // Mark the player the coach sees now: the poster arriving later must not replace it (it could be playing).
    await page.getByTestId('exercise-clip').evaluate((element: HTMLVideoElement) => {
      element.dataset.firstPlayer = 'yes'
    })
    // A poster frame is taken from the clip in the browser and stored beside it.
    await page.getByText('A poster frame from the clip was saved.').waitFor({ timeout: 30_000 })
    const firstPlayer = page.locator('[data-testid="exercise-clip"][data-first-player="yes"]')
    await expect.poll(() => firstPlayer.getAttribute('poster')).toMatch(/\S/)
    const details = page.getByTestId('clip-details')
    await expect.poll(() => details.textContent()).toMatch(/WEBM · .* · 4\.0 s · 320×180 · with poster image/)
    const playback = await team.coach.get<{ posterUrl: string | null }>(`/api/exercises/${exerciseId}/clip`)
    expect(playback.data.posterUrl).toBeTruthy()
    const poster = await fetch(playback.data.posterUrl!)
    expect(poster.headers.get('content-type')).toBe('image/jpeg')

    const video = page.getByTestId('exercise-clip')
    await video.scrollIntoViewIfNeeded()
    await seek(video, 1)
    await page.getByRole('button', { name: 'Pause and pin a cue at 0:01.0' }).click()
    await page.getByLabel('What to say').fill('Knee drives up here')
    await page.getByRole('button', { name: 'Pin cue' }).click()
    await page.getByTestId('cue-list').getByText('Knee drives up here').waitFor()

    await seek(video, 2.5)
    await page.getByRole('button', { name: 'Pause and pin a cue at 0:02.5' }).click()
    await page.getByLabel('What to say').fill('Heel stays down now')
    await page.getByLabel('Ends at (seconds, optional)').fill('3.5')
    await page.getByRole('button', { name: 'Pin cue' }).click()
    await page.getByTestId('cue-list').getByText('Heel stays down now').waitFor()

    // Nudge the first cue by keyboard: two steps of 0.1 s later, then one back.
    const marker = page.getByRole('slider', { name: 'Cue 1: Knee drives up here' })
    await marker.focus()
    await page.keyboard.press('ArrowRight')
    await expect.poll(() => marker.getAttribute('aria-valuenow')).toBe('1.1')
    await page.keyboard.press('ArrowRight')
    await expect.poll(() => marker.getAttribute('aria-valuenow')).toBe('1.2')
    await page.keyboard.press('ArrowLeft')
    await expect.poll(() => marker.getAttribute('aria-valuenow')).toBe('1.1')
    await page.screenshot({ path: screenshotPath('clip-cues-desktop'), fullPage: true })
    const saved = await team.coach.get<ClipCue[]>(`/api/exercises/${exerciseId}/cues`)
    expect(saved.data.map(cue => [cue.startSeconds, cue.endSeconds, cue.text])).toEqual([
      [1.1, null, 'Knee drives up here'],
      [2.5, 3.5, 'Heel stays down now'],
    ])
    await coachContext.close()

    // The athlete, in the session player's clip panel.
    const athlete = await addAthlete(running.stack, team.coach, { name: 'Ffion Aske' })
    const exercise = { id: exerciseId, name: 'A-skips', category: 'strength' as const, summary: '', cues: ['Knee drives up here', 'Heel stays down now'], equipment: [], cautions: [] }
    const { id: assignmentId } = await running.fixtures.assignment(team.teamId, athlete.userId, {
      title: 'Thursday drills',
      category: 'strength',
      description: '',
      exercises: [exercise],
      steps: [{ id: 'skips', type: 'block', kind: 'work', exerciseId, measure: { by: 'time', seconds: 600 } }],
    })
    const athleteContext = await newContext(running.browser, 'phone')
    await signIn(athleteContext, athlete.email)
    const player = await athleteContext.newPage()
    await player.goto(`${running.stack.url}/session/${assignmentId}`)
    await player.getByRole('checkbox', { name: /I have read the cautions/ }).check()
    await player.getByRole('button', { name: 'Start session' }).click()
    await player.getByRole('button', { name: 'Cues and demo clip' }).click()
    const panel = player.getByRole('dialog', { name: 'A-skips' })
    const clip = panel.getByTestId('exercise-clip')
    await clip.waitFor()
    await seek(clip, 0.2)
    const activeCues = () => clip.evaluate((element: HTMLVideoElement) => {
      const track = element.textTracks[0]
      return track ? { mode: track.mode, active: Array.from(track.activeCues ?? [], cue => (cue as VTTCue).text), time: element.currentTime } : null
    })
    await expect.poll(async () => (await activeCues())?.mode).toBe('showing')
    expect((await activeCues())!.active).toEqual([])

    // Play from just before the first cue: its caption appears at its moment, then the second one.
    await clip.evaluate((element: HTMLVideoElement) => {
      element.muted = true
      element.currentTime = 0.8
      return element.play()
    })
    await expect.poll(async () => (await activeCues())?.active, { timeout: 10_000, interval: 50 }).toEqual(['Knee drives up here'])
    const whenFirst = await activeCues()
    expect(whenFirst!.time).toBeGreaterThanOrEqual(1.1)
    expect(whenFirst!.time).toBeLessThan(2.5)
    await expect.poll(async () => (await activeCues())?.active, { timeout: 10_000, interval: 50 }).toEqual(['Heel stays down now'])
    const whenSecond = await activeCues()
    expect(whenSecond!.time).toBeGreaterThanOrEqual(2.5)
    expect(whenSecond!.time).toBeLessThan(3.5)
    await player.screenshot({ path: screenshotPath('clip-cues-player-phone'), fullPage: true })

    // The athlete can turn the captions off; the track stays loaded (hidden) for spoken cues.
    await panel.getByRole('button', { name: 'Captions on' }).click()
    await expect.poll(async () => (await activeCues())?.mode).toBe('hidden')
    await panel.getByRole('button', { name: 'Captions off' }).waitFor()
    await athleteContext.close()
  })
})
