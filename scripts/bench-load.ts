/**
 * `npm run bench:load`: mixed traffic at 50 connections (scripts/bench/load-kinds.ts) against the
 * built server on a throwaway, demo-seeded MariaDB, bounded in time (LOAD_SECONDS, default 20)
 * and in count (LOAD_MAX_REQUESTS per kind, default 100,000). Prints requests/s and
 * p50/p95/p99 per kind, per group and overall, writes bench-load-report.json and exits 1 when a
 * target is missed: reads p95 < 100 ms, zero errors (non-2xx other than a kind's designed
 * statuses, socket errors, timeouts), and evaluations queued (some accepted) while reads hold.
 */
import autocannon from 'autocannon'
import { writeFileSync } from 'node:fs'
import { loadavg } from 'node:os'
import { TRAFFIC, type LoadFixtures, type Role, type TrafficKind } from './bench/load-kinds'
import { benchSignIn, quantile, startBenchDatabase, startServer } from './bench/stack'

const SECONDS = Number(process.env.LOAD_SECONDS ?? 20)
const MAX_REQUESTS = Number(process.env.LOAD_MAX_REQUESTS ?? 100_000)
const PASSWORD = 'harrow-lake-demo'
const WRITE_STUDIES = 24
/** Kinds left out (comma-separated names), for finding which part of the mix costs what; targets still apply. */
const SKIP = new Set((process.env.LOAD_SKIP ?? '').split(',').map(s => s.trim()).filter(Boolean))
const KINDS = TRAFFIC.filter(k => !SKIP.has(k.name))

interface KindResult { name: string, group: string, connections: number, times: number[], statuses: Record<string, number>, designed: number, errors: number, socketErrors: number, timeouts: number }

async function call<T>(url: string, cookie: string, method = 'GET', body?: unknown): Promise<T> {
  const res = await fetch(url, { method, headers: { cookie, 'accept': 'application/json', 'content-type': 'application/json' }, body: body === undefined ? undefined : JSON.stringify(body) })
  if (!res.ok) throw new Error(`${method} ${url} answered ${res.status}: ${await res.text()}`)
  return await res.json() as T
}

/** Signs each demo user in once (the rate limit counts failures only) and arranges the studies. */
async function fixtures(url: string): Promise<LoadFixtures> {
  const cookies = {} as Record<Role, string>
  for (const role of ['admin', 'architect', 'engineer', 'manager'] as const) cookies[role] = await benchSignIn(url, `${role}@harrowlake.example`, PASSWORD)
  const list = await call<{ items: { id: number, version: number, spec: unknown }[] }>(`${url}/api/studies?pageSize=100`, cookies.manager)
  const source = list.items.find(s => s.version > 0)
  if (!source) throw new Error('no demo study with a revision to copy inputs from')
  const rev = await call<{ spec: unknown, process: unknown, options: unknown }>(`${url}/api/studies/${source.id}/revisions/${source.version}`, cookies.manager)
  const writeStudies = []
  for (let i = 0; i < WRITE_STUDIES; i++) {
    const study = await call<{ id: number, version: number }>(`${url}/api/studies`, cookies.engineer, 'POST', { title: `Load run study ${i + 1}`, spec: rev.spec })
    writeStudies.push({ id: study.id, version: study.version })
  }
  const revisionInputs = { spec: rev.spec, process: rev.process, options: rev.options }
  return {
    cookies, writeStudies, revisionInputs,
    readStudyIds: [...list.items.map(s => s.id), ...writeStudies.map(s => s.id)],
    evaluationInput: { ...revisionInputs, options: { ...(rev.options as object), trials: 1000 } }
  }
}

function runKind(url: string, kind: TrafficKind, f: LoadFixtures): Promise<KindResult> {
  const result: KindResult = { name: kind.name, group: kind.group, connections: kind.connections, times: [], statuses: {}, designed: 0, errors: 0, socketErrors: 0, timeouts: 0 }
  const instance = autocannon({
    url, connections: kind.connections, duration: SECONDS, maxOverallRequests: MAX_REQUESTS, overallRate: kind.rate,
    timeout: 10, requests: kind.requests(f)
  }, () => undefined)
  instance.on('response', (_client, status, _bytes, ms) => {
    result.times.push(ms)
    result.statuses[status] = (result.statuses[status] ?? 0) + 1
    if (kind.designed?.includes(status)) result.designed += 1
    else if (status < 200 || status > 299) result.errors += 1
  })
  return new Promise((resolve, reject) => {
    instance.on('done', (r) => {
      result.socketErrors = r.errors - r.timeouts
      result.timeouts = r.timeouts
      result.times.sort((a, b) => a - b)
      resolve(result)
    })
    instance.on('error', reject)
  })
}

