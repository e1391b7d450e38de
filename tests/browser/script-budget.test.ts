import { existsSync, readFileSync } from 'node:fs'
import { join } from 'node:path'
import { gzipSync } from 'node:zlib'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser } from 'playwright-core'
import { launchBrowser, newContext } from '../support/browser'
import { Fixtures } from '../support/fixtures'
import { root, startStack, type Stack } from '../support/stack'
import { addAthlete, PASSWORD, registerCoach } from '../support/team'

// The session player's JavaScript budget on a phone's first visit (docs/performance.md): sizes are those of
// the files the build ships, gzipped, so the figure does not depend on the machine or its load.
const MAX_SCRIPTS = 20
const MAX_GZIPPED_BYTES = 110 * 1024

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

describe('the session player\'s JavaScript budget', () => {
  it('opens cold on a phone with at most 20 scripts and 110 KB of them gzipped, and starts in short tasks', async () => {
    const fixtures = new Fixtures(stack)
    const team = await registerCoach(stack)
    const athlete = await addAthlete(stack, team.coach, { name: 'Wren Holloway' })
    const squat = await fixtures.exercise(team.teamId, { name: 'Split squat', cues: ['Tall through the trunk'], equipment: ['Dumbbells'] })
    const { id } = await fixtures.assignment(team.teamId, athlete.userId, {
      title: 'Hill strength',
      category: 'strength',
      description: 'Legs for the climbs',
      exercises: [squat],
      steps: [
        { id: 'warm', type: 'block', kind: 'warmup', measure: { by: 'time', seconds: 300 } },
        { id: 'squat', type: 'sets', exerciseId: squat.id, sets: 3, perSet: { by: 'reps', reps: 8 }, restSeconds: 60, target: { type: 'load', kg: 12 } },
      ],
    })
    fixtures.close()

    const context = await newContext(browser, 'phone')
    const signIn = await context.request.post(`${stack.url}/api/auth/login`, { data: { email: athlete.email, password: PASSWORD } })
    expect(signIn.status()).toBe(200)
    const page = await context.newPage()
    const scripts = new Set<string>()
    page.on('request', (request) => {
      if (request.resourceType() === 'script') scripts.add(new URL(request.url()).pathname)
    })
    await page.goto(`${stack.url}/session/${id}`, { waitUntil: 'networkidle' })
    await page.getByRole('heading', { name: 'Hill strength' }).waitFor()

    const shipped = [...scripts].map(script => join(root, '.output/public', script))
    expect(shipped.filter(file => !existsSync(file))).toEqual([])
    const gzipped = shipped.reduce((sum, file) => sum + gzipSync(readFileSync(file), { level: 9 }).length, 0)
    console.log(`Session player, cold on a phone: ${scripts.size} scripts, ${(gzipped / 1024).toFixed(1)} KB gzipped`)
    expect(scripts.size).toBeGreaterThan(0)
    expect(scripts.size).toBeLessThanOrEqual(MAX_SCRIPTS)
    expect(gzipped).toBeLessThanOrEqual(MAX_GZIPPED_BYTES)

    // The app's start is split into shorter tasks (plugins/yield.client.ts): after the scripts are evaluated,
    // before hydration, and between the header's hydration and the page's (layouts/default.vue).
    const yields = await context.newPage()
    await yields.addInitScript(() => {
      const scheduler = (window as unknown as { scheduler: { yield: () => Promise<void> } }).scheduler
      const handBack = scheduler.yield.bind(scheduler)
      const counted = window as unknown as { yields: number }
      counted.yields = 0
      scheduler.yield = () => {
        counted.yields++
        return handBack()
      }
    })
    await yields.goto(`${stack.url}/session/${id}`, { waitUntil: 'networkidle' })
    // Hydrated: the briefing's tick box now enables the start button.
    await yields.locator('input[name="acknowledge"]').check()
    await expect.poll(() => yields.getByRole('button', { name: 'Start session' }).isEnabled()).toBe(true)
    expect(await yields.evaluate(() => (window as unknown as { yields: number }).yields)).toBe(3)
    await context.close()
  })
})
