import type { BrowserContext } from 'playwright-core'
import { describe, expect, it } from 'vitest'
import { addDays, startOfWeek, todayIn } from '../../shared/utils/dates'
import { newContext, signInThroughPage, screenshotPath, viewports, waitForAuthForm, fillRegisterForm } from '../support/browser'
import { ApiClient, uniqueEmail } from '../support/client'
import { linkIn } from '../support/mail-catcher'
import { hillSteps, insertRoutine } from '../support/planner'
import { addAthlete, PASSWORD, registerCoach } from '../support/team'
import { useBrowserStack } from '../support/hooks'

const running = useBrowserStack()

async function signIn(context: BrowserContext, email: string) {
  return signInThroughPage(context, running.stack.url, email)
}

describe('a new club in Chromium', () => {
  it('the front page offers to start a club; the club starts with the starter set, invites an athlete who answers the first-visit questions and sees a session', async () => {
    const coachContext = await newContext(running.browser, 'desktop')
    const coach = await coachContext.newPage()
    await coach.goto(running.stack.url)
    await coach.getByRole('heading', { name: 'The work around the running, planned and done.' }).waitFor()
    expect(await coach.locator('img').count()).toBe(0)
    await coach.getByRole('link', { name: 'Start a club' }).first().click()
    await coach.waitForURL(/\/register$/)
    await fillRegisterForm(coach, { name: 'Morwen Tay', password: 'a-good-long-password', teamName: 'Larchford Ridge Runners', email: uniqueEmail('club') })
    expect(await coach.getByLabel('Empty').isChecked()).toBe(true)
    await coach.getByLabel('With the starter set').check()
    await coach.getByRole('button', { name: 'Create team' }).click()
    await coach.waitForURL(/\/team$/)

    await coach.goto(`${running.stack.url}/exercises?q=calf`)
    await coach.getByRole('link', { name: 'Single-leg calf raise' }).first().waitFor()
    await coach.getByText('Starter set', { exact: true }).click()
    await coach.getByRole('button', { name: 'Add the starter set' }).click()
    await coach.getByText('Your team already has the whole starter set.').waitFor()

    await coach.goto(`${running.stack.url}/team`)
    const athleteEmail = uniqueEmail('athlete')
    await coach.getByLabel('Their e-mail').fill(athleteEmail)
    await coach.getByLabel('Joins as').selectOption('athlete')
    await coach.getByRole('button', { name: 'Send invitation' }).click()
    await coach.getByText(`Invitation sent to ${athleteEmail}`).waitFor()

    // The coach's home lists the invitation and the checklist's progress.
    await coach.goto(`${running.stack.url}/coach`)
    await coach.getByRole('heading', { name: /Getting the club started \(3 of 6\)/ }).waitFor()
    await coach.getByRole('link', { name: athleteEmail }).waitFor()

    const mail = await running.stack.mail.waitFor(athleteEmail, /invited you/)
    const athleteContext = await newContext(running.browser, 'phone')
    const athlete = await athleteContext.newPage()
    await athlete.goto(linkIn(mail, /http:\/\/127\.0\.0\.1:\d+\/join\/[\w-]+/))
    await waitForAuthForm(athlete)
    await athlete.getByLabel('Your name').fill('Tamsin Rook')
    await athlete.getByLabel('Password').fill('tamsins-own-password')
    await athlete.keyboard.press('Enter')
    await athlete.waitForURL(/\/today$/)

    // The coach plans a starter routine for today through the planner's route.
    const athletes = await coach.request.get(`${running.stack.url}/api/planner/options`)
    const options = await athletes.json() as { routines: { id: number, title: string }[], athletes: { id: number }[] }
    const routine = options.routines.find(item => item.title.startsWith('Short hills'))!
    const planned = await coach.request.post(`${running.stack.url}/api/assignments`, { data: { routineId: routine.id, athleteIds: [options.athletes[0]!.id], dates: [todayIn('UTC')] } })
    expect(planned.status()).toBe(201)

    await athlete.reload()
    await athlete.getByRole('heading', { name: 'Before your first session' }).waitFor()
    await athlete.getByLabel('Distance').selectOption({ label: '5 km' })
    await athlete.getByLabel('Time (h:mm:ss or mm:ss)').fill('24:30')
    await athlete.getByLabel('Miles').check()
    await athlete.getByLabel('Your time zone').fill('UTC')
    await athlete.getByLabel('Where').selectOption({ label: 'Knee' })
    await athlete.screenshot({ path: screenshotPath('club-first-visit-phone'), fullPage: true })
    await athlete.getByRole('button', { name: 'Save my answers' }).click()
    await athlete.getByRole('heading', { name: 'Before your first session' }).waitFor({ state: 'detached' })
    await athlete.getByText(routine.title).first().waitFor()

    const profile = await athlete.request.get(`${running.stack.url}/api/me/profile`)
    const saved = await profile.json() as { profile: { benchmarkDistanceM: number, benchmarkTimeS: number, units: string }, injuryNotes: { bodyArea: string }[] }
    expect(saved.profile).toMatchObject({ benchmarkDistanceM: 5000, benchmarkTimeS: 1470, units: 'mi' })
    expect(saved.injuryNotes.map(note => note.bodyArea)).toEqual(['knee'])
    await coachContext.close()
    await athleteContext.close()
  })

  it('the coach\'s home lists a new pain flag, newest first, and takes a reply', async () => {
    const team = await registerCoach(running.stack, 'Pain Flag Harriers')
    const { userId } = await addAthlete(running.stack, team.coach, { name: 'Wren Calder' })
    const db = running.db
    const routineId = await insertRoutine(db, team.teamId, { title: 'Downhill strides' })
    const today = todayIn('UTC')
    const assignment = await db.execute({ sql: 'insert into assignments (team_id, athlete_id, routine_id, routine_version, snapshot, date, status) values (?, ?, ?, 1, ?, ?, \'done\') returning id', args: [team.teamId, userId, routineId, JSON.stringify({ title: 'Downhill strides', category: 'hills', description: '', steps: hillSteps(), exercises: [] }), today] })
    const session = await db.execute({ sql: 'insert into session_logs (team_id, assignment_id, athlete_id, client_id, started_at, finished_at, day, duration_s, session_rpe, load, pain, pain_area) values (?, ?, ?, ?, ?, ?, ?, 1800, 6, 180, 7, \'shin\') returning id', args: [team.teamId, Number(assignment.rows[0]!.id), userId, 'browser-pain', Date.now() - 3_600_000, Date.now(), today] })
    await db.execute({ sql: 'insert into pain_flags (team_id, athlete_id, session_id, pain, area, reason) values (?, ?, ?, 7, \'shin\', \'high_pain\')', args: [team.teamId, userId, Number(session.rows[0]!.id)] })

    const context = await newContext(running.browser, 'phone')
    const page = await signIn(context, team.email)
    await page.goto(`${running.stack.url}/coach`)
    await page.getByRole('heading', { name: 'Open pain flags (1)' }).waitFor()
    const flag = page.getByRole('article', { name: /Pain flag: Wren Calder, Shin/ })
    await flag.waitFor()
    await page.getByRole('heading', { name: 'Yesterday and today' }).waitFor()
    await page.getByText('Trained').first().waitFor()
    await page.screenshot({ path: screenshotPath('club-coach-home-phone'), fullPage: true })
    await flag.getByLabel('Reply to Wren Calder (optional)').fill('Rest the shin two days and see the physio if it still hurts.')
    await flag.getByRole('button', { name: 'Acknowledge' }).click()
    await page.getByRole('heading', { name: 'Open pain flags (0)' }).waitFor()
    await context.close()
  })
})

