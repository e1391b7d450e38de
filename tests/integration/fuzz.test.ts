import { readdirSync } from 'node:fs'
import { join, relative } from 'node:path'
import type { Client } from '@libsql/client'
import fc from 'fast-check'
import { beforeAll, describe, expect, it } from 'vitest'
import { ApiClient } from '../support/client'
import { root } from '../support/stack'
import { addAthlete, registerCoach } from '../support/team'
import { useStack } from '../support/hooks'

// Generated bad input against every POST/PUT/PATCH route file: wrong types, missing and extra
// fields, huge and deeply nested values, NaN/Infinity, NUL bytes, injection strings and __proto__
// keys, and malformed path ids. No answer may be a 5xx, and a refused request changes nothing.

const RUNS = 1200

// Tables whose rows record refusals themselves (failed sign-ins, counted e-mail requests), or that a
// background worker changes on its own (the outbox's sending state), are compared by count only or left out.
const auditTables = new Set(['login_failures', 'rate_events', '__drizzle_migrations'])
const countOnlyTables = new Set(['email_outbox', 'media_objects'])

async function fingerprint(db: Client, tables: { name: string, updatedAt: boolean }[]) {
  const parts = tables.map(table => table.updatedAt
    ? `select '${table.name}' as t, count(*) as n, max(updated_at) as u from "${table.name}"`
    : `select '${table.name}' as t, count(*) as n, null as u from "${table.name}"`)
  const result = await db.execute(parts.join(' union all '))
  return result.rows.map(row => `${row.t}:${row.n}:${row.u}`).join('|')
}

interface Target { file: string, method: string, template: string, caller: 'coach' | 'athlete' | 'visitor' }

function writeRoutes(): Target[] {
  return readdirSync(join(root, 'server/api'), { recursive: true, withFileTypes: true })
    .filter(entry => entry.isFile() && /\.(post|put|patch)\.ts$/.test(entry.name))
    .map((entry) => {
      const file = relative(root, join(entry.parentPath, entry.name)).split('\\').join('/')
      const [, method] = /\.(post|put|patch)\.ts$/.exec(file)!
      const template = file.replace(/^server/, '').replace(/\.(post|put|patch)\.ts$/, '').replace(/\/index$/, '')
      const caller = template.startsWith('/api/auth') || template.startsWith('/api/invites/[token]')
        ? 'visitor'
        : /^\/api\/(me|sessions|entries)\b|^\/api\/assignments\/\[id\]\/sessions/.test(template) ? 'athlete' : 'coach'
      return { file, method: method!.toUpperCase(), template, caller } as Target
    })
    // Signing out is not input handling, and would end the callers' sessions mid-run.
    .filter(target => !['/api/auth/logout', '/api/me/sign-out-everywhere'].includes(target.template))
}

const nasty = fc.constantFrom(
  '', ' ', '\u0000', 'a\u0000b', '\'; drop table users; --', '" or 1=1 --', '<script>alert(1)</script>', '${7*7}', '{{7*7}}',
  '../../etc/passwd', '%00', '\uFFFF', '\uD800', 'NaN', 'Infinity', '-1', '0x10', '1e309', 'null', 'true', '__proto__', 'constructor',
)
const scalar = fc.oneof(
  nasty,
  fc.string({ maxLength: 40 }),
  fc.string({ minLength: 2000, maxLength: 5000 }),
  fc.integer(),
  fc.constantFrom(0, -1, 1e308, -1e308, Number.MAX_SAFE_INTEGER + 2, 0.1, -0),
  fc.double(),
  fc.boolean(),
  fc.constant(null),
)
const value = fc.letrec(tie => ({
  node: fc.oneof({ depthSize: 'small', withCrossShrink: true }, scalar, tie('array'), tie('object')),
  array: fc.array(tie('node'), { maxLength: 5 }),
  object: fc.dictionary(fc.oneof(fc.string({ maxLength: 12 }), fc.constantFrom('__proto__', 'constructor', 'prototype', 'id', 'teamId', 'athleteIds', 'steps', 'email', 'password', 'date', 'name')), tie('node'), { maxKeys: 6 }),
})).node

/** Routine-shaped steps nested `depth` levels deep, written as text (no recursion on either side). */
function nested(depth: number) {
  const leaf = '{"id":"x","type":"block","kind":"work","measure":{"by":"time","seconds":1}}'
  const open = '{"id":"r","type":"repeat","times":2,"steps":['.repeat(depth)
  const close = ']}'.repeat(depth)
  return `{"title":"Deep","category":"hills","name":"Deep","steps":[${open}${leaf}${close}]}`
}

