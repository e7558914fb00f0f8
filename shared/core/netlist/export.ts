/**
 * `exportNetlist(input)`: the netlist contract's entry point (validated input → output).
 */
import type { NetlistInput, NetlistOutput } from '../contract/netlist'
import { spiceNetlist } from './spice'

/**
 * SPICE netlist of the circuit in a validated netlist input (parse it with
 * `netlistInputSchema` first). Pure; the text is the same for the same input.
 */
export function exportNetlist(input: NetlistInput): NetlistOutput {
  const c = input.circuit
  const s = spiceNetlist(c, { note: input.note })
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
