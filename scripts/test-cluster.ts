/**
 * `npm run test:cluster` (minutes; not part of `npm test`): a 3-node MariaDB Galera cluster on
 * loopback, migrated and demo-seeded through node 1; the whole API test project against it with
 * app instance A on node 1 and B on node 2 (tests/api/two-instances.spec.ts); then a write burst
 * through both instances during which node 2 is killed with SIGKILL and later rejoins by IST.
 * Checks that every acknowledged write is on the surviving nodes and on the rejoined one (with
 * its audit row), that no request went unserved, and that B serves again without a restart.
 * Prints the figures and writes cluster-report.json. Needs a build (it runs one when missing).
 */
import { execFileSync, spawnSync } from 'node:child_process'
import { existsSync, mkdirSync, writeFileSync } from 'node:fs'
import { startAppServer, stopAppServer, SERVER_ENTRY, type AppServer } from '../tests/support/app-server'
import { writeBurst } from './cluster/burst'
import { clusterSize, ensureGaleraPackages, killNode, rejoinNode, sql, startCluster, stopCluster, type GaleraCluster } from './cluster/galera'

const LOG_DIR = '.data/cluster-logs'
const log = (line: string) => console.log(`[cluster] ${line}`)
const sleep = (ms: number) => new Promise(r => setTimeout(r, ms))
const SPEC = {
  bits: 10, vrefV: 1.2, updateRateHz: 1e6, loadCapacitanceF: 5e-12, loadResistanceOhm: null, inlTargetLsb: 1, dnlTargetLsb: 0.5, yieldTarget: 0.99,
  monotonicRequired: true, areaBudgetMm2: 0.02, glitchLimitVs: 2e-11, refSourceOhm: 0, powerBudgetW: 5e-4
}

function runApiSuite(cluster: GaleraCluster): { ok: boolean, summary: string } {
  log('running the API test project against the cluster (A on node 1, B on node 2)')
  const run = spawnSync(process.execPath, ['node_modules/vitest/vitest.mjs', 'run', '--project', 'api'], {
    env: { ...process.env, NO_COLOR: '1', FORCE_COLOR: '0', RW_TEST_DATABASE_URL: cluster.nodes[0]!.url, RW_TEST_DATABASE_URL_2: cluster.nodes[1]!.url }, encoding: 'utf8', maxBuffer: 64 * 1024 * 1024
  })
  const output = `${run.stdout}${run.stderr}`
  writeFileSync('cluster-api-tests.log', output)
  const summary = output.split('\n').filter(l => /^\s*(Test Files|Tests)\s/.test(l)).map(l => l.trim()).join('; ')
  if (run.status !== 0) console.log(output.split('\n').filter(l => /FAIL|×|AssertionError|Error:/.test(l)).slice(0, 40).join('\n'))
  return { ok: run.status === 0, summary: summary || 'no summary (see cluster-api-tests.log)' }
}

