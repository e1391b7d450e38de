import { mkdirSync } from 'node:fs'
import { join, resolve } from 'node:path'
import { chromium, type Browser, type BrowserContext } from 'playwright-core'

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
