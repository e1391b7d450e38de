import { mkdirSync } from 'node:fs'
import { join, resolve } from 'node:path'
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core'
import { uniqueEmail } from './client'
import { PASSWORD } from './team'

export const artifacts = resolve(import.meta.dirname, '../artifacts')

export const viewports = {
  phone: { width: 390, height: 844 },
  desktop: { width: 1280, height: 800 },
} as const

/**
 * Debian's Chromium through playwright-core (each launch gets a fresh, empty profile); no browser is downloaded.
 * `extraArgs` adds switches for one test file's browser only (a fake camera, say).
 */
export async function launchBrowser(extraArgs: string[] = []): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--autoplay-policy=no-user-gesture-required', ...extraArgs],
  })
}

/** Chromium switches for a camera and microphone that need no device and no prompt: a moving test picture and a tone. */
export const fakeCameraArgs = ['--use-fake-device-for-media-stream', '--use-fake-ui-for-media-stream']

export async function newContext(browser: Browser, size: keyof typeof viewports = 'desktop'): Promise<BrowserContext> {
  const context = await browser.newContext({ viewport: viewports[size], isMobile: size === 'phone', hasTouch: size === 'phone' })
  context.setDefaultTimeout(15_000)
  return context
}

export function screenshotPath(name: string) {
  mkdirSync(artifacts, { recursive: true })
  return join(artifacts, `${name}.png`)
}

/**
 * Waits until a sign-in, register, join or reset form has come alive: its button is enabled once the page's
 * script runs. Fill the fields after this — text typed before would be reset by the page's own state.
 */
export async function waitForAuthForm(page: Page) {
  await page.locator('form[method="post"] button[type="submit"]:enabled').first().waitFor()
}

/**
 * Signs in through the sign-in page in a new tab of `context` and waits until the app has moved on
 * (to `next` when given).
 */
export async function signInThroughPage(context: BrowserContext, baseUrl: string, email: string, options: { password?: string, next?: string } = {}): Promise<Page> {
  const page = await context.newPage()
  await page.goto(`${baseUrl}/login${options.next ? `?next=${options.next}` : ''}`)
  await waitForAuthForm(page)
  await page.getByLabel('E-mail').fill(email)
  await page.getByLabel('Password').fill(options.password ?? PASSWORD)
  await page.getByRole('button', { name: 'Sign in' }).click()
  await page.waitForURL(url => (options.next ? url.pathname === options.next : !url.pathname.startsWith('/login')), { timeout: 30_000 })
  return page
}

/**
 * Signs `context` in through the sign-in route, without a page: its pages and requests then carry the
 * session cookie.
 */
export async function signInByRequest(context: BrowserContext, baseUrl: string, email: string, password = PASSWORD) {
  const response = await context.request.post(`${baseUrl}/api/auth/login`, { data: { email, password } })
  if (response.status() !== 200) throw new Error(`sign-in of ${email} answered ${response.status()}: ${await response.text()}`)
}

/** Fills the register form with a new coach and their team once it has come alive; the caller presses the button. */
export async function fillRegisterForm(page: Page, coach: { name: string, password: string, teamName: string, email?: string }) {
  await waitForAuthForm(page)
  await page.getByLabel('Your name').fill(coach.name)
  await page.getByLabel('E-mail').fill(coach.email ?? uniqueEmail('coach'))
  await page.getByLabel('Password').fill(coach.password)
  await page.getByLabel('Team or club name').fill(coach.teamName)
}

export interface StepTimings {
  /** The player's own record: when each step change was due and when it was shown. */
  timings: { index: number, scheduledAt: number, shownAt: number }[]
  /** When each step's name reached the page's DOM, noted independently of the player. */
  seen: { index: number, at: number }[]
}

/** Starts noting the moment each step's name reaches the page (call before starting the session). */
export async function watchStepChanges(page: Page) {
  await page.evaluate(() => {
    const seen: { index: number, at: number }[] = []
    ;(window as unknown as { seenChanges: typeof seen }).seenChanges = seen
    new MutationObserver(() => {
      const element = document.querySelector('[data-testid="current-step"]')
      const index = Number(element?.getAttribute('data-index'))
      if (element && seen.at(-1)?.index !== index) seen.push({ index, at: performance.now() })
    }).observe(document.body, { subtree: true, childList: true, attributes: true, attributeFilter: ['data-index'] })
  })
}

/** The player's step timings and the DOM's, after `watchStepChanges` and a finished session. */
export async function readStepTimings(page: Page): Promise<StepTimings> {
  return page.evaluate(() => ({
    timings: (window as unknown as { switchbackPlayer?: { timings: StepTimings['timings'] } }).switchbackPlayer?.timings ?? [],
    seen: (window as unknown as { seenChanges?: StepTimings['seen'] }).seenChanges ?? [],
  }))
}

/** A beep the player put on the audio clock (composables/useBeepSchedule.ts), as its test-only record shows it. */
export interface ScheduledBeepRecord {
  key: string
  kind: 'countdown' | 'change'
  /** Index of the segment whose end the beep belongs to, and that end on performance.now's line. */
  boundary: number
  boundaryAt: number
  /** Its start on the audio clock (s). */
  audioAt: number
  cancelled: boolean
  /** For a change beep: when it will be heard on performance.now's line, read again at its boundary. */
  heardAt?: number
}

/** Every beep the session runner scheduled so far (empty before it first ran). */
export async function readScheduledBeeps(page: Page): Promise<ScheduledBeepRecord[]> {
  return page.evaluate(() => JSON.parse(JSON.stringify((window as unknown as { switchbackBeeps?: unknown[] }).switchbackBeeps ?? [])))
}
