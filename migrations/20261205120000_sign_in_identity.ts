import type { Knex } from 'knex'

/**
 * One canonical form of an address (issue 13): stored addresses are rewritten to it and their
 * columns compare bytes (utf8mb4_bin), so the server's accent- and case-insensitive collation can no
 * longer make `árchitect@…` find `architect@…` while the lockout counted them apart. Lockout keys
 * compare bytes too. Failed sign-ins from an address remember which account they tried, so the
 * per-address limit counts distinct accounts, not attempts (users behind one proxy share an address).
 */
// shared/utils/email.ts canonicalEmail as of this migration (a migration never changes with the code)
const canonicalEmail = (a: string) => a.normalize('NFKC').trim().toLowerCase().normalize('NFKC')

async function canonicalise(knex: Knex, table: string): Promise<void> {
  const rows: { id: number, email: string }[] = await knex(table).select('id', 'email')
  for (const row of rows) {
    const email = canonicalEmail(row.email)
    if (email !== row.email) await knex(table).where({ id: row.id }).update({ email })
  }
}

export async function up(knex: Knex): Promise<void> {
  await canonicalise(knex, 'users')
  await canonicalise(knex, 'invitations')
  await knex.raw('ALTER TABLE users MODIFY email VARCHAR(254) CHARACTER SET utf8mb4 COLLATE utf8mb4_bin NOT NULL')
  await knex.raw('ALTER TABLE invitations MODIFY email VARCHAR(254) CHARACTER SET utf8mb4 COLLATE utf8mb4_bin NOT NULL')
  await knex.raw('ALTER TABLE sign_in_attempts MODIFY scope_key VARCHAR(300) CHARACTER SET utf8mb4 COLLATE utf8mb4_bin NOT NULL')
  await knex.raw('ALTER TABLE sign_in_attempts ADD COLUMN account_key VARCHAR(300) CHARACTER SET utf8mb4 COLLATE utf8mb4_bin NULL')
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('sign_in_attempts', (t) => {
    t.dropColumn('account_key')
  })
  await knex.raw('ALTER TABLE sign_in_attempts MODIFY scope_key VARCHAR(300) NOT NULL')
  await knex.raw('ALTER TABLE invitations MODIFY email VARCHAR(254) NOT NULL')
  await knex.raw('ALTER TABLE users MODIFY email VARCHAR(254) NOT NULL')
}
