import { BufferTarget, EncodedPacket, EncodedVideoPacketSource, MovOutputFormat, Mp4OutputFormat, Output, WebMOutputFormat } from 'mediabunny'
import { beforeAll, describe, expect, it } from 'vitest'
import { svgToVp8 } from '../../seeds/clip'
import { ApiClient, type FieldError } from '../support/client'
import { addAthlete, registerCoach } from '../support/team'
import { useStack } from '../support/hooks'
import type { ExerciseView } from '../../shared/schemas/exercise'
import type { ClipUploadUrl, ClipCue } from '../../types/api'

const running = useStack()
let coach: ApiClient
let teamId: number

/** A real clip in the given container: `frames` VP8 key frames of width × height at 10 fps. */
async function makeClip(container: 'webm' | 'mp4' | 'mov', frames: number, width: number, height: number) {
  const frame = await svgToVp8(`<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}"><rect width="100%" height="100%" fill="#224668"/></svg>`)
  const format = { webm: new WebMOutputFormat(), mp4: new Mp4OutputFormat(), mov: new MovOutputFormat() }[container]
  const output = new Output({ format, target: new BufferTarget() })
  const source = new EncodedVideoPacketSource('vp8')
  output.addVideoTrack(source, { frameRate: 10 })
  await output.start()
  for (let index = 0; index < frames; index++) {
    await source.add(new EncodedPacket(frame, 'key', index / 10, 0.1), index === 0 ? { decoderConfig: { codec: 'vp8', codedWidth: width, codedHeight: height } } : undefined)
  }
  source.close()
  await output.finalize()
  return new Uint8Array(output.target.buffer!)
}

const sql = (statement: string, args: (string | number)[] = []) => running.fixtures.rows(statement, args)

let counter = 0
async function exerciseWithClip(client: ApiClient, body: Uint8Array, contentType = 'video/webm') {
  counter += 1
  const created = await client.post<ExerciseView>('/api/exercises', { name: `A-skip ${counter}`, category: 'drill', cues: ['Knee drives up', 'Heel stays down'] })
  expect(created.status, created.text).toBe(201)
  const confirmed = await uploadClip(client, created.data.id, body, contentType)
  return confirmed
}

async function uploadClip(client: ApiClient, exerciseId: number, body: Uint8Array, contentType: string) {
  const signed = await client.post<ClipUploadUrl>(`/api/exercises/${exerciseId}/clip/upload-url`, { contentType, size: body.byteLength })
  expect(signed.status, signed.text).toBe(200)
  const put = await fetch(signed.data.url, { method: 'PUT', body: Buffer.from(body), headers: { 'content-type': contentType } })
  expect(put.status).toBe(200)
  const confirmed = await client.post<ExerciseView>(`/api/exercises/${exerciseId}/clip/confirm`, { key: signed.data.key })
  expect(confirmed.status, confirmed.text).toBe(200)
  return confirmed.data
}

beforeAll(async () => {
  const registered = await registerCoach(running.stack, 'Larchford Ridge Runners')
  coach = registered.coach
  teamId = registered.teamId
})

describe('clip length and picture size at confirm', () => {
  it('reads duration, width and height from WebM, MP4 and QuickTime containers in the store', async () => {
    const webm = await exerciseWithClip(coach, await makeClip('webm', 25, 320, 240))
    expect(webm.clip).toMatchObject({ contentType: 'video/webm', width: 320, height: 240 })
    expect(webm.clip!.durationSeconds).toBeCloseTo(2.5, 1)

    const mp4 = await exerciseWithClip(coach, await makeClip('mp4', 42, 640, 360), 'video/mp4')
    expect(mp4.clip).toMatchObject({ contentType: 'video/mp4', width: 640, height: 360 })
    expect(mp4.clip!.durationSeconds).toBeCloseTo(4.2, 1)

    const mov = await exerciseWithClip(coach, await makeClip('mov', 15, 480, 270), 'video/quicktime')
    expect(mov.clip).toMatchObject({ width: 480, height: 270 })
    expect(mov.clip!.durationSeconds).toBeCloseTo(1.5, 1)

    // Stored, and shown to whoever plays it.
    const [row] = await sql('select m.duration_seconds as d, m.width as w from exercises e join media_objects m on m.id = e.clip_id where e.id = ?', [mp4.id])
    expect(Number(row!.w)).toBe(640)
    const playback = await coach.get<{ durationSeconds: number, width: number, captionsUrl: string }>(`/api/exercises/${mp4.id}/clip`)
    expect(playback.data).toMatchObject({ width: 640, captionsUrl: `/captions/${mp4.id}.vtt` })
  })
})

