/**
 * `exportNetlist(input)`: the netlist contract's entry point (validated input → output).
 */
import type { NetlistInput, NetlistOutput } from '../contract/netlist'
import type { SolveInput } from '../contract/solve'
import { candidateCircuit } from './candidate'
import { portableNetlist } from './portable'
import { spiceNetlist } from './spice'

function render(c: SolveInput, note: string | undefined, deck: NetlistInput['deck']): NetlistOutput {
  if (deck === 'portable') {
    const p = portableNetlist(c, { note })
    return { netlist: p.netlist, format: 'spice', topology: c.topology, bits: c.bits, elements: p.elements, dcFile: '', dcColumns: p.printColumns, routFile: '', routColumn: c.topology === 'r2r-current' ? 'gout' : 'rout', deck, printColumns: p.printColumns }
  }
  const s = spiceNetlist(c, { note })
  return {
    netlist: s.netlist,
    format: 'spice',
    topology: c.topology,
    bits: c.bits,
    elements: s.elements,
    dcFile: s.dcFile,
    dcColumns: s.dcColumns,
    routFile: s.routFile,
    routColumn: s.routColumn
  }
}

/**
 * SPICE netlist of a validated netlist input (parse it with `netlistInputSchema` first): the
 * given circuit, or the sized candidate (nominal or one sample), whose circuit and sizing are
 * returned too. Pure; the same input always gives the same text.
 */
export function exportNetlist(input: NetlistInput): NetlistOutput {
  if ('circuit' in input) return render(input.circuit, input.note, input.deck)
  const built = candidateCircuit(input)
  const note = input.note ? `${built.note}; ${input.note}` : built.note
  return {
    ...render(built.circuit, note, input.deck),
    circuit: built.circuit,
    sizing: { unitOhm: built.unitOhm, sigmaUnit: built.sigmaUnit },
    design: built.design,
    sample: input.sample
  }
}
