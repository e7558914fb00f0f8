/**
 * Seed handling for every random stream in the engine.
 *
 * SplitMix64 (Steele, Lea, Flood 2014; the seeder Blackman and Vigna recommend for the
 * xoshiro family) expands one user seed into generator state, and derives independent
 * sub-seeds for (seed, candidate, chunk) so a result never depends on how work is split.
 */

const MASK64 = (1n << 64n) - 1n
const GOLDEN_GAMMA = 0x9e3779b97f4a7c15n

function mix64(z0: bigint): bigint {
  let z = z0 & MASK64
  z = ((z ^ (z >> 30n)) * 0xbf58476d1ce4e5b9n) & MASK64
  z = ((z ^ (z >> 27n)) * 0x94d049bb133111ebn) & MASK64
  return z ^ (z >> 31n)
}

/**
 * Expands a seed into `count` 32-bit words with SplitMix64 (two words per 64-bit output).
 * Invariant: the same (seed, count) always gives the same words; at least one word is non-zero.
 * @param seed any safe integer (negative values are taken modulo 2^64)
 */
export function splitMix64Words(seed: number, count: number): Uint32Array {
  const out = new Uint32Array(count)
  let state = BigInt.asUintN(64, BigInt(Math.trunc(seed)))
  for (let i = 0; i < count; i += 2) {
    state = (state + GOLDEN_GAMMA) & MASK64
    const z = mix64(state)
    out[i] = Number(z & 0xffffffffn)
    if (i + 1 < count) {
      out[i + 1] = Number(z >> 32n)
    }
  }
  if (out.every(w => w === 0)) {
    out[0] = 1
  }
  return out
}

/**
 * Derives a 32-bit sub-seed in [1, 2^32 − 1] from a seed and a path of integer keys
 * (e.g. candidate index, chunk index). Pure; order of keys matters.
 */
export function deriveSeed(seed: number, ...keys: number[]): number {
  let h = mix64(BigInt.asUintN(64, BigInt(Math.trunc(seed))) + GOLDEN_GAMMA)
  for (const key of keys) {
    h = mix64(h ^ mix64(BigInt.asUintN(64, BigInt(Math.trunc(key))) + GOLDEN_GAMMA))
  }
  const word = Number(h & 0xffffffffn)
  return word === 0 ? 1 : word
}
