import { emailLockoutKey } from '#shared/utils/email'

/**
 * Failed sign-ins allowed per window, shared through MariaDB: per account (every spelling of an
 * address counts under its lockout key), and per client address as the number of DISTINCT
 * accounts it failed on, so many people behind one proxy who each mistype their own password do
 * not lock each other out, while spraying one password over many accounts still stops.
 */
export const SIGN_IN_LIMITS = { windowS: 15 * 60, perAccount: 5, accountsPerAddress: 20 }

function windowStart(): Date {
  return new Date(Date.now() - SIGN_IN_LIMITS.windowS * 1000)
}

const accountKey = (email: string) => `account:${emailLockoutKey(email)}`
const addressKey = (ip: string) => `address:${ip}`

/** True when the account has used up its failed attempts, or the address has failed on too many accounts. */
export async function signInBlocked(email: string, ip: string): Promise<boolean> {
  const db = useDb()
  const [account, address] = await Promise.all([
    db('sign_in_attempts').where({ scope_key: accountKey(email) }).where('attempted_at', '>', windowStart()).count({ n: '*' }),
    db('sign_in_attempts').where({ scope_key: addressKey(ip) }).where('attempted_at', '>', windowStart()).countDistinct({ n: 'account_key' })
  ])
  return Number(account[0]?.n ?? 0) >= SIGN_IN_LIMITS.perAccount || Number(address[0]?.n ?? 0) >= SIGN_IN_LIMITS.accountsPerAddress
}

/** Records one failed attempt against the account and the address, in one statement. */
export async function recordFailedSignIn(email: string, ip: string): Promise<void> {
  const account = accountKey(email)
  await useDb()('sign_in_attempts').insert([{ scope_key: account }, { scope_key: addressKey(ip), account_key: account }])
}

/** A successful sign-in clears the account's failures (not the address's). */
export async function clearAccountFailures(email: string): Promise<void> {
  await useDb()('sign_in_attempts').where({ scope_key: accountKey(email) }).delete()
}
