import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser } from 'playwright-core'
import { launchBrowser, newContext, screenshotPath, viewports, waitForAuthForm } from '../support/browser'
import { uniqueEmail } from '../support/client'
import { linkIn } from '../support/mail-catcher'
import { startStack, type Stack } from '../support/stack'

let stack: Stack
let browser: Browser

beforeAll(async () => {
  stack = await startStack()
  browser = await launchBrowser()
})

afterAll(async () => {
  await browser?.close()
  await stack?.stop()
})

describe.each(Object.keys(viewports) as (keyof typeof viewports)[])('onboarding at %s width', (size) => {
  it('a coach registers and invites an athlete, who joins from the e-mailed link and lands on their home page', async () => {
    const coachContext = await newContext(browser, size)
    const coach = await coachContext.newPage()
    await coach.goto(`${stack.url}/register`)
    await waitForAuthForm(coach)
    await coach.getByLabel('Your name').fill('Morwen Tay')
    await coach.getByLabel('E-mail').fill(uniqueEmail('coach'))
    await coach.getByLabel('Password').fill('short')
    await coach.getByLabel('Team or club name').fill('Larchford Ridge Runners')
    await coach.getByRole('button', { name: 'Create team' }).click()
    // The shared schema catches the weak password before anything is sent.
    await expect.poll(() => coach.getByText('Use at least 10 characters').isVisible()).toBe(true)
    await coach.getByLabel('Password').fill('a-good-long-password')
    await coach.getByRole('button', { name: 'Create team' }).click()
    await coach.waitForURL(/\/team$/)
    await coach.getByRole('heading', { name: 'Larchford Ridge Runners' }).waitFor()

    const athleteEmail = uniqueEmail('athlete')
    await coach.getByLabel('Their e-mail').fill(athleteEmail)
    await coach.getByLabel('Joins as').selectOption('athlete')
    await coach.getByRole('button', { name: 'Send invitation' }).click()
    await coach.getByText(`Invitation sent to ${athleteEmail}`).waitFor()
    await coach.getByText('Waiting to join').waitFor()
    await coach.getByText(athleteEmail, { exact: true }).first().waitFor()
    await coach.screenshot({ path: screenshotPath(`onboarding-team-${size}`), fullPage: true })

    const mail = await stack.mail.waitFor(athleteEmail, /invited you/)
    const link = linkIn(mail, /http:\/\/127\.0\.0\.1:\d+\/join\/[\w-]+/)

    const athleteContext = await newContext(browser, size)
    const athlete = await athleteContext.newPage()
    await athlete.goto(link)
    await athlete.getByRole('heading', { name: 'Join Larchford Ridge Runners' }).waitFor()
    await waitForAuthForm(athlete)
    await athlete.getByLabel('Your name').fill('Tamsin Rook')
    await athlete.getByLabel('Password').fill('tamsins-own-password')
    await athlete.keyboard.press('Enter')
    await athlete.waitForURL(/\/today$/)
    await athlete.getByRole('heading', { name: 'Today', exact: true }).waitFor()
    expect(await athlete.getByText('Hello Tamsin Rook').isVisible()).toBe(true)
    // Athletes are kept out of coach pages.
    await athlete.goto(`${stack.url}/team`)
    await athlete.waitForURL(/\/today$/)
    await athlete.screenshot({ path: screenshotPath(`onboarding-athlete-${size}`), fullPage: true })

    await coachContext.close()
    await athleteContext.close()
  })
})
