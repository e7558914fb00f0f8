/**
 * ngspice against the engine on the same 200 mismatched 8-bit ladders (all 256 codes each), a
 * part of the solve section of `npm run bench`: ngspice at its fastest (one process, one
 * `.control` loop that alters the 16 resistors and reruns the DC sweep per sample, fastest of
 * three runs, process start subtracted) against the engine's allocation-free weights + transfer
 * per sample; outputs must agree within 1e-9 of V_REF. The target ratio is taken on CPU time on
 * both sides (ngspice's from the reaped child's rusage), so it does not move with what else the
 * machine runs; the wall-time ratio is shown beside it.
 */
import { spawnSync } from 'node:child_process'
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { buildCircuit } from '../../shared/core/circuits/index'
import type { R2rVoltageInput } from '../../shared/core/contract/solve'
import { spiceNetlist } from '../../shared/core/netlist/spice'
import { linearAllCodes } from '../../shared/core/solve/codes'
import { ladderWeights } from '../../shared/core/solve/ladder'
import type { BenchRow } from './ladders'
import { ladders, median, UNIT_OHM, VREF_V } from './ladders'

const NGSPICE = '/usr/bin/ngspice'
/** USER_HZ of /proc (100 on every Linux architecture the bench runs on) */
const CLOCK_TICKS_PER_S = 100

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

/** CPU seconds (user + system) of this process's reaped children so far (Linux: /proc/self/stat, in clock ticks). */
function childCpuS(): number {
  const fields = readFileSync('/proc/self/stat', 'utf8').replace(/^.*\) /s, '').split(' ')
  // after the command name: field 3 is the state, so cutime (16) and cstime (17) sit at 13 and 14
  return (Number(fields[13]) + Number(fields[14])) / CLOCK_TICKS_PER_S
}

/** Runs ngspice once on `samples`; returns wall and CPU ms and the V(out) rows of every sample. */
function runLoop(samples: R2rVoltageInput[], nominal: R2rVoltageInput): { ms: number, cpuMs: number, values: number[] } {
  const dir = mkdtempSync(join(tmpdir(), 'rungwise-bench-'))
  try {
    const deck = spiceNetlist(nominal, { controlLines: loopControl(samples, 'loop.txt') }).netlist
    writeFileSync(join(dir, 'deck.cir'), deck)
    const c0 = childCpuS()
    const t0 = performance.now()
    const r = spawnSync(NGSPICE, ['-b', 'deck.cir'], { cwd: dir, encoding: 'utf8', timeout: 300_000 })
    const ms = performance.now() - t0
    const cpuMs = (childCpuS() - c0) * 1000
    // long sweeps print a progress counter ("Reference value : …") on stderr; anything else is an error
    const errors = r.stderr.replace(/Reference value\s*:\s*\S+/g, '').trim()
    if (r.status !== 0 || errors !== '') throw new Error(`ngspice failed: ${errors.slice(0, 500)}`)
    const values = samples.length === 0
      ? []
      : readFileSync(join(dir, 'loop.txt'), 'utf8').split('\n')
          .filter(l => /^\s*[-\d]/.test(l)).map(l => Number(l.trim().split(/\s+/)[1]))
    return { ms, cpuMs, values }
  } finally {
    rmSync(dir, { recursive: true, force: true })
  }
}

/** A sample's elements as typed arrays, the form the Monte Carlo samplers hand to the solver. */
interface TypedLadder {
  legs: Float64Array
  series: Float64Array
  termination: number
  vref: number
}

/** Per-sample µs of `run` (one pass over every sample): wall and CPU medians over repeats of ≥ ~20 ms each. */
function perSampleUs(run: () => void, samples: number): { wallUs: number, cpuUs: number } {
  const t = performance.now()
  let passes = 0
  while (performance.now() - t < 500) {
    run()
    passes++
  }
  const inner = Math.max(1, Math.ceil(passes / 25))
  const wall: number[] = []
  const cpu: number[] = []
  for (let rep = 0; rep < 15; rep++) {
    const c0 = process.cpuUsage()
    const t0 = performance.now()
    for (let i = 0; i < inner; i++) run()
    const c = process.cpuUsage(c0)
    wall.push((performance.now() - t0) * 1000 / (inner * samples))
    cpu.push((c.user + c.system) / (inner * samples))
  }
  return { wallUs: median(wall), cpuUs: median(cpu) }
}

