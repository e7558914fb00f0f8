import { spawn, type ChildProcess } from 'node:child_process'
import { existsSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import { freePort } from './mariadb'

const root = fileURLToPath(new URL('../..', import.meta.url))
export const SERVER_ENTRY = `${root}.output/server/index.mjs`

export interface AppServer {
  url: string
  port: number
  process: ChildProcess
  /** everything the server wrote to stdout and stderr so far */
  log: () => string
}

/** Starts the built Nitro server against the given database and waits for /api/health. */
export async function startAppServer(databaseUrl: string, env: Record<string, string> | ((port: number) => Record<string, string>) = {}): Promise<AppServer> {
  if (!existsSync(SERVER_ENTRY)) throw new Error('No build found: run `npx nuxi build` first (npm test does it)')
  const port = await freePort()
  // APP_SERVER_NODE_ARGS: extra node flags for the server, e.g. "--cpu-prof --cpu-prof-dir=/tmp/prof" (profiling a bench)
  const nodeArgs = (process.env.APP_SERVER_NODE_ARGS ?? '').split(' ').filter(Boolean)
  const child = spawn(process.execPath, [...nodeArgs, SERVER_ENTRY], {
    env: { ...process.env, HOST: '127.0.0.1', PORT: String(port), NUXT_DATABASE_URL: databaseUrl, NUXT_AUTH_SECRET: 'test-secret-0123456789-abcdefghijklmnop', NUXT_APP_URL: `http://127.0.0.1:${port}`, ...(typeof env === 'function' ? env(port) : env) },
    stdio: ['ignore', 'pipe', 'pipe']
  })
  let log = ''
  const collect = (d: Buffer) => {
    log += d.toString()
  }
  child.stdout?.on('data', collect)
  child.stderr?.on('data', collect)
  const url = `http://127.0.0.1:${port}`
  const until = Date.now() + 30_000
  while (Date.now() < until) {
    if (child.exitCode !== null) throw new Error(`App server exited early:\n${log}`)
    try {
      const res = await fetch(`${url}/api/health`)
      if (res.status === 200) return { url, port, process: child, log: () => log }
    } catch {
      // not listening yet
    }
    await new Promise(r => setTimeout(r, 150))
  }
  child.kill('SIGTERM')
  throw new Error(`App server did not become healthy within 30 s:\n${log}`)
}

/** Stops a server started by startAppServer. */
export async function stopAppServer(server: AppServer): Promise<void> {
  if (server.process.exitCode !== null) return
  await new Promise<void>((resolve) => {
    server.process.once('exit', () => resolve())
    server.process.kill('SIGTERM')
  })
}
