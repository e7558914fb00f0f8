import bcrypt from 'bcryptjs'
import type { Knex } from 'knex'

export const TEAM_ROLES = ['admin', 'architect', 'engineer', 'manager'] as const
export type TeamRole = typeof TEAM_ROLES[number]

export interface TestTeam {
  id: number
  password: string
  /** user ids and e-mail addresses per role */
  users: Record<TeamRole, { id: number, email: string }>
}

/** A fresh team with one active member of every role, all with the same password. */
export async function createTeam(db: Knex, tag: string): Promise<TestTeam> {
  const stamp = `${Date.now()}-${Math.floor(Math.random() * 1e6)}`
  const [id] = await db('teams').insert({ name: `Team ${tag} ${stamp}`, slug: `${tag}-${stamp}` })
  const password = `${tag}-team-password`
  const hash = await bcrypt.hash(password, 4)
  const users = {} as TestTeam['users']
  for (const role of TEAM_ROLES) {
    const email = `${role}-${stamp}@${tag}.example`
    const [userId] = await db('users').insert({ team_id: id, email, display_name: `${tag} ${role}`, password_hash: hash, role })
    users[role] = { id: userId!, email }
  }
  return { id: id!, password, users }
}
