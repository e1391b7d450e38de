import { describe, expect, it } from 'vitest'
import {
  athleteReadUrls,
  clipsAllowed,
  clipStoreKey,
  defaultLogbookRange,
  keptReadKind,
  offlineClipUrl,
  opensOffline,
  sessionsToKeep,
} from '../../shared/utils/offline'

describe('which pages open with no network', () => {
  it('opens the athlete pages from the app shell and sends everything else to the offline page', () => {
    for (const path of ['/', '/today', '/session/12', '/session/12/', '/logbook', '/profile', '/progress', '/login']) expect(opensOffline(path), path).toBe(true)
    for (const path of ['/coach', '/planner', '/exercises', '/exercises/4', '/routines/3', '/insights', '/team', '/todayx', '/register']) expect(opensOffline(path), path).toBe(false)
  })
})

describe('stored clips', () => {
  it('names a clip by its object address, whatever signature the URL carries', () => {
    const first = 'http://127.0.0.1:4569/switchback-media/teams/1/exercises/7/abc.webm?X-Amz-Signature=one&X-Amz-Date=20261202T100000Z'
    const second = 'http://127.0.0.1:4569/switchback-media/teams/1/exercises/7/abc.webm?X-Amz-Signature=two&X-Amz-Date=20261202T101500Z'
    expect(clipStoreKey(first)).toBe('http://127.0.0.1:4569/switchback-media/teams/1/exercises/7/abc.webm')
    expect(clipStoreKey(second)).toBe(clipStoreKey(first))
    expect(clipStoreKey('http://127.0.0.1:4569/switchback-media/teams/1/exercises/7/def.webm?X-Amz-Signature=one')).not.toBe(clipStoreKey(first))
    expect(offlineClipUrl(clipStoreKey(first))).toBe('/offline-clip?src=http%3A%2F%2F127.0.0.1%3A4569%2Fswitchback-media%2Fteams%2F1%2Fexercises%2F7%2Fabc.webm')
  })

  it('fetches clips on Wi-Fi or a cable, or anywhere when the athlete allows it', () => {
    expect(clipsAllowed({ type: 'wifi' }, false)).toBe(true)
    expect(clipsAllowed({ type: 'ethernet' }, false)).toBe(true)
    expect(clipsAllowed({ type: 'cellular' }, false)).toBe(false)
    expect(clipsAllowed({ type: 'wifi', saveData: true }, false)).toBe(false)
    expect(clipsAllowed(undefined, false)).toBe(false)
    expect(clipsAllowed({}, false)).toBe(false)
    expect(clipsAllowed({ type: 'cellular', saveData: true }, true)).toBe(true)
  })
})

describe('what is fetched ahead', () => {
  const assignments = [
    { id: 1, date: '2026-11-27', shownStatus: 'overdue' },
    { id: 2, date: '2026-11-28', shownStatus: 'done' },
    { id: 3, date: '2026-12-02', shownStatus: 'planned' },
    { id: 4, date: '2026-12-09', shownStatus: 'planned' },
    { id: 5, date: '2026-12-10', shownStatus: 'planned' },
  ]

  it('keeps today, the next seven days and the missed sessions Today still offers', () => {
    expect(sessionsToKeep(assignments, '2026-12-02')).toEqual([1, 3, 4])
    expect(sessionsToKeep(assignments, '2026-12-03')).toEqual([1, 4, 5])
  })

  it('asks for the athlete pages\' reads the way the pages do', () => {
    const now = new Date('2026-12-02T14:00:00Z')
    expect(defaultLogbookRange(now)).toEqual({ from: '2026-11-05', to: '2026-12-02' })
    expect(athleteReadUrls(now)).toContain('/api/me/assignments?missedDays=7')
    expect(athleteReadUrls(now)).toContain('/api/me/logbook?from=2026-11-05&to=2026-12-02')
    expect(athleteReadUrls(now)).toContain('/api/_auth/session')
  })

  it('tells plans and clip answers apart from page reads, so old ones can be dropped', () => {
    expect(keptReadKind('/api/assignments/12/plan')).toBe('plan')
    expect(keptReadKind('/api/exercises/3/clip')).toBe('clip')
    expect(keptReadKind('/api/me/profile')).toBe('page')
    expect(keptReadKind('/api/assignments/12/plan/extra')).toBe('page')
  })
})