async function signIn(url: string): Promise<string> {
  const res = await fetch(`${url}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'engineer@harrowlake.example', password: 'harrow-lake-demo' }) })
  const cookie = res.headers.getSetCookie().find(c => c.startsWith('rw_session='))
  if (!cookie) throw new Error(`sign-in answered ${res.status}`)
  return cookie.split(';')[0]!
}

async function firstOk(url: string, cookie: string, timeoutMs: number): Promise<number | null> {
  const t0 = performance.now()
  while (performance.now() - t0 < timeoutMs) {
    const res = await fetch(`${url}/api/studies?pageSize=1`, { headers: { cookie } }).catch(() => null)
    if (res?.status === 200) return (performance.now() - t0) / 1000
    await sleep(100)
  }
  return null
}

/** The write burst with node 2 killed after 4 s and rejoined 4 s later; returns the figures. */
async function faultRun(cluster: GaleraCluster) {
  const [n1, n2, n3] = cluster.nodes as [typeof cluster.nodes[0], typeof cluster.nodes[0], typeof cluster.nodes[0]]
  const servers: AppServer[] = []
  try {
    servers.push(await startAppServer(n1!.url), await startAppServer(n2!.url))
    const [a, b] = servers as [AppServer, AppServer]
    const cookie = await signIn(a.url)
    const tag = `burst-${Date.now()}`
    let finish!: () => void
    const stop = new Promise<void>(resolve => (finish = resolve))
    const burst = writeBurst([{ name: 'A (node 1)', url: a.url }, { name: 'B (node 2)', url: b.url }], cookie, SPEC, tag, 8, stop)
    await sleep(4000)
    const killedAt = performance.now()
    killNode(n2!)
    log('node 2 killed (SIGKILL) during the burst')
    // Until the survivors drop the dead node from the cluster (failure detection), then 2 s more.
    while (clusterSize(n1!) > 2 && performance.now() - killedAt < 20_000) await sleep(100)
    const detectedS = (performance.now() - killedAt) / 1000
    const sizeDuringLoss = clusterSize(n1!)
    await sleep(2000)
    const rejoin = await rejoinNode(n2!)
    log(`node 2 rejoined in ${rejoin.seconds.toFixed(1)} s (${rejoin.ist ? 'IST' : 'state transfer'}, from ${rejoin.position})`)
    const bBackS = await firstOk(b.url, cookie, 30_000)
    await sleep(3000)
    finish()
    const result = await burst
    const ids = result.acknowledged.map(w => w.id)
    const onNode = (node: typeof n1) => {
      const found = new Set(sql(node!, `SELECT id FROM rungwise_test.studies WHERE title LIKE '${tag}-%'`).split('\n').filter(Boolean).map(Number))
      const audited = new Set(sql(node!, `SELECT target_id FROM rungwise_test.audit_log WHERE action = 'study_created' AND target_id IN (SELECT CAST(id AS CHAR) FROM rungwise_test.studies WHERE title LIKE '${tag}-%')`).split('\n').filter(Boolean).map(Number))
      return { missing: ids.filter(id => !found.has(id)).length, withoutAudit: [...found].filter(id => !audited.has(id)).length, rows: found.size }
    }
    const nodes = { node1: onNode(n1), node2: onNode(n2), node3: onNode(n3) }
    return {
      acknowledged: ids.length, perInstance: result.perInstance, failedOnFirstTry: result.failedOnFirstTry.length,
      failedOnFirstTryByStatus: result.failedOnFirstTry.reduce<Record<string, number>>((m, f) => ({ ...m, [`${f.via} ${f.status}`]: (m[`${f.via} ${f.status}`] ?? 0) + 1 }), {}),
      unserved: result.unserved.length, slowestRequestMs: Math.round(result.slowestMs), clusterSizeDuringLoss: sizeDuringLoss,
      nodeDroppedAfterS: Number(detectedS.toFixed(1)), rejoinSeconds: Number(rejoin.seconds.toFixed(1)),
      transactionsRetried: servers.reduce((n, s) => n + (s.log().match(/transaction retried/g)?.length ?? 0), 0), rejoinByIst: rejoin.ist, instanceBServesAgainAfterRejoinS: bBackS, lossSeconds: Number(((performance.now() - killedAt) / 1000).toFixed(1)),
      nodes
    }
  } finally {
    mkdirSync(LOG_DIR, { recursive: true })
    servers.forEach((s, i) => writeFileSync(`${LOG_DIR}/app-${'AB'[i]}.log`, s.log()))
    for (const s of servers) await stopAppServer(s)
  }
}

async function main(): Promise<number> {
  ensureGaleraPackages()
  if (!existsSync(SERVER_ENTRY)) {
    log('no build found: running npx nuxi build')
    execFileSync('npx', ['nuxi', 'build'], { stdio: 'inherit' })
  }
  const t0 = performance.now()
  const cluster = await startCluster()
  let passed = false
  try {
    log(`3 nodes Synced in ${((performance.now() - t0) / 1000).toFixed(1)} s (cluster size ${clusterSize(cluster.nodes[0]!)})`)
    for (const command of ['latest', 'seed']) {
      execFileSync(process.execPath, ['--import', 'tsx', 'scripts/migrate.ts', command], { env: { ...process.env, NUXT_DATABASE_URL: cluster.nodes[0]!.url }, stdio: 'pipe' })
    }
    log('migrated and seeded through node 1')
    // CLUSTER_SKIP_API=1 runs the fault part only (while working on it; the full run needs the suite).
    const suite = process.env.CLUSTER_SKIP_API === '1' ? { ok: false, summary: 'skipped (CLUSTER_SKIP_API=1)' } : runApiSuite(cluster)
    log(`API tests: ${suite.ok ? 'passed' : 'FAILED'}: ${suite.summary}`)
    const fault = await faultRun(cluster)
    const consistent = Object.values(fault.nodes).every(n => n.missing === 0 && n.withoutAudit === 0)
    const checks = [
      { name: 'API test project passes against the cluster', pass: suite.ok },
      { name: 'every acknowledged write on nodes 1, 2 (rejoined) and 3, each with its audit row', pass: consistent && fault.acknowledged > 0 },
      { name: 'no request unserved during the loss (each answered by A or B)', pass: fault.unserved === 0 },
      { name: 'instance B serves again after node 2 rejoins, without a restart', pass: fault.instanceBServesAgainAfterRejoinS !== null },
      { name: 'the killed node rejoined by IST', pass: fault.rejoinByIst },
      { name: 'the survivors kept quorum (cluster of 2 during the loss)', pass: fault.clusterSizeDuringLoss === 2 }
    ]
    console.log(JSON.stringify(fault, null, 2))
    for (const c of checks) console.log(`${c.pass ? 'ok  ' : 'MISS'} ${c.name}`)
    writeFileSync('cluster-report.json', `${JSON.stringify({ date: new Date().toISOString(), suite, fault, checks }, null, 2)}\n`)
    passed = checks.every(c => c.pass)
    return passed ? 0 : 1
  } finally {
    if (!passed) log(`node and app logs kept in ${LOG_DIR}/`)
    await stopCluster(cluster, passed ? undefined : LOG_DIR)
  }
}

main().then((code) => {
  process.exitCode = code
}, (error: unknown) => {
  console.error(`test:cluster failed: ${error instanceof Error ? error.stack ?? error.message : String(error)}`)
  process.exitCode = 1
})
