/**
 * A burst of 2^N-cost requests from one user while /api/health is probed (issue 13, finding 3):
 * shared by tests/api/heavy-parallel.spec.ts (generous bound) and `npm run bench` (the target).
 */
const SPEC16 = { bits: 16, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-12, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.99, areaBudgetMm2: 0.05, glitchLimitVs: 1e-10, powerBudgetW: 1e-3 }
const PROCESS = { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'pair', switchOhm: 50 }
/** A 16-bit R-2R ladder of explicit values (POST /api/solve): 65,536 codes to solve. */
export const LADDER16 = { topology: 'r2r-voltage', bits: 16, vrefV: 1, legsOhm: Array(16).fill(2e4), seriesOhm: Array(15).fill(1e4), terminationOhm: 2e4 }

async function call(url: string, path: string, cookie: string, body?: unknown): Promise<number> {
  const res = await fetch(`${url}${path}`, {
    method: body === undefined ? 'GET' : 'POST',
    headers: { cookie, accept: 'application/json', ...(body === undefined ? {} : { 'content-type': 'application/json' }) },
    body: body === undefined ? undefined : JSON.stringify(body)
  })
  await res.arrayBuffer()
  return res.status
}

/** A 16-bit study with a saved revision (imported by `editorCookie`); returns its id. */
export async function sixteenBitStudy(url: string, editorCookie: string): Promise<number> {
  const text = JSON.stringify([{ title: 'Heavy burst 16-bit', spec: SPEC16, process: PROCESS, options: { trials: 0 } }])
  const res = await fetch(`${url}/api/studies/import`, { method: 'POST', headers: { 'content-type': 'application/json', 'cookie': editorCookie }, body: JSON.stringify({ text }) })
  const body = await res.json() as { studies: { id: number }[] }
  if (res.status !== 201) throw new Error(`import answered ${res.status}`)
  return body.studies[0]!.id
}

/** Statuses of the 16-bit string netlists (refused before building: 2^16 codes × at least 500 B) and of the rest, which compete for slots. */
export interface BurstResult { stringNetlists: number[], statuses: number[], healthMs: number[] }

/**
 * At once, `perKind` of each: 16-bit string netlist downloads, 16-bit two-stage netlist downloads
 * and 16-bit solves; health probed every 20 ms meanwhile.
 */
export async function heavyBurst(url: string, cookie: string, studyId: number, perKind: number): Promise<BurstResult> {
  const healthMs: number[] = []
  let busy = true
  const prober = (async () => {
    while (busy) {
      const t0 = performance.now()
      await (await fetch(`${url}/api/health`)).text()
      healthMs.push(performance.now() - t0)
      await new Promise(r => setTimeout(r, 20))
    }
  })()
  const strings = Array.from({ length: perKind }, () => call(url, `/api/studies/${studyId}/netlist?candidate=string-direct`, cookie))
  const competing = Array.from({ length: perKind }, () => [
    call(url, `/api/studies/${studyId}/netlist?candidate=two-stage-buffered`, cookie),
    call(url, '/api/solve', cookie, LADDER16)
  ]).flat()
  const [stringNetlists, statuses] = await Promise.all([Promise.all(strings), Promise.all(competing)])
  busy = false
  await prober
  return { stringNetlists, statuses, healthMs }
}

export function percentile(values: number[], p: number): number {
  const sorted = [...values].sort((a, b) => a - b)
  return sorted[Math.floor(p * (sorted.length - 1))] ?? 0
}
