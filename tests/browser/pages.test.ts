import { resolve } from 'node:path'
import { beforeAll, describe, expect, it } from 'vitest'
import type { BrowserContext, Page } from 'playwright-core'
import { newContext, screenshotPath, viewports, signInByRequest } from '../support/browser'
import { createRoutine, insertHistory, openTestDatabase } from '../support/insights-data'
import { linkIn } from '../support/mail-catcher'
import { hillSteps } from '../support/planner'
import { addAthlete, registerCoach } from '../support/team'
import { formatDate } from '../../shared/utils/date-format'
import { addDays, todayIn } from '../../shared/utils/dates'
import { useBrowserStack } from '../support/hooks'

// Every page, at a phone's width and a laptop's, signed out, as a coach and as an athlete.
// To cover a new page, add a row: `{path}` placeholders are filled from the team made in beforeAll.
type Who = 'nobody' | 'coach' | 'athlete'
interface PageVisit { path: string, as: Who }

const pages: PageVisit[] = [
  { path: '/', as: 'nobody' },
  { path: '/login', as: 'nobody' },
  { path: '/register', as: 'nobody' },
  { path: '/reset', as: 'nobody' },
  { path: '/join/{inviteToken}', as: 'nobody' },
  { path: '/coach', as: 'coach' },
  { path: '/exercises', as: 'coach' },
  { path: '/exercises/new', as: 'coach' },
  { path: '/exercises/{exerciseId}', as: 'coach' },
  { path: '/routines', as: 'coach' },
  { path: '/routines/new', as: 'coach' },
  { path: '/routines/{routineId}', as: 'coach' },
  { path: '/routines/{routineId}/print', as: 'coach' },
  { path: '/planner', as: 'coach' },
  { path: '/insights', as: 'coach' },
  { path: '/insights/athletes/{athleteId}', as: 'coach' },
  { path: '/team', as: 'coach' },
  { path: '/blocks', as: 'coach' },
  { path: '/blocks/new', as: 'coach' },
  { path: '/blocks/{blockId}', as: 'coach' },
  { path: '/reviews', as: 'coach' },
  { path: '/today', as: 'athlete' },
  { path: '/logbook', as: 'athlete' },
  { path: '/progress', as: 'athlete' },
  { path: '/profile', as: 'athlete' },
  { path: '/reviews', as: 'athlete' },
  { path: '/my-block/{blockId}', as: 'athlete' },
  { path: '/session/{assignmentId}', as: 'athlete' },
  { path: '/session/routine/{otherRoutineId}', as: 'athlete' },
]

const axeScript = resolve(import.meta.dirname, '../../node_modules/axe-core/axe.min.js')

const running = useBrowserStack()
const people: Partial<Record<Who, { email: string }>> = {}
const values: Record<string, string> = {}

