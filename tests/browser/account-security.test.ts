import { describe, expect, it } from 'vitest'
import { newContext, signInThroughPage } from '../support/browser'
import { ApiClient } from '../support/client'
import { PASSWORD, registerCoach } from '../support/team'
import { useBrowserStack } from '../support/hooks'

const running = useBrowserStack()

describe('password and sign-in on the team page', () => {
  it('changes the password, signing out another device, then signs out everywhere', async () => {
    // Registering signs in one client, and another device signs in too: two other sessions.
    const { email } = await registerCoach(running.stack)
    const otherDevice = new ApiClient(running.stack.url)
    expect((await otherDevice.post('/api/auth/login', { email, password: PASSWORD })).status).toBe(200)

    const context = await newContext(running.browser, 'phone')
    const page = await signInThroughPage(context, running.stack.url, email)
    await page.waitForURL(/\/(coach|team)/)
    await page.goto(`${running.stack.url}/team`)
    // Wait for the page to come alive, so the form is sent by the app and not by the browser.
    await page.waitForLoadState('networkidle')
    await page.getByLabel('Current password').fill('not-my-password')
    await page.getByLabel('New password').fill('a-changed-password')
    await page.getByRole('button', { name: 'Change password' }).click()
    await page.getByText('This is not your current password').waitFor()
    await page.getByLabel('Current password').fill(PASSWORD)
    // Leaving the field clears its old message first, so the button is where the click lands.
    await page.getByLabel('Current password').blur()
    await page.getByRole('button', { name: 'Change password' }).click()
    // Checking and hashing passwords takes a moment on a busy machine: wait for the answer itself.
    await expect.poll(async () => (await otherDevice.get('/api/me')).status, { timeout: 15_000 }).toBe(401)
    await page.getByText(/^Password changed./).waitFor()
    expect(await page.getByText(/^Password changed./).innerText()).toBe('Password changed. You were signed out on 2 other devices.')
    expect((await otherDevice.get('/api/me')).status).toBe(401)

    await page.getByRole('button', { name: 'Sign out on all devices' }).click()
    await page.waitForURL(/\/login/)
    await page.goto(`${running.stack.url}/team`)
    await page.waitForURL(/\/login/)
    await context.close()
  })
})
