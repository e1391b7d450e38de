import { describe, expect, it } from 'vitest'
import { useBrowserStack, useDemoClipFile } from '../support/hooks'
import { newContext, screenshotPath, viewports, fillRegisterForm } from '../support/browser'

const running = useBrowserStack()
const demoClip = useDemoClipFile('hill-sprint-demo.webm', { seconds: 3, motion: 'climb' })

describe.each(Object.keys(viewports) as (keyof typeof viewports)[])('exercise clip at %s width', (size) => {
  it('a coach creates an exercise, uploads a clip with a progress bar and plays it back', async () => {
    const context = await newContext(running.browser, size)
    const page = await context.newPage()
    await page.goto(`${running.stack.url}/register`)
    await fillRegisterForm(page, { name: 'Idris Fenn', password: 'a-good-long-password', teamName: 'Larchford Ridge Runners' })
    await page.getByRole('button', { name: 'Create team' }).click()
    await page.waitForURL(/\/team$/)

    await page.goto(`${running.stack.url}/exercises/new`)
    await page.getByRole('heading', { name: 'New exercise' }).waitFor()
    // The shared schema answers before anything is sent.
    await page.getByRole('button', { name: 'Save exercise' }).click()
    await page.getByText('Name is required').waitFor()
    await page.getByLabel('Name').fill('Short hill sprints')
    await page.getByLabel('Category').selectOption('hill')
    await page.getByLabel('Summary').fill('Eight-second sprints up a steep hill, walking back down.')
    await page.getByRole('button', { name: 'Add a cue' }).click()
    await page.getByLabel('Cue 1', { exact: true }).fill('Stay tall')
    await page.getByRole('button', { name: 'Add a cue' }).click()
    await page.getByLabel('Cue 2', { exact: true }).fill('Drive the knees')
    await page.getByRole('button', { name: 'Move cue 2 up' }).click()
    expect(await page.getByLabel('Cue 1', { exact: true }).inputValue()).toBe('Drive the knees')
    await page.getByLabel('Add equipment').fill('Hill')
    await page.getByRole('button', { name: 'Add', exact: true }).click()
    await page.getByRole('button', { name: 'Add a caution' }).click()
    await page.getByLabel('Caution 1', { exact: true }).fill('Walk down: running the descent loads the knees.')
    await page.getByRole('checkbox', { name: 'Knee' }).check()
    await page.getByRole('button', { name: 'Save exercise' }).click()
    await page.waitForURL(/\/exercises\/\d+/)
    await page.getByRole('heading', { name: 'Short hill sprints' }).waitFor()
    const cues = await page.getByRole('region', { name: 'About this exercise' }).getByRole('listitem').allTextContents()
    expect(cues.slice(0, 2).map(cue => cue.trim())).toEqual(['Drive the knees', 'Stay tall'])
    await page.getByText('Concerns: Knee').waitFor()

    // Slow the upload down so the progress is there to see, as on a phone's mobile connection.
    const cdp = await context.newCDPSession(page)
    await cdp.send('Network.enable')
    await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 20, downloadThroughput: -1, uploadThroughput: 24 * 1024 })
    await page.getByTestId('clip-file').setInputFiles(demoClip.path)
    const progress = page.getByRole('progressbar', { name: 'Upload progress' })
    await progress.waitFor()
    await expect.poll(async () => Number(await progress.getAttribute('aria-valuenow')), { timeout: 30_000 }).toBeGreaterThan(0)
    await page.screenshot({ path: screenshotPath(`exercise-clip-uploading-${size}`), fullPage: true })
    await page.getByText(/Clip uploaded and checked/).waitFor({ timeout: 60_000 })
    await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: -1 })

    // The player asks for its playback URL once it is on screen.
    await page.getByRole('heading', { name: 'Demo clip' }).scrollIntoViewIfNeeded()
    const video = page.getByTestId('exercise-clip')
    await video.waitFor()
    const duration = await video.evaluate((element: HTMLVideoElement) => new Promise<number>((resolve, reject) => {
      if (element.readyState >= 1) resolve(element.duration)
      element.addEventListener('loadedmetadata', () => resolve(element.duration), { once: true })
      element.addEventListener('error', () => reject(new Error(element.error?.message ?? 'video error')), { once: true })
    }))
    expect(Number.isFinite(duration)).toBe(true)
    expect(duration).toBeGreaterThan(0)
    // Seeking needs range requests on the playback URL; then it plays from there.
    const played = await video.evaluate(async (element: HTMLVideoElement) => {
      element.muted = true
      element.currentTime = element.duration / 2
      await new Promise(resolve => element.addEventListener('seeked', resolve, { once: true }))
      const from = element.currentTime
      await element.play()
      await new Promise(resolve => element.addEventListener('timeupdate', resolve, { once: true }))
      element.pause()
      return { from, now: element.currentTime }
    })
    expect(played.from).toBeGreaterThan(0)
    expect(played.now).toBeGreaterThanOrEqual(played.from)
    await page.getByRole('button', { name: 'Replace clip' }).waitFor()
    await page.screenshot({ path: screenshotPath(`exercise-clip-${size}`), fullPage: true })

    await page.goto(`${running.stack.url}/exercises?hasClip=true`)
    const link = page.getByRole('link', { name: /Short hill sprints/ })
    await link.first().waitFor()
    expect(await link.filter({ visible: true }).count()).toBe(1)
    await page.screenshot({ path: screenshotPath(`exercise-library-${size}`), fullPage: true })
    await context.close()
  })
})
