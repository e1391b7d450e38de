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

/** Invites someone by e-mail, follows the link from the caught message and signs them in. */
async function joinByInvite(stack: Stack, inviter: ApiClient, role: 'athlete' | 'coach', name: string, squadId?: number) {
  const email = uniqueEmail(role)
  const invite = await inviter.post('/api/invites', { email, role, squadId })
  if (invite.status !== 201) throw new Error(`invite failed: ${invite.status} ${invite.text}`)
  const mail = await stack.mail.waitFor(email, /invited you/)
  const token = linkIn(mail, /\/join\/[\w-]+/).split('/').pop()!
  const client = new ApiClient(stack.url)
  const accepted = await client.post<{ user: { id: number } }>(`/api/invites/${token}/accept`, { name, password: PASSWORD })
  if (accepted.status !== 201) throw new Error(`accept failed: ${accepted.status} ${accepted.text}`)
  return { client, email, userId: accepted.data.user.id }
}

/** Invites an athlete by e-mail, follows the link from the caught message and signs them in. */
export async function addAthlete(stack: Stack, coach: ApiClient, options: { name?: string, squadId?: number } = {}) {
  const { client, email, userId } = await joinByInvite(stack, coach, 'athlete', options.name ?? 'Tamsin Rook', options.squadId)
  return { athlete: client, email, userId }
}

/** Invites a (plain) coach of the head coach's team the same way. */
export async function addCoach(stack: Stack, head: ApiClient, options: { name?: string } = {}) {
  const { client, email, userId } = await joinByInvite(stack, head, 'coach', options.name ?? 'Idris Fenn')
  return { coach: client, email, userId }
}

/** A squad of `count` invited athletes, named "<athleteName> 1", "<athleteName> 2" and so on. */
export async function addSquad(stack: Stack, coach: ApiClient, options: { name: string, count: number, athleteName: string }) {
  const squad = await coach.post<{ id: number }>('/api/squads', { name: options.name })
  if (squad.status !== 201) throw new Error(`squad failed: ${squad.status} ${squad.text}`)
  const athletes = []
  for (let index = 0; index < options.count; index++) {
    athletes.push(await addAthlete(stack, coach, { squadId: squad.data.id, name: `${options.athleteName} ${index + 1}` }))
  }
  return { squadId: squad.data.id, athletes }
}
