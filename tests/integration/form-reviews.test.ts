import { HeadObjectCommand, S3Client } from '@aws-sdk/client-s3'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { makeDemoClip } from '../../seeds/clip'
import type { ApiClient, FieldError } from '../support/client'
import { addAthlete, addCoach, registerCoach } from '../support/team'
import { useStack } from '../support/hooks'
import type { FormReview, ReviewUploadUrl } from '../../types/api'

const running = useStack({ MEDIA_SWEEP_INTERVAL_MS: '300' })
let s3: S3Client
let clip: Buffer

beforeAll(async () => {
  s3 = new S3Client({ endpoint: running.stack.s3.endpoint, region: 'us-east-1', forcePathStyle: true, credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' } })
  clip = await makeDemoClip({ seconds: 3, framesPerSecond: 8 })
})

afterAll(async () => {
  s3?.destroy()
})

const exists = (key: string) => s3.send(new HeadObjectCommand({ Bucket: running.stack.s3.bucket, Key: key })).then(() => true, () => false)

const sql = (statement: string, args: (string | number)[] = []) => running.fixtures.rows(statement, args)

async function put(client: ApiClient, path: string, body: Buffer) {
  const signed = await client.post<ReviewUploadUrl>(path, { contentType: 'video/webm', size: body.byteLength })
  expect(signed.status, signed.text).toBe(200)
  expect((await fetch(signed.data.url, { method: 'PUT', body: new Uint8Array(body), headers: { 'content-type': 'video/webm' } })).status).toBe(200)
  return signed.data.key
}

async function sendForReview(athlete: ApiClient, question = 'Is my knee drive high enough?') {
  const key = await put(athlete, '/api/reviews/upload-url', clip)
  const created = await athlete.post<FormReview>('/api/reviews', { key, question })
  expect(created.status, created.text).toBe(201)
  return { key, review: created.data }
}

describe('form review', () => {
  it('an athlete sends a clip; the coach comments at moments, links an exercise, replies with a clip and the athlete is e-mailed', async () => {
    const { coach } = await registerCoach(running.stack, 'Larchford Ridge Runners')
    const athlete = await addAthlete(running.stack, coach, { name: 'Ffion Aske' })
    const { key, review } = await sendForReview(athlete.athlete)
    expect(key).toMatch(new RegExp(`/reviews/${athlete.userId}/`))
    expect(review).toMatchObject({ status: 'open', question: 'Is my knee drive high enough?', comments: [], reply: null })
    expect(review.durationSeconds).toBeCloseTo(3, 0)

    const queue = await coach.get<{ items: { id: number, athleteName: string }[], openCount: number }>('/api/reviews?status=open')
    expect(queue.data.openCount).toBe(1)
    expect(queue.data.items[0]).toMatchObject({ id: review.id, athleteName: 'Ffion Aske' })

    const base = `/api/reviews/${review.id}`
    expect((await coach.post(`${base}/comments`, { atSeconds: 2, text: 'Knee higher here' })).status).toBe(201)
    const commented = await coach.post<FormReview>(`${base}/comments`, { atSeconds: 0.5, text: 'Good tall start' })
    expect(commented.data.comments.map(comment => [comment.atSeconds, comment.text])).toEqual([[0.5, 'Good tall start'], [2, 'Knee higher here']])

    for (const [body, field, message] of [
      [{ atSeconds: 1, text: '' }, 'text', /Write the comment/],
      [{ atSeconds: 1, text: 'x'.repeat(2001) }, 'text', /at most 2000/],
      [{ atSeconds: 4, text: 'Past the end' }, 'atSeconds', /past the end/],
      [{ atSeconds: -1, text: 'Before' }, 'atSeconds', /before the clip starts/],
    ] as const) {
      const response = await coach.post<FieldError>(`${base}/comments`, body)
      expect(response.status).toBe(400)
      expect(response.data.data?.fields?.[field]).toMatch(message)
    }
    expect((await athlete.athlete.post(`${base}/comments`, { atSeconds: 1, text: 'Me' })).status).toBe(403)

    const exercise = await coach.post<{ id: number }>('/api/exercises', { name: 'A-skips', category: 'drill', cues: ['Knee drives up'] })
    const linked = await coach.patch<FormReview>(base, { exerciseId: exercise.data.id })
    expect(linked.data.exercise).toMatchObject({ name: 'A-skips', cues: ['Knee drives up'] })

    const replyKey = await put(coach, `${base}/reply-url`, clip)
    const answered = await coach.post<FormReview>(`${base}/answer`, { replyKey })
    expect(answered.status, answered.text).toBe(200)
    expect(answered.data.status).toBe('answered')
    expect(answered.data.reply?.url).toBeTruthy()
    const mail = await running.stack.mail.waitFor(athlete.email, /answered your form review/)
    expect(mail.text).toContain(`/reviews/${review.id}`)

    const seen = await athlete.athlete.get<FormReview>(base)
    expect(seen.data.comments.map(comment => comment.text)).toEqual(['Good tall start', 'Knee higher here'])
    expect(seen.data.reply).not.toBeNull()
    expect((await fetch(seen.data.clip.url)).status).toBe(200)
  })

  it('keeps each clip to its athlete and the team\'s coaches (404 otherwise), and refuses what is not a short video', async () => {
    const { coach } = await registerCoach(running.stack)
    const athlete = await addAthlete(running.stack, coach)
    const teammate = await addAthlete(running.stack, coach, { name: 'Ivo Penhale' })
    const { coach: otherCoach } = await registerCoach(running.stack, 'Another club')
    const { review } = await sendForReview(athlete.athlete)

    expect((await teammate.athlete.get(`/api/reviews/${review.id}`)).status).toBe(404)
    expect((await otherCoach.get(`/api/reviews/${review.id}`)).status).toBe(404)
    expect((await otherCoach.post(`/api/reviews/${review.id}/comments`, { atSeconds: 1, text: 'Hi' })).status).toBe(404)
    expect((await teammate.athlete.delete(`/api/reviews/${review.id}`)).status).toBe(404)
    expect((await teammate.athlete.get<{ items: unknown[] }>('/api/reviews')).data.items).toHaveLength(0)
    expect((await otherCoach.get<{ items: unknown[] }>('/api/reviews')).data.items).toHaveLength(0)

    // Another athlete's key cannot be claimed, and a coach cannot send a clip as an athlete.
    const key = await put(athlete.athlete, '/api/reviews/upload-url', clip)
    const stolen = await teammate.athlete.post<FieldError>('/api/reviews', { key })
    expect(stolen.status).toBe(400)
    expect(stolen.data.data?.fields?.key).toMatch(/not in this athlete/)
    expect((await coach.post('/api/reviews/upload-url', { contentType: 'video/webm', size: 10 })).status).toBe(403)

    const tooBig = await athlete.athlete.post<FieldError>('/api/reviews/upload-url', { contentType: 'video/webm', size: 100 * 1024 * 1024 + 1 })
    expect(tooBig.data.data?.fields?.size).toMatch(/100 MB/)
    const notVideo = await athlete.athlete.post<FieldError>('/api/reviews/upload-url', { contentType: 'image/png', size: 10 })
    expect(notVideo.data.data?.fields?.contentType).toMatch(/video/)
    const longKey = await put(athlete.athlete, '/api/reviews/upload-url', await makeDemoClip({ seconds: 62, framesPerSecond: 1, width: 64, height: 48 }))
    const tooLong = await athlete.athlete.post<FieldError>('/api/reviews', { key: longKey })
    expect(tooLong.status).toBe(400)
    expect(tooLong.data.data?.fields?.key).toMatch(/at most 60 s/)
    expect(await exists(longKey)).toBe(false)
  })

  it('an athlete deletes their clip and the object leaves the store; the sweep removes clips past the team\'s retention', async () => {
    const { coach, teamId } = await registerCoach(running.stack)
    const athlete = await addAthlete(running.stack, coach)
    const { key, review } = await sendForReview(athlete.athlete)
    expect(await exists(key)).toBe(true)
    expect((await coach.delete(`/api/reviews/${review.id}`)).status).toBe(403)
    expect((await athlete.athlete.delete(`/api/reviews/${review.id}`)).status).toBe(204)
    expect(await exists(key)).toBe(false)
    expect((await athlete.athlete.get(`/api/reviews/${review.id}`)).status).toBe(404)

    const old = await sendForReview(athlete.athlete, 'An old one')
    const fresh = await sendForReview(athlete.athlete, 'A new one')
    // The head coach's setting, through the team settings route, is what the sweep reads.
    expect((await coach.patch('/api/team', { reviewRetentionDays: 30 })).status).toBe(200)
    expect(await sql('select review_retention_days as days from teams where id = ?', [teamId])).toMatchObject([{ days: 30 }])
    await sql('update form_reviews set created_at = ? where id = ?', [Date.now() - 31 * 86_400_000, old.review.id])
    await expect.poll(() => exists(old.key), { timeout: 10_000 }).toBe(false)
    expect((await athlete.athlete.get(`/api/reviews/${old.review.id}`)).status).toBe(404)
    expect((await athlete.athlete.get(`/api/reviews/${fresh.review.id}`)).status).toBe(200)
    expect(await exists(fresh.key)).toBe(true)
  })

  it('counts the clips waiting for the team\'s coaches (coaches only, one team), and the queue narrows to a squad, newest first', async () => {
    const { coach } = await registerCoach(running.stack)
    const plainCoach = (await addCoach(running.stack, coach)).coach
    const { coach: otherCoach } = await registerCoach(running.stack, 'Another club')
    const road = await coach.post<{ id: number }>('/api/squads', { name: 'Road' })
    const trail = await coach.post<{ id: number }>('/api/squads', { name: 'Trail' })
    expect([road.status, trail.status]).toEqual([201, 201])
    const roadRunner = await addAthlete(running.stack, coach, { name: 'Cai Penhallow', squadId: road.data.id })
    const trailRunner = await addAthlete(running.stack, coach, { name: 'Wren Calder', squadId: trail.data.id })
    const count = async (client: ApiClient) => (await client.get<{ open: number }>('/api/reviews/open-count')).data.open

    expect(await count(coach)).toBe(0)
    const first = await sendForReview(roadRunner.athlete, 'First')
    const second = await sendForReview(trailRunner.athlete, 'Second')
    const third = await sendForReview(roadRunner.athlete, 'Third')
    expect(await count(coach)).toBe(3)
    expect(await count(plainCoach)).toBe(3)
    expect(await count(otherCoach)).toBe(0)
    expect((await roadRunner.athlete.get('/api/reviews/open-count')).status).toBe(403)

    expect((await coach.post(`/api/reviews/${second.review.id}/answer`, {})).status).toBe(200)
    expect(await count(coach)).toBe(2)

    type Queue = { items: { id: number, athleteName: string }[] }
    const roadQueue = await coach.get<Queue>(`/api/reviews?status=all&squadId=${road.data.id}`)
    expect(roadQueue.data.items.map(item => item.id)).toEqual([third.review.id, first.review.id])
    const trailQueue = await coach.get<Queue>(`/api/reviews?status=open&squadId=${trail.data.id}`)
    expect(trailQueue.data.items).toEqual([])
    const everyone = await coach.get<Queue>('/api/reviews?status=all')
    expect(everyone.data.items.map(item => item.id)).toEqual([third.review.id, second.review.id, first.review.id])
    // Another team's squad id narrows this team's queue to nothing rather than leaking its clips.
    const rivalSquad = await otherCoach.post<{ id: number }>('/api/squads', { name: 'Hills' })
    expect((await coach.get<Queue>(`/api/reviews?squadId=${rivalSquad.data.id}`)).data.items).toEqual([])
    const badSquad = await coach.get<FieldError>('/api/reviews?squadId=road')
    expect(badSquad.status).toBe(400)
    expect(badSquad.data.data?.fields?.squadId).toBeTruthy()
  })

  it('lets the head coach set how long clips are kept (a whole number of days, 7 to 730), and no one else', async () => {
    const { coach: head, teamId } = await registerCoach(running.stack)
    const { coach } = await addCoach(running.stack, head)
    const athlete = await addAthlete(running.stack, head)
    type Team = { team: { reviewRetentionDays: number } }
    expect((await head.get<Team>('/api/team')).data.team.reviewRetentionDays).toBe(180)

    const refused = await coach.patch('/api/team', { reviewRetentionDays: 30 })
    expect(refused.status).toBe(403)
    expect((await athlete.athlete.patch('/api/team', { reviewRetentionDays: 30 })).status).toBe(403)

    for (const [value, message] of [[3, /at least 7/], [731, /at most 730/], [14.5, /whole number/], ['30', /number of days/], [null, /number of days/]] as const) {
      const response = await head.patch<FieldError>('/api/team', { name: 'Half written', reviewRetentionDays: value })
      expect(response.status, String(value)).toBe(400)
      expect(response.data.data?.fields?.reviewRetentionDays, String(value)).toMatch(message)
    }
    // Nothing half-written: neither the name sent beside a bad value nor the setting changed.
    expect(await sql('select name, review_retention_days as days from teams where id = ?', [teamId])).toMatchObject([{ name: 'Larchford Hill Harriers', days: 180 }])

    const saved = await head.patch<{ reviewRetentionDays: number, name: string }>('/api/team', { reviewRetentionDays: 45 })
    expect(saved.status, saved.text).toBe(200)
    expect(saved.data).toMatchObject({ reviewRetentionDays: 45, name: 'Larchford Hill Harriers' })
    expect((await coach.get<Team>('/api/team')).data.team.reviewRetentionDays).toBe(45)
  })
})
