/**
 * Per-code reference solutions of every topology, built as explicit switched resistor networks
 * (each switch position drawn as a wire to V_REF, ground or the output pin) and solved with the
 * dense nodal solver. Deliberately naive: one full nodal solve per code and per quantity.
 */
import type { SolveInput } from '#shared/core/contract/solve'
import { solveNodal } from './dense-nodal'
import type { Resistor } from './dense-nodal'

export interface ReferenceCode {
  value: number
  irefA: number
  routOhm: number | null
}

const bit = (k: number, n: number, i: number): number => (k >> (n - 1 - i)) & 1

function ladder(net: Resistor[], legs: number[], series: number[], term: number, sw: number, to: (i: number) => string, first = 'n0'): void {
  const node = (i: number) => (i === 0 ? first : `n${i}`)
  legs.forEach((r, i) => net.push({ a: node(i), b: to(i), ohm: r + sw }))
  series.forEach((r, i) => net.push({ a: node(i), b: node(i + 1), ohm: r }))
  net.push({ a: node(legs.length - 1), b: '0', ohm: term })
}

function chain(net: Resistor[], r: number[], prefix: string, low: string, high: string): (k: number) => string {
  const node = (k: number) => (k === 0 ? low : k === r.length ? high : `${prefix}${k}`)
  r.forEach((ohm, k) => net.push({ a: node(k), b: node(k + 1), ohm }))
  return node
}

/** Voltage-output network for code k, with `ref` at vref (or 0 for R_out), output node `out`. */
function voltageNet(c: SolveInput, k: number): { net: Resistor[], fixed: Record<string, number> } {
  const net: Resistor[] = []
  const sw = c.switchOhm ?? 0
  if (c.topology === 'r2r-voltage') {
    ladder(net, c.legsOhm, c.seriesOhm, c.terminationOhm, sw, i => (bit(k, c.bits, i) ? 'ref' : '0'), 'out')
  } else if (c.topology === 'segmented') {
    const l = c.bits - c.unaryBits
    const m = k >> l
    c.unaryLegsOhm.forEach((r, j) => net.push({ a: 'out', b: j < m ? 'ref' : '0', ohm: r + sw }))
    net.push({ a: 'out', b: 'n0', ohm: c.jointOhm })
    ladder(net, c.legsOhm, c.seriesOhm, c.terminationOhm, sw, i => (bit(k, l, i) ? 'ref' : '0'))
  } else if (c.topology === 'string') {
    const tap = chain(net, c.unitsOhm, 't', '0', 'ref')
    net.push({ a: tap(k), b: 'out', ohm: sw })
  } else if (c.topology === 'two-stage-string' && !c.buffered) {
    const l = c.bits - c.coarseBits
    const seg = k >> l
    const coarse = chain(net, c.coarseOhm, 'c', '0', 'ref')
    const fine = chain(net, c.fineOhm, 'f', 'fl', 'fh')
    net.push({ a: coarse(seg), b: 'fl', ohm: sw }, { a: 'fh', b: coarse(seg + 1), ohm: sw })
    net.push({ a: fine(k & (2 ** l - 1)), b: 'out', ohm: sw })
  }
  return { net, fixed: {} }
}

function bufferedTwoStage(c: Extract<SolveInput, { topology: 'two-stage-string' }>, k: number): ReferenceCode {
  const l = c.bits - c.coarseBits
  const seg = k >> l
  const coarseNet: Resistor[] = []
  const coarse = chain(coarseNet, c.coarseOhm, 'c', '0', 'ref')
  const cs = solveNodal(coarseNet, { ref: c.vrefV })
  const [osLo, osHi] = c.bufferOffsetV ?? [0, 0]
  const fineNet: Resistor[] = []
  const fine = chain(fineNet, c.fineOhm, 'f', 'fl', 'fh')
  fineNet.push({ a: fine(k & (2 ** l - 1)), b: 'out', ohm: c.switchOhm ?? 0 })
  const fixed = { fl: cs.v(coarse(seg)) + osLo, fh: cs.v(coarse(seg + 1)) + osHi }
  const vs = solveNodal(fineNet, fixed)
  const rout = solveNodal(fineNet, { fl: 0, fh: 0 }, { out: 1 }).v('out')
  return { value: vs.v('out'), irefA: cs.currentOut('ref'), routOhm: rout }
}

function currentMode(c: Extract<SolveInput, { topology: 'r2r-current' }>, k: number): ReferenceCode {
  const net: Resistor[] = []
  ladder(net, c.legsOhm, c.seriesOhm, c.terminationOhm, c.switchOhm ?? 0, i => (bit(k, c.bits, i) ? 'outp' : '0'), 'ref')
  const s = solveNodal(net, { ref: c.vrefV, outp: 0 })
  const value = -s.currentOut('outp')
  const rout = k === 0 ? null : solveNodal(net, { ref: 0 }, { outp: 1 }).v('outp')
  return { value, irefA: s.currentOut('ref'), routOhm: rout }
}

/** Reference value, I_REF and R_out of one code (switch resistances must be > 0 where used). */
export function referenceCode(c: SolveInput, k: number): ReferenceCode {
  if (c.topology === 'r2r-current') return currentMode(c, k)
  if (c.topology === 'two-stage-string' && c.buffered) return bufferedTwoStage(c, k)
  const { net } = voltageNet(c, k)
  const s = solveNodal(net, { ref: c.vrefV })
  const rout = solveNodal(net, { ref: 0 }, { out: 1 }).v('out')
  return { value: s.v('out'), irefA: s.currentOut('ref'), routOhm: rout }
}
