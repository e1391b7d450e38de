// What to tell an athlete who reports severe or sudden pain. General first-aid practice, no published
// source; the emergency number comes from the team's settings and is never assumed here.

/** Pain at or above this shows the urgent guidance before anything else. */
export const URGENT_PAIN = 7

export interface UrgentGuidance {
  title: string
  /** Red-flag signs that need medical help at once. */
  redFlags: string[]
  call: string
  steps: string[]
}

export function needsUrgentGuidance(report: { pain?: number | null, sudden?: boolean | null }): boolean {
  return (report.pain ?? 0) >= URGENT_PAIN || Boolean(report.sudden)
}

/** The number to call in words: the team's number, or a plain pointer to the local one. */
export function emergencyNumberText(emergencyNumber: string | null | undefined): string {
  const number = emergencyNumber?.trim()
  return number ? `the emergency number ${number}` : 'your local emergency number'
}

export function urgentGuidance(emergencyNumber: string | null | undefined): UrgentGuidance {
  return {
    title: 'Stop training now',
    redFlags: [
      'chest pain or tightness',
      'fainting, or feeling dizzy or faint',
      'unusual breathlessness',
      'a joint that gave way',
      'being unable to bear weight',
    ],
    call: `Get medical help at once — call ${emergencyNumberText(emergencyNumber)} — if you have any of these:`,
    steps: [
      'Do not finish the session or try the painful movement again to test it.',
      'If none of those signs are there, rest and have the pain checked by a doctor or physiotherapist before you train again.',
      'Tell your coach; Switchback does not replace a clinician or local emergency services.',
    ],
  }
}
