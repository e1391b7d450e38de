export interface CueSettings {
  sound: boolean
  speech: boolean
  vibration: boolean
  keepAwake: boolean
}

const SETTINGS_KEY = 'switchback.player.settings.v1'

// One audio context per page, whichever component asks: the page unlocks the sound on the start tap, the
// runner's beep schedule (useBeepSchedule) plays on it.
let audio: AudioContext | undefined

/** The page's audio context once a tap has unlocked it (undefined before, or with beeps switched off). */
export function sessionAudio() {
  return audio
}

/** Beeps (Web Audio), spoken step names, vibration and the screen wake lock, each switchable. */
export function useSessionCues() {
  const settings = useState<CueSettings>('session-cue-settings', () => ({ sound: true, speech: false, vibration: true, keepAwake: true }))
  let wakeLock: WakeLockSentinel | undefined

  function loadSettings() {
    try {
      const stored = JSON.parse(localStorage.getItem(SETTINGS_KEY) ?? 'null') as Partial<CueSettings> | null
      if (stored) settings.value = { ...settings.value, ...stored }
    }
    catch {
      // defaults
    }
  }

  function saveSettings() {
    try {
      localStorage.setItem(SETTINGS_KEY, JSON.stringify(settings.value))
    }
    catch {
      // not stored; still applies now
    }
  }

  /** Call from a tap or key press: browsers only allow sound after a gesture. */
  function unlock() {
    if (!settings.value.sound || typeof AudioContext === 'undefined') return
    audio ??= new AudioContext()
    if (audio.state === 'suspended') void audio.resume()
  }

  /** The vibration and the next step's name at a step change (the beep is useBeepSchedule's). */
  function change(nextLabel?: string) {
    if (settings.value.vibration && 'vibrate' in navigator) navigator.vibrate([120, 60, 120])
    if (settings.value.speech && nextLabel && 'speechSynthesis' in window) {
      window.speechSynthesis.cancel()
      window.speechSynthesis.speak(new SpeechSynthesisUtterance(nextLabel))
    }
  }

  /** Says a clip's form cue when its moment comes, if spoken cues are on. */
  function speak(text: string) {
    if (!settings.value.speech || !text || !('speechSynthesis' in window)) return
    window.speechSynthesis.cancel()
    window.speechSynthesis.speak(new SpeechSynthesisUtterance(text))
  }

  async function keepAwake(on: boolean) {
    if (!on || !settings.value.keepAwake) {
      await wakeLock?.release().catch(() => undefined)
      wakeLock = undefined
      return
    }
    if (wakeLock || !('wakeLock' in navigator) || document.visibilityState !== 'visible') return
    try {
      wakeLock = await navigator.wakeLock.request('screen')
      wakeLock.addEventListener('release', () => {
        wakeLock = undefined
      })
    }
    catch {
      // Refused (battery saver, no permission): the session still runs.
    }
  }

  return { settings, loadSettings, saveSettings, unlock, change, speak, keepAwake }
}