function stats(name: string, times: number[], extra: Partial<KindResult> = {}) {
  const sorted = [...times].sort((a, b) => a - b)
  return {
    name, requests: sorted.length, perSecond: sorted.length / SECONDS,
    p50: quantile(sorted, 0.5), p95: quantile(sorted, 0.95), p99: quantile(sorted, 0.99),
    designed: extra.designed ?? 0, errors: (extra.errors ?? 0) + (extra.socketErrors ?? 0) + (extra.timeouts ?? 0)
  }
}

function printTable(rows: ReturnType<typeof stats>[]): void {
  const pad = (s: string | number, n: number) => String(s).padStart(n)
  process.stdout.write(`${'kind'.padEnd(22)}${pad('req', 8)}${pad('req/s', 9)}${pad('p50 ms', 9)}${pad('p95 ms', 9)}${pad('p99 ms', 9)}${pad('by design', 11)}${pad('errors', 8)}\n`)
  for (const r of rows) {
    process.stdout.write(`${r.name.padEnd(22)}${pad(r.requests, 8)}${pad(r.perSecond.toFixed(0), 9)}${pad(r.p50.toFixed(1), 9)}${pad(r.p95.toFixed(1), 9)}${pad(r.p99.toFixed(1), 9)}${pad(r.designed, 11)}${pad(r.errors, 8)}\n`)
  }
}

async function main(): Promise<number> {
  const stack = await startBenchDatabase()
  try {
    const server = await startServer(stack)
    const f = await fixtures(server.url)
    const before = loadavg()
    const results = await Promise.all(KINDS.map(kind => runKind(server.url, kind, f)))
    const after = loadavg()
    const perKind = results.map(r => stats(r.name, r.times, r))
    const groups = ['read', 'write', 'evaluation'].map(g => stats(`all ${g}s`, results.filter(r => r.group === g).flatMap(r => r.times), {
      designed: results.filter(r => r.group === g).reduce((n, r) => n + r.designed, 0),
      errors: results.filter(r => r.group === g).reduce((n, r) => n + r.errors + r.socketErrors + r.timeouts, 0)
    }))
    const overall = stats('overall', results.flatMap(r => r.times), { designed: groups.reduce((n, g) => n + g.designed, 0), errors: groups.reduce((n, g) => n + g.errors, 0) })
    printTable([...perKind, ...groups, overall])
    const reads = groups[0]!
    const accepted = results.filter(r => r.group === 'evaluation').reduce((n, r) => n + (r.statuses[202] ?? 0), 0)
    const targets = [
      { name: 'reads p95 < 100 ms at 50 connections', pass: reads.p95 < 100, value: reads.p95 },
      { name: 'zero errors (non-2xx other than designed, socket errors, timeouts)', pass: overall.errors === 0, value: overall.errors },
      { name: 'evaluations queued: some jobs accepted (202), the rest refused by the per-user cap (429)', pass: accepted > 0, value: accepted }
    ]
    const connections = KINDS.reduce((n, k) => n + k.connections, 0)
    process.stdout.write(`\n${connections} connections for ${SECONDS} s (at most ${MAX_REQUESTS} requests per kind); load average 1/5/15 min before ${before.map(x => x.toFixed(2)).join(' ')}, after ${after.map(x => x.toFixed(2)).join(' ')} (other processes share this 2-core machine)\n`)
    process.stdout.write(`evaluation jobs accepted ${accepted}, refused by the per-user cap ${groups[2]!.designed}; status codes per kind: ${results.map(r => `${r.name} ${JSON.stringify(r.statuses)}`).join('; ')}\n`)
    for (const t of targets) process.stdout.write(`${t.pass ? 'ok  ' : 'MISS'} ${t.name}: ${typeof t.value === 'number' && !Number.isInteger(t.value) ? t.value.toFixed(1) : t.value}\n`)
    writeFileSync('bench-load-report.json', `${JSON.stringify({ date: new Date().toISOString(), seconds: SECONDS, connections, loadAverage: { before, after }, kinds: perKind, groups, overall, statuses: Object.fromEntries(results.map(r => [r.name, r.statuses])), targets }, null, 2)}\n`)
    return targets.every(t => t.pass) ? 0 : 1
  } finally {
    await stack.stop()
  }
}

main().then((code) => {
  process.exitCode = code
}, (error: unknown) => {
  process.stderr.write(`bench:load failed: ${error instanceof Error ? error.stack ?? error.message : String(error)}\n`)
  process.exitCode = 1
})
