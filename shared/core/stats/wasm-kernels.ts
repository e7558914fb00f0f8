/**
 * The Monte Carlo kernels in WebAssembly (source: scripts/kernels/montecarlo.ts): the fast
 * normal generator (the same stream as FastNormalGenerator, bit for bit) and the hot scans of the
 * string and segmented samplers (the same arithmetic in the same order). A 16-bit trial draws
 * 2^16 normals and scans as many units; here that runs about a quarter faster, with nothing
 * copied: the driver and samplers read the kernels' memory through Float64Array views.
 *
 * One instance per thread (state in its globals). `claimWasmNormals` hands the normal buffer to
 * one Monte Carlo chunk at a time; a sampler uses the scans only when its z is that buffer
 * (`kernelsFor`). Where WebAssembly is missing or refused (a browser CSP without
 * 'wasm-unsafe-eval'), everything stays on the TypeScript path, which gives the same numbers.
 */
import { KERNELS_WASM_BASE64 } from './kernels-wasm'
import { splitMix64Words } from './seed'
import type { FilledRange } from './ziggurat'
import { ZIGGURAT_TABLES } from './ziggurat'

interface Exports {
  memory: WebAssembly.Memory
  OUT: WebAssembly.Global
  OUT_CAPACITY: WebAssembly.Global
  LEGS: WebAssembly.Global
  LEGS_CAPACITY: WebAssembly.Global
  BUCKETS: WebAssembly.Global
  BUCKETS_CAPACITY: WebAssembly.Global
  setState: (a: number, b: number, c: number, d: number) => void
  stateWord: (i: number) => number
  sum: () => number
  hiK: () => number
  loK: () => number
  fill: (start: number, end: number) => void
  stringScan: (from: number, n: number, size: number, inl0: number, c0: number, c1: number) => number
  sampleLegs: (count: number, b: number, sw: number) => number
  legHiIndex: () => number
  legLoIndex: () => number
  unaryScan: (count: number, k: number, step: number, c0: number, group: number) => number
}

/** The kernels and views of their memory. */
export interface Kernels {
  /** the normal buffer (OUT region) */
  normals: Float64Array
  /** segmented leg conductances (LEGS region) */
  legs: Float64Array
  /** per bucket b: max at 3b, min at 3b + 1, the running value at its start at 3b + 2 (BUCKETS region) */
  buckets: Float64Array
  bucketCapacity: number
  stringScan: Exports['stringScan']
  sampleLegs: Exports['sampleLegs']
  legHiIndex: Exports['legHiIndex']
  legLoIndex: Exports['legLoIndex']
  unaryScan: Exports['unaryScan']
  raw: Exports
}

let loaded: Kernels | null | undefined
let claimed = false

function decode(b64: string): Uint8Array<ArrayBuffer> {
  const text = atob(b64)
  const bytes = new Uint8Array(text.length)
  for (let i = 0; i < text.length; i++) bytes[i] = text.charCodeAt(i)
  return bytes
}

/** The thread's kernels, instantiated on first use; null where WebAssembly is unavailable. */
export function loadKernels(): Kernels | null {
  if (loaded !== undefined) return loaded
  try {
    const module = new WebAssembly.Module(decode(KERNELS_WASM_BASE64))
    const x = new WebAssembly.Instance(module, { env: { exp: Math.exp, log: Math.log } }).exports as unknown as Exports
    const at = (g: WebAssembly.Global) => Number(g.value)
    const buffer = x.memory.buffer
    if (at(x.BUCKETS) + at(x.BUCKETS_CAPACITY) * 24 > buffer.byteLength) throw new Error('kernel memory too small')
    new Int32Array(buffer, 0, 128).set(ZIGGURAT_TABLES.KI)
    new Float64Array(buffer, 512, 128).set(ZIGGURAT_TABLES.WN)
    new Float64Array(buffer, 1536, 128).set(ZIGGURAT_TABLES.FN)
    loaded = {
      normals: new Float64Array(buffer, at(x.OUT), at(x.OUT_CAPACITY)),
      legs: new Float64Array(buffer, at(x.LEGS), at(x.LEGS_CAPACITY)),
      buckets: new Float64Array(buffer, at(x.BUCKETS), 3 * at(x.BUCKETS_CAPACITY)),
      bucketCapacity: at(x.BUCKETS_CAPACITY),
      stringScan: x.stringScan,
      sampleLegs: x.sampleLegs,
      legHiIndex: x.legHiIndex,
      legLoIndex: x.legLoIndex,
      unaryScan: x.unaryScan,
      raw: x
    }
  } catch {
    loaded = null
  }
  return loaded
}

/** The kernels if this thread has loaded them (never loads). */
export function loadedKernels(): Kernels | null {
  return loaded ?? null
}

/** The kernels when `z` is their normal buffer (so the scans can read it), else null. */
export function kernelsFor(z: Float64Array): Kernels | null {
  const k = loaded
  return k && z.buffer === k.normals.buffer && z.byteOffset === k.normals.byteOffset ? k : null
}

/** A seeded generator writing into `z` (a view of the kernels' memory); `release` frees it. */
export interface WasmNormals {
  z: Float64Array
  readonly filled: FilledRange
  fill: (start: number, end: number) => void
  release: () => void
}

/**
 * The normal buffer as `count` normals of the stream seeded with `seed`, or null when
 * WebAssembly is unavailable, the buffer is in use, or `count` exceeds its capacity.
 */
export function claimWasmNormals(seed: number, count: number): WasmNormals | null {
  const k = claimed ? null : loadKernels()
  if (!k || count > k.normals.length) return null
  const x = k.raw
  claimed = true
  const state = Int32Array.from(splitMix64Words(seed, 4))
  const filled: FilledRange = { start: 0, end: 0, sum: 0, hiK: 0, loK: 0 }
  return {
    z: k.normals.subarray(0, count),
    filled,
    fill(start, end) {
      x.setState(state[0]!, state[1]!, state[2]!, state[3]!)
      x.fill(start, end)
      for (let i = 0; i < 4; i++) state[i] = x.stateWord(i)
      filled.start = start
      filled.end = end
      filled.sum = x.sum()
      filled.hiK = x.hiK()
      filled.loK = x.loK()
    },
    release() {
      claimed = false
    }
  }
}
