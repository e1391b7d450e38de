// Plain-text and simple HTML bodies for every message the app sends, in our own words.
import { formatDay, isCalendarDay } from '#shared/utils/dates'

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
    const count = dates.length === 1 ? 'one session' : `${dates.length} sessions`
    const intro = `Hello ${str(payload, 'athleteName')}, ${coach} has planned ${count} of "${title}" for you with ${str(payload, 'teamName')}:`
    const closing = 'Open Switchback on the day for the steps, timings and cautions. You can turn these e-mails off on your Today page.'
    const list = dates.map(day => `- ${day}`).join('\n')
    const noteText = note ? `\n\nNote from your coach:\n${note}` : ''
    return {
      subject: `New training: ${title} (${count})`,
      text: `${intro}\n\n${list}${noteText}\n\n${closing}\n\n${url}`,
      html: layout(`New training: ${title}`, [intro, ...dates, ...(note ? [`Note from your coach: ${note}`] : []), closing], { url, label: 'See your plan' }),
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
    const area = str(payload, 'area').replace('_', ' ')
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