/** A raw request body (text), most of them JSON, some not. */
const rawBody = fc.oneof(
  { weight: 6, arbitrary: value.map(body => JSON.stringify(body) ?? 'null') },
  { weight: 2, arbitrary: value.map(body => JSON.stringify(body)?.replace(/"__proto__"|"constructor"/g, '"__proto__"') ?? '{}') },
  { weight: 1, arbitrary: fc.integer({ min: 40, max: 3000 }).map(nested) },
  { weight: 1, arbitrary: fc.constantFrom('{"a": NaN}', '{"a": Infinity}', '{"a": -Infinity}', '{', '[1,2', 'not json', '{"__proto__": {"admin": true}}', '{"constructor": {"prototype": {"x": 1}}}', '\u0000', '{"a":"\u0000"}', '"just a string"', '123', '[]', 'null', '{}') },
  { weight: 1, arbitrary: fc.integer({ min: 1, max: 900_000 }).map(size => JSON.stringify({ name: 'x'.repeat(size), note: 'y', title: 'z' })) },
)
const badId = fc.oneof(
  fc.constantFrom('0x10', '1e1', '%201', '1.0', '-1', '0', '99999999999999999999', 'abc', '%00', '1%00', '%2e%2e', 'NaN', 'Infinity', '1 OR 1=1'),
  fc.string({ minLength: 1, maxLength: 30 }).map(text => encodeURIComponent(text)),
)

describe('generated bad input', () => {
  const running = useStack()
  let clients: Record<Target['caller'], ApiClient>
  let goodIds: Record<string, string>
  let tables: { name: string, updatedAt: boolean }[]

  beforeAll(async () => {
    const team = await registerCoach(running.stack)
    const athlete = await addAthlete(running.stack, team.coach)
    clients = { coach: team.coach, athlete: athlete.athlete, visitor: new ApiClient(running.stack.url) }
    const exercise = await running.fixtures.exercise(team.teamId, { name: 'Skips', category: 'drill' })
    const routineId = await running.fixtures.routine(team.teamId, { title: 'Strides', category: 'drills', steps: [{ id: 'w', type: 'block', kind: 'work', measure: { by: 'time', seconds: 20 } }] })
    goodIds = { exercises: String(exercise.id), routines: String(routineId), athletes: String(athlete.userId) }
    const names = await running.fixtures.rows<{ name: string }>('select name from sqlite_master where type = \'table\' and name not like \'sqlite_%\'')
    tables = []
    for (const { name } of names) {
      if (auditTables.has(name)) continue
      const columns = await running.fixtures.rows<{ name: string }>(`pragma table_info("${name}")`)
      tables.push({ name, updatedAt: !countOnlyTables.has(name) && columns.some(column => column.name === 'updated_at') })
    }
  })

  it(`answers ${RUNS} malformed bodies and path ids across every write route without a 5xx, changing nothing when it refuses`, async () => {
    const targets = writeRoutes()
    expect(targets.length).toBeGreaterThan(30)
    const seen = new Set<string>()
    const statuses: Record<number, number> = {}
    let signedOutMidway = 0
    await fc.assert(fc.asyncProperty(
      fc.constantFrom(...targets),
      rawBody,
      badId,
      fc.boolean(),
      async (target, body, id, breakId) => {
        seen.add(target.file)
        const path = target.template.replace(/\[(\w+)\]/g, (_, name: string) => {
          if (breakId) return id
          if (name === 'token') return 'z'.repeat(43)
          const resource = /\/api\/(\w+)\//.exec(target.template)?.[1] ?? ''
          return goodIds[resource] ?? '999999'
        })
        const before = await fingerprint(running.fixtures.client, tables)
        const response = await clients[target.caller].request(target.method, path, undefined, { raw: body })
        expect(response.status, `${target.method} ${path} ${body.slice(0, 200)} → ${response.text.slice(0, 300)}`).toBeLessThan(500)
        statuses[response.status] = (statuses[response.status] ?? 0) + 1
        if (response.status === 401 && target.caller !== 'visitor') signedOutMidway++
        if (response.status >= 400) {
          expect(await fingerprint(running.fixtures.client, tables), `${target.method} ${path} was refused with ${response.status} but changed the database`).toBe(before)
        }
      },
    ), { numRuns: RUNS, seed: Number(process.env.FUZZ_SEED) || undefined })
    expect(seen.size).toBe(targets.length)
    // The callers stayed signed in, so the bodies reached the routes' own checks.
    expect(signedOutMidway).toBe(0)
    expect(statuses[400]).toBeGreaterThan(RUNS / 3)
  }, 600_000)
})