beforeAll(async () => {
  const team = await registerCoach(running.stack, 'Larchford Ridge Runners with a rather long club name')
  people.coach = { email: team.email }
  const athlete = await addAthlete(running.stack, team.coach, { name: 'Ffion Aske-Penhallow' })
  people.athlete = { email: athlete.email }

  const exercise = await running.fixtures.exercise(team.teamId, {
    name: 'Hill bounds on the old quarry track',
    category: 'hill',
    summary: 'Long, springy strides up a gentle slope.',
    cues: ['Drive the knee forward', 'Land under the hips'],
    equipment: ['Cones'],
    cautions: [{ text: 'Walk back down to spare the knees', bodyAreas: ['knee'] }],
  })
  await running.fixtures.injuryNote(team.teamId, athlete.userId, 'knee', 'Aches on descents')
  const steps = hillSteps(exercise.id)
  const routineId = await running.fixtures.routine(team.teamId, { title: 'Ridge Lane hill reps with a long title that wraps', category: 'hills', steps: steps as never })
  const today = todayIn('UTC')
  const { id: assignmentId } = await running.fixtures.assignment(team.teamId, athlete.userId, {
    title: 'Ridge Lane hill reps with a long title that wraps',
    category: 'hills',
    description: 'Eight climbs of the lane',
    steps: steps as never,
    exercises: [exercise],
  }, { date: today, routineId })
  const otherRoutineId = await running.fixtures.routine(team.teamId, { title: 'Quarry strides', category: 'drills', steps: [] })

  const db = await openTestDatabase(running.stack.databaseUrl)
  const history = await createRoutine(db, team.teamId, 'Tuesday gym circuit')
  await insertHistory(db, {
    teamId: team.teamId,
    athleteId: athlete.userId,
    today,
    routine: history,
    days: [
      { daysAgo: 1, done: true, sessionRpe: 6, pain: 4, painArea: 'knee', note: 'Knee grumbled on the last set', sets: [{ kg: 40, reps: 8 }, { kg: 42.5, reps: 6 }] },
      { daysAgo: 3, done: true, sessionRpe: 5, sets: [{ kg: 40, reps: 8 }] },
      { daysAgo: 8, done: false },
      { daysAgo: -2, done: false },
    ],
  })

  // A block in its second week, planned, for the block pages.
  const block = await team.coach.post<{ id: number }>('/api/blocks', { name: 'Ridge Lane spring block', startDate: addDays(today, -7), weeks: 4, athleteIds: [athlete.userId], routines: [{ routineId, weekday: 3, rules: [] }] })
  if (block.status !== 201) throw new Error(`block: ${block.status} ${block.text}`)
  const planned = await team.coach.post(`/api/blocks/${block.data.id}/plan`)
  if (planned.status !== 200) throw new Error(`block plan: ${planned.status} ${planned.text}`)

  // A pending invite for the join page.
  const inviteEmail = `pending.${Date.now()}@example.test`
  await team.coach.post('/api/invites', { email: inviteEmail, role: 'athlete' })
  const mail = await running.stack.mail.waitFor(inviteEmail, /invited you/)
  Object.assign(values, {
    inviteToken: linkIn(mail, /\/join\/[\w-]+/).split('/').pop()!,
    exerciseId: String(exercise.id),
    routineId: String(routineId),
    otherRoutineId: String(otherRoutineId),
    athleteId: String(athlete.userId),
    assignmentId: String(assignmentId),
    blockId: String(block.data.id),
  })
})

const fill = (path: string) => path.replace(/\{(\w+)\}/g, (_, name: string) => {
  if (!values[name]) throw new Error(`No value for {${name}}`)
  return values[name]
})

const contexts = new Map<string, BrowserContext>()
async function contextFor(as: Who, size: keyof typeof viewports) {
  const key = `${as}-${size}`
  let context = contexts.get(key)
  if (!context) {
    context = await newContext(running.browser, size)
    const person = people[as as 'coach' | 'athlete']
    if (person) {
      await signInByRequest(context, running.stack.url, person.email)
    }
    contexts.set(key, context)
  }
  return context
}

interface AxeViolation { id: string, impact: string | null, help: string, nodes: { target: string[], failureSummary?: string }[] }

async function axeViolations(page: Page) {
  await page.addScriptTag({ path: axeScript })
  const violations = await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: (context: Document, options: object) => Promise<{ violations: AxeViolation[] }> } }).axe
    const result = await axe.run(document, { resultTypes: ['violations'] })
    return result.violations.map(v => ({ id: v.id, impact: v.impact, help: v.help, nodes: v.nodes.slice(0, 5).map(n => ({ target: n.target, failureSummary: n.failureSummary })) }))
  })
  return violations.filter(v => v.impact === 'serious' || v.impact === 'critical')
}

/**
 * Controls a thumb must hit, smaller than 44 × 44 CSS px. Links inside running text are exempt (WCAG 2.5.8's
 * inline exception), as are checkboxes and radios whose label around them is the target.
 */
