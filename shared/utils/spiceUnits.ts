/**
 * Values written the way circuit people write them, beside mathjs units: SPICE scale suffixes
 * (`10k`, `4.7K`, `10p`, `1meg`, `100m`) and the usual case variants of unit words (`2.5 v`,
 * `10 Kohm`, `50 pVs`, `0.5 lsb`). Rewritten into mathjs unit text only when mathjs alone cannot
 * read the entry in the field's dimension, and always with a note saying how a bare `m` was read.
 *
 * Scale factors: SPICE3 user's manual, "scale factors" (T, G, MEG, K, M = milli, U, N, P, F, case
 * insensitive), from memory. A bare `M` is refused: SPICE reads it as milli, SI as mega.
 */

/** A rewrite of one entry, with what a reader must be told about it. */
export interface SpiceRewrite {
  /** mathjs unit text, or null when the entry is not SPICE-style */
  text: string | null
  /** said beside the value read back (e.g. that `m` was read as milli) */
  note?: string
  /** set when the entry is refused outright, with the reason */
  refusal?: string
}

const PREFIXES: Record<string, string> = { t: 'T', g: 'G', meg: 'M', k: 'k', m: 'm', u: 'u', n: 'n', p: 'p', f: 'f' }
/** Unit words in any case → the mathjs unit. */
const BASES: Record<string, string> = {
  'v': 'V', 'f': 'F', 'ohm': 'ohm', 'ohms': 'ohm', 'hz': 'Hz', 's': 's', 'a': 'A', 'c': 'C', 'w': 'W', 'vs': 'V*s', 'v*s': 'V*s', 'lsb': 'LSB', 'sps': 'sps'
}
const NUMBER = /^([-+]?(?:\d+\.?\d*|\.\d+)(?:e[-+]?\d+)?)(\s*)(.*)$/i

/** The SPICE scale word at the start of `word` (longest first), or null. */
function scaleOf(word: string): { key: string, rest: string } | null {
  const lower = word.toLowerCase()
  if (lower.startsWith('meg')) return { key: 'meg', rest: word.slice(3) }
  const key = lower[0]
  return key && key in PREFIXES ? { key, rest: word.slice(1) } : null
}

function baseOf(word: string): string | null {
  return BASES[word.toLowerCase()] ?? null
}

/** Reads "prefix + unit word" (`Kohm`, `pVs`, `megohm`, `v`), or a bare scale (`k`, `meg`). */
function unitWord(word: string, attached: boolean): SpiceRewrite {
  const scale = scaleOf(word)
  const whole = baseOf(word)
  if (whole && scale?.rest !== '') return { text: whole }
  if (!scale) return { text: null }
  const base = scale.rest === '' ? '' : baseOf(scale.rest)
  if (base === null) return { text: null }
  if (base === '' && scale.key === 'm' && word === 'M') {
    return { text: null, refusal: `is ambiguous: SPICE reads a bare M as milli, SI as mega; write ${attached ? 'meg' : '"meg"'} for mega or m for milli` }
  }
  // With a unit after it, a capital M is the SI mega (MΩ, MHz); SPICE would read milli, so say so.
  const siMega = scale.key === 'm' && word[0] === 'M' && base !== ''
  const text = `${siMega ? 'M' : PREFIXES[scale.key]!}${base}`
  if (siMega) return { text, note: 'M read as mega (SI); SPICE would read milli, so write meg to be unambiguous' }
  if (scale.key === 'm') return { text, note: 'm read as milli (10⁻³); write meg for mega' }
  return { text }
}

/**
 * Rewrites a SPICE-style or case-variant entry into mathjs unit text: `10k` → `10 k`, `4.7K` →
 * `4.7 k`, `1meg` → `1 M`, `10 Kohm` → `10 kohm`, `50 pVs` → `50 pV*s`, `2.5 v` → `2.5 V`. A bare
 * scale (`k`) becomes a factor on the field's own unit, marked by the caller.
 */
export function spiceRewrite(entry: string): SpiceRewrite {
  const match = NUMBER.exec(entry.trim())
  if (!match) return { text: null }
  const [, number, space, rest] = match as unknown as [string, string, string, string]
  if (rest === '' || /\s/.test(rest)) return { text: null }
  const read = unitWord(rest, space === '')
  if (read.refusal || read.text === null) return read
  return { ...read, text: `${number} ${read.text}` }
}

/** Multiplier of a bare SPICE scale word (`k` → 1e3), or null when the text carries a unit. */
export function bareScale(unitText: string): number | null {
  const factors: Record<string, number> = { T: 1e12, G: 1e9, M: 1e6, k: 1e3, m: 1e-3, u: 1e-6, n: 1e-9, p: 1e-12, f: 1e-15 }
  return factors[unitText] ?? null
}
