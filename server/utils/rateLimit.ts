/** Failed sign-ins allowed per window: per account and per client address. Shared through MariaDB. */
export const SIGN_IN_LIMITS = { windowS: 15 * 60, perAccount: 5, perAddress: 20 }

function windowStart(): Date {
  return new Date(Date.now() - SIGN_IN_LIMITS.windowS * 1000)
}

/** True when either the account or the address has used up its failed attempts. */
export async function signInBlocked(email: string, ip: string): Promise<boolean> {
  const rows: { scope_key: string, n: number }[] = await useDb()('sign_in_attempts')
    .whereIn('scope_key', [`account:${email}`, `address:${ip}`]).where('attempted_at', '>', windowStart())
    .groupBy('scope_key').select('scope_key').count({ n: '*' })
  const count = (key: string) => Number(rows.find(r => r.scope_key === key)?.n ?? 0)
  return count(`account:${email}`) >= SIGN_IN_LIMITS.perAccount || count(`address:${ip}`) >= SIGN_IN_LIMITS.perAddress
}

/** Records one failed attempt against both keys, in one statement. */
export async function recordFailedSignIn(email: string, ip: string): Promise<void> {
  await useDb()('sign_in_attempts').insert([{ scope_key: `account:${email}` }, { scope_key: `address:${ip}` }])
}

/** A successful sign-in clears the account's failures (not the address's). */
export async function clearAccountFailures(email: string): Promise<void> {
  await useDb()('sign_in_attempts').where({ scope_key: `account:${email}` }).delete()
}
