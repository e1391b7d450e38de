import { describe, expect, it } from 'vitest'
import { newContext, screenshotPath, viewports, waitForAuthForm, fillRegisterForm } from '../support/browser'
import { uniqueEmail } from '../support/client'
import { linkIn } from '../support/mail-catcher'
import { useBrowserStack } from '../support/hooks'

const running = useBrowserStack()

describe.each(Object.keys(viewports) as (keyof typeof viewports)[])('onboarding at %s width', (size) => {
  it('a coach registers and invites an athlete, who joins from the e-mailed link and lands on their home page', async () => {
    const coachContext = await newContext(running.browser, size)
    const coach = await coachContext.newPage()
    await coach.goto(`${running.stack.url}/register`)
    await fillRegisterForm(coach, { name: 'Morwen Tay', password: 'short', teamName: 'Larchford Ridge Runners' })
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

    const mail = await running.stack.mail.waitFor(athleteEmail, /invited you/)
    const link = linkIn(mail, /http:\/\/127\.0\.0\.1:\d+\/join\/[\w-]+/)

    const athleteContext = await newContext(running.browser, size)
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
    await athlete.goto(`${running.stack.url}/team`)
    await athlete.waitForURL(/\/today$/)
    await athlete.screenshot({ path: screenshotPath(`onboarding-athlete-${size}`), fullPage: true })

    await coachContext.close()
    await athleteContext.close()
  })
})
