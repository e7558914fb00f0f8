/**
 * `npm run bench`: runs every benchmark section, prints one table and writes
 * bench-report.json (git-ignored). Exit code 1 when any row misses its target.
 * Add a section by appending `{ section, run }` to SECTIONS; `run` returns BenchRow[].
 * `npm run bench -- solve evaluate` runs only the named sections (`--help` lists them).
 */
import { writeFileSync } from 'node:fs'
import type { BenchRow } from './bench/solve'
import { runSolveBench } from './bench/solve'
import { runApiBench } from './bench/api'
import { runMonteCarloBench } from './bench/montecarlo'
import { runEvaluateBench } from './bench/evaluate'
import { runScaleBench } from './bench/scale'

interface Section {
  section: string
  run: () => BenchRow[] | Promise<BenchRow[]>
}

const SECTIONS: Section[] = [
  { section: 'solve', run: runSolveBench },
  { section: 'api', run: runApiBench },
  { section: 'montecarlo', run: runMonteCarloBench },
  { section: 'evaluate', run: runEvaluateBench },
  { section: 'scale', run: runScaleBench }
]

function format(x: number): string {
  if (x === 0) return '0'
  const a = Math.abs(x)
  return a >= 1e5 || a < 1e-3 ? x.toExponential(3) : x.toPrecision(4)
}

/** The sections named on the command line (all when none is named). */
function selected(args: readonly string[]): Section[] {
  if (args.length === 0) return SECTIONS
  const unknown = args.filter(a => !SECTIONS.some(s => s.section === a))
  if (unknown.length > 0) throw new Error(`unknown section ${unknown.join(', ')} (sections: ${SECTIONS.map(s => s.section).join(', ')})`)
  return SECTIONS.filter(s => args.includes(s.section))
}

async function main(): Promise<number> {
  const args = process.argv.slice(2)
  if (args.includes('--help')) {
    process.stdout.write(`usage: npm run bench [-- section ...]\nsections: ${SECTIONS.map(s => s.section).join(', ')}\n`)
    return 0
  }
  const report: Array<BenchRow & { section: string }> = []
  for (const s of selected(args)) {
    for (const row of await s.run()) report.push({ section: s.section, ...row })
  }
  for (const r of report) {
    const mark = r.pass ? 'ok  ' : 'MISS'
    process.stdout.write(`${mark} [${r.section}] ${r.name}: ${format(r.value)} ${r.unit} (target ${r.target})\n`)
  }
  writeFileSync('bench-report.json', `${JSON.stringify({ date: new Date().toISOString(), rows: report }, null, 2)}\n`)
  return report.every(r => r.pass) ? 0 : 1
}

main().then((code) => {
  process.exitCode = code
}, (e: unknown) => {
  process.stderr.write(`bench failed: ${e instanceof Error ? e.message : String(e)}\n`)
  process.exitCode = 1
})
