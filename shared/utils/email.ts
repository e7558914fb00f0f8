/**
 * The one canonical form of an e-mail address, used wherever an address is compared or stored
 * (sign-in, lockout, invitations, uniqueness): Unicode NFKC (full-width letters and composed or
 * decomposed accents become one spelling), surrounding space trimmed, lower case. The database
 * columns holding addresses compare bytes (utf8mb4_bin), so its accent-insensitive collation
 * never makes two different canonical addresses equal.
 */
export function canonicalEmail(address: string): string {
  return address.normalize('NFKC').trim().toLowerCase().normalize('NFKC')
}

/**
 * The key the per-account sign-in lockout counts under: the canonical address with accents
 * removed, so `árchitect@…` and `architect@…` share one counter (stricter than the address
 * itself: a look-alike can never be used to guess beside a locked account, nor clear its lock).
 */
export function emailLockoutKey(address: string): string {
  return canonicalEmail(address).normalize('NFD').replace(/\p{M}/gu, '').normalize('NFC')
}
