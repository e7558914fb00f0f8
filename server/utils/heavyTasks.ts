import type { NetlistInput, NetlistSpecInput } from '../../shared/core/contract/netlist'
import type { SolveInput } from '../../shared/core/contract/solve'
import { candidateCircuit } from '../../shared/core/netlist/candidate'
import { exportNetlist } from '../../shared/core/netlist/export'
import { solveCircuit, solveCircuitLevels } from '../../shared/core/solve'

/**
 * Work whose cost grows with 2^N besides evaluations (issue 13, finding 3): the exact solve of a
 * circuit, a netlist file and a candidate's nominal transfer. Each runs on the worker pool
 * (server/workers/evaluate.worker.ts), under the user's heavy slot (heavyRequests.ts).
 */
export type HeavyTask
  = | { kind: 'solve', input: SolveInput }
    | { kind: 'netlist-file', input: NetlistInput, maxBytes: number }
    | { kind: 'nominal', input: NetlistSpecInput }

/** A netlist file, or only its size when it is above `maxBytes` (the text never crosses back). */
export interface NetlistFile { bytes: number, text: string | null }

/** Runs one task; in a worker, or inline where no pool exists. */
export function runHeavyTask(task: HeavyTask): string | NetlistFile | Float64Array {
  if (task.kind === 'solve') return JSON.stringify(solveCircuit(task.input))
  if (task.kind === 'nominal') return solveCircuitLevels(candidateCircuit(task.input).circuit)
  const text = exportNetlist(task.input).netlist
  const bytes = Buffer.byteLength(text)
  return { bytes, text: bytes > task.maxBytes ? null : text }
}
