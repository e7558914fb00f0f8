import { describe, expect, it } from 'vitest'
import { canonicalEmail, emailLockoutKey } from '../../../../shared/utils/email'

// Expected forms from Unicode UAX #15 (NFKC maps full-width U+FF21…U+FF5A to ASCII and composes
// "e" + U+0301 into U+00E9) and from the Unicode case mapping of ASCII and Latin-1 letters.
describe('canonicalEmail', () => {
  it('folds case, width, padding and composition into one spelling', () => {
    const canonical = 'architect@harrowlake.example'
    for (const variant of ['Architect@HarrowLake.Example', '\uFF21rchitect@harrowlake.example', `  ${canonical}\t`, '\uFF41\uFF52\uFF43\uFF48\uFF49\uFF54\uFF45\uFF43\uFF54@harrowlake.example']) {
      expect(canonicalEmail(variant)).toBe(canonical)
    }
    expect(canonicalEmail('re\u0301sume\u0301@x.example')).toBe('r\u00E9sum\u00E9@x.example')
    expect(canonicalEmail('R\u00C9SUM\u00C9@X.EXAMPLE')).toBe('r\u00E9sum\u00E9@x.example')
  })

  it('keeps accents: an accented address is a different address', () => {
    expect(canonicalEmail('\u00E1rchitect@harrowlake.example')).not.toBe(canonicalEmail('architect@harrowlake.example'))
  })
})

describe('emailLockoutKey', () => {
  it('gives every look-alike of an address, accents included, one lockout key', () => {
    const key = emailLockoutKey('architect@harrowlake.example')
    for (const variant of ['\u00E1rchitect@harrowlake.example', 'a\u0301rchitect@harrowlake.example', '\u00C1RCHITECT@HARROWLAKE.EXAMPLE', '\uFF21rchitect@harrowlake.example']) {
      expect(emailLockoutKey(variant)).toBe(key)
    }
    expect(emailLockoutKey('engineer@harrowlake.example')).not.toBe(key)
  })
})