/**
 * Engine per-sample time (µs): weights + all codes into one reused buffer, as a Monte Carlo
 * loop does (typed arrays, allocation-free); about half a second of warm-up, then the median of
 * 15 repeats of ≥ 20 ms each. Then one pass fills `out` per sample for the comparison with ngspice.
 */
function engineLoop(samples: R2rVoltageInput[], out: Float64Array[]): { wallUs: number, cpuUs: number } {
  const typed: TypedLadder[] = samples.map(c => ({ legs: Float64Array.from(c.legsOhm), series: Float64Array.from(c.seriesOhm), termination: c.terminationOhm, vref: c.vrefV }))
  const w = new Float64Array(8)
  const v = new Float64Array(256)
  const run = () => {
    for (let s = 0; s < typed.length; s++) {
      const c = typed[s]!
      ladderWeights(c.legs, c.series, c.termination, 0, w)
      linearAllCodes(w, c.vref, v)
    }
  }
  const time = perSampleUs(run, typed.length)
  typed.forEach((c, s) => linearAllCodes(ladderWeights(c.legs, c.series, c.termination, 0, w), c.vref, out[s]!))
  return time
}

/**
 * ngspice at its fastest: the fastest of three runs of the loop deck minus the median start-up
 * (a deck with no samples); CPU time of the child process (what ngspice computes, whatever else
 * the machine runs) and wall time.
 */
function ngspicePerSample(samples: R2rVoltageInput[], nominal: R2rVoltageInput): { wallMs: number, cpuMs: number, values: number[] } {
  const empty = [0, 1, 2].map(() => runLoop([], nominal))
  const full = [0, 1, 2].map(() => runLoop(samples, nominal))
  return {
    wallMs: (Math.min(...full.map(r => r.ms)) - median(empty.map(r => r.ms))) / samples.length,
    cpuMs: (Math.min(...full.map(r => r.cpuMs)) - median(empty.map(r => r.cpuMs))) / samples.length,
    values: full[0]!.values
  }
}

/** The ngspice comparison rows. */
export function benchVsNgspice(): BenchRow[] {
  const samples = ladders(8, 200, 8)
  const nominal = buildCircuit({ topology: 'r2r-voltage', bits: 8 }, { unitOhm: UNIT_OHM, vrefV: VREF_V }) as R2rVoltageInput
  const ng = ngspicePerSample(samples, nominal)
  const out = samples.map(() => new Float64Array(256))
  const engine = engineLoop(samples, out)
  let worst = 0
  out.forEach((v, s) => v.forEach((x, k) => {
    worst = Math.max(worst, Math.abs(x - (ng.values[s * 256 + k] as number)) / VREF_V)
  }))
  const ratio = ng.cpuMs * 1000 / engine.cpuUs
  const wallRatio = ng.wallMs * 1000 / engine.wallUs
  return [
    { name: 'ngspice, 8-bit ladder, one process, .control alter loop (start-up subtracted), CPU time', value: ng.cpuMs, unit: 'ms/sample', target: 'reference (≈ 5 ms)', pass: true },
    { name: 'ngspice, same, wall time (fastest of 3)', value: ng.wallMs, unit: 'ms/sample', target: 'informational', pass: true },
    { name: 'engine, same 200 samples, weights + 256 codes, CPU time (median of 15 repeats)', value: engine.cpuUs, unit: 'µs/sample', target: 'informational', pass: true },
    { name: 'engine speed-up over ngspice per sample (CPU time both sides)', value: ratio, unit: '×', target: '≥ 10,000×', pass: ratio >= 10_000 },
    { name: 'engine speed-up over ngspice per sample (wall time both sides)', value: wallRatio, unit: '×', target: 'informational (moves with load)', pass: true },
    { name: 'largest |V_engine − V_ngspice| / V_REF over 200 × 256 outputs', value: worst, unit: '', target: '< 1e-9', pass: worst < 1e-9 && ng.values.length === 200 * 256 }
  ]
}