describe('a coach of two teams in Chromium', () => {
  it('switches team from the header, sees only the chosen team\'s athletes, and keeps the choice across a reload', async () => {
    const north = await registerCoach(running.stack, 'North Ridge Runners')
    const south = await registerCoach(running.stack, 'South Ridge Runners')
    const cai = await addAthlete(running.stack, north.coach, { name: 'Cai Penhallow' })
    const juno = await addAthlete(running.stack, south.coach, { name: 'Juno Halloway' })
    // One coach joins both teams from the e-mailed invitations, with one account.
    const email = uniqueEmail('twoteams')
    for (const [index, team] of [north, south].entries()) {
      expect((await team.coach.post('/api/invites', { email, role: 'coach' })).status).toBe(201)
      const mail = await running.stack.mail.waitFor(email, index === 0 ? /North Ridge/ : /South Ridge/)
      const token = linkIn(mail, /\/join\/[\w-]+/).split('/').pop()!
      const accepted = await new ApiClient(running.stack.url).post(`/api/invites/${token}/accept`, { name: 'Idris Fenn', password: PASSWORD })
      expect(accepted.status).toBe(201)
    }
    // An open pain flag in each team, so each coach's home shows its own athlete.
    const db = running.db
    const today = todayIn('UTC')
    for (const [team, athleteId, title] of [[north, cai.userId, 'Ridge hill reps'], [south, juno.userId, 'Valley strides']] as const) {
      const routineId = await insertRoutine(db, team.teamId, { title })
      const assignment = await db.execute({ sql: 'insert into assignments (team_id, athlete_id, routine_id, routine_version, snapshot, date, status) values (?, ?, ?, 1, ?, ?, \'done\') returning id', args: [team.teamId, athleteId, routineId, JSON.stringify({ title, category: 'hills', description: '', steps: hillSteps(), exercises: [] }), today] })
      const session = await db.execute({ sql: 'insert into session_logs (team_id, assignment_id, athlete_id, client_id, started_at, finished_at, day, duration_s, session_rpe, load, pain, pain_area) values (?, ?, ?, ?, ?, ?, ?, 1800, 6, 180, 6, \'knee\') returning id', args: [team.teamId, Number(assignment.rows[0]!.id), athleteId, `switch-${athleteId}`, Date.now() - 3_600_000, Date.now(), today] })
      await db.execute({ sql: 'insert into pain_flags (team_id, athlete_id, session_id, pain, area, reason) values (?, ?, ?, 6, \'knee\', \'high_pain\')', args: [team.teamId, athleteId, Number(session.rows[0]!.id)] })
    }

    const context = await newContext(running.browser, 'desktop')
    const page = await signIn(context, email)
    await page.goto(`${running.stack.url}/coach`)
    // Signing in picks the newest membership: the south team.
    await page.getByRole('heading', { level: 1, name: 'South Ridge Runners' }).waitFor()
    await page.getByRole('article', { name: /Pain flag: Juno Halloway/ }).waitFor()
    expect(await page.getByText('Cai Penhallow').count()).toBe(0)
    const switcher = page.getByRole('combobox', { name: 'Team', exact: true })
    expect(await switcher.locator('option').allTextContents()).toEqual(['South Ridge Runners', 'North Ridge Runners'])

    await switcher.selectOption({ label: 'North Ridge Runners' })
    await page.getByRole('heading', { level: 1, name: 'North Ridge Runners' }).waitFor()
    await page.getByRole('article', { name: /Pain flag: Cai Penhallow/ }).waitFor()
    expect(await page.getByText('Juno Halloway').count()).toBe(0)
    await page.screenshot({ path: screenshotPath('club-team-switcher-desktop'), fullPage: false })

    // The choice stays across a reload, and every page follows it.
    await page.reload()
    await page.getByRole('heading', { level: 1, name: 'North Ridge Runners' }).waitFor()
    expect(await page.getByRole('combobox', { name: 'Team', exact: true }).inputValue()).toBe(String(north.teamId))
    await page.goto(`${running.stack.url}/insights`)
    await page.getByText('Cai Penhallow').first().waitFor()
    expect(await page.getByText('Juno Halloway').count()).toBe(0)

    // At phone width the switcher is in the header too; switching back shows the south team's athlete only.
    await page.setViewportSize(viewports.phone)
    await page.getByRole('combobox', { name: 'Team', exact: true }).selectOption({ label: 'South Ridge Runners' })
    await page.getByRole('heading', { level: 1, name: 'South Ridge Runners' }).waitFor()
    await page.getByRole('article', { name: /Pain flag: Juno Halloway/ }).waitFor()
    expect(await page.getByText('Cai Penhallow').count()).toBe(0)
    await context.close()
  })
})

