/**
 * A portable SPICE deck of any circuit: the same elements and sources as the ngspice deck
 * (spice.ts: header and body), the DC sweep of the `code` source over every code and a `.print`
 * of the output and the reference current, and nothing simulator-specific: no `.control` block,
 * no result files. Switches stay behavioural sources (B elements with V(), I() and floor()), which
 * ngspice, Xyce and LTspice read; simulators that write them as E/G `VALUE=` sources need that
 * one edit. The `.options` line uses the classic SPICE2 names (RELTOL, VNTOL, ABSTOL).
 */
import type { SolveInput } from '../contract/solve'
import { createDeck } from './deck'
import { body, header, TIGHT_TOLERANCES } from './spice'

export interface PortableNetlist {
  netlist: string
  /** element lines in the deck */
  elements: number
  /** what `.print dc` lists after the swept code, in order */
  printColumns: string[]
}

/** Writes the portable deck of one circuit (pure; the same input always gives the same text). */
export function portableNetlist(c: SolveInput, options: { note?: string } = {}): PortableNetlist {
  const deck = createDeck()
  header(deck, c, options)
  deck.comment('Portable deck: elements, sources and the sweep only; read the .print table (or your simulator\'s own output).')
  body(deck, c)
  const current = c.topology === 'r2r-current'
  if (current) deck.element('VOUTP', ['out', '0'], 'DC 0', 'output pin held at 0 V (virtual ground); its current is I_OUT')
  deck.raw(`.options ${TIGHT_TOLERANCES}`)
  deck.raw(`.dc VCODE 0 ${2 ** c.bits - 1} 1`)
  const printColumns = [current ? 'i(voutp)' : 'v(out)', 'i(vref)']
  deck.comment(`Columns: ${current ? 'I_OUT into the held output pin' : 'V(out)'}, then the current through VREF (the negative of the current drawn from the reference).`)
  deck.raw(`.print dc ${printColumns.join(' ')}`)
  deck.raw('.end')
  return { netlist: deck.text(), elements: deck.count(), printColumns }
}
