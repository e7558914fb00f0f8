/**
 * The command-line entry, spawned as users run it: JSON in (file or stdin), JSON out, exit 2
 * with a field-naming message on bad input.
 */
import { spawnSync } from 'node:child_process'
import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'

const ROOT = join(import.meta.dirname, '../../..')
const dir = mkdtempSync(join(tmpdir(), 'rungwise-cli-'))

function cli(args: string[], stdin?: string) {
  const r = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/cli.ts', ...args], {
    cwd: ROOT, input: stdin, encoding: 'utf8', timeout: 30_000, maxBuffer: 64 * 2 ** 20
  })
  return { code: r.status, stdout: r.stdout, stderr: r.stderr }
}

function file(name: string, content: unknown): string {
  const path = join(dir, name)
  writeFileSync(path, typeof content === 'string' ? content : JSON.stringify(content))
  return path
}

const ladder = (n: number) => ({
  topology: 'r2r-voltage', bits: n, vrefV: 2.5, legsOhm: Array(n).fill(20e3), seriesOhm: Array(n - 1).fill(10e3), terminationOhm: 20e3, switchOhm: 0
})

describe('cli solve', () => {
  it('solves a file and prints the contract JSON (CV01: 5-bit code 10110 → 0.6875 V_REF, textbook)', () => {
    const r = cli(['solve', file('five.json', ladder(5))])
    expect(r.code).toBe(0)
    expect(r.stderr).toBe('')
    const out = JSON.parse(r.stdout)
    expect(out.codes).toHaveLength(32)
    expect(out.codes[0b10110].voutV).toBeCloseTo(0.6875 * 2.5, 12)
    expect(Object.keys(out.codes[3]).sort()).toEqual(['code', 'irefA', 'routOhm', 'voutV'])
  })

  it('reads stdin for "-" and solves a 16-bit ladder (65,536 codes); its speed is a bench row, the 30 s spawn timeout only catches a hang', () => {
    const r = cli(['solve', '-'], JSON.stringify(ladder(16)))
    expect(r.code).toBe(0)
    expect(JSON.parse(r.stdout).codes).toHaveLength(65536)
  })

  it('is wired as the npm script "cli"', () => {
    const r = spawnSync('npm', ['run', '--silent', 'cli', '--', 'solve', file('three.json', ladder(3))], { cwd: ROOT, encoding: 'utf8', timeout: 30_000 })
    expect(r.status).toBe(0)
    expect(JSON.parse(r.stdout).bits).toBe(3)
  })
})

describe('cli bad input exits 2 with a message naming the field', () => {
  const cases: Array<[string, unknown, RegExp]> = [
    ['bits out of range', { ...ladder(4), bits: 40 }, /^bits: must be an integer from 2 to 16 \(got 40\)/],
    ['array of the wrong length', { ...ladder(4), legsOhm: [1, 1, 1] }, /^legsOhm: must have 4 values/],
    ['zero value', { ...ladder(4), terminationOhm: 0 }, /^terminationOhm: must be a finite number from 1e-6 to 1e15 \(ohms\) \(got 0\)/],
    ['negative value', { ...ladder(4), seriesOhm: [1, -2, 1] }, /^seriesOhm\[1\]: must be a finite number from .* \(got -2\)/],
    ['non-finite value', '{"topology":"string","bits":2,"vrefV":1,"unitsOhm":[1,1e999,1,1]}', /^unitsOhm\[1\]: .*\(got Infinity\)/],
    ['unknown topology', { ...ladder(4), topology: 'sigma-delta' }, /^topology: must be one of string, r2r-voltage/],
    ['not JSON', '{"topology": ', /^input: must be a JSON document/]
  ]
  for (const [what, input, pattern] of cases) {
    it(what, () => {
      const r = cli(['solve', file(`${what.replace(/\W/g, '-')}.json`, input)])
      expect(r.code).toBe(2)
      expect(r.stdout).toBe('')
      expect(r.stderr.trim()).toMatch(pattern)
    })
  }

  it('prints the usage for an unknown command or missing arguments', () => {
    for (const args of [['simulate', 'x.json'], [], ['solve']]) {
      const r = cli(args)
      expect(r.code).toBe(2)
      expect(r.stderr).toMatch(/usage: npm run --silent cli -- <command> <file.json\|->/)
    }
    expect(cli(['simulate', 'x.json']).stderr).toMatch(/^unknown command: simulate/)
    expect(cli(['constructor', 'x.json']).stderr).toMatch(/^unknown command: constructor/)
  })

  it('reports a missing file without a stack trace', () => {
    const r = cli(['solve', join(dir, 'nope.json')])
    expect(r.code).toBe(2)
    expect(r.stderr.trim()).toMatch(/^input: cannot read .*nope\.json \(ENOENT\)$/)
  })
})

