/**
 * AssemblyScript source of the Monte Carlo kernels (loaded by shared/core/stats/wasm-kernels.ts).
 * The generator is FastNormalGenerator.fill (shared/core/stats/ziggurat.ts) line for line: the same
 * xoshiro128** steps, the same layer tables (copied in by the loader, never recomputed here),
 * the same rejection steps with the host's Math.exp and Math.log, so it writes the same stream,
 * bit for bit; a unit test compares the two. Build: `npm run build:kernels`.
 *
 * Memory: KI i32[128] at 0, WN f64[128] at 512, FN f64[128] at 1536, the normals from OUT,
 * segmented leg conductances from LEGS, per bucket (max, min, value at its start) from BUCKETS.
 *
 * The scans below are the hot loops of stats/string-mc.ts and stats/segmented-scan.ts with the
 * same arithmetic in the same order (running sums), so they give the same values; their callers
 * keep the rest (line, replays for codes, envelopes) in TypeScript.
 */
@external('env', 'exp') declare function hostExp(x: f64): f64
@external('env', 'log') declare function hostLog(x: f64): f64

const R: f64 = 3.442619855899
const WN_AT: usize = 512
const FN_AT: usize = 1536
export const OUT: usize = 4096
/** normals the OUT region holds */
export const OUT_CAPACITY: i32 = 66560
export const LEGS: usize = OUT + (<usize>OUT_CAPACITY << 3)
export const LEGS_CAPACITY: i32 = 32768
export const BUCKETS: usize = LEGS + (<usize>LEGS_CAPACITY << 3)
export const BUCKETS_CAPACITY: i32 = 2048

let s0: i32 = 0
let s1: i32 = 0
let s2: i32 = 0
let s3: i32 = 0
let filledSum: f64 = 0
let filledHiK: i32 = 0
let filledLoK: i32 = 0

export function setState(a: i32, b: i32, c: i32, d: i32): void {
  s0 = a
  s1 = b
  s2 = c
  s3 = d
}

export function stateWord(i: i32): i32 {
  return i == 0 ? s0 : i == 1 ? s1 : i == 2 ? s2 : s3
}

export function sum(): f64 {
  return filledSum
}

export function hiK(): i32 {
  return filledHiK
}

export function loK(): i32 {
  return filledLoK
}

function nextInt32(): i32 {
  const m = s1 * 5
  const result = rotl<i32>(m, 7) * 9
  const t = s1 << 9
  s2 ^= s0
  s3 ^= s1
  s1 ^= s2
  s0 ^= s3
  s2 ^= t
  s3 = rotl<i32>(s3, 11)
  return result
}

function nextUniform(): f64 {
  return (<f64><u32>nextInt32() + 0.5) * 2.3283064365386963e-10
}

function slowSample(iz: i32, ji: i32): f64 {
  if (iz != 0) {
    const x = (<f64>ji + 0.5) * load<f64>(WN_AT + (<usize>iz << 3))
    const fi = load<f64>(FN_AT + (<usize>iz << 3))
    const below = load<f64>(FN_AT + (<usize>(iz - 1) << 3))
    return fi + nextUniform() * (below - fi) < hostExp(-0.5 * x * x) ? x : NaN
  }
  while (true) {
    const x = -hostLog(nextUniform()) / R
    const y = -hostLog(nextUniform())
    if (y + y >= x * x) return ji >= 0 ? R + x : -R - x
  }
  return 0
}

