import { createHash, randomBytes } from 'node:crypto'
import { readdirSync } from 'node:fs'
import { join, relative } from 'node:path'
import { beforeAll, describe, expect, it } from 'vitest'
import type { AssignmentSnapshot } from '../../shared/types/domain'
import { ApiClient, uniqueEmail } from '../support/client'
import { linkIn } from '../support/mail-catcher'
import { root } from '../support/stack'
import { addAthlete, PASSWORD, registerCoach } from '../support/team'
import { useStack } from '../support/hooks'

// Who may call each route file, checked on the built server with real ids. Every file under
// server/api and server/routes needs a row here; a new route without one fails the first test.
//
// A row gives the request and the status each caller gets, in this order:
//   [signed out, the athlete, another athlete of the team, a coach, the head coach, a coach of another team]
// `fresh` rows change or remove what they touch, so each caller gets new ids (`ids()` is called per caller).

const callers = ['signed out', 'athlete', 'teammate', 'coach', 'head coach', 'other team coach'] as const
type Statuses = [number, number, number, number, number, number]

interface Ids {
  athleteId: number
  mateId: number
  exerciseId: number
  routineId: number
  assignmentId: number
  seriesId: number
  noteId: number
  squadId: number
  inviteId: number
  inviteToken: string
  sessionId: number
  entryId: number
  painFlagId: number
  feedToken: string
  coachId: number
  rivalTeamId: number
  leaverId: number
  blockId: number
  blockRoutineId: number
  blockStart: string
  clipExerciseId: number
  cueId: number
  reviewId: number
}

interface Row {
  method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE'
  path: (ids: Ids) => string
  body?: (ids: Ids) => unknown
  fresh?: boolean
  expect: Statuses
}

const signedOutOnly = (status: number): Statuses => [status, status, status, status, status, status]
const coachRead: Statuses = [401, 403, 403, 200, 200, 200]
const coachReadById: Statuses = [401, 403, 403, 200, 200, 404]
const athleteOwn: Statuses = [401, 200, 200, 403, 403, 403]
const anyMember: Statuses = [401, 200, 200, 200, 200, 200]

