/**
 * SPICE netlist export of any circuit (a solve input): plain SPICE with behavioural sources,
 * ideal switches as controlled sources, a DC sweep of a `code` source over all codes, and a
 * `.control` block writing the results with `wrdata` (15 digits). Runs unchanged in ngspice
 * batch mode (`ngspice -b file.cir`); other simulators take the element section.
 */
import type { SolveInput } from '../contract/solve'
import { bitDecoders, createDeck, num } from './deck'
import type { Deck } from './deck'
import { emitR2rCurrent, emitR2rVoltage, emitSegmented, emitString, emitTwoStage } from './topologies'

export interface SpiceOptions {
  /** free text placed in the header, e.g. which Monte Carlo sample this is */
  note?: string
  /** results file of the sweep (columns: code, output, reference current) */
  dcFile?: string
  /** results file of the output-resistance sweep (columns: code, R_out; current mode: code, G_out) */
  routFile?: string
  /** replaces the default `.control` block body (lines between `.control` and `.endc`) */
  controlLines?: string[]
}

export interface SpiceNetlist {
  netlist: string
  format: 'spice'
  /** element lines in the netlist */
  elements: number
  dcFile: string
  routFile: string
  /** column names of dcFile after the code column */
  dcColumns: string[]
  /** column name of routFile after the code column: `rout` (ohms) or `gout` (siemens) */
  routColumn: 'rout' | 'gout'
}

/** Convergence tolerances of every exported deck (relative, volts, amperes). */
export const TIGHT_TOLERANCES = 'reltol=1e-12 vntol=1e-12 abstol=1e-15'

/** Probe current (A) injected into the output for the R_out sweep (V_REF shorted). */
const PROBE_A = 1e-3

/** Emits the circuit; returns independent sources besides V_REF to zero for the R_out sweep (also portable.ts). */
export function body(deck: Deck, c: SolveInput): string[] {
  switch (c.topology) {
    case 'string':
      emitString(deck, c)
      return []
    case 'r2r-voltage':
      emitR2rVoltage(deck, c)
      return []
    case 'r2r-current':
      emitR2rCurrent(deck, c)
      return []
    case 'segmented':
      emitSegmented(deck, c)
      return []
    case 'two-stage-string':
      return emitTwoStage(deck, c)
  }
}

export function header(deck: Deck, c: SolveInput, o: SpiceOptions): void {
  deck.raw(`* Rungwise netlist: ${c.topology}, ${c.bits} bits, V_REF = ${num(c.vrefV)} V`)
  if (o.note) deck.comment(o.note)
  deck.comment('Units: ohms, volts, amperes. Ideal switches are controlled sources (B/V elements).')
  deck.comment(`Sweep: V(code) from 0 to ${2 ** c.bits - 1} in steps of 1; each code is one DC point.`)
  deck.element('VREF', ['ref', '0'], `DC ${num(c.vrefV)}`, 'reference voltage source')
  deck.element('VCODE', ['code', '0'], 'DC 0', 'input code as a voltage (swept)')
  bitDecoders(deck, c.bits)
}

function control(deck: Deck, c: SolveInput, o: Required<Pick<SpiceOptions, 'dcFile' | 'routFile'>>, zeroed: string[]): void {
  const last = 2 ** c.bits - 1
  const current = c.topology === 'r2r-current'
  deck.raw('.control')
  deck.raw('set wr_singlescale')
  deck.raw('set wr_vecnames')
  deck.raw('option numdgt=15')
  deck.raw(`dc vcode 0 ${last} 1`)
  deck.raw(current ? 'let iout = i(voutp)' : 'let vout = v(out)')
  deck.raw('let iref = -i(vref)')
  deck.raw(`wrdata ${o.dcFile} ${current ? 'iout' : 'vout'} iref`)
  for (const source of ['vref', ...zeroed]) deck.raw(`alter ${source} dc = 0`)
  deck.raw(current ? 'alter voutp dc = 1' : `alter iprobe dc = ${num(PROBE_A)}`)
  deck.raw(`dc vcode 0 ${last} 1`)
  deck.raw(current ? 'let gout = -i(voutp)' : `let rout = v(out)/${num(PROBE_A)}`)
  deck.raw(`wrdata ${o.routFile} ${current ? 'gout' : 'rout'}`)
  deck.raw('quit 0')
  deck.raw('.endc')
}

/**
 * Writes the SPICE netlist of one circuit. Outputs when run in ngspice: `dcFile` with code,
 * V(out) (or I_OUT into the output pin held at 0 V, current mode) and the current drawn from
 * V_REF; `routFile` with code and the output resistance in ohms (V_REF and other sources
 * shorted), or for current mode the output conductance in siemens at the output pin (0 at code
 * 0, where the pin is open).
 */
export function spiceNetlist(c: SolveInput, options: SpiceOptions = {}): SpiceNetlist {
  const files = { dcFile: options.dcFile ?? 'rungwise-dc.txt', routFile: options.routFile ?? 'rungwise-rout.txt' }
  const deck = createDeck()
  header(deck, c, options)
  const zeroed = body(deck, c)
  if (c.topology === 'r2r-current') deck.element('VOUTP', ['out', '0'], 'DC 0', 'output pin held at 0 V (virtual ground); its current is I_OUT')
  else deck.element('IPROBE', ['0', 'out'], 'DC 0', 'test current into the output, used only by the R_out sweep')
  // Newton on the behavioural selectors may stop within the default reltol (1e-3) before the
  // bits have settled; tight tolerances make every DC point converge to the exact linear solution
  deck.raw(`.options ${TIGHT_TOLERANCES}`)
  if (options.controlLines) {
    deck.raw('.control')
    for (const line of options.controlLines) deck.raw(line)
    deck.raw('.endc')
  } else {
    control(deck, c, files, zeroed)
  }
  deck.raw('.end')
  const dcColumns = [c.topology === 'r2r-current' ? 'iout' : 'vout', 'iref']
  const routColumn = c.topology === 'r2r-current' ? 'gout' : 'rout'
  return { netlist: deck.text(), format: 'spice', elements: deck.count(), ...files, dcColumns, routColumn }
}
