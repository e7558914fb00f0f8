import bcrypt from 'bcryptjs'
import type { Knex } from 'knex'

/** Invented demo scenario: a fictional sensor company with one account per role. */
export const DEMO_TEAM = { name: 'Harrow Lake Instruments', slug: 'harrow-lake' }
export const DEMO_PASSWORD = 'harrow-lake-demo'
export const DEMO_USERS = [
  { email: 'admin@harrowlake.example', display_name: 'Imogen Vale', role: 'admin' },
  { email: 'architect@harrowlake.example', display_name: 'Tomas Reyne', role: 'architect' },
  { email: 'engineer@harrowlake.example', display_name: 'Priya Okafor', role: 'engineer' },
  { email: 'manager@harrowlake.example', display_name: 'Dana Whitcombe', role: 'manager' }
] as const

export async function seed(knex: Knex): Promise<void> {
  await knex('teams').insert(DEMO_TEAM).onConflict('slug').merge(['name'])
  const team = await knex('teams').where({ slug: DEMO_TEAM.slug }).first('id')
  for (const user of DEMO_USERS) {
    const existing = await knex('users').where({ email: user.email }).first('id')
    if (existing) {
      await knex('users').where({ id: existing.id }).update({ ...user, team_id: team.id, active: true })
    } else {
      const passwordHash = await bcrypt.hash(DEMO_PASSWORD, 12)
      await knex('users').insert({ ...user, team_id: team.id, password_hash: passwordHash, active: true })
    }
  }
}
