/**
 * Fast seeded standard normals: the ziggurat method (Marsaglia and Tsang, J. Stat. Softw. 5(8),
 * 2000; 128 layers, their constants r = 3.442619855899 and v = 9.91256303526217e-3) driven by
 * xoshiro128** (Blackman and Vigna, 2018) 32-bit uniforms seeded with SplitMix64.
 *
 * Each sample takes one 32-bit word: its low 7 bits choose the layer and its upper 25 bits give
 * the signed abscissa, so layer and abscissa come from disjoint bits (the flaw Doornik, 2005,
 * found in the original shared-bit scheme). The abscissa is a symmetric half-integer grid of
 * 2^25 points per layer. Statistical checks (moments, KS) live in tests/unit/shared/core/rng.spec.ts.
 */
import { splitMix64Words } from './seed'

const LAYERS = 128
const SCALE = 16777216 // 2^24: magnitude range of the 25-bit signed abscissa
const R = 3.442619855899
const V = 9.91256303526217e-3
const KN = new Float64Array(LAYERS)
const WN = new Float64Array(LAYERS)
const FN = new Float64Array(LAYERS)
/** Integer form of the fast-path test |j + ½| < KN[i] for the folded index j ^ (j >> 31). */
const KI = new Int32Array(LAYERS)

function buildTables(): void {
  let dn = R
  let tn = dn
  const q = V / Math.exp(-0.5 * dn * dn)
  KN[0] = (dn / q) * SCALE
  KN[1] = 0
  WN[0] = q / SCALE
  WN[LAYERS - 1] = dn / SCALE
  FN[0] = 1
  FN[LAYERS - 1] = Math.exp(-0.5 * dn * dn)
  for (let i = LAYERS - 2; i >= 1; i--) {
    dn = Math.sqrt(-2 * Math.log(V / dn + Math.exp(-0.5 * dn * dn)))
    KN[i + 1] = (dn / tn) * SCALE
    tn = dn
    FN[i] = Math.exp(-0.5 * dn * dn)
    WN[i] = dn / SCALE
  }
  for (let i = 0; i < LAYERS; i++) {
    KI[i] = Math.ceil(KN[i]! - 0.5)
  }
}
buildTables()

/** The layer tables (read-only): the WebAssembly generator copies them so both paths share every constant. */
export const ZIGGURAT_TABLES = { KI, WN, FN } as const

const TWO_POW_M32 = 2.3283064365386963e-10

/** A seeded generator of standard normal deviates with a bulk `fill`. Not thread-shared. */
/** What the last `fill` wrote: out[start, end), Σ in index order, first largest and smallest positions. */
export interface FilledRange {
  start: number
  end: number
  sum: number
  hiK: number
  loK: number
}

export class FastNormalGenerator {
  /** xoshiro128** state; an Int32Array keeps one field representation (int32 values exceed V8's small-integer range) */
  private readonly st = new Int32Array(4)
  private readonly one = new Float64Array(1)
  /** Summary of the last `fill` (overwritten by the next one, `next` included). */
  readonly filled: FilledRange = { start: 0, end: 0, sum: 0, hiK: 0, loK: 0 }

  /** @param seed any safe integer; the same seed always yields the same sequence */
  constructor(seed: number) {
    this.st.set(splitMix64Words(seed, 4))
  }

  /** Next xoshiro128** output as a signed 32-bit integer. */
  nextInt32(): number {
    const st = this.st
    const s1 = st[1]!
    const m = Math.imul(s1, 5)
    const result = Math.imul((m << 7) | (m >>> 25), 9)
    const t = s1 << 9
    st[2] = st[2]! ^ st[0]!
    st[3] = st[3]! ^ s1
    st[1] = s1 ^ st[2]!
    st[0] = st[0]! ^ st[3]!
    st[2] = st[2]! ^ t
    st[3] = (st[3]! << 11) | (st[3]! >>> 21)
    return result
  }

  /** Uniform deviate in the open interval (0, 1). */
  nextUniform(): number {
    return ((this.nextInt32() >>> 0) + 0.5) * TWO_POW_M32
  }

  /** One standard normal deviate (the next value of the same stream `fill` writes). */
  next(): number {
    this.fill(this.one, 0, 1)
    return this.one[0]!
  }

  /**
   * Fills out[start, end) with standard normals and records their sum and first extremes in
   * `filled` (the sum in index order, so it equals a later left-to-right sum exactly; a caller
   * that needs Σz saves that pass, see stats/montecarlo.ts). The fast path (about 99 % of
   * samples: one word, one table test) runs on local copies of the state; a rejected first test
   * saves the state and finishes that sample in `slowSample`, which consumes the following words
   * of the same stream. Hot loop kept whole (and long) on purpose: the generator step must stay
   * inlined in it (the running sum and the rare record branches hide behind its dependency chain).
   */
  fill(out: Float64Array, start = 0, end = out.length): void {
    const st = this.st
    let s0 = st[0]!
    let s1 = st[1]!
    let s2 = st[2]!
    let s3 = st[3]!
    let sum = 0
    let hi = -Infinity
    let lo = Infinity
    let hiK = start
    let loK = start
    let k = start
    while (k < end) {
      const m = Math.imul(s1, 5)
      const u = Math.imul((m << 7) | (m >>> 25), 9)
      const t = s1 << 9
      s2 ^= s0
      s3 ^= s1
      s1 ^= s2
      s0 ^= s3
      s2 ^= t
      s3 = (s3 << 11) | (s3 >>> 21)
      const iz = u & 127
      const ji = u >> 7
      if ((ji ^ (ji >> 31)) < KI[iz]!) {
        const x = (ji + 0.5) * WN[iz]!
        out[k] = x
        sum += x
        if (x > hi) {
          hi = x
          hiK = k
        }
        if (x < lo) {
          lo = x
          loK = k
        }
        k++
        continue
      }
      st[0] = s0
      st[1] = s1
      st[2] = s2
      st[3] = s3
      const v = this.slowSample(iz, ji)
      s0 = st[0]!
      s1 = st[1]!
      s2 = st[2]!
      s3 = st[3]!
      if (v === v) {
        out[k] = v
        sum += v
        if (v > hi) {
          hi = v
          hiK = k
        }
        if (v < lo) {
          lo = v
          loK = k
        }
        k++
      }
    }
    st[0] = s0
    st[1] = s1
    st[2] = s2
    st[3] = s3
    const f = this.filled
    f.start = start
    f.end = end
    f.sum = sum
    f.hiK = hiK
    f.loK = loK
  }

  /** The rejection steps of a sample whose fast test failed: the value, or NaN (rejected; draw anew). */
  private slowSample(iz: number, ji: number): number {
    if (iz !== 0) {
      const x = (ji + 0.5) * WN[iz]!
      return FN[iz]! + this.nextUniform() * (FN[iz - 1]! - FN[iz]!) < Math.exp(-0.5 * x * x) ? x : Number.NaN
    }
    for (;;) {
      const x = -Math.log(this.nextUniform()) / R
      const y = -Math.log(this.nextUniform())
      if (y + y >= x * x) {
        return ji >= 0 ? R + x : -R - x
      }
    }
  }
}

// Type feedback for all of `fill`, loop exit included, before V8 optimizes it: the first real call
// is long enough for on-stack replacement to compile the loop before the code after it ever ran,
// and that code then left through a deoptimization on every later call (a throwaway generator).
new FastNormalGenerator(1).fill(new Float64Array(64))
