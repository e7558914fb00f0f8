/**
 * `exportNetlist(input)`: the netlist contract's entry point (validated input → output).
 */
import type { NetlistInput, NetlistOutput } from '../contract/netlist'
import type { SolveInput } from '../contract/solve'
import { candidateCircuit } from './candidate'
import { spiceNetlist } from './spice'

function render(c: SolveInput, note: string | undefined): NetlistOutput {
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
  if ('circuit' in input) return render(input.circuit, input.note)
  const built = candidateCircuit(input)
  const note = input.note ? `${built.note}; ${input.note}` : built.note
  return {
    ...render(built.circuit, note),
    circuit: built.circuit,
    sizing: { unitOhm: built.unitOhm, sigmaUnit: built.sigmaUnit },
    design: built.design,
    sample: input.sample
  }
}