describe.each(Object.keys(viewports) as (keyof typeof viewports)[])('the planner grid with 80 athletes at %s width', (size) => {
  it('shows the squads, renders only the rows in view, and moves a session', async () => {
    const team = await registerCoach(running.stack, `Big Squad Club ${size}`)
    const db = running.db
    const monday = startOfWeek(todayIn('UTC'))
    // 80 athletes in two squads, written straight into the test database (the subject is the grid, not invitations).
    const squadIds: number[] = []
    for (const name of ['Road squad', 'Trail squad']) {
      const squad = await db.execute({ sql: 'insert into squads (team_id, name) values (?, ?) returning id', args: [team.teamId, name] })
      squadIds.push(Number(squad.rows[0]!.id))
    }
    const routineId = await insertRoutine(db, team.teamId, { title: 'Hill reps' })
    const snapshot = JSON.stringify({ title: 'Hill reps', category: 'hills', description: '', steps: hillSteps(), exercises: [] })
    const people = await db.batch(Array.from({ length: 80 }, (_, index) => ({
      sql: 'insert into users (email, name, password_hash) values (?, ?, ?) returning id',
      args: [uniqueEmail('grid'), `Runner ${String(index + 1).padStart(2, '0')}`, 'not-a-real-hash'],
    })), 'write')
    const athleteIds = people.map(result => Number(result.rows[0]!.id))
    await db.batch(athleteIds.flatMap((id, index) => [
      { sql: 'insert into memberships (team_id, user_id, role) values (?, ?, \'athlete\')', args: [team.teamId, id] },
      { sql: 'insert into squad_members (squad_id, user_id) values (?, ?)', args: [squadIds[index % 2]!, id] },
      { sql: 'insert into assignments (team_id, athlete_id, routine_id, routine_version, snapshot, date) values (?, ?, ?, 1, ?, ?)', args: [team.teamId, id, routineId, snapshot, addDays(monday, 7 + (index % 5))] },
    ]), 'write')
    const [first] = (await db.execute({ sql: 'select id, date from assignments where athlete_id = ?', args: [athleteIds[0]!] })).rows as unknown as { id: number, date: string }[]

    const context = await newContext(running.browser, size)
    const page = await signIn(context, team.email)
    await page.goto(`${running.stack.url}/planner?view=grid&date=${monday}`)
    const grid = page.locator('[data-planner-grid]')
    await grid.waitFor()
    await page.getByText('80 athletes shown').waitFor()
    await page.getByRole('rowheader', { name: 'Road squad (40)' }).waitFor()
    // Only the rows in view (and a few either side) are in the page.
    const rendered = await grid.getByRole('rowheader').count()
    expect(rendered).toBeGreaterThan(3)
    expect(rendered).toBeLessThan(60)

    const chip = grid.locator(`[data-grid-assignment="${first!.id}"]`)
    await chip.waitFor()
    await page.screenshot({ path: screenshotPath(`club-planner-grid-${size}`), fullPage: false })
    if (size === 'desktop') {
      // Drag to the next day in the same row.
      const target = grid.locator(`[data-athlete-id="${athleteIds[0]}"][data-day="${addDays(String(first!.date), 1)}"]`)
      await chip.dragTo(target)
    }
    else {
      await chip.focus()
      await page.keyboard.press('Alt+ArrowRight')
    }
    await page.getByText(new RegExp(`Moved Hill reps to Runner 01`)).waitFor()
    const [moved] = (await db.execute({ sql: 'select date, athlete_id from assignments where id = ?', args: [first!.id] })).rows as unknown as { date: string, athlete_id: number }[]
    expect(moved).toMatchObject({ date: addDays(String(first!.date), 1), athlete_id: athleteIds[0] })

    // Down a row with the keyboard: the session changes hands to the next athlete in the squad.
    await grid.locator(`[data-grid-assignment="${first!.id}"]`).focus()
    await page.keyboard.press('Alt+ArrowDown')
    await page.getByText(/Moved Hill reps to Runner 03/).waitFor()
    const [handed] = (await db.execute({ sql: 'select athlete_id from assignments where id = ?', args: [first!.id] })).rows as unknown as { athlete_id: number }[]
    expect(Number(handed!.athlete_id)).toBe(athleteIds[2])
    await context.close()
  })
})
