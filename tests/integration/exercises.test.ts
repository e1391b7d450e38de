import { randomBytes } from 'node:crypto'
import { HeadObjectCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { makeDemoClip } from '../../seeds/clip'
import { ApiClient, type FieldError } from '../support/client'
import { addAthlete, registerCoach } from '../support/team'
import { useStack } from '../support/hooks'
import type { ExerciseView } from '../../shared/schemas/exercise'
import type { ClipPlayback, ClipUploadUrl, ExerciseList } from '../../types/api'

const running = useStack()
let s3: S3Client
let clip: Buffer
let coach: ApiClient
let teamId: number

beforeAll(async () => {
  s3 = new S3Client({
    endpoint: running.stack.s3.endpoint,
    region: 'us-east-1',
    credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' },
    forcePathStyle: true,
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  })
  clip = await makeDemoClip({ seconds: 1, framesPerSecond: 8 })
  const registered = await registerCoach(running.stack, 'Larchford Ridge Runners')
  coach = registered.coach
  teamId = registered.teamId
})

afterAll(async () => {
  s3?.destroy()
})

async function stored(key: string) {
  try {
    const head = await s3.send(new HeadObjectCommand({ Bucket: running.stack.s3.bucket, Key: key }))
    return { contentType: head.ContentType, size: head.ContentLength }
  }
  catch (error) {
    if ((error as { name?: string }).name === 'NotFound') return null
    throw error
  }
}

const sql = (statement: string, args: (string | number)[] = []) => running.fixtures.rows(statement, args)

let counter = 0
async function createExercise(client: ApiClient, overrides: Record<string, unknown> = {}) {
  counter += 1
  const response = await client.post<ExerciseView>('/api/exercises', {
    name: `Hill sprint ${counter}`,
    category: 'hill',
    summary: 'Short, fast efforts up a steep grade.',
    cues: ['Drive the knees', 'Stay tall'],
    equipment: ['Hill'],
    cautions: [{ text: 'Walk back down gently', bodyAreas: ['knee', 'shin'] }],
    ...overrides,
  })
  expect(response.status, response.text).toBe(201)
  return response.data
}

/** The whole browser-side flow: ask for a URL, PUT the bytes straight to the store, confirm. */
async function uploadClip(client: ApiClient, exerciseId: number, body: Uint8Array = clip, contentType = 'video/webm') {
  const signed = await client.post<ClipUploadUrl>(`/api/exercises/${exerciseId}/clip/upload-url`, { contentType, size: body.byteLength })
  expect(signed.status, signed.text).toBe(200)
  const put = await fetch(signed.data.url, { method: 'PUT', body: new Uint8Array(body), headers: { 'content-type': contentType } })
  expect(put.status, await put.clone().text()).toBe(200)
  const confirmed = await client.post<ExerciseView & FieldError>(`/api/exercises/${exerciseId}/clip/confirm`, { key: signed.data.key })
  return { key: signed.data.key, confirmed }
}

describe('exercise records', () => {
  it('creates an exercise with ordered cues, equipment and cautions and reads it back', async () => {
    const created = await createExercise(coach, { name: 'Bulgarian split squat', category: 'strength', cues: ['Front shin upright', 'Lower straight down', 'Push through the whole foot'], equipment: ['Bench', 'Dumbbells'] })
    expect(created).toMatchObject({ name: 'Bulgarian split squat', category: 'strength', hasClip: false, clip: null, archivedAt: null })
    const read = await coach.get<ExerciseView>(`/api/exercises/${created.id}`)
    expect(read.status).toBe(200)
    expect(read.data.cues).toEqual(['Front shin upright', 'Lower straight down', 'Push through the whole foot'])
    expect(read.data.cautions).toEqual([{ text: 'Walk back down gently', bodyAreas: ['knee', 'shin'] }])
  })

  it('refuses bad input with field-level messages and writes nothing', async () => {
    const before = (await coach.get<ExerciseList>('/api/exercises?status=all')).data.total
    const cases: [Record<string, unknown>, string][] = [
      [{ category: 'hill' }, 'name'],
      [{ name: 'x'.repeat(121), category: 'hill' }, 'name'],
      [{ name: 'Jumping jacks', category: 'cardio' }, 'category'],
      [{ name: 'Calf raise', category: 'strength', cautions: [{ text: 'Go slowly', bodyAreas: ['elbow'] }] }, 'cautions.0.bodyAreas.0'],
      [{ name: 'Calf raise', category: 'strength', cautions: [{ text: '', bodyAreas: [] }] }, 'cautions.0.text'],
      [{ name: 'Calf raise', category: 'strength', summary: 'y'.repeat(2001) }, 'summary'],
      [{ name: 'Calf raise', category: 'strength', cues: Array.from({ length: 21 }, (_, i) => `cue ${i}`) }, 'cues'],
      [{ name: 'Calf raise', category: 'strength', cues: ['ok', '  '] }, 'cues.1'],
      [{ name: 'Calf raise', category: 'strength', equipment: ['Step', 'step'] }, 'equipment'],
    ]
    for (const [body, field] of cases) {
      const response = await coach.post<FieldError>('/api/exercises', body)
      expect(response.status, JSON.stringify(body)).toBe(400)
      expect(response.data.data?.fields?.[field], JSON.stringify(response.data)).toBeTruthy()
    }
    const malformed = await coach.request<FieldError>('POST', '/api/exercises', undefined, { raw: '{"name":' })
    expect(malformed.status).toBe(400)
    expect((await coach.get<ExerciseList>('/api/exercises?status=all')).data.total).toBe(before)
  })

  it('refuses a second exercise with the same name in the team (any case) with 409', async () => {
    const first = await createExercise(coach, { name: 'A-skips' })
    const again = await coach.post<FieldError>('/api/exercises', { name: 'a-SKIPS', category: 'drill' })
    expect(again.status).toBe(409)
    expect(again.data.data?.fields?.name).toMatch(/already has/)
    const rename = await coach.patch<FieldError>(`/api/exercises/${(await createExercise(coach)).id}`, { name: 'A-Skips' })
    expect(rename.status).toBe(409)
    expect((await coach.patch<ExerciseView>(`/api/exercises/${first.id}`, { name: 'A-skips' })).status).toBe(200)
  })

  it('edits fields one at a time and refuses an empty or invalid change', async () => {
    const exercise = await createExercise(coach)
    const edited = await coach.patch<ExerciseView>(`/api/exercises/${exercise.id}`, { cues: ['Stay tall', 'Drive the knees', 'Quick arms'], category: 'stride' })
    expect(edited.status).toBe(200)
    expect(edited.data).toMatchObject({ name: exercise.name, category: 'stride', cues: ['Stay tall', 'Drive the knees', 'Quick arms'], summary: exercise.summary })
    expect((await coach.patch<FieldError>(`/api/exercises/${exercise.id}`, {})).status).toBe(400)
    const bad = await coach.patch<FieldError>(`/api/exercises/${exercise.id}`, { cautions: [{ text: 'Careful', bodyAreas: ['wrist'] }] })
    expect(bad.status).toBe(400)
    expect(bad.data.data?.fields?.['cautions.0.bodyAreas.0']).toBeTruthy()
    expect((await coach.get<ExerciseView>(`/api/exercises/${exercise.id}`)).data.cautions).toEqual(exercise.cautions)
    expect((await coach.get<FieldError>('/api/exercises/abc')).status).toBe(400)
    expect((await coach.get('/api/exercises/999999')).status).toBe(404)
  })

  it('archives and restores: archived exercises leave the default list but stay readable', async () => {
    const exercise = await createExercise(coach, { name: 'Old drill to archive' })
    const archived = await coach.post<ExerciseView>(`/api/exercises/${exercise.id}/archive`)
    expect(archived.status).toBe(200)
    expect(archived.data.archivedAt).not.toBeNull()
    const active = await coach.get<ExerciseList>('/api/exercises?q=old%20drill')
    expect(active.data.items.map(item => item.id)).not.toContain(exercise.id)
    const archivedList = await coach.get<ExerciseList>('/api/exercises?status=archived&q=old%20drill')
    expect(archivedList.data.items.map(item => item.id)).toContain(exercise.id)
    expect((await coach.get<ExerciseView>(`/api/exercises/${exercise.id}`)).status).toBe(200)
    const restored = await coach.post<ExerciseView>(`/api/exercises/${exercise.id}/archive`, { archived: false })
    expect(restored.data.archivedAt).toBeNull()
  })

  it('duplicates an exercise under a free name, copying its clip to the copy\'s own key', async () => {
    const exercise = await createExercise(coach, { name: 'Glute bridge' })
    const { key } = await uploadClip(coach, exercise.id)
    const copy = await coach.post<ExerciseView & { mediaCopied: boolean }>(`/api/exercises/${exercise.id}/duplicate`)
    expect(copy.status).toBe(201)
    expect(copy.data).toMatchObject({ name: 'Glute bridge (copy)', category: 'hill', cues: exercise.cues, cautions: exercise.cautions, hasClip: true, mediaCopied: true })
    const second = await coach.post<ExerciseView>(`/api/exercises/${exercise.id}/duplicate`)
    expect(second.data.name).toBe('Glute bridge (copy 2)')

    const [row] = await sql('select m.key from exercises e join media_objects m on m.id = e.clip_id where e.id = ?', [copy.data.id])
    const copyKey = String(row!.key)
    expect(copyKey.startsWith(`teams/${teamId}/exercises/${copy.data.id}/`)).toBe(true)
    expect(copyKey).not.toBe(key)
    expect(await stored(copyKey)).toMatchObject({ contentType: 'video/webm', size: clip.byteLength })
    // Removing the copy's clip leaves the original's in place.
    expect((await coach.delete(`/api/exercises/${copy.data.id}/clip`)).status).toBe(200)
    expect(await stored(copyKey)).toBeNull()
    expect(await stored(key)).not.toBeNull()
  })
})

describe('browsing the library', () => {
  let listCoach: ApiClient
  beforeAll(async () => {
    listCoach = (await registerCoach(running.stack, 'Quenmere Striders')).coach
    const specs = [
      { name: 'Romanian deadlift', category: 'strength', equipment: ['Barbell'] },
      { name: 'Step-ups', category: 'strength', equipment: ['Box', 'Dumbbells'] },
      { name: 'Side plank', category: 'mobility', equipment: [] },
      { name: 'Hill bounding', category: 'plyometric', equipment: ['Hill'] },
      { name: 'Strides on grass', category: 'stride', equipment: [] },
      { name: 'B-skips', category: 'drill', equipment: [], summary: 'A skipping drill with a pawing leg action' },
    ]
    for (const spec of specs) await createExercise(listCoach, { cautions: [], cues: [], summary: '', ...spec })
  })

  it('searches by name or summary, filters by category and equipment, pages and sorts', async () => {
    const all = await listCoach.get<ExerciseList>('/api/exercises')
    expect(all.status).toBe(200)
    expect(all.data.total).toBe(6)
    expect(all.data.items.map(item => item.name)).toEqual(['B-skips', 'Hill bounding', 'Romanian deadlift', 'Side plank', 'Step-ups', 'Strides on grass'])
    expect(all.data.equipmentOptions).toEqual(['Barbell', 'Box', 'Dumbbells', 'Hill'])

    expect((await listCoach.get<ExerciseList>('/api/exercises?q=SKIP')).data.items.map(item => item.name)).toEqual(['B-skips'])
    expect((await listCoach.get<ExerciseList>('/api/exercises?q=pawing')).data.items.map(item => item.name)).toEqual(['B-skips'])
    expect((await listCoach.get<ExerciseList>('/api/exercises?q=100%25')).data.total).toBe(0)
    expect((await listCoach.get<ExerciseList>('/api/exercises?category=strength')).data.items.map(item => item.name)).toEqual(['Romanian deadlift', 'Step-ups'])
    expect((await listCoach.get<ExerciseList>('/api/exercises?equipment=dumbbells')).data.items.map(item => item.name)).toEqual(['Step-ups'])

    const desc = await listCoach.get<ExerciseList>('/api/exercises?sort=name&dir=desc&pageSize=2')
    expect(desc.data.items.map(item => item.name)).toEqual(['Strides on grass', 'Step-ups'])
    const page2 = await listCoach.get<ExerciseList>('/api/exercises?pageSize=4&page=2')
    expect(page2.data).toMatchObject({ total: 6, page: 2, pageSize: 4 })
    expect(page2.data.items.map(item => item.name)).toEqual(['Step-ups', 'Strides on grass'])
    const byCategory = await listCoach.get<ExerciseList>('/api/exercises?sort=category')
    expect(byCategory.data.items.map(item => item.category)).toEqual(['drill', 'mobility', 'plyometric', 'strength', 'strength', 'stride'])
  })

  it('filters by whether a clip is attached', async () => {
    const { items } = (await listCoach.get<ExerciseList>('/api/exercises?q=side%20plank')).data
    await uploadClip(listCoach, items[0]!.id)
    expect((await listCoach.get<ExerciseList>('/api/exercises?hasClip=true')).data.items.map(item => item.name)).toEqual(['Side plank'])
    expect((await listCoach.get<ExerciseList>('/api/exercises?hasClip=false')).data.total).toBe(5)
    const sorted = await listCoach.get<ExerciseList>('/api/exercises?sort=clip&dir=desc')
    expect(sorted.data.items[0]!.name).toBe('Side plank')
  })

  it('answers bad filters with field messages', async () => {
    for (const [query, field] of [['category=cardio', 'category'], ['hasClip=maybe', 'hasClip'], ['page=0', 'page'], ['pageSize=500', 'pageSize'], ['sort=colour', 'sort']]) {
      const response = await listCoach.get<FieldError>(`/api/exercises?${query}`)
      expect(response.status, query).toBe(400)
      expect(response.data.data?.fields?.[field!], query).toBeTruthy()
    }
  })
})

describe('demo clips in object storage', () => {
  it('uploads straight to the store with a presigned PUT, verifies it and plays it back with ranges', async () => {
    const exercise = await createExercise(coach)
    const signed = await coach.post<ClipUploadUrl>(`/api/exercises/${exercise.id}/clip/upload-url`, { contentType: 'video/webm', size: clip.byteLength })
    expect(signed.status).toBe(200)
    expect(signed.data.key).toMatch(new RegExp(`^teams/${teamId}/exercises/${exercise.id}/[0-9a-f]{24}\\.webm$`))
    const expiresIn = new Date(signed.data.expiresAt).getTime() - Date.now()
    expect(expiresIn).toBeGreaterThan(0)
    expect(expiresIn).toBeLessThanOrEqual(10 * 60 * 1000)
    expect(new URL(signed.data.url).searchParams.get('X-Amz-Expires')).toBe('600')
    expect(new URL(signed.data.url).searchParams.get('X-Amz-SignedHeaders')).toMatch(/content-length.*content-type|content-type.*content-length/)

    // Not there until the browser uploads; confirming now is an upload that never happened.
    const early = await coach.post<FieldError>(`/api/exercises/${exercise.id}/clip/confirm`, { key: signed.data.key })
    expect(early.status).toBe(400)
    expect(early.data.data?.fields?.key).toMatch(/Nothing has been uploaded/)

    const put = await fetch(signed.data.url, { method: 'PUT', body: new Uint8Array(clip), headers: { 'content-type': 'video/webm' } })
    expect(put.status).toBe(200)
    const confirmed = await coach.post<ExerciseView>(`/api/exercises/${exercise.id}/clip/confirm`, { key: signed.data.key })
    expect(confirmed.status, confirmed.text).toBe(200)
    expect(confirmed.data).toMatchObject({ hasClip: true, clip: { contentType: 'video/webm', size: clip.byteLength } })
    expect(await stored(signed.data.key)).toMatchObject({ contentType: 'video/webm', size: clip.byteLength })
    const [media] = await sql('select status from media_objects where key = ?', [signed.data.key])
    expect(media!.status).toBe('ready')

    const again = await coach.post<FieldError>(`/api/exercises/${exercise.id}/clip/confirm`, { key: signed.data.key })
    expect(again.status).toBe(400)

    const playback = await coach.get<ClipPlayback>(`/api/exercises/${exercise.id}/clip`)
    expect(playback.status).toBe(200)
    expect(playback.data.contentType).toBe('video/webm')
    const whole = Buffer.from(await (await fetch(playback.data.url)).arrayBuffer())
    expect(whole.equals(clip)).toBe(true)
    const ranged = await fetch(playback.data.url, { headers: { range: 'bytes=100-199' } })
    expect(ranged.status).toBe(206)
    expect(Buffer.from(await ranged.arrayBuffer()).equals(clip.subarray(100, 200))).toBe(true)

    const redirect = await coach.get(`/api/exercises/${exercise.id}/clip?redirect=1`)
    expect(redirect.status).toBe(302)
    expect(redirect.headers.get('location')).toContain(encodeURIComponent(signed.data.key).replaceAll('%2F', '/'))
  })

  it('refuses a wrong content type or a size over 200 MB before signing anything', async () => {
    const exercise = await createExercise(coach)
    const wrongType = await coach.post<FieldError>(`/api/exercises/${exercise.id}/clip/upload-url`, { contentType: 'application/pdf', size: 1000 })
    expect(wrongType.status).toBe(400)
    expect(wrongType.data.data?.fields?.contentType).toMatch(/MP4, WebM or QuickTime/)
    const tooBig = await coach.post<FieldError>(`/api/exercises/${exercise.id}/clip/upload-url`, { contentType: 'video/mp4', size: 200 * 1024 * 1024 + 1 })
    expect(tooBig.status).toBe(400)
    expect(tooBig.data.data?.fields?.size).toMatch(/200 MB/)
    const empty = await coach.post<FieldError>(`/api/exercises/${exercise.id}/clip/upload-url`, { contentType: 'video/mp4', size: 0 })
    expect(empty.data.data?.fields?.size).toBeTruthy()
    const posterTooBig = await coach.post<FieldError>(`/api/exercises/${exercise.id}/clip/upload-url`, { contentType: 'image/png', size: 6 * 1024 * 1024, purpose: 'poster' })
    expect(posterTooBig.data.data?.fields?.size).toMatch(/5 MB/)
    expect(Number((await sql('select count(*) as n from media_objects where exercise_id = ?', [exercise.id]))[0]!.n)).toBe(0)
    // Exactly 200 MB is allowed: only a URL is handed out, nothing is uploaded.
    expect((await coach.post(`/api/exercises/${exercise.id}/clip/upload-url`, { contentType: 'video/quicktime', size: 200 * 1024 * 1024 })).status).toBe(200)
  })

  it('a PUT whose type or size differs from the signed one never becomes the clip', async () => {
    // A real S3 refuses such a PUT against the signature; s3rver does not check SigV4 signatures,
    // so this shows the second line of defence: confirm compares the stored object and discards it.
    const exercise = await createExercise(coach)
    for (const [body, contentType, message] of [[clip, 'video/mp4', /video\/mp4, not video\/webm/], [Buffer.concat([clip, clip]), 'video/webm', /bytes, not the announced/]] as const) {
      const signed = await coach.post<ClipUploadUrl>(`/api/exercises/${exercise.id}/clip/upload-url`, { contentType: 'video/webm', size: clip.byteLength })
      const put = await fetch(signed.data.url, { method: 'PUT', body: new Uint8Array(body), headers: { 'content-type': contentType } })
      await put.arrayBuffer()
      const confirmed = await coach.post<FieldError>(`/api/exercises/${exercise.id}/clip/confirm`, { key: signed.data.key })
      expect(confirmed.status).toBe(400)
      expect(confirmed.data.data?.fields?.key).toMatch(message)
      expect(await stored(signed.data.key)).toBeNull()
    }
    expect((await coach.get<ExerciseView>(`/api/exercises/${exercise.id}`)).data.hasClip).toBe(false)
  })

  it('refuses to confirm a key outside the exercise\'s own prefix, or one never handed out', async () => {
    const exercise = await createExercise(coach)
    const other = await createExercise(coach)
    const otherUpload = await uploadClip(coach, other.id)
    for (const key of [`teams/${teamId + 1}/exercises/${exercise.id}/abc.webm`, otherUpload.key, `teams/${teamId}/exercises/${exercise.id}/../${other.id}/x.webm`, 'elsewhere/file.webm']) {
      const response = await coach.post<FieldError>(`/api/exercises/${exercise.id}/clip/confirm`, { key })
      expect(response.status, key).toBe(400)
      expect(response.data.data?.fields?.key, key).toMatch(/not in this exercise/)
    }
    const invented = await coach.post<FieldError>(`/api/exercises/${exercise.id}/clip/confirm`, { key: `teams/${teamId}/exercises/${exercise.id}/made-up.webm` })
    expect(invented.status).toBe(400)
    expect(invented.data.data?.fields?.key).toMatch(/No upload was started/)
    expect((await coach.post<FieldError>(`/api/exercises/${exercise.id}/clip/confirm`, {})).data.data?.fields?.key).toBeTruthy()
    expect((await coach.get<ExerciseView>(`/api/exercises/${exercise.id}`)).data.hasClip).toBe(false)
    expect(await stored(otherUpload.key)).not.toBeNull()
  })

  it('discards an object that is not what it claimed, and leaves the exercise without a clip', async () => {
    const exercise = await createExercise(coach)
    // Right size and type on the wire, but not a video inside.
    const fake = randomBytes(4096)
    const { key, confirmed } = await uploadClip(coach, exercise.id, fake, 'video/mp4')
    expect(confirmed.status).toBe(400)
    expect(confirmed.data.data?.fields?.key).toMatch(/not a real video\/mp4 file/)
    expect(await stored(key)).toBeNull()
    const [media] = await sql('select status from media_objects where key = ?', [key])
    expect(media!.status).toBe('deleted')

    // An object written under the key by other means with another type and size.
    const signed = await coach.post<ClipUploadUrl>(`/api/exercises/${exercise.id}/clip/upload-url`, { contentType: 'video/webm', size: clip.byteLength })
    await s3.send(new PutObjectCommand({ Bucket: running.stack.s3.bucket, Key: signed.data.key, Body: 'not a clip', ContentType: 'text/plain' }))
    const mismatch = await coach.post<FieldError>(`/api/exercises/${exercise.id}/clip/confirm`, { key: signed.data.key })
    expect(mismatch.status).toBe(400)
    expect(mismatch.data.data?.fields?.key).toMatch(/text\/plain, not video\/webm/)
    expect(await stored(signed.data.key)).toBeNull()
    expect((await coach.get<ExerciseView>(`/api/exercises/${exercise.id}`)).data.hasClip).toBe(false)
    expect((await coach.get(`/api/exercises/${exercise.id}/clip`)).status).toBe(404)
  })

  it('replacing a clip deletes the old object; removing it deletes the object and the link', async () => {
    const exercise = await createExercise(coach)
    const first = await uploadClip(coach, exercise.id)
    expect(first.confirmed.status).toBe(200)
    const second = await uploadClip(coach, exercise.id, await makeDemoClip({ seconds: 1, framesPerSecond: 6, motion: 'bounce' }))
    expect(second.confirmed.status).toBe(200)
    expect(await stored(first.key)).toBeNull()
    expect(await stored(second.key)).not.toBeNull()

    const poster = await (await import('sharp')).default({ create: { width: 32, height: 18, channels: 3, background: '#1f4d3a' } }).png().toBuffer()
    const posterUpload = await coach.post<ClipUploadUrl>(`/api/exercises/${exercise.id}/clip/upload-url`, { contentType: 'image/png', size: poster.byteLength, purpose: 'poster' })
    expect((await fetch(posterUpload.data.url, { method: 'PUT', body: poster, headers: { 'content-type': 'image/png' } })).status).toBe(200)
    const withPoster = await coach.post<ExerciseView>(`/api/exercises/${exercise.id}/clip/confirm`, { key: posterUpload.data.key })
    expect(withPoster.data).toMatchObject({ hasClip: true, hasPoster: true })
    expect((await coach.get<ClipPlayback>(`/api/exercises/${exercise.id}/clip`)).data.posterUrl).toContain(posterUpload.data.key.split('/').pop())

    const removed = await coach.delete<ExerciseView>(`/api/exercises/${exercise.id}/clip`)
    expect(removed.status).toBe(200)
    expect(removed.data).toMatchObject({ hasClip: false, hasPoster: false, clip: null })
    expect(await stored(second.key)).toBeNull()
    expect(await stored(posterUpload.data.key)).toBeNull()
    expect((await coach.get(`/api/exercises/${exercise.id}/clip`)).status).toBe(404)
    expect((await coach.delete(`/api/exercises/${exercise.id}/clip`)).status).toBe(404)
  })
})

describe('who may see what', () => {
  let otherCoach: ApiClient
  let exercise: ExerciseView
  beforeAll(async () => {
    otherCoach = (await registerCoach(running.stack, 'Varrow Edge Club')).coach
    exercise = await createExercise(coach, { name: 'Single-leg calf raise', category: 'strength' })
    await uploadClip(coach, exercise.id)
  })

  it('another team gets 404 for every route on this team\'s exercise and cannot see it listed', async () => {
    const base = `/api/exercises/${exercise.id}`
    const calls = [
      otherCoach.get(base),
      otherCoach.patch(base, { name: 'Mine now' }),
      otherCoach.post(`${base}/archive`),
      otherCoach.post(`${base}/duplicate`),
      otherCoach.get(`${base}/usage`),
      otherCoach.post(`${base}/clip/upload-url`, { contentType: 'video/webm', size: 100 }),
      otherCoach.post(`${base}/clip/confirm`, { key: `teams/${teamId}/exercises/${exercise.id}/x.webm` }),
      otherCoach.get(`${base}/clip`),
      otherCoach.delete(`${base}/clip`),
    ]
    for (const response of await Promise.all(calls)) expect(response.status, response.text).toBe(404)
    expect((await otherCoach.get<ExerciseList>('/api/exercises?q=calf')).data.total).toBe(0)
    const still = await coach.get<ExerciseView>(base)
    expect(still.data).toMatchObject({ name: 'Single-leg calf raise', hasClip: true, archivedAt: null })
  })

  it('signed-out callers get 401', async () => {
    const anonymous = new ApiClient(running.stack.url)
    expect((await anonymous.get('/api/exercises')).status).toBe(401)
    expect((await anonymous.get(`/api/exercises/${exercise.id}/clip`)).status).toBe(401)
  })

  it('an athlete reads only exercises in their own assignments, with their clips, and changes nothing', async () => {
    const { athlete, userId } = await addAthlete(running.stack, coach)
    const { userId: teammateId } = await addAthlete(running.stack, coach, { name: 'Cai Penhallow' })
    const listed = await createExercise(coach, { name: 'Listed in the snapshot' })
    const inSteps = await createExercise(coach, { name: 'Named only by a step' })
    const teammates = await createExercise(coach, { name: 'In a teammate\'s plan' })

    expect((await athlete.get(`/api/exercises/${exercise.id}`)).status).toBe(404)
    expect((await athlete.get(`/api/exercises/${exercise.id}/clip`)).status).toBe(404)
    expect((await athlete.get<ExerciseList>('/api/exercises')).data.total).toBe(0)

    const [routine] = await sql(`insert into routines (team_id, title, category, steps) values (?, 'Thursday hills', 'hills', '[]') returning id`, [teamId])
    const snapshot = (exerciseIds: number[], stepIds: number[]) => JSON.stringify({
      title: 'Thursday hills',
      category: 'hills',
      description: '',
      steps: [{ id: 'r1', type: 'repeat', times: 6, steps: stepIds.map((id, index) => ({ id: `b${index}`, type: 'block', kind: 'work', measure: { by: 'time', seconds: 30 }, exerciseId: id })) }],
      exercises: exerciseIds.map(id => ({ id, name: 'x', category: 'hill', summary: '', cues: [], equipment: [], cautions: [] })),
    })
    const insertAssignment = (athleteId: number, body: string, date: string) => sql(
      'insert into assignments (team_id, athlete_id, routine_id, routine_version, snapshot, date) values (?, ?, ?, 1, ?, ?)',
      [teamId, athleteId, Number(routine!.id), body, date],
    )
    await insertAssignment(userId, snapshot([exercise.id, listed.id], [inSteps.id]), '2099-01-10')
    await insertAssignment(teammateId, snapshot([teammates.id], []), '2099-01-10')

    for (const id of [exercise.id, listed.id, inSteps.id]) expect((await athlete.get(`/api/exercises/${id}`)).status, String(id)).toBe(200)
    expect((await athlete.get(`/api/exercises/${teammates.id}`)).status).toBe(404)
    const list = await athlete.get<ExerciseList>('/api/exercises')
    expect(list.data.items.map(item => item.id).sort()).toEqual([exercise.id, listed.id, inSteps.id].sort())

    const playback = await athlete.get<ClipPlayback>(`/api/exercises/${exercise.id}/clip`)
    expect(playback.status).toBe(200)
    expect((await fetch(playback.data.url, { headers: { range: 'bytes=0-3' } })).status).toBe(206)
    expect((await athlete.get(`/api/exercises/${listed.id}/clip`)).status).toBe(404)

    expect((await athlete.post('/api/exercises', { name: 'Mine', category: 'drill' })).status).toBe(403)
    expect((await athlete.patch(`/api/exercises/${exercise.id}`, { name: 'Renamed' })).status).toBe(403)
    expect((await athlete.post(`/api/exercises/${exercise.id}/archive`)).status).toBe(403)
    expect((await athlete.post(`/api/exercises/${exercise.id}/duplicate`)).status).toBe(403)
    expect((await athlete.post(`/api/exercises/${exercise.id}/clip/upload-url`, { contentType: 'video/webm', size: 10 })).status).toBe(403)
    expect((await athlete.delete(`/api/exercises/${exercise.id}/clip`)).status).toBe(403)
    expect((await athlete.get(`/api/exercises/${exercise.id}/usage`)).status).toBe(403)
    expect((await coach.get<ExerciseView>(`/api/exercises/${exercise.id}`)).data).toMatchObject({ name: 'Single-leg calf raise', hasClip: true })
  })
})

describe('where an exercise is used', () => {
  it('lists live routines through routine_exercises and upcoming assignments from snapshots or those routines', async () => {
    const { userId } = await addAthlete(running.stack, coach, { name: 'Ffion Aske' })
    const exercise = await createExercise(coach, { name: 'Hill sprints for usage' })
    const unused = await createExercise(coach, { name: 'Nobody uses this' })
    const routine = async (title: string, archived = false) => {
      const [row] = await sql(`insert into routines (team_id, title, category, steps, archived_at) values (?, ?, 'hills', '[]', ?) returning id`, [teamId, title, archived ? Date.now() : null] as (string | number)[])
      return Number(row!.id)
    }
    const live = await routine('Ridge hill reps')
    const archived = await routine('Old hill session', true)
    const other = await routine('Gym circuit')
    for (const id of [live, archived]) await sql('insert into routine_exercises (routine_id, exercise_id) values (?, ?)', [id, exercise.id])
    await sql('insert into routine_exercises (routine_id, exercise_id) values (?, ?)', [other, unused.id])

    const snapshot = (ids: number[]) => JSON.stringify({ title: 'Snapshot title', category: 'hills', description: '', steps: [], exercises: ids.map(id => ({ id, name: 'x', category: 'hill', summary: '', cues: [], equipment: [], cautions: [] })) })
    const assign = async (routineId: number, ids: number[], date: string) => {
      const [row] = await sql('insert into assignments (team_id, athlete_id, routine_id, routine_version, snapshot, date) values (?, ?, ?, 1, ?, ?) returning id', [teamId, userId, routineId, snapshot(ids), date])
      return Number(row!.id)
    }
    const viaRoutine = await assign(live, [], '2099-03-01')
    const viaSnapshot = await assign(other, [exercise.id], '2099-02-01')
    await assign(live, [exercise.id], '2000-01-01')
    await assign(other, [unused.id], '2099-02-02')

    const usage = await coach.get<{ routines: { id: number, title: string }[], assignments: { id: number, date: string, athleteName: string, title: string }[], assignmentTotal: number }>(`/api/exercises/${exercise.id}/usage`)
    expect(usage.status).toBe(200)
    expect(usage.data.routines.map(item => item.title)).toEqual(['Ridge hill reps'])
    expect(usage.data.assignments.map(item => item.id)).toEqual([viaSnapshot, viaRoutine])
    expect(usage.data.assignments[0]).toMatchObject({ date: '2099-02-01', athleteName: 'Ffion Aske', title: 'Snapshot title' })
    expect(usage.data.assignmentTotal).toBe(2)

    const none = await coach.get<{ routines: unknown[], assignments: unknown[] }>(`/api/exercises/${unused.id}/usage`)
    expect(none.data.routines).toHaveLength(1)
    // Both upcoming assignments of "Gym circuit" count for it, whatever their snapshots hold.
    expect(none.data.assignments).toHaveLength(2)
  })
})

describe('with the object store down', () => {
  it('upload routes answer 503 with a clear message while the rest of the library keeps working', async () => {
    const exercise = await createExercise(coach, { name: 'Before the outage' })
    await uploadClip(coach, exercise.id)
    const stopStore = running.stack.s3.stop
    running.stack.s3.stop = async () => {}
    await stopStore()

    const upload = await coach.post<FieldError>(`/api/exercises/${exercise.id}/clip/upload-url`, { contentType: 'video/webm', size: 1000 })
    expect(upload.status).toBe(503)
    expect(upload.data.message).toMatch(/clip store cannot be reached/)
    const removal = await coach.delete<FieldError>(`/api/exercises/${exercise.id}/clip`)
    expect(removal.status).toBe(503)
    expect((await coach.get<ExerciseView>(`/api/exercises/${exercise.id}`)).data.hasClip).toBe(true)

    const created = await coach.post<ExerciseView>('/api/exercises', { name: 'During the outage', category: 'drill' })
    expect(created.status).toBe(201)
    expect((await coach.patch(`/api/exercises/${created.data.id}`, { summary: 'Still editable' })).status).toBe(200)
    expect((await coach.get<ExerciseList>('/api/exercises?q=outage')).data.total).toBe(2)
    const copy = await coach.post<ExerciseView & { mediaCopied: boolean }>(`/api/exercises/${exercise.id}/duplicate`)
    expect(copy.status).toBe(201)
    expect(copy.data).toMatchObject({ hasClip: false, mediaCopied: false })
  })
})