const matrix: Record<string, Row> = {
  'server/api/assignments/[id].delete.ts': { method: 'DELETE', path: i => `/api/assignments/${i.assignmentId}`, fresh: true, expect: [401, 403, 403, 204, 204, 404] },
  'server/api/assignments/[id].patch.ts': { method: 'PATCH', path: i => `/api/assignments/${i.assignmentId}`, body: () => ({ note: 'Easy on the descents' }), expect: [401, 403, 403, 200, 200, 404] },
  'server/api/assignments/[id]/plan.get.ts': { method: 'GET', path: i => `/api/assignments/${i.assignmentId}/plan`, expect: [401, 200, 404, 403, 403, 403] },
  'server/api/assignments/[id]/rest-of-series.delete.ts': { method: 'DELETE', path: i => `/api/assignments/${i.assignmentId}/rest-of-series`, fresh: true, expect: [401, 403, 403, 200, 200, 404] },
  'server/api/assignments/[id]/sessions.post.ts': { method: 'POST', path: i => `/api/assignments/${i.assignmentId}/sessions`, body: () => ({ clientId: `matrix-${Math.random()}` }), fresh: true, expect: [401, 201, 404, 403, 403, 403] },
  'server/api/assignments/index.get.ts': { method: 'GET', path: () => `/api/assignments?from=2026-01-05&to=2026-02-01`, expect: coachRead },
  'server/api/assignments/index.post.ts': { method: 'POST', path: () => '/api/assignments', body: i => ({ routineId: i.routineId, athleteIds: [i.athleteId], dates: [today()] }), fresh: true, expect: [401, 403, 403, 201, 201, 400] },
  'server/api/assignments/refresh-routine.post.ts': { method: 'POST', path: () => '/api/assignments/refresh-routine', body: i => ({ routineId: i.routineId }), expect: [401, 403, 403, 200, 200, 404] },
  'server/api/assignments/series/[id]/sync-squad.post.ts': { method: 'POST', path: i => `/api/assignments/series/${i.seriesId}/sync-squad`, expect: [401, 403, 403, 400, 400, 404] },
  'server/api/athletes/[id]/injury-notes.post.ts': { method: 'POST', path: i => `/api/athletes/${i.athleteId}/injury-notes`, body: () => ({ bodyArea: 'ankle', note: 'Rolled it on the trail' }), expect: [401, 403, 403, 201, 201, 404] },
  'server/api/athletes/[id]/logbook.get.ts': { method: 'GET', path: i => `/api/athletes/${i.athleteId}/logbook`, expect: coachReadById },
  'server/api/athletes/[id]/profile.get.ts': { method: 'GET', path: i => `/api/athletes/${i.athleteId}/profile`, expect: coachReadById },
  'server/api/athletes/[id]/profile.patch.ts': { method: 'PATCH', path: i => `/api/athletes/${i.athleteId}/profile`, body: () => ({ goal: 'Stronger on the climbs' }), expect: coachReadById },
  'server/api/athletes/index.get.ts': { method: 'GET', path: () => '/api/athletes', expect: coachRead },
  'server/api/auth/login.post.ts': { method: 'POST', path: () => '/api/auth/login', body: () => ({ email: uniqueEmail('nobody'), password: 'not-the-password' }), expect: signedOutOnly(401) },
  'server/api/auth/logout.post.ts': { method: 'POST', path: () => '/api/auth/logout', fresh: true, expect: signedOutOnly(204) },
  'server/api/auth/password-reset.post.ts': { method: 'POST', path: () => '/api/auth/password-reset', body: () => ({ email: uniqueEmail('nobody') }), expect: signedOutOnly(202) },
  'server/api/auth/password-reset/[token].post.ts': { method: 'POST', path: () => `/api/auth/password-reset/${'x'.repeat(43)}`, body: () => ({ password: 'a-new-password-1' }), expect: signedOutOnly(404) },
  'server/api/auth/register.post.ts': { method: 'POST', path: () => '/api/auth/register', body: () => ({ name: 'Wren Hollis', email: uniqueEmail('reg'), password: PASSWORD, teamName: 'Larchford Juniors' }), fresh: true, expect: signedOutOnly(201) },
  'server/api/entries/[id].patch.ts': { method: 'PATCH', path: i => `/api/entries/${i.entryId}`, body: () => ({ seconds: 21 }), expect: [401, 200, 404, 403, 403, 403] },
  'server/api/exercises/[id].get.ts': { method: 'GET', path: i => `/api/exercises/${i.exerciseId}`, expect: [401, 404, 404, 200, 200, 404] },
  'server/api/exercises/[id].patch.ts': { method: 'PATCH', path: i => `/api/exercises/${i.exerciseId}`, body: () => ({ summary: 'Tall posture, quick feet' }), expect: [401, 403, 403, 200, 200, 404] },
  'server/api/exercises/[id]/archive.post.ts': { method: 'POST', path: i => `/api/exercises/${i.exerciseId}/archive`, body: () => ({ archived: false }), expect: [401, 403, 403, 200, 200, 404] },
  'server/api/exercises/[id]/clip/confirm.post.ts': { method: 'POST', path: i => `/api/exercises/${i.exerciseId}/clip/confirm`, body: () => ({ key: 'nothing-uploaded' }), expect: [401, 403, 403, 400, 400, 404] },
  'server/api/exercises/[id]/clip/index.delete.ts': { method: 'DELETE', path: i => `/api/exercises/${i.exerciseId}/clip`, expect: [401, 403, 403, 404, 404, 404] },
  'server/api/exercises/[id]/clip/index.get.ts': { method: 'GET', path: i => `/api/exercises/${i.exerciseId}/clip`, expect: [401, 404, 404, 404, 404, 404] },
  'server/api/exercises/[id]/clip/upload-url.post.ts': { method: 'POST', path: i => `/api/exercises/${i.exerciseId}/clip/upload-url`, body: () => ({ contentType: 'video/mp4', size: 1000 }), expect: [401, 403, 403, 200, 200, 404] },
  'server/api/exercises/[id]/duplicate.post.ts': { method: 'POST', path: i => `/api/exercises/${i.exerciseId}/duplicate`, expect: [401, 403, 403, 201, 201, 404] },
  'server/api/exercises/[id]/usage.get.ts': { method: 'GET', path: i => `/api/exercises/${i.exerciseId}/usage`, expect: coachReadById },
  'server/api/exercises/index.get.ts': { method: 'GET', path: () => '/api/exercises', expect: anyMember },
  'server/api/exercises/index.post.ts': { method: 'POST', path: () => '/api/exercises', body: () => ({ name: `Skip ${Math.random()}`, category: 'drill' }), expect: [401, 403, 403, 201, 201, 201] },
  'server/api/health.get.ts': { method: 'GET', path: () => '/api/health', expect: signedOutOnly(200) },
  'server/api/injury-notes/[id].patch.ts': { method: 'PATCH', path: i => `/api/injury-notes/${i.noteId}`, body: () => ({ note: 'Better after rest' }), expect: [401, 200, 404, 200, 200, 404] },
  'server/api/insights/athletes/[id].get.ts': { method: 'GET', path: i => `/api/insights/athletes/${i.athleteId}`, expect: [401, 200, 404, 200, 200, 404] },
  'server/api/insights/team.get.ts': { method: 'GET', path: () => '/api/insights/team', expect: coachRead },
  'server/api/invites/[token].get.ts': { method: 'GET', path: i => `/api/invites/${i.inviteToken}`, expect: signedOutOnly(200) },
  'server/api/invites/[token]/accept.post.ts': { method: 'POST', path: () => `/api/invites/${'y'.repeat(43)}/accept`, body: () => ({ name: 'Wren Hollis', password: PASSWORD }), expect: signedOutOnly(404) },
  'server/api/invites/index.post.ts': { method: 'POST', path: () => '/api/invites', body: () => ({ email: uniqueEmail('matrix'), role: 'athlete' }), expect: [401, 403, 403, 201, 201, 201] },
  'server/api/me.get.ts': { method: 'GET', path: () => '/api/me', expect: anyMember },
  'server/api/me/assignments.get.ts': { method: 'GET', path: () => '/api/me/assignments', expect: athleteOwn },
  'server/api/me/calendar-feed.delete.ts': { method: 'DELETE', path: () => '/api/me/calendar-feed', expect: [401, 204, 204, 403, 403, 403] },
  'server/api/me/calendar-feed.get.ts': { method: 'GET', path: () => '/api/me/calendar-feed', expect: athleteOwn },
  'server/api/me/calendar-feed.post.ts': { method: 'POST', path: () => '/api/me/calendar-feed', expect: [401, 201, 201, 403, 403, 403] },
  'server/api/me/injury-notes.post.ts': { method: 'POST', path: () => '/api/me/injury-notes', body: () => ({ bodyArea: 'calf', note: 'Tight after hills' }), expect: [401, 201, 201, 403, 403, 403] },
  'server/api/me/insights.get.ts': { method: 'GET', path: () => '/api/me/insights', expect: athleteOwn },
  'server/api/me/logbook.get.ts': { method: 'GET', path: () => '/api/me/logbook', expect: athleteOwn },
  'server/api/me/next-assignment.get.ts': { method: 'GET', path: i => `/api/me/next-assignment?routineId=${i.routineId}`, expect: [401, 200, 404, 403, 403, 403] },
  'server/api/me/notifications.get.ts': { method: 'GET', path: () => '/api/me/notifications', expect: athleteOwn },
  'server/api/me/notifications.patch.ts': { method: 'PATCH', path: () => '/api/me/notifications', body: () => ({ notifyByEmail: true }), expect: athleteOwn },
  'server/api/me/paces.get.ts': { method: 'GET', path: () => '/api/me/paces', expect: athleteOwn },
  'server/api/me/pain-flags.get.ts': { method: 'GET', path: () => '/api/me/pain-flags', expect: athleteOwn },
  'server/api/me/password.post.ts': { method: 'POST', path: () => '/api/me/password', body: () => ({ currentPassword: 'not-the-password', newPassword: 'another-password-1' }), expect: [401, 400, 400, 400, 400, 400] },
  'server/api/me/profile.get.ts': { method: 'GET', path: () => '/api/me/profile', expect: athleteOwn },
  'server/api/me/profile.patch.ts': { method: 'PATCH', path: () => '/api/me/profile', body: () => ({ goal: 'Finish the ridge race' }), expect: athleteOwn },
  'server/api/me/sign-out-everywhere.post.ts': { method: 'POST', path: () => '/api/me/sign-out-everywhere', fresh: true, expect: anyMember },
  'server/api/pain-flags/[id]/acknowledge.post.ts': { method: 'POST', path: i => `/api/pain-flags/${i.painFlagId}/acknowledge`, body: () => ({ reply: '' }), expect: [401, 403, 403, 200, 200, 404] },
  'server/api/pain-flags/index.get.ts': { method: 'GET', path: () => '/api/pain-flags', expect: coachRead },
  'server/api/planner/options.get.ts': { method: 'GET', path: () => '/api/planner/options', expect: coachRead },
  'server/api/routines/[id].get.ts': { method: 'GET', path: i => `/api/routines/${i.routineId}`, expect: [401, 403, 403, 200, 200, 404] },
  'server/api/routines/[id].put.ts': { method: 'PUT', path: i => `/api/routines/${i.routineId}`, body: () => ({ title: 'Ridge hills', category: 'hills', description: '', version: 1, steps: [{ id: 'w', type: 'block', kind: 'work', measure: { by: 'time', seconds: 60 } }] }), fresh: true, expect: [401, 403, 403, 200, 200, 404] },
  'server/api/routines/[id]/archive.post.ts': { method: 'POST', path: i => `/api/routines/${i.routineId}/archive`, body: () => ({ archived: false }), expect: [401, 403, 403, 200, 200, 404] },
  'server/api/routines/[id]/duplicate.post.ts': { method: 'POST', path: i => `/api/routines/${i.routineId}/duplicate`, expect: [401, 403, 403, 201, 201, 404] },
  'server/api/routines/[id]/preview.get.ts': { method: 'GET', path: i => `/api/routines/${i.routineId}/preview?athleteId=${i.athleteId}`, expect: coachReadById },
  'server/api/routines/index.get.ts': { method: 'GET', path: () => '/api/routines', expect: coachRead },
  'server/api/routines/index.post.ts': { method: 'POST', path: () => '/api/routines', body: () => ({ title: 'Strides', category: 'drills', steps: [{ id: 's', type: 'block', kind: 'work', measure: { by: 'time', seconds: 20 } }] }), expect: [401, 403, 403, 201, 201, 201] },
  'server/api/sessions/[id].get.ts': { method: 'GET', path: i => `/api/sessions/${i.sessionId}`, expect: [401, 200, 404, 200, 200, 404] },
  'server/api/sessions/[id]/entries.post.ts': { method: 'POST', path: i => `/api/sessions/${i.sessionId}/entries`, body: () => ({ idempotencyKey: 'matrix-entry-1', stepId: 'w', seconds: 60 }), expect: [401, 200, 404, 403, 403, 403] },
  'server/api/sessions/[id]/finish.post.ts': { method: 'POST', path: i => `/api/sessions/${i.sessionId}/finish`, body: () => ({ sessionRpe: 4 }), fresh: true, expect: [401, 200, 404, 403, 403, 403] },
  'server/api/squads/[id].delete.ts': { method: 'DELETE', path: i => `/api/squads/${i.squadId}`, fresh: true, expect: [401, 403, 403, 204, 204, 404] },
  'server/api/squads/[id].patch.ts': { method: 'PATCH', path: i => `/api/squads/${i.squadId}`, body: () => ({ name: 'Ridge group' }), expect: [401, 403, 403, 200, 200, 404] },
  'server/api/squads/[id]/members.put.ts': { method: 'PUT', path: i => `/api/squads/${i.squadId}/members`, body: i => ({ athleteIds: [i.athleteId] }), expect: [401, 403, 403, 200, 200, 404] },
  'server/api/squads/index.get.ts': { method: 'GET', path: () => '/api/squads', expect: coachRead },
  'server/api/squads/index.post.ts': { method: 'POST', path: () => '/api/squads', body: () => ({ name: 'Hill group' }), expect: [401, 403, 403, 201, 201, 201] },
  'server/api/team/index.get.ts': { method: 'GET', path: () => '/api/team', expect: coachRead },
  'server/api/team/invites/[id]/resend.post.ts': { method: 'POST', path: i => `/api/team/invites/${i.inviteId}/resend`, expect: [401, 403, 403, 200, 200, 404] },
  'server/api/team/invites/[id]/revoke.post.ts': { method: 'POST', path: i => `/api/team/invites/${i.inviteId}/revoke`, fresh: true, expect: [401, 403, 403, 204, 204, 404] },
  'server/routes/calendar/[token].ics.ts': { method: 'GET', path: i => `/calendar/${i.feedToken}.ics`, fresh: true, expect: signedOutOnly(200) },
  'server/api/blocks/[id].get.ts': { method: 'GET', path: i => `/api/blocks/${i.blockId}`, expect: coachReadById },
  'server/api/blocks/[id].put.ts': { method: 'PUT', path: i => `/api/blocks/${i.blockId}`, body: i => blockBody(i, true), expect: [401, 403, 403, 200, 200, 404] },
  'server/api/blocks/[id]/plan.post.ts': { method: 'POST', path: i => `/api/blocks/${i.blockId}/plan`, fresh: true, expect: [401, 403, 403, 200, 200, 404] },
  'server/api/blocks/[id]/progress.get.ts': { method: 'GET', path: i => `/api/blocks/${i.blockId}/progress`, expect: coachReadById },
  'server/api/blocks/[id]/weeks/[week].put.ts': { method: 'PUT', path: i => `/api/blocks/${i.blockId}/weeks/1`, body: i => ({ blockRoutineId: i.blockRoutineId, values: [] }), expect: [401, 403, 403, 200, 200, 404] },
  'server/api/blocks/index.get.ts': { method: 'GET', path: () => '/api/blocks', expect: coachRead },
  'server/api/blocks/index.post.ts': { method: 'POST', path: () => '/api/blocks', body: i => blockBody(i), expect: [401, 403, 403, 201, 201, 400] },
  'server/api/blocks/preview.post.ts': { method: 'POST', path: () => '/api/blocks/preview', body: i => blockBody(i), expect: [401, 403, 403, 200, 200, 400] },
  'server/api/coach/checklist.post.ts': { method: 'POST', path: () => '/api/coach/checklist', body: () => ({ dismissed: false }), expect: coachRead },
  'server/api/coach/home.get.ts': { method: 'GET', path: () => '/api/coach/home', expect: coachRead },
  'server/api/exercises/[id]/cues/[cueId].delete.ts': { method: 'DELETE', path: i => `/api/exercises/${i.clipExerciseId}/cues/${i.cueId}`, fresh: true, expect: [401, 403, 403, 204, 204, 404] },
  'server/api/exercises/[id]/cues/[cueId].patch.ts': { method: 'PATCH', path: i => `/api/exercises/${i.clipExerciseId}/cues/${i.cueId}`, body: () => ({ text: 'Drive the knee up' }), expect: [401, 403, 403, 200, 200, 404] },
  'server/api/exercises/[id]/cues/fit.post.ts': { method: 'POST', path: i => `/api/exercises/${i.clipExerciseId}/cues/fit`, body: () => ({ mode: 'clamp' }), expect: [401, 403, 403, 200, 200, 404] },
  'server/api/exercises/[id]/cues/index.get.ts': { method: 'GET', path: i => `/api/exercises/${i.clipExerciseId}/cues`, expect: [401, 404, 404, 200, 200, 404] },
  'server/api/exercises/[id]/cues/index.post.ts': { method: 'POST', path: i => `/api/exercises/${i.clipExerciseId}/cues`, body: () => ({ startSeconds: 1, endSeconds: 2, text: 'Land under the hip' }), expect: [401, 403, 403, 201, 201, 404] },
  'server/api/health/live.get.ts': { method: 'GET', path: () => '/api/health/live', expect: signedOutOnly(200) },
  'server/api/health/ready.get.ts': { method: 'GET', path: () => '/api/health/ready', expect: signedOutOnly(200) },
  'server/api/me/blocks/[id].get.ts': { method: 'GET', path: i => `/api/me/blocks/${i.blockId}`, expect: [401, 200, 404, 403, 403, 403] },
  'server/api/me/blocks/index.get.ts': { method: 'GET', path: () => '/api/me/blocks', expect: athleteOwn },
  'server/api/me/pain-flag-emails.put.ts': { method: 'PUT', path: () => '/api/me/pain-flag-emails', body: () => ({ painFlagEmails: true }), expect: coachRead },
  'server/api/me/team.post.ts': { method: 'POST', path: () => '/api/me/team', body: i => ({ teamId: i.rivalTeamId }), expect: [401, 404, 404, 404, 404, 200] },
  'server/api/me/teams.get.ts': { method: 'GET', path: () => '/api/me/teams', expect: anyMember },
  // Leaving a team one is not in is 404; the rival is their team's only head coach, so leaving it is refused.
  'server/api/me/teams/[id].delete.ts': { method: 'DELETE', path: i => `/api/me/teams/${i.rivalTeamId}`, expect: [401, 404, 404, 404, 404, 409] },
  'server/api/me/welcome.post.ts': { method: 'POST', path: () => '/api/me/welcome', body: () => ({ skip: true }), expect: athleteOwn },
  'server/api/pain-flags/open-count.get.ts': { method: 'GET', path: () => '/api/pain-flags/open-count', expect: coachRead },
  'server/api/reviews/[id].delete.ts': { method: 'DELETE', path: i => `/api/reviews/${i.reviewId}`, fresh: true, expect: [401, 204, 404, 403, 403, 404] },
  'server/api/reviews/[id].get.ts': { method: 'GET', path: i => `/api/reviews/${i.reviewId}`, expect: [401, 200, 404, 200, 200, 404] },
  'server/api/reviews/[id].patch.ts': { method: 'PATCH', path: i => `/api/reviews/${i.reviewId}`, body: () => ({ exerciseId: null }), expect: [401, 403, 403, 200, 200, 404] },
  'server/api/reviews/[id]/answer.post.ts': { method: 'POST', path: i => `/api/reviews/${i.reviewId}/answer`, fresh: true, expect: [401, 403, 403, 200, 200, 404] },
  'server/api/reviews/[id]/comments.post.ts': { method: 'POST', path: i => `/api/reviews/${i.reviewId}/comments`, body: () => ({ atSeconds: 1, text: 'Keep the hips level' }), expect: [401, 403, 403, 201, 201, 404] },
  'server/api/reviews/[id]/reply-url.post.ts': { method: 'POST', path: i => `/api/reviews/${i.reviewId}/reply-url`, body: () => ({ contentType: 'video/mp4', size: 1000 }), expect: [401, 403, 403, 200, 200, 404] },
  'server/api/reviews/open-count.get.ts': { method: 'GET', path: () => '/api/reviews/open-count', expect: coachRead },
  'server/api/reviews/index.get.ts': { method: 'GET', path: () => '/api/reviews', expect: anyMember },
  // Nothing was uploaded under the key, so the athlete's request is refused on the key.
  'server/api/reviews/index.post.ts': { method: 'POST', path: () => '/api/reviews', body: () => ({ key: 'nothing-uploaded' }), expect: [401, 400, 400, 403, 403, 403] },
  'server/api/reviews/upload-url.post.ts': { method: 'POST', path: () => '/api/reviews/upload-url', body: () => ({ contentType: 'video/mp4', size: 1000 }), expect: athleteOwn },
  'server/api/team/emergency-number.put.ts': { method: 'PUT', path: () => '/api/team/emergency-number', body: () => ({ emergencyNumber: null }), expect: [401, 403, 403, 403, 200, 200] },
  // The confirmation does not match, so no team is deleted: the callers who may try get 400.
  'server/api/team/index.delete.ts': { method: 'DELETE', path: () => '/api/team', body: () => ({ confirmName: 'Not the team name' }), expect: [401, 403, 403, 403, 400, 400] },
  'server/api/team/index.patch.ts': { method: 'PATCH', path: () => '/api/team', body: () => ({ timezone: 'UTC' }), expect: [401, 403, 403, 403, 200, 200] },
  'server/api/team/members/[id].delete.ts': { method: 'DELETE', path: i => `/api/team/members/${i.leaverId}`, fresh: true, expect: [401, 403, 403, 204, 204, 404] },
  'server/api/team/members/[id].patch.ts': { method: 'PATCH', path: i => `/api/team/members/${i.coachId}`, body: () => ({ role: 'coach' }), expect: [401, 403, 403, 403, 200, 404] },
  'server/api/team/plates.get.ts': { method: 'GET', path: () => '/api/team/plates', expect: coachRead },
  'server/api/team/plates.patch.ts': { method: 'PATCH', path: () => '/api/team/plates', body: () => ({ plateIncrementKg: 2.5 }), expect: coachRead },
  'server/api/team/safety.get.ts': { method: 'GET', path: () => '/api/team/safety', expect: coachRead },
  'server/api/team/starter-set.post.ts': { method: 'POST', path: () => '/api/team/starter-set', expect: coachRead },
  'server/routes/captions/[id].vtt.ts': { method: 'GET', path: i => `/captions/${i.clipExerciseId}.vtt`, expect: [401, 404, 404, 200, 200, 404] },
  'server/routes/exports/logs.csv.get.ts': { method: 'GET', path: () => '/exports/logs.csv?kind=sessions', expect: anyMember },
}

