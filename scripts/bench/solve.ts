/**
 * Solver benchmarks (section of `npm run bench`):
 * 1. exact solve of a mismatched 16-bit R-2R ladder, all 65,536 codes with I_REF and R_out;
 * 2. ngspice against the engine on the same 200 mismatched 8-bit ladders (all 256 codes each):
 *    ngspice at its fastest (one process, one `.control` loop that alters the 16 resistors and
 *    reruns the DC sweep per sample, process start subtracted) against the engine's
 *    allocation-free weights + transfer per sample; outputs must agree within 1e-9 of V_REF.
 */
import { spawnSync } from 'node:child_process'
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { buildCircuit } from '../../shared/core/circuits/index'
import type { R2rVoltageInput } from '../../shared/core/contract/solve'
import { spiceNetlist } from '../../shared/core/netlist/spice'
import { linearAllCodes } from '../../shared/core/solve/codes'
import { solveCircuit } from '../../shared/core/solve/index'
import { ladderWeights } from '../../shared/core/solve/ladder'
import { solveR2rVoltage } from '../../shared/core/solve/r2r'
import { createNormalSource } from '../../shared/core/stats/rng'

export interface BenchRow {
  name: string
  value: number
  unit: string
  target: string
  pass: boolean
}

const NGSPICE = '/usr/bin/ngspice'
const SIGMA_UNIT = 0.01
const UNIT_OHM = 10e3
const VREF_V = 2.5

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b)
  return s[Math.floor(s.length / 2)] as number
}

function ladders(bits: number, count: number, seed: number): R2rVoltageInput[] {
  const normal = createNormalSource(seed)
  return Array.from({ length: count }, () => buildCircuit({ topology: 'r2r-voltage', bits }, { unitOhm: UNIT_OHM, vrefV: VREF_V, sigmaUnit: SIGMA_UNIT, normal }) as R2rVoltageInput)
}

/** Median wall time (ms) of the full 16-bit exact solve (typed arrays), and of the JSON contract form. */
function bench16(): BenchRow[] {
  const [c] = ladders(16, 1, 16) as [R2rVoltageInput]
  for (let i = 0; i < 5; i++) solveR2rVoltage(c)
  const times: number[] = []
  for (let i = 0; i < 30; i++) {
    const t0 = performance.now()
    solveR2rVoltage(c)
    times.push(performance.now() - t0)
  }
  const contract: number[] = []
  for (let i = 0; i < 5; i++) {
    const t0 = performance.now()
    solveCircuit(c)
    contract.push(performance.now() - t0)
  }
  const ms = median(times)
  return [
    { name: 'exact solve, 16-bit mismatched R-2R, 65,536 codes with V, I_REF, R_out', value: ms, unit: 'ms', target: '< 10 ms', pass: ms < 10 },
    { name: 'same, as the solve contract (65,536 JSON-ready entries)', value: median(contract), unit: 'ms', target: 'informational', pass: true }
  ]
}

/** ngspice control lines that alter every resistor of each sample and rerun the sweep. */
function loopControl(samples: R2rVoltageInput[], file: string): string[] {
  const lines = ['set wr_singlescale', 'set wr_vecnames', 'set appendwrite', 'option numdgt=15']
  for (const s of samples) {
    s.legsOhm.forEach((r, i) => lines.push(`alter rleg${i + 1} = ${r}`))
    s.seriesOhm.forEach((r, i) => lines.push(`alter rser${i + 1} = ${r}`))
    lines.push(`alter rterm = ${s.terminationOhm}`, `dc vcode 0 ${2 ** s.bits - 1} 1`, `wrdata ${file} v(out)`, 'destroy all')
  }
  lines.push('quit 0')
  return lines
}

