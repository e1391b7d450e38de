import { describe, expect, it } from 'vitest'
import { buildWebVtt, escapeVttText, formatCueTime, vttTimestamp } from '../../shared/utils/webvtt'
import { cueTimeProblems } from '../../shared/schemas/clip-cue'

/** A small reader for the parts of WebVTT (W3C) we write: header, optional id line, timing line, one text line. */
function parseWebVtt(text: string) {
  const [header, ...blocks] = text.split(/\n\n+/)
  if (header !== 'WEBVTT') throw new Error(`Bad header: ${header}`)
  const seconds = (stamp: string) => {
    const match = /^(\d{2,}):(\d{2}):(\d{2})\.(\d{3})$/.exec(stamp)
    if (!match) throw new Error(`Bad timestamp: ${stamp}`)
    return Number(match[1]) * 3600 + Number(match[2]) * 60 + Number(match[3]) + Number(match[4]) / 1000
  }
  const unescape = (value: string) => value.replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&amp;/g, '&')
  return blocks.filter(block => block.trim()).map((block) => {
    const lines = block.trim().split('\n')
    const timing = lines.findIndex(line => line.includes('-->'))
    const [start, end] = lines[timing]!.split(' --> ')
    const body = lines.slice(timing + 1)
    if (body.some(line => line.includes('-->') || /[<>]/.test(line) || /&(?!amp;|lt;|gt;)/.test(line))) throw new Error(`Unescaped text: ${body.join('|')}`)
    return { id: timing > 0 ? lines[0] : undefined, start: seconds(start!), end: seconds(end!), text: unescape(body.join('\n')) }
  })
}

describe('WebVTT for clip cues', () => {
  it('writes timestamps as hh:mm:ss.ttt', () => {
    expect(vttTimestamp(0)).toBe('00:00:00.000')
    expect(vttTimestamp(2.5)).toBe('00:00:02.500')
    expect(vttTimestamp(61.0004)).toBe('00:01:01.000')
    expect(vttTimestamp(3723.456)).toBe('01:02:03.456')
  })

  it('parses back to the same cues, times and text, in time order', () => {
    const vtt = buildWebVtt([
      { startSeconds: 3.2, endSeconds: 4.75, text: 'Heel stays down now' },
      { startSeconds: 0.4, endSeconds: null, text: 'Knee drives up here' },
    ], 6)
    const cues = parseWebVtt(vtt)
    expect(cues).toEqual([
      { id: '1', start: 0.4, end: 2.9, text: 'Knee drives up here' },
      { id: '2', start: 3.2, end: 4.75, text: 'Heel stays down now' },
    ])
  })

  it('ends an open cue just before the next cue, and never past the clip', () => {
    const [first, second] = parseWebVtt(buildWebVtt([
      { startSeconds: 1, endSeconds: null, text: 'a' },
      { startSeconds: 1.8, endSeconds: null, text: 'b' },
    ], 3))
    expect(first!.end).toBe(1.75)
    expect(second!.end).toBe(3)
  })

  it('escapes &, <, > and an arrow in the text so it cannot end or mark up the cue', () => {
    const text = 'Hips <up> & knees --> out'
    expect(escapeVttText(text)).toBe('Hips &lt;up&gt; &amp; knees --&gt; out')
    const vtt = buildWebVtt([{ startSeconds: 0, endSeconds: 1, text }])
    expect(vtt.split('-->').length).toBe(2) // only the timing line's arrow
    expect(parseWebVtt(vtt)[0]!.text).toBe(text)
  })

  it('keeps a cue on one line: a line break would otherwise end it early', () => {
    const [cue] = parseWebVtt(buildWebVtt([{ startSeconds: 0, endSeconds: 1, text: 'Tall\n\nthrough the hips' }]))
    expect(cue!.text).toBe('Tall through the hips')
  })

  it('writes only the header when there are no cues', () => {
    expect(buildWebVtt([])).toBe('WEBVTT\n\n')
    expect(parseWebVtt(buildWebVtt([]))).toEqual([])
  })

  it('shows times as m:ss.t', () => {
    expect(formatCueTime(2.34)).toBe('0:02.3')
    expect(formatCueTime(75)).toBe('1:15.0')
  })

  it('names the field when a cue does not fit its clip', () => {
    expect(cueTimeProblems({ startSeconds: 2, endSeconds: 3 }, 4)).toEqual({})
    expect(cueTimeProblems({ startSeconds: 5, endSeconds: null }, 4)).toHaveProperty('startSeconds')
    expect(cueTimeProblems({ startSeconds: 1, endSeconds: 4.5 }, 4)).toHaveProperty('endSeconds')
    expect(cueTimeProblems({ startSeconds: 2, endSeconds: 1 }, 4).endSeconds).toMatch(/after the start/)
  })
})
