import type { Role } from './vocabulary'

const roleRank: Record<Role, number> = { athlete: 0, coach: 1, head_coach: 2 }

/** Whether `role` is at least `minimum` (head coach ≥ coach ≥ athlete). */
export function hasRole(role: Role | undefined | null, minimum: Role) {
  return role != null && roleRank[role] >= roleRank[minimum]
}

/** The coach check, shared by the server's guards, the route middleware and the navigation. */
export function isCoachRole(role: Role | undefined | null) {
  return hasRole(role, 'coach')
}