describe('cli netlist', () => {
  it('prints a SPICE netlist for { circuit }', () => {
    const r = cli(['netlist', file('net.json', { circuit: ladder(4), note: 'nominal' })])
    expect(r.code).toBe(0)
    const out = JSON.parse(r.stdout)
    expect(out.format).toBe('spice')
    expect(out.netlist).toMatch(/^\* Rungwise netlist: r2r-voltage, 4 bits/)
    expect(out.netlist).toContain('dc vcode 0 15 1')
  })

  it('names the nested field of a bad circuit', () => {
    const r = cli(['netlist', file('badnet.json', { circuit: { ...ladder(4), bits: 99 } })])
    expect(r.code).toBe(2)
    expect(r.stderr).toMatch(/^circuit\.bits: must be an integer from 2 to 16 \(got 99\)/)
  })
})

const spec = {
  bits: 8, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-12, inlTargetLsb: 0.5, dnlTargetLsb: 0.5,
  yieldTarget: 0.997, areaBudgetMm2: 0.1, glitchLimitVs: 1e-9, powerBudgetW: 0.01
}
const proc = { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'single' }

describe('cli evaluate', () => {
  it('evaluates a spec and prints ranked candidates', () => {
    const r = cli(['evaluate', file('eval.json', { spec, process: proc, options: { trials: 20 } })])
    expect(r.code).toBe(0)
    const out = JSON.parse(r.stdout)
    expect(out.candidates.length).toBeGreaterThan(5)
    expect(out.candidates.map((c: { id: string }) => c.id)).toContain('r2r-voltage')
  })

  it('adds the built-in findings, the ranking and one recommendation, as the API does', () => {
    const r = cli(['evaluate', file('eval-findings.json', { spec, process: proc, options: { trials: 20 } })])
    const out = JSON.parse(r.stdout)
    expect(out.findings.length).toBeGreaterThan(0)
    expect(out.rulePacks.map((p: { id: string }) => p.id)).toContain('rungwise-core')
    expect(out.ranking.candidates).toHaveLength(out.candidates.length)
    expect(out.recommendedId).toBe(out.recommendation.candidateId)
  })

  it('rejects too many Monte Carlo trials, naming the field and the cap', () => {
    const r = cli(['evaluate', file('eval-many.json', { spec, process: proc, options: { trials: 10_000_000 } })])
    expect(r.code).toBe(2)
    expect(r.stderr).toMatch(/^options\.trials: must be an integer from 0 to \d+/)
  })

  it('rejects an out-of-range spec field', () => {
    const r = cli(['evaluate', file('eval-bits.json', { spec: { ...spec, bits: 24 }, process: proc })])
    expect(r.code).toBe(2)
    expect(r.stderr).toMatch(/^spec\.bits: must be an integer from 2 to 16 \(got 24\)/)
  })
})

describe('cli netlist of a candidate', () => {
  it('exports a sized Monte Carlo sample of a segmented candidate', () => {
    const r = cli(['netlist', file('cand.json', { spec, process: proc, candidate: { topology: 'segmented', unaryBits: 3 }, sample: { seed: 4, index: 1 } })])
    expect(r.code).toBe(0)
    const out = JSON.parse(r.stdout)
    expect(out.netlist).toContain('Monte Carlo sample index 1 of seed 4')
    expect(out.circuit.unaryLegsOhm).toHaveLength(7)
  })
})
