/**
 * Runs a netlist in Debian's ngspice (batch mode) in a throwaway folder and reads back the
 * wrdata files. Pitfalls handled (ngspice 39): the exit code is 0 after `quit 0` even on errors,
 * so any stderr output counts as failure (except the progress counter long sweeps print);
 * results come from wrdata (15 digits), not .print.
 */
import { spawnSync } from 'node:child_process'
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'

export const NGSPICE = '/usr/bin/ngspice'

export interface NgspiceTable {
  names: string[]
  rows: number[][]
}

/** Parses a wrdata file written with wr_singlescale and wr_vecnames. */
export function parseWrdata(text: string): NgspiceTable {
  const lines = text.trim().split('\n')
  const names = (lines[0] ?? '').trim().split(/\s+/)
  const rows = lines.slice(1).map(l => l.trim().split(/\s+/).map(Number))
  return { names, rows }
}

/** stderr without ngspice's progress counter of long sweeps ("Reference value : 2.15e+02"). */
export function stderrErrors(stderr: string): string {
  return stderr.replace(/Reference value\s*:\s*\S+/g, '').trim()
}

export interface NgspiceRun {
  files: Record<string, NgspiceTable>
  stdout: string
  ms: number
}

/**
 * Runs `netlist` with ngspice -b and returns the parsed output files.
 * @throws Error with ngspice's stderr when it writes any, or when a file is missing
 */
export function runNgspice(netlist: string, outputFiles: string[], timeoutMs = 60_000): NgspiceRun {
  const dir = mkdtempSync(join(tmpdir(), 'rungwise-ngspice-'))
  try {
    writeFileSync(join(dir, 'deck.cir'), netlist)
    const t0 = performance.now()
    const r = spawnSync(NGSPICE, ['-b', 'deck.cir'], { cwd: dir, encoding: 'utf8', timeout: timeoutMs, maxBuffer: 256 * 2 ** 20 })
    const ms = performance.now() - t0
    if (r.error) throw r.error
    if (r.status !== 0 || stderrErrors(r.stderr) !== '') {
      throw new Error(`ngspice failed (exit ${r.status}): ${stderrErrors(r.stderr).slice(0, 2000)}`)
    }
    const files: Record<string, NgspiceTable> = {}
    for (const f of outputFiles) files[f] = parseWrdata(readFileSync(join(dir, f), 'utf8'))
    return { files, stdout: r.stdout, ms }
  } finally {
    rmSync(dir, { recursive: true, force: true })
  }
}