describe('cues at moments', () => {
  it('creates, moves, edits and deletes cues, and serves them as WebVTT in time order', async () => {
    const exercise = await exerciseWithClip(coach, await makeClip('webm', 40, 160, 120))
    const base = `/api/exercises/${exercise.id}/cues`
    const late = await coach.post<ClipCue>(base, { startSeconds: 2.5, text: 'Heel stays down <now> & then --> go' })
    expect(late.status, late.text).toBe(201)
    const early = await coach.post<ClipCue>(base, { startSeconds: 0.5, endSeconds: 1.5, text: 'Knee drives up here' })
    expect(early.status).toBe(201)
    expect((await coach.get<ClipCue[]>(base)).data.map(cue => cue.text)).toEqual(['Knee drives up here', 'Heel stays down <now> & then --> go'])

    const moved = await coach.patch<ClipCue>(`${base}/${early.data.id}`, { startSeconds: 0.6, endSeconds: 1.6 })
    expect(moved.data).toMatchObject({ startSeconds: 0.6, endSeconds: 1.6, text: 'Knee drives up here' })
    const edited = await coach.patch<ClipCue>(`${base}/${early.data.id}`, { text: 'Knee up, toes up' })
    expect(edited.data).toMatchObject({ startSeconds: 0.6, text: 'Knee up, toes up' })

    const track = await coach.get<string>(`/captions/${exercise.id}.vtt`)
    expect(track.status).toBe(200)
    expect(track.headers.get('content-type')).toMatch(/^text\/vtt/)
    expect(track.text).toBe('WEBVTT\n\n1\n00:00:00.600 --> 00:00:01.600\nKnee up, toes up\n\n2\n00:00:02.500 --> 00:00:04.000\nHeel stays down &lt;now&gt; &amp; then --&gt; go\n')

    // The print card reads each exercise's pinned cues, in time order, with the routine.
    const steps = JSON.stringify([{ id: 's1', type: 'block', kind: 'work', measure: { by: 'time', seconds: 60 }, exerciseId: exercise.id }])
    const [routine] = await sql(`insert into routines (team_id, title, category, steps) values (?, 'Drill card', 'drills', ?) returning id`, [teamId, steps])
    const card = await coach.get<{ exercises: { id: number, clipCues: { startSeconds: number, text: string }[] }[] }>(`/api/routines/${Number(routine!.id)}`)
    expect(card.data.exercises[0]!.clipCues).toEqual([
      { startSeconds: 0.6, text: 'Knee up, toes up' },
      { startSeconds: 2.5, text: 'Heel stays down <now> & then --> go' },
    ])

    const removed = await coach.delete(`${base}/${early.data.id}`)
    expect(removed.status).toBe(204)
    expect((await coach.get<ClipCue[]>(base)).data).toHaveLength(1)
    expect((await coach.delete(`${base}/${early.data.id}`)).status).toBe(404)
  })

  it('refuses cues that do not fit, naming the field, and writes nothing', async () => {
    const exercise = await exerciseWithClip(coach, await makeClip('webm', 30, 160, 120))
    const base = `/api/exercises/${exercise.id}/cues`
    const cases: [Record<string, unknown>, string, RegExp][] = [
      [{ startSeconds: 3.5, text: 'Past the end' }, 'startSeconds', /past the end/],
      [{ startSeconds: -1, text: 'Before the start' }, 'startSeconds', /before the clip starts/],
      [{ startSeconds: 1, endSeconds: 3.2, text: 'Ends too late' }, 'endSeconds', /past the end/],
      [{ startSeconds: 2, endSeconds: 1, text: 'Backwards' }, 'endSeconds', /after the start/],
      [{ startSeconds: 1, text: '' }, 'text', /Write the cue/],
      [{ startSeconds: 1, text: 'x'.repeat(141) }, 'text', /at most 140/],
      [{ startSeconds: 'soon', text: 'Not a number' }, 'startSeconds', /number of seconds/],
    ]
    for (const [body, field, message] of cases) {
      const response = await coach.post<FieldError>(base, body)
      expect(response.status, JSON.stringify(body)).toBe(400)
      expect(response.data.data?.fields?.[field], JSON.stringify(body)).toMatch(message)
    }
    expect((await coach.post(base, { startSeconds: 1, text: 'x'.repeat(140) })).status).toBe(201)

    const cue = (await coach.get<ClipCue[]>(base)).data[0]!
    const badMove = await coach.patch<FieldError>(`${base}/${cue.id}`, { startSeconds: 9 })
    expect(badMove.status).toBe(400)
    expect(badMove.data.data?.fields?.startSeconds).toMatch(/past the end/)
    expect((await coach.get<ClipCue[]>(base)).data[0]!.startSeconds).toBe(1)

    for (let index = 1; index < 40; index++) expect((await coach.post(base, { startSeconds: index * 0.07, text: `Cue ${index}` })).status).toBe(201)
    const tooMany = await coach.post<FieldError>(base, { startSeconds: 2, text: 'One too many' })
    expect(tooMany.status).toBe(400)
    expect(tooMany.data.data?.fields?.cues).toMatch(/at most 40/)
    expect((await coach.get<ClipCue[]>(base)).data).toHaveLength(40)
  })

  it('keeps the cues when the clip is replaced, and fits them to a shorter one on request', async () => {
    const exercise = await exerciseWithClip(coach, await makeClip('webm', 40, 160, 120))
    const base = `/api/exercises/${exercise.id}/cues`
    await coach.post(base, { startSeconds: 1, text: 'Early' })
    await coach.post(base, { startSeconds: 3, endSeconds: 3.8, text: 'Late' })
    const replaced = await uploadClip(coach, exercise.id, await makeClip('webm', 20, 160, 120), 'video/webm')
    expect(replaced.clip!.durationSeconds).toBeCloseTo(2, 1)
    expect((await coach.get<ClipCue[]>(base)).data.map(cue => cue.startSeconds)).toEqual([1, 3])

    const clamped = await coach.post<ClipCue[]>(`${base}/fit`, { mode: 'clamp' })
    expect(clamped.data.map(cue => [cue.startSeconds, cue.endSeconds])).toEqual([[1, null], [1.9, 2]])
    expect((await coach.post<FieldError>(`${base}/fit`, { mode: 'scale' })).data.data?.fields?.fromSeconds).toBeTruthy()
  })

  it('scales cues to the new length', async () => {
    const exercise = await exerciseWithClip(coach, await makeClip('webm', 20, 160, 120))
    const base = `/api/exercises/${exercise.id}/cues`
    await coach.post(base, { startSeconds: 1, endSeconds: 1.5, text: 'Half-way' })
    const scaled = await coach.post<ClipCue[]>(`${base}/fit`, { mode: 'scale', fromSeconds: 4 })
    expect(scaled.data[0]).toMatchObject({ startSeconds: 0.5, endSeconds: 0.75 })
  })

  it('serves the track to the team\'s coaches and to athletes with the exercise in an assignment; 404 for everyone else', async () => {
    const exercise = await exerciseWithClip(coach, await makeClip('webm', 20, 160, 120))
    await coach.post(`/api/exercises/${exercise.id}/cues`, { startSeconds: 0.5, text: 'Tall' })
    const { athlete, userId } = await addAthlete(running.stack, coach)
    const { athlete: teammate } = await addAthlete(running.stack, coach, { name: 'Ivo Penhale' })
    const { coach: otherCoach } = await registerCoach(running.stack, 'Another club')
    const stranger = new ApiClient(running.stack.url)

    expect((await athlete.get(`/captions/${exercise.id}.vtt`)).status).toBe(404)
    const [routine] = await sql(`insert into routines (team_id, title, category, steps) values (?, 'Drills', 'drills', '[]') returning id`, [teamId])
    const snapshot = JSON.stringify({ title: 'Drills', category: 'drills', description: '', steps: [], exercises: [{ id: exercise.id, name: 'x', category: 'drill', summary: '', cues: [], equipment: [], cautions: [] }] })
    await sql('insert into assignments (team_id, athlete_id, routine_id, routine_version, snapshot, date) values (?, ?, ?, 1, ?, ?)', [teamId, userId, Number(routine!.id), snapshot, '2099-02-01'])

    const mine = await athlete.get<string>(`/captions/${exercise.id}.vtt`)
    expect(mine.status).toBe(200)
    expect(mine.text).toContain('Tall')
    expect((await athlete.get<ClipCue[]>(`/api/exercises/${exercise.id}/cues`)).data).toHaveLength(1)
    expect((await athlete.post(`/api/exercises/${exercise.id}/cues`, { startSeconds: 1, text: 'Mine' })).status).toBe(403)
    expect((await teammate.get(`/captions/${exercise.id}.vtt`)).status).toBe(404)
    expect((await otherCoach.get(`/captions/${exercise.id}.vtt`)).status).toBe(404)
    expect((await otherCoach.get(`/api/exercises/${exercise.id}/cues`)).status).toBe(404)
    expect((await otherCoach.post(`/api/exercises/${exercise.id}/cues`, { startSeconds: 1, text: 'Theirs' })).status).toBe(404)
    expect((await stranger.get(`/captions/${exercise.id}.vtt`)).status).toBe(401)
    expect((await coach.get('/captions/abc.vtt')).status).toBe(404)
    expect((await coach.get('/captions/999999.vtt')).status).toBe(404)
  })
})