/** A block as the coach's form sends it; with `slot`, the saved block's routine keeps its id. */
function blockBody(ids: Ids, slot = false) {
  return { name: 'Spring hills', startDate: ids.blockStart, weeks: 4, athleteIds: [ids.athleteId], routines: [{ ...(slot ? { id: ids.blockRoutineId } : {}), routineId: ids.routineId, weekday: 2 }] }
}

function sha256(text: string) {
  return createHash('sha256').update(text).digest('hex')
}

function today() {
  return new Date().toISOString().slice(0, 10)
}

function routeFiles(folder: string): string[] {
  return readdirSync(join(root, folder), { recursive: true, withFileTypes: true })
    .filter(entry => entry.isFile() && /\.(ts|js|mjs)$/.test(entry.name))
    .map(entry => relative(root, join(entry.parentPath, entry.name)).split('\\').join('/'))
    .sort()
}

describe('access matrix: the table', () => {
  it('has a row for every route file under server/api and server/routes', () => {
    const files = [...routeFiles('server/api'), ...routeFiles('server/routes')]
    const missing = files.filter(file => !matrix[file])
    expect(missing, `Add a row to tests/integration/access-matrix.test.ts for: ${missing.join(', ')}`).toEqual([])
    const stale = Object.keys(matrix).filter(file => !files.includes(file))
    expect(stale, `Rows for route files that no longer exist: ${stale.join(', ')}`).toEqual([])
  })
})

