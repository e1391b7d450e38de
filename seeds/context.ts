import { Hash } from '@adonisjs/hash'
import { Scrypt } from '@adonisjs/hash/drivers/scrypt'
import type { Database } from '../server/db/client'

/** The same scrypt settings nuxt-auth-utils uses, so seeded passwords sign in. */
const hasher = new Hash(new Scrypt({}))
export const hashPassword = (password: string) => hasher.make(password)

export const DEMO_PASSWORD = 'switchback-demo'

export interface SeedContext {
  db: Database
  teamId: number
  /** Seeded people by a short handle, e.g. `users.headCoach`, `users.athletes[0]`. */
  users: { headCoach: number, coach: number, athletes: number[] }
  squads: Record<string, number>
  log: (line: string) => void
}

export type SeedStep = (context: SeedContext) => Promise<void>
