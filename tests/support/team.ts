import { ApiClient, uniqueEmail } from './client'
import { linkIn } from './mail-catcher'
import type { Stack } from './stack'

export const PASSWORD = 'long-enough-password'

export async function registerCoach(stack: Stack, teamName = 'Larchford Hill Harriers') {
  const coach = new ApiClient(stack.url)
  const email = uniqueEmail('coach')
  const response = await coach.post<{ user: { id: number }, team: { id: number } }>('/api/auth/register', { name: 'Morwen Tay', email, password: PASSWORD, teamName })
  if (response.status !== 201) throw new Error(`register failed: ${response.status} ${response.text}`)
  return { coach, email, userId: response.data.user.id, teamId: response.data.team.id }
}

/** Invites an athlete by e-mail, follows the link from the caught message and signs them in. */
export async function addAthlete(stack: Stack, coach: ApiClient, options: { name?: string, squadId?: number } = {}) {
  const email = uniqueEmail('athlete')
  const invite = await coach.post('/api/invites', { email, role: 'athlete', squadId: options.squadId })
  if (invite.status !== 201) throw new Error(`invite failed: ${invite.status} ${invite.text}`)
  const mail = await stack.mail.waitFor(email, /invited you/)
  const token = linkIn(mail, /\/join\/[\w-]+/).split('/').pop()!
  const athlete = new ApiClient(stack.url)
  const accepted = await athlete.post<{ user: { id: number } }>(`/api/invites/${token}/accept`, { name: options.name ?? 'Tamsin Rook', password: PASSWORD })
  if (accepted.status !== 201) throw new Error(`accept failed: ${accepted.status} ${accepted.text}`)
  return { athlete, email, userId: accepted.data.user.id }
}