/** Writes standard normals to out[start, end) (f64 slots from OUT) and records Σ and the first extremes. */
export function fill(start: i32, end: i32): void {
  let a = s0
  let b = s1
  let c = s2
  let d = s3
  let total: f64 = 0
  let hi: f64 = -Infinity
  let lo: f64 = Infinity
  let hk = start
  let lk = start
  let k = start
  while (k < end) {
    const m = b * 5
    const u = rotl<i32>(m, 7) * 9
    const t = b << 9
    c ^= a
    d ^= b
    b ^= c
    a ^= d
    c ^= t
    d = rotl<i32>(d, 11)
    const iz = u & 127
    const ji = u >> 7
    if ((ji ^ (ji >> 31)) < load<i32>(<usize>iz << 2)) {
      const x = (<f64>ji + 0.5) * load<f64>(WN_AT + (<usize>iz << 3))
      store<f64>(OUT + (<usize>k << 3), x)
      total += x
      if (x > hi) {
        hi = x
        hk = k
      }
      if (x < lo) {
        lo = x
        lk = k
      }
      k++
      continue
    }
    s0 = a
    s1 = b
    s2 = c
    s3 = d
    const v = slowSample(iz, ji)
    a = s0
    b = s1
    c = s2
    d = s3
    if (v == v) {
      store<f64>(OUT + (<usize>k << 3), v)
      total += v
      if (v > hi) {
        hi = v
        hk = k
      }
      if (v < lo) {
        lo = v
        lk = k
      }
      k++
    }
  }
  s0 = a
  s1 = b
  s2 = c
  s3 = d
  filledSum = total
  filledHiK = hk
  filledLoK = lk
}

let legHi: i32 = 0
let legLo: i32 = 0

export function legHiIndex(): i32 {
  return legHi
}

export function legLoIndex(): i32 {
  return legLo
}

/**
 * The running INL of a string, bucket by bucket: over k in [from, from + n) in buckets of `size`,
 * each bucket's (max, min, start) of the value before unit k is added (inl += c0 + c1·z[k]) goes to
 * BUCKETS; returns the value after the last unit (stats/string-mc.ts, stringBucket).
 */
export function stringScan(from: i32, n: i32, size: i32, inl0: f64, c0: f64, c1: f64): f64 {
  let inl = inl0
  let b: usize = 0
  for (let start = from; start < from + n; start += size) {
    const stop = start + size
    let hi: f64 = -Infinity
    let lo: f64 = Infinity
    store<f64>(BUCKETS + b * 24 + 16, inl)
    for (let k = start; k < stop; k++) {
      hi = max<f64>(hi, inl)
      lo = min<f64>(lo, inl)
      inl += c0 + c1 * load<f64>(OUT + (<usize>k << 3))
    }
    store<f64>(BUCKETS + b * 24, hi)
    store<f64>(BUCKETS + b * 24 + 8, lo)
    b++
  }
  return inl
}

/**
 * Segmented unary legs g_j = 1/(2 + b·z_j + sw) for j < count into LEGS; returns Σg in index
 * order and keeps the first largest and smallest positions (models/samplers.ts, sampleLegs).
 */
export function sampleLegs(count: i32, b: f64, sw: f64): f64 {
  let total: f64 = 0
  let hiV: f64 = -Infinity
  let loV: f64 = Infinity
  let hi = 0
  let lo = 0
  for (let j = 0; j < count; j++) {
    const g = 1 / (2 + b * load<f64>(OUT + (<usize>j << 3)) + sw)
    store<f64>(LEGS + (<usize>j << 3), g)
    total += g
    if (g > hiV) {
      hiV = g
      hi = j
    }
    if (g < loV) {
      loV = g
      lo = j
    }
  }
  legHi = hi
  legLo = lo
  return total
}

/**
 * The cumulative unary INL c over segments m = 0 … count in groups of `group`: c starts at c0
 * and gains g_m·k − step after segment m; each group's (max, min, start) of c goes to BUCKETS; returns
 * the last c (stats/segmented-scan.ts, inlGroup).
 */
export function unaryScan(count: i32, k: f64, step: f64, c0: f64, group: i32): f64 {
  let c = c0
  let b: usize = 0
  for (let start = 0; start <= count; start += group) {
    const end = start + group < count + 1 ? start + group : count + 1
    const stop = end < count ? end : count
    let hi: f64 = -Infinity
    let lo: f64 = Infinity
    store<f64>(BUCKETS + b * 24 + 16, c)
    for (let m = start; m < stop; m++) {
      hi = max<f64>(hi, c)
      lo = min<f64>(lo, c)
      c += load<f64>(LEGS + (<usize>m << 3)) * k - step
    }
    if (end > stop) {
      hi = max<f64>(hi, c)
      lo = min<f64>(lo, c)
    }
    store<f64>(BUCKETS + b * 24, hi)
    store<f64>(BUCKETS + b * 24 + 8, lo)
    b++
  }
  return c
}