async function smallTargets(page: Page) {
  return page.evaluate(() => {
    const found: string[] = []
    for (const element of document.querySelectorAll<HTMLElement>('a[href], button, select, input:not([type="hidden"]), textarea, summary, [role="button"]')) {
      const box = element.getBoundingClientRect()
      // Nothing to hit, or visually hidden on purpose (the skip link until focused, a styled file input).
      if (box.width <= 1 || box.height <= 1 || getComputedStyle(element).visibility === 'hidden') continue
      if (element.closest('[aria-hidden="true"], [inert]')) continue
      if (element.tagName === 'A' && getComputedStyle(element).display === 'inline') continue
      const label = element.closest('label')
      const target = label && ['checkbox', 'radio'].includes((element as HTMLInputElement).type) ? label.getBoundingClientRect() : box
      if (Math.round(target.width) < 44 || Math.round(target.height) < 44) {
        found.push(`${element.tagName.toLowerCase()} "${(element.getAttribute('aria-label') ?? element.textContent ?? '').trim().slice(0, 40)}" ${Math.round(target.width)}×${Math.round(target.height)}`)
      }
    }
    return found
  })
}

describe.each(Object.keys(viewports) as (keyof typeof viewports)[])('every page at %s width', (size) => {
  it.each(pages)('$path as $as', async ({ path, as }) => {
    const context = await contextFor(as, size)
    const page = await context.newPage()
    const problems: string[] = []
    page.on('console', async (message) => {
      const text = message.text()
      if (message.type() !== 'error' && !/hydrat/i.test(text)) return
      // Vue names the mismatching nodes as arguments: show their markup, not "JSHandle@node".
      const parts = await Promise.all(message.args().map(arg => arg.evaluate(value => (value instanceof Node ? (value instanceof Element ? value.outerHTML : `${JSON.stringify(value.textContent)} in ${value.parentElement?.outerHTML.slice(0, 300)}`)?.slice(0, 400) : String(value))).catch(() => '?')))
      problems.push(`console ${message.type()}: ${parts.join(' ') || text}`)
    })
    page.on('pageerror', error => problems.push(`page error: ${error.message}`))
    try {
      const url = fill(path)
      const response = await page.goto(`${running.stack.url}${url}`, { waitUntil: 'networkidle' })
      expect(response?.status(), `${url} answered ${response?.status()}`).toBeLessThan(400)
      await page.waitForFunction(() => Boolean((document.querySelector('#__nuxt') as { __vue_app__?: unknown } | null)?.__vue_app__))
      await page.waitForLoadState('networkidle')
      // Where the visit ended up (a signed-out visitor is sent to sign in) is part of what is checked.
      const overflow = await page.evaluate(() => ({ scroll: document.documentElement.scrollWidth, inner: window.innerWidth }))
      const slug = `${as}${path.replace(/[^\w]+/g, '-')}-${size}`
      await page.screenshot({ path: screenshotPath(`pages-${slug}`), fullPage: true })
      const violations = await axeViolations(page)
      const small = size === 'phone' ? await smallTargets(page) : []
      expect.soft(overflow.scroll, `page is ${overflow.scroll}px wide in a ${overflow.inner}px window`).toBeLessThanOrEqual(overflow.inner)
      expect.soft(violations, JSON.stringify(violations, null, 1)).toEqual([])
      expect.soft(problems).toEqual([])
      expect.soft(small, 'touch targets under 44 × 44 px on a phone').toEqual([])
    }
    finally {
      await page.close()
    }
  })
})

