import { describe, expect, it } from 'vitest'
import { chooseRecordingType, clipTypeOfRecording, recordingFileName, recordingStopSeconds } from '../../shared/utils/recording'

describe('in-page recording', () => {
  it('asks for WebM first and falls back to MP4, or lets the browser choose', () => {
    expect(chooseRecordingType(type => type.startsWith('video/webm'))).toBe('video/webm;codecs=vp9,opus')
    expect(chooseRecordingType(type => type === 'video/webm;codecs=vp8,opus' || type === 'video/mp4')).toBe('video/webm;codecs=vp8,opus')
    expect(chooseRecordingType(type => type === 'video/mp4')).toBe('video/mp4')
    expect(chooseRecordingType(() => false)).toBe('')
  })

  it('uploads a recording under the container type, without codecs, and refuses other containers by leaving the type empty', () => {
    expect(clipTypeOfRecording('video/webm;codecs=vp8,opus')).toBe('video/webm')
    expect(clipTypeOfRecording('Video/MP4; codecs="avc1.42E01E"')).toBe('video/mp4')
    expect(clipTypeOfRecording('video/x-matroska;codecs=avc1')).toBe('')
    expect(clipTypeOfRecording('')).toBe('')
  })

  it('names the file by the moment it was made and its container', () => {
    expect(recordingFileName('video/webm', new Date(2026, 2, 5, 7, 9))).toBe('clip-2026-03-05-0709.webm')
    expect(recordingFileName('video/mp4', new Date(2026, 10, 15, 18, 30))).toBe('clip-2026-11-15-1830.mp4')
  })

  it('stops just inside the 60 s limit', () => {
    expect(recordingStopSeconds(60)).toBe(59.75)
  })
})