/** Runs ngspice once on `samples`; returns wall ms and the V(out) rows of every sample. */
function runLoop(samples: R2rVoltageInput[], nominal: R2rVoltageInput): { ms: number, values: number[] } {
  const dir = mkdtempSync(join(tmpdir(), 'rungwise-bench-'))
  try {
    const deck = spiceNetlist(nominal, { controlLines: loopControl(samples, 'loop.txt') }).netlist
    writeFileSync(join(dir, 'deck.cir'), deck)
    const t0 = performance.now()
    const r = spawnSync(NGSPICE, ['-b', 'deck.cir'], { cwd: dir, encoding: 'utf8', timeout: 300_000 })
    const ms = performance.now() - t0
    // long sweeps print a progress counter ("Reference value : …") on stderr; anything else is an error
    const errors = r.stderr.replace(/Reference value\s*:\s*\S+/g, '').trim()
    if (r.status !== 0 || errors !== '') throw new Error(`ngspice failed: ${errors.slice(0, 500)}`)
    const values = samples.length === 0
      ? []
      : readFileSync(join(dir, 'loop.txt'), 'utf8').split('\n')
          .filter(l => /^\s*[-\d]/.test(l)).map(l => Number(l.trim().split(/\s+/)[1]))
    return { ms, values }
  } finally {
    rmSync(dir, { recursive: true, force: true })
  }
}

/**
 * Engine per-sample time (µs): weights + all codes into one reused buffer, as a Monte Carlo
 * loop does (allocation-free), median over repetitions; then one pass fills `out` per sample
 * for the comparison with ngspice.
 */
function engineLoop(samples: R2rVoltageInput[], out: Float64Array[]): number {
  const w = new Float64Array(8)
  const v = new Float64Array(256)
  const run = () => {
    for (let s = 0; s < samples.length; s++) {
      const c = samples[s] as R2rVoltageInput
      ladderWeights(c.legsOhm, c.seriesOhm, c.terminationOhm, 0, w)
      linearAllCodes(w, c.vrefV, v)
    }
  }
  for (let i = 0; i < 500; i++) run()
  const per: number[] = []
  for (let rep = 0; rep < 50; rep++) {
    const t0 = performance.now()
    for (let i = 0; i < 20; i++) run()
    per.push((performance.now() - t0) * 1000 / (20 * samples.length))
  }
  samples.forEach((c, s) => linearAllCodes(ladderWeights(c.legsOhm, c.seriesOhm, c.terminationOhm, 0, w), c.vrefV, out[s] as Float64Array))
  return median(per)
}

function benchVsNgspice(): BenchRow[] {
  const samples = ladders(8, 200, 8)
  const nominal = buildCircuit({ topology: 'r2r-voltage', bits: 8 }, { unitOhm: UNIT_OHM, vrefV: VREF_V }) as R2rVoltageInput
  const empty = median([0, 1, 2].map(() => runLoop([], nominal).ms))
  const full = runLoop(samples, nominal)
  const ngspiceMsPerSample = (full.ms - empty) / samples.length
  const out = samples.map(() => new Float64Array(256))
  const engineUs = engineLoop(samples, out)
  let worst = 0
  out.forEach((v, s) => v.forEach((x, k) => {
    worst = Math.max(worst, Math.abs(x - (full.values[s * 256 + k] as number)) / VREF_V)
  }))
  const ratio = ngspiceMsPerSample * 1000 / engineUs
  return [
    { name: 'ngspice, 8-bit ladder, one process, .control alter loop (start-up subtracted)', value: ngspiceMsPerSample, unit: 'ms/sample', target: 'reference (≈ 5 ms)', pass: true },
    { name: 'engine, same 200 samples, weights + 256 codes', value: engineUs, unit: 'µs/sample', target: 'informational', pass: true },
    { name: 'engine speed-up over ngspice per sample', value: ratio, unit: '×', target: '≥ 10,000×', pass: ratio >= 10_000 },
    { name: 'largest |V_engine − V_ngspice| / V_REF over 200 × 256 outputs', value: worst, unit: '', target: '< 1e-9', pass: worst < 1e-9 && full.values.length === 200 * 256 }
  ]
}

/** Runs the solver benchmarks and returns one row per measurement. */
export function runSolveBench(): BenchRow[] {
  return [...bench16(), ...benchVsNgspice()]
}