describe('navigation on a phone', () => {
  const visible = (page: Page, name: string) => page.getByRole('link', { name, exact: true }).isVisible()

  it('shows a coach every destination from the menu, and closes it with Escape back onto its button', async () => {
    const page = await (await contextFor('coach', 'phone')).newPage()
    await page.goto(`${running.stack.url}/routines`)
    const menu = page.getByRole('button', { name: 'Menu' })
    expect(await menu.getAttribute('aria-expanded')).toBe('false')
    expect(await visible(page, 'Insights')).toBe(false)
    await menu.click()
    for (const name of ['Overview', 'Library', 'Routines', 'Planner', 'Insights', 'Team']) expect(await visible(page, name), name).toBe(true)
    expect(await page.getByRole('link', { name: 'Routines', exact: true }).getAttribute('aria-current')).toBe('page')
    await page.keyboard.press('Escape')
    expect(await visible(page, 'Insights')).toBe(false)
    expect(await page.evaluate(() => document.activeElement?.getAttribute('aria-controls'))).toBe('main-menu')
    await menu.click()
    await page.getByRole('link', { name: 'Team', exact: true }).click()
    await page.waitForURL(/\/team$/)
    await expect.poll(() => visible(page, 'Insights')).toBe(false)
    await page.close()
  })

  it('keeps an athlete\'s four destinations in a bar at the bottom of the screen', async () => {
    const page = await (await contextFor('athlete', 'phone')).newPage()
    await page.goto(`${running.stack.url}/today`)
    const bar = page.getByRole('navigation', { name: 'Main, at the bottom' })
    for (const name of ['Today', 'Logbook', 'Progress', 'Profile']) {
      const box = await bar.getByRole('link', { name, exact: true }).boundingBox()
      expect(box, name).not.toBeNull()
      expect(box!.y + box!.height).toBeGreaterThan(viewports.phone.height - 80)
      expect(box!.height).toBeGreaterThanOrEqual(44)
    }
    await bar.getByRole('link', { name: 'Logbook', exact: true }).click()
    await page.waitForURL(/\/logbook$/)
    await expect.poll(() => bar.getByRole('link', { name: 'Logbook', exact: true }).getAttribute('aria-current')).toBe('page')
    await page.close()
  })
})

describe('dates in the reader\'s language and time zone', () => {
  it('renders the logbook the same on the server and in a German browser far from UTC', async () => {
    const context = await running.browser.newContext({ viewport: viewports.phone, locale: 'de-DE', timezoneId: 'Pacific/Auckland' })
    await signInByRequest(context, running.stack.url, people.athlete!.email)
    for (const visit of ['first', 'second']) {
      const page = await context.newPage()
      const problems: string[] = []
      page.on('console', (message) => {
        if (message.type() === 'error' || /hydrat/i.test(message.text())) problems.push(message.text())
      })
      await page.goto(`${running.stack.url}/logbook`, { waitUntil: 'networkidle' })
      const yesterday = addDays(todayIn('UTC'), -1)
      // The calendar day of the session, in German words: "Di., 1. Dez. 2026".
      await page.getByText(formatDate(yesterday, 'day', { locale: 'de-DE', timeZone: 'Pacific/Auckland' })).first().waitFor()
      expect(problems, `${visit} visit`).toEqual([])
      await page.close()
    }
    // The browser told the server its zone for next time.
    expect(decodeURIComponent((await context.cookies()).find(cookie => cookie.name === 'switchback-tz')?.value ?? '')).toBe('Pacific/Auckland')
    await context.close()
  })
})

describe('our own confirmation dialog', () => {
  it('asks before withdrawing an invitation, keeps focus inside and gives it back', async () => {
    const page = await (await contextFor('coach', 'phone')).newPage()
    await page.goto(`${running.stack.url}/team`, { waitUntil: 'networkidle' })
    const withdraw = page.getByRole('button', { name: 'Withdraw' }).first()
    await withdraw.focus()
    await page.keyboard.press('Enter')
    const dialog = page.getByRole('dialog', { name: /Withdraw the invitation for pending\./ })
    await dialog.waitFor()
    expect(await page.evaluate(() => document.activeElement?.textContent?.trim())).toBe('Cancel')
    for (let i = 0; i < 3; i++) {
      await page.keyboard.press('Tab')
      expect(await page.evaluate(() => Boolean(document.activeElement?.closest('dialog')))).toBe(true)
    }
    await page.keyboard.press('Escape')
    await dialog.waitFor({ state: 'hidden' })
    expect(await page.evaluate(() => document.activeElement?.textContent?.trim())).toBe('Withdraw')
    await withdraw.click()
    await dialog.getByRole('button', { name: 'Withdraw' }).click()
    await page.getByText(/no longer works/).waitFor()
    await page.close()
  })
})
