// Plain-text and simple HTML bodies for every message the app sends, in our own words.
import { formatDay, isCalendarDay } from '#shared/utils/dates'
import { bodyAreas, painFlagReasons, plural, type PainFlagReason } from '#shared/utils/vocabulary'

export interface RenderedEmail {
  subject: string
  text: string
  html: string
}

function escapeHtml(value: string) {
  return value.replace(/[&<>"']/g, char => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', '\'': '&#39;' })[char]!)
}

function layout(title: string, paragraphs: string[], link?: { url: string, label: string }) {
  const body = paragraphs.map(p => `<p style="margin:0 0 14px">${escapeHtml(p)}</p>`).join('')
  const button = link
    ? `<p style="margin:20px 0"><a href="${escapeHtml(link.url)}" style="background:#1f533b;color:#fff;padding:12px 18px;border-radius:8px;text-decoration:none;display:inline-block">${escapeHtml(link.label)}</a></p><p style="font-size:13px;color:#615e54">Or paste this address into your browser: ${escapeHtml(link.url)}</p>`
    : ''
  return `<!doctype html><html><body style="font-family:system-ui,sans-serif;color:#2a2926;max-width:560px;margin:0 auto;padding:24px"><h1 style="font-size:20px;color:#1f4d3a">${escapeHtml(title)}</h1>${body}${button}<p style="font-size:12px;color:#7a766a;margin-top:28px">Sent by Switchback for your running club.</p></body></html>`
}

type Payload = Record<string, unknown>
const str = (payload: Payload, key: string) => String(payload[key] ?? '')

const calendarDay = (day: string) => isCalendarDay(day) ? formatDay(day) : day

export const emailTemplates: Record<string, (payload: Payload) => RenderedEmail> = {
  invite(payload) {
    const who = str(payload, 'inviterName')
    const team = str(payload, 'teamName')
    const role = str(payload, 'role') === 'coach' ? 'a coach' : 'an athlete'
    const url = str(payload, 'url')
    const lines = [
      `${who} has invited you to join ${team} on Switchback as ${role}.`,
      'Open the link to choose your name and password. The link works once and expires in 7 days.',
    ]
    return {
      subject: `${who} invited you to ${team}`,
      text: `${lines.join('\n\n')}\n\n${url}\n\nIf you were not expecting this, you can ignore this message.`,
      html: layout(`Join ${team}`, [...lines, 'If you were not expecting this, you can ignore this message.'], { url, label: 'Accept the invitation' }),
    }
  },
  assignments_created(payload) {
    const coach = str(payload, 'coachName')
    const title = str(payload, 'title')
    const note = str(payload, 'note')
    const url = str(payload, 'url')
    const dates = (Array.isArray(payload.dates) ? payload.dates : []).map(day => calendarDay(String(day)))
    const count = plural(dates.length, 'session')
    const intro = `Hello ${str(payload, 'athleteName')}, ${coach} has planned ${count} of "${title}" for you with ${str(payload, 'teamName')}:`
    const closing = 'Open Switchback on the day for the steps, timings and cautions. You can turn these e-mails off on your Today page.'
    const list = dates.map(day => `- ${day}`).join('\n')
    const noteText = note ? `\n\nNote from your coach:\n${note}` : ''
    return {
      subject: `Planned for you: ${title} (${count})`,
      text: `${intro}\n\n${list}${noteText}\n\n${closing}\n\n${url}`,
      html: layout(`Planned for you: ${title}`, [intro, ...dates, ...(note ? [`Note from your coach: ${note}`] : []), closing], { url, label: 'See your plan' }),
    }
  },
  pain_flag_raised(payload) {
    const athlete = str(payload, 'athleteName')
    const area = bodyAreas.label(str(payload, 'area'))
    const reason = painFlagReasons.labels[str(payload, 'reason') as PainFlagReason] ?? 'Pain reported'
    const url = str(payload, 'url')
    const where = area ? ` (${area.toLowerCase()})` : ''
    const lines = [
      `Hello ${str(payload, 'coachName')}, ${athlete} just finished "${str(payload, 'routineTitle')}" and reported pain of ${str(payload, 'pain')} out of 10${where}.`,
      `Why you are told: ${reason.toLowerCase()}${payload.sudden ? '; the athlete said it came on suddenly or is sharp' : ''}.`,
      'Open the report to reply; the athlete sees your reply on their progress page. If the athlete may need medical help, say so plainly: Switchback does not replace a clinician.',
      'You can turn these e-mails off on the Team page.',
    ]
    return {
      subject: `Pain report: ${athlete}, ${str(payload, 'pain')}/10${where}`,
      text: `${lines.join('\n\n')}\n\n${url}`,
      html: layout(`${athlete} reported pain`, lines, { url, label: 'Open the pain report' }),
    }
  },
  block_planned(payload) {
    const coach = str(payload, 'coachName')
    const block = str(payload, 'blockName')
    const url = str(payload, 'url')
    const dates = (Array.isArray(payload.dates) ? payload.dates : []).map(day => calendarDay(String(day)))
    const count = dates.length === 1 ? 'one session' : `${dates.length} sessions`
    const first = dates[0] ?? ''
    const last = dates.at(-1) ?? ''
    const intro = payload.replanned
      ? `Hello ${str(payload, 'athleteName')}, ${coach} has updated the weeks ahead of "${block}" with ${str(payload, 'teamName')}: ${count} from ${first} to ${last}.`
      : `Hello ${str(payload, 'athleteName')}, ${coach} has planned the training block "${block}" for you with ${str(payload, 'teamName')}: ${count} from ${first} to ${last}.`
    const closing = 'Each week shows what changed from the week before. Open Switchback on the day for the steps, timings and cautions. You can turn these e-mails off on your Today page.'
    return {
      subject: `${payload.replanned ? 'Updated block' : 'New training block'}: ${block} (${count})`,
      text: `${intro}\n\n${closing}\n\n${url}`,
      html: layout(`Training block: ${block}`, [intro, closing], { url, label: 'See your block' }),
    }
  },
  plan_changes(payload) {
    const url = str(payload, 'url')
    const changes = (Array.isArray(payload.changes) ? payload.changes : []) as { kind?: string, title?: string, from?: string, to?: string, count?: number }[]
    const line = (change: typeof changes[number]) => {
      const title = `"${change.title ?? 'a session'}"`
      if (change.kind === 'moved') return `${title} moved from ${calendarDay(String(change.from))} to ${calendarDay(String(change.to))}`
      if (change.kind === 'added') return `${title} added on ${calendarDay(String(change.to))}`
      if (change.count && change.count > 1) return `${title}: ${change.count} sessions from ${calendarDay(String(change.from))} on removed`
      return `${title} on ${calendarDay(String(change.from))} removed`
    }
    const intro = `Hello ${str(payload, 'athleteName')}, your plan with ${str(payload, 'teamName')} changed:`
    const closing = 'You can turn these e-mails off on your Today page.'
    const lines = changes.map(line)
    const count = changes.length === 1 ? 'one change' : `${changes.length} changes`
    return {
      subject: `Your plan changed (${count})`,
      text: `${intro}\n\n${lines.map(item => `- ${item}`).join('\n')}\n\n${closing}\n\n${url}`,
      html: layout('Your plan changed', [intro, ...lines, closing], { url, label: 'See your plan' }),
    }
  },
  review_answered(payload) {
    const coach = str(payload, 'coachName')
    const url = str(payload, 'url')
    const lines = [
      `Hello ${str(payload, 'athleteName')}, ${coach} has answered the clip you sent for review with ${str(payload, 'teamName')}.`,
      'Open it to see the comments at their moments in your clip, and any clip your coach sent back.',
    ]
    return {
      subject: `${coach} answered your form review`,
      text: `${lines.join('\n\n')}\n\n${url}`,
      html: layout('Your form review is answered', lines, { url, label: 'See the review' }),
    }
  },
  password_reset(payload) {
    const url = str(payload, 'url')
    const lines = [
      'Someone asked to reset the password of your Switchback account.',
      'Open the link within one hour to choose a new password. It works once.',
    ]
    return {
      subject: 'Reset your Switchback password',
      text: `${lines.join('\n\n')}\n\n${url}\n\nIf it was not you, ignore this message: your password stays as it is.`,
      html: layout('Reset your password', [...lines, 'If it was not you, ignore this message: your password stays as it is.'], { url, label: 'Choose a new password' }),
    }
  },
  pain_flag_reply(payload) {
    const coach = str(payload, 'coachName')
    const area = bodyAreas.label(str(payload, 'area')).toLowerCase()
    const url = str(payload, 'url')
    const lines = [
      `${coach} read the pain you reported${area ? ` (${area}, ${str(payload, 'pain')}/10)` : ''} and replied:`,
      str(payload, 'reply'),
      'If the pain is sharp, getting worse or stops you moving normally, see a licensed clinician; Switchback does not replace one.',
    ]
    return {
      subject: `${coach} replied to your pain report`,
      text: `${lines.join('\n\n')}\n\n${url}`,
      html: layout('Your coach replied', lines, { url, label: 'Open your progress page' }),
    }
  },
}

export function renderEmail(template: string, payload: Payload): RenderedEmail {
  const render = emailTemplates[template]
  if (!render) throw new Error(`Unknown e-mail template "${template}"`)
  return render(payload)
}
