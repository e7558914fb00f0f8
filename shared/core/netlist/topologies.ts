/**
 * Element emitters of each topology for the SPICE export. Node names: `ref` (V_REF), `out`
 * (output), `b<i>` bits (b1 = MSB), ladder nodes `n<i>` (n1 = MSB/output end).
 */
import type { R2rCurrentInput, R2rVoltageInput, SegmentedInput, StringInput, TwoStageInput } from '../contract/solve'
import type { Deck } from './deck'
import { num, selector, selectorTree } from './deck'

/** A leg: resistor, optional switch resistance, ideal changeover to `lo`/`hi`. */
function leg(deck: Deck, id: string, node: string, ohm: number, swOhm: number, lo: string, hi: string, bit: string, what: string): void {
  const end = `${id.toLowerCase()}_s`
  const mid = swOhm > 0 ? `${id.toLowerCase()}_m` : end
  deck.element(`R${id}`, [node, mid], num(ohm), `${what}: leg resistor`)
  if (swOhm > 0) deck.element(`R${id}SW`, [mid, end], num(swOhm), `${what}: switch on-resistance`)
  selector(deck, `S${id}`, end, lo, hi, bit, `${what} switch`)
}

/** Series resistors and termination (with its dummy switch, when designed) of a ladder whose MSB node is `n1`. */
function ladderBody(deck: Deck, c: { legsOhm: number[], seriesOhm: number[], terminationOhm: number, terminationSwitchOhm?: number }, first: string): void {
  const node = (i: number) => (i === 0 ? first : `n${i + 1}`)
  c.seriesOhm.forEach((r, i) => deck.element(`RSER${i + 1}`, [node(i), node(i + 1)], num(r), `series resistor ${i + 1} (R), between ladder nodes ${i + 1} and ${i + 2}`))
  const dummy = c.terminationSwitchOhm ?? 0
  const last = node(c.legsOhm.length - 1)
  if (dummy > 0) {
    deck.element('RTERM', [last, 'term_d'], num(c.terminationOhm), 'termination (2R) from the LSB node')
    deck.element('RTERMSW', ['term_d', '0'], num(dummy), 'dummy switch in the termination, always on (matches the leg switches)')
    return
  }
  deck.element('RTERM', [last, '0'], num(c.terminationOhm), 'termination (2R) from the LSB node to ground')
}

/** The switch of leg i: its own on-resistance when the design gives one per leg, else the common one. */
function legSwitch(c: { switchOhm?: number, legSwitchOhm?: number[] }, i: number): number {
  return c.legSwitchOhm ? c.legSwitchOhm[i]! : (c.switchOhm ?? 0)
}

/** Voltage-mode ladder: node n1 is the output node `out`. */
export function emitR2rVoltage(deck: Deck, c: R2rVoltageInput): void {
  const node = (i: number) => (i === 0 ? 'out' : `n${i + 1}`)
  c.legsOhm.forEach((r, i) => leg(deck, `LEG${i + 1}`, node(i), r, legSwitch(c, i), '0', 'ref', `b${i + 1}`, `leg ${i + 1}`))
  ladderBody(deck, c, 'out')
}

/** Current-mode ladder: V_REF drives n1 (= `ref`); legs steer to the output pin `out` or ground. */
export function emitR2rCurrent(deck: Deck, c: R2rCurrentInput): void {
  const node = (i: number) => (i === 0 ? 'ref' : `n${i + 1}`)
  c.legsOhm.forEach((r, i) => leg(deck, `LEG${i + 1}`, node(i), r, legSwitch(c, i), '0', 'out', `b${i + 1}`, `leg ${i + 1}`))
  ladderBody(deck, c, 'ref')
}

/** Segmented: unary legs on `out` driven by thermometer nodes t<j>, joint R to the L-bit ladder. */
export function emitSegmented(deck: Deck, c: SegmentedInput): void {
  const l = c.bits - c.unaryBits
  const sw = c.switchOhm ?? 0
  c.unaryLegsOhm.forEach((r, j) => {
    const expr = `min(1,max(0,floor((V(code)+0.5)/${2 ** l})-${j}))`
    deck.element(`BTHERM${j + 1}`, [`t${j + 1}`, '0'], `V=${expr}`, `thermometer bit ${j + 1}: 1 V when the upper ${c.unaryBits} bits exceed ${j}`)
    leg(deck, `UNARY${j + 1}`, 'out', r, c.unaryLegSwitchOhm ? c.unaryLegSwitchOhm[j]! : sw, '0', 'ref', `t${j + 1}`, `unary leg ${j + 1}`)
  })
  deck.element('RJOINT', ['out', 'n1'], num(c.jointOhm), 'joint resistor (R) from the output node to the ladder MSB node')
  c.legsOhm.forEach((r, i) => leg(deck, `LEG${i + 1}`, `n${i + 1}`, r, legSwitch(c, i), '0', 'ref', `b${c.unaryBits + i + 1}`, `ladder leg ${i + 1}`))
  ladderBody(deck, c, 'n1')
}

