import autocannon from 'autocannon'
import { benchSignIn, startBenchDatabase, startServer } from '../bench/stack'
const stack = await startBenchDatabase()
const prof = process.env.PROF === '1'
const server = await startServer(stack, prof ? { NODE_OPTIONS: '--cpu-prof --cpu-prof-dir=/tmp/srvprof' } : {})
const cookie = await benchSignIn(server.url, 'manager@harrowlake.example', 'harrow-lake-demo')
const path = process.env.LPATH ?? '/api/studies?page=1&pageSize=25'
for (const c of [1, 50]) {
  const r = await autocannon({ url: server.url + path, connections: c, duration: 8, headers: { cookie, accept: 'application/json' } })
  console.log(`${path} c=${c}: ${r.requests.average} req/s, p50 ${r.latency.p50} p97.5 ${r.latency.p97_5} ms, non2xx ${r.non2xx}`)
}
await stack.stop()
