import { benchSignIn, startBenchDatabase, startServer } from '../bench/stack'
const stack = await startBenchDatabase()
const server = await startServer(stack)
const cookie = await benchSignIn(server.url, 'manager@harrowlake.example', 'harrow-lake-demo')
const list = await (await fetch(`${server.url}/api/studies?page=1&pageSize=25`, { headers: { cookie } })).text()
console.log('list bytes', list.length)
for (const s of (JSON.parse(list).items as { id: number }[])) {
  const t = await (await fetch(`${server.url}/api/studies/${s.id}`, { headers: { cookie } })).text()
  console.log('study', s.id, t.length)
}
await stack.stop()