describe('access matrix: on the built server', () => {
  const running = useStack()
  let head: Awaited<ReturnType<typeof registerCoach>>
  let rival: Awaited<ReturnType<typeof registerCoach>>
  let athlete: Awaited<ReturnType<typeof addAthlete>>
  let mate: Awaited<ReturnType<typeof addAthlete>>
  let coachEmail: string
  const snapshot: AssignmentSnapshot = { title: 'Ridge hills', category: 'hills', description: '', exercises: [], steps: [{ id: 'w', type: 'block', kind: 'work', measure: { by: 'time', seconds: 60 } }] }

  beforeAll(async () => {
    head = await registerCoach(running.stack)
    rival = await registerCoach(running.stack, 'Brackenmoor Harriers')
    athlete = await addAthlete(running.stack, head.coach, { name: 'Ffion Aske' })
    mate = await addAthlete(running.stack, head.coach, { name: 'Cai Penhallow' })
    coachEmail = uniqueEmail('coach')
    expect((await head.coach.post('/api/invites', { email: coachEmail, role: 'coach' })).status).toBe(201)
    const token = linkIn(await running.stack.mail.waitFor(coachEmail, /invited you/), /\/join\/[\w-]+/).split('/').pop()!
    expect((await new ApiClient(running.stack.url).post(`/api/invites/${token}/accept`, { name: 'Morwen Tay', password: PASSWORD })).status).toBe(201)
  })

  async function makeIds(): Promise<Ids> {
    const teamId = head.teamId
    const exercise = await running.fixtures.exercise(teamId, { name: `Bounding ${Math.random()}`, category: 'drill' })
    const routineId = await running.fixtures.routine(teamId, { title: snapshot.title, category: 'hills', steps: snapshot.steps })
    const { id: assignmentId } = await running.fixtures.assignment(teamId, athlete.userId, snapshot, { routineId })
    const [series] = await running.fixtures.rows<{ id: number }>('insert into assignment_series (team_id, routine_id, start_date, weeks, weekdays) values (?, ?, ?, 1, ?) returning id', [teamId, routineId, today(), '[1]'])
    await running.fixtures.rows('update assignments set series_id = ? where id = ?', [series!.id, assignmentId])
    const noteId = await running.fixtures.injuryNote(teamId, athlete.userId, 'knee', 'Sore on descents')
    const [squad] = await running.fixtures.rows<{ id: number }>('insert into squads (team_id, name) values (?, ?) returning id', [teamId, 'Tuesday group'])
    const inviteToken = randomBytes(32).toString('base64url')
    const [invite] = await running.fixtures.rows<{ id: number }>('insert into invites (team_id, email, role, token_hash, invited_by_id, expires_at) values (?, ?, ?, ?, ?, ?) returning id', [teamId, uniqueEmail('pending'), 'athlete', sha256(inviteToken), head.userId, Date.now() + 86_400_000])
    // The session hangs off an assignment of its own, so deleting `assignmentId` is not refused.
    const { id: loggedAssignmentId } = await running.fixtures.assignment(teamId, athlete.userId, snapshot, { routineId })
    const [session] = await running.fixtures.rows<{ id: number }>('insert into session_logs (team_id, athlete_id, assignment_id, client_id, started_at, day) values (?, ?, ?, ?, ?, ?) returning id', [teamId, athlete.userId, loggedAssignmentId, `s-${Math.random()}`, Date.now(), today()])
    const [entry] = await running.fixtures.rows<{ id: number }>('insert into entry_logs (team_id, session_id, athlete_id, idempotency_key, step_id, seconds) values (?, ?, ?, ?, ?, 60) returning id', [teamId, session!.id, athlete.userId, 'matrix-entry-1', 'w'])
    const [flag] = await running.fixtures.rows<{ id: number }>('insert into pain_flags (team_id, athlete_id, session_id, pain, area, reason) values (?, ?, ?, 7, ?, ?) returning id', [teamId, athlete.userId, session!.id, 'knee', 'high_pain'])
    const feedToken = randomBytes(32).toString('base64url')
    await running.fixtures.rows('insert into calendar_feeds (team_id, user_id, token_hash) values (?, ?, ?)', [teamId, athlete.userId, sha256(feedToken)])
    const [coach] = await running.fixtures.rows<{ id: number }>('select id from users where email = ?', [coachEmail])
    // A member to remove: a row of their own, so removing them spoils no sign-in.
    const [leaver] = await running.fixtures.rows<{ id: number }>('insert into users (email, name, password_hash) values (?, ?, ?) returning id', [uniqueEmail('leaver'), 'Idris Fenwick', 'not-a-hash'])
    await running.fixtures.rows('insert into memberships (team_id, user_id, role) values (?, ?, ?)', [teamId, leaver!.id, 'athlete'])
    // A block of the athlete's, with one planned session, so the athlete sees it.
    const blockStart = today()
    const [block] = await running.fixtures.rows<{ id: number }>('insert into blocks (team_id, name, start_date, weeks, created_by_id) values (?, ?, ?, 4, ?) returning id', [teamId, 'Spring hills', blockStart, head.userId])
    const [slot] = await running.fixtures.rows<{ id: number }>('insert into block_routines (block_id, routine_id, weekday) values (?, ?, 2) returning id', [block!.id, routineId])
    await running.fixtures.rows('insert into block_targets (block_id, athlete_id) values (?, ?)', [block!.id, athlete.userId])
    const { id: blockAssignmentId } = await running.fixtures.assignment(teamId, athlete.userId, snapshot, { routineId })
    await running.fixtures.rows('update assignments set block_id = ?, block_week = 1 where id = ?', [block!.id, blockAssignmentId])
    // An exercise with a clip, and a cue on it.
    const clipExercise = await running.fixtures.exercise(teamId, { name: `Hill bounds ${Math.random()}`, category: 'drill' })
    const [clip] = await running.fixtures.rows<{ id: number }>('insert into media_objects (team_id, exercise_id, key, content_type, size, status, duration_seconds) values (?, ?, ?, ?, 1000, ?, 10) returning id', [teamId, clipExercise.id, `matrix/${Math.random()}.mp4`, 'video/mp4', 'ready'])
    await running.fixtures.rows('update exercises set clip_id = ? where id = ?', [clip!.id, clipExercise.id])
    const [cue] = await running.fixtures.rows<{ id: number }>('insert into clip_cues (team_id, exercise_id, start_seconds, end_seconds, text) values (?, ?, 1, 2, ?) returning id', [teamId, clipExercise.id, 'Tall through the hips'])
    // The athlete's form review of a clip of their own.
    const [reviewClip] = await running.fixtures.rows<{ id: number }>('insert into media_objects (team_id, key, content_type, size, status, duration_seconds) values (?, ?, ?, 1000, ?, 10) returning id', [teamId, `reviews/matrix/${Math.random()}.mp4`, 'video/mp4', 'ready'])
    const [review] = await running.fixtures.rows<{ id: number }>('insert into form_reviews (team_id, athlete_id, clip_id, question) values (?, ?, ?, ?) returning id', [teamId, athlete.userId, reviewClip!.id, 'Is my knee caving?'])
    return {
      coachId: coach!.id, rivalTeamId: rival.teamId, leaverId: leaver!.id, blockId: block!.id, blockRoutineId: slot!.id, blockStart,
      clipExerciseId: clipExercise.id, cueId: cue!.id, reviewId: review!.id,
      athleteId: athlete.userId, mateId: mate.userId, exerciseId: exercise.id, routineId, assignmentId, seriesId: series!.id, noteId,
      squadId: squad!.id, inviteId: invite!.id, inviteToken, sessionId: session!.id, entryId: entry!.id, painFlagId: flag!.id, feedToken,
    }
  }

  /** A client per caller; signed-in ones are fresh sign-ins, so a row that signs out spoils nothing. */
  async function clientsFor(): Promise<ApiClient[]> {
    const signIn = async (email: string) => {
      const client = new ApiClient(running.stack.url)
      const response = await client.post('/api/auth/login', { email, password: PASSWORD })
      if (response.status !== 200) throw new Error(`sign-in of ${email} failed: ${response.status} ${running.stack.log().slice(-1500)}`)
      return client
    }
    return [new ApiClient(running.stack.url), await signIn(athlete.email), await signIn(mate.email), await signIn(coachEmail), await signIn(head.email), await signIn(rival.email)]
  }

  it('gives each caller what the table says, for every route file', async () => {
    const shared = await makeIds()
    let clients = await clientsFor()
    const wrong: string[] = []
    for (const [file, row] of Object.entries(matrix)) {
      for (let n = 0; n < callers.length; n++) {
        const ids = row.fresh ? await makeIds() : shared
        // Signed out is always a client with no cookie at all.
        const client = n === 0 ? new ApiClient(running.stack.url) : row.fresh ? (await clientsFor())[n]! : clients[n]!
        const body = row.body?.(ids)
        const response = await client.request(row.method, row.path(ids), body ?? (row.method === 'GET' || row.method === 'DELETE' ? undefined : {}))
        if (response.status !== row.expect[n]) wrong.push(`${file} as ${callers[n]}: expected ${row.expect[n]}, got ${response.status} ${response.text.slice(0, 160)}`)
      }
      // A row that signs people out (everywhere) must not spoil the next rows' sign-ins.
      if (row.fresh) clients = await clientsFor()
    }
    expect(wrong).toEqual([])
  }, 600_000)
})