/** Resistor chain from `low` to `high`; returns the node names of taps 0 … r.length. */
function chain(deck: Deck, prefix: string, r: number[], low: string, high: string, what: string): string[] {
  const taps = r.map((_, k) => (k === 0 ? low : `${prefix.toLowerCase()}${k}`)).concat(high)
  r.forEach((ohm, k) => deck.element(`R${prefix}${k + 1}`, [taps[k] as string, taps[k + 1] as string], num(ohm), `${what} resistor ${k + 1} (tap ${k} to tap ${k + 1})`))
  return taps
}

/** The output switch: resistor from the selected node to `out`, or a 0 V link when ideal. */
function outputSwitch(deck: Deck, from: string, ohm: number, what: string): void {
  if (ohm > 0) deck.element('RSWOUT', [from, 'out'], num(ohm), `${what} on-resistance in series with the output`)
  else deck.element('VSWOUT', [from, 'out'], 'DC 0', `${what} (ideal): 0 V link to the output`)
}

/** Bit node names, LSB first, for value bits lo … hi−1 of an n-bit code. */
function bitsLsbFirst(n: number, lo: number, hi: number): string[] {
  const out: string[] = []
  for (let p = lo; p < hi; p++) out.push(`b${n - p}`)
  return out
}

/** String: unit chain, a selector tree picks tap k (k units below it). */
export function emitString(deck: Deck, c: StringInput): void {
  const taps = chain(deck, 'UNIT', c.unitsOhm, '0', 'ref', 'string unit')
  selectorTree(deck, 'TAP', taps.slice(0, -1), bitsLsbFirst(c.bits, 0, c.bits), 'sel', 'tap selector')
  const how = c.decode === 'tree' ? `tree decode (${c.bits} switches in series)` : 'direct decode (one switch)'
  outputSwitch(deck, 'sel', c.switchOhm ?? 0, `tap switch path, ${how}`)
}

/**
 * Two-stage string; buffered uses ideal unity-gain buffers with series offset sources.
 * @returns the offset sources, which the R_out sweep must zero along with V_REF
 */
export function emitTwoStage(deck: Deck, c: TwoStageInput): string[] {
  const l = c.bits - c.coarseBits
  const sw = c.switchOhm ?? 0
  const coarse = chain(deck, 'COARSE', c.coarseOhm, '0', 'ref', 'coarse string')
  const upper = bitsLsbFirst(c.bits, l, c.bits)
  selectorTree(deck, 'CLO', coarse.slice(0, -1), upper, 'clo', 'coarse selector, segment bottom')
  selectorTree(deck, 'CHI', coarse.slice(1), upper, 'chi', 'coarse selector, segment top')
  if (c.buffered) {
    const [osLo, osHi] = c.bufferOffsetV ?? [0, 0]
    deck.element('EBUFLO', ['blo', '0', 'clo', '0'], '1', 'ideal unity-gain buffer copying the segment bottom')
    deck.element('VOSLO', ['flo', 'blo'], `DC ${num(osLo)}`, 'offset of the bottom buffer (V)')
    deck.element('EBUFHI', ['bhi', '0', 'chi', '0'], '1', 'ideal unity-gain buffer copying the segment top')
    deck.element('VOSHI', ['fhi', 'bhi'], `DC ${num(osHi)}`, 'offset of the top buffer (V)')
  } else if (sw > 0) {
    deck.element('RSWCLO', ['clo', 'flo'], num(sw), 'coarse selection switch on-resistance, bottom')
    deck.element('RSWCHI', ['fhi', 'chi'], num(sw), 'coarse selection switch on-resistance, top')
  }
  const ends = c.buffered || sw > 0 ? ['flo', 'fhi'] : ['clo', 'chi']
  const fine = chain(deck, 'FINE', c.fineOhm, ends[0] as string, ends[1] as string, 'fine string')
  selectorTree(deck, 'FTAP', fine.slice(0, -1), bitsLsbFirst(c.bits, 0, l), 'fsel', 'fine tap selector')
  outputSwitch(deck, 'fsel', sw, 'fine tap switch')
  return c.buffered ? ['voslo', 'voshi'] : []
}
