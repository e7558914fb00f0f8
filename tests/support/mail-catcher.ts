import { spawn, type ChildProcess } from 'node:child_process'
import { existsSync, mkdtempSync, readdirSync, readFileSync } from 'node:fs'
import { connect } from 'node:net'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { fileURLToPath } from 'node:url'
import type { CaughtMail } from '../../scripts/mail-catcher'

const root = fileURLToPath(new URL('../..', import.meta.url))

function listening(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = connect(port, '127.0.0.1')
    socket.once('connect', () => {
      socket.destroy()
      resolve(true)
    })
    socket.once('error', () => resolve(false))
  })
}

/** Starts scripts/mail-catcher.ts as its own process (so a test can stop and restart it). */
export async function startCatcherProcess(port: number, dir: string): Promise<ChildProcess> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'scripts/mail-catcher.ts', '--port', String(port), '--dir', dir], { cwd: root, stdio: 'ignore', detached: true })
  child.unref()
  const until = Date.now() + 20_000
  while (!(await listening(port))) {
    if (Date.now() > until) throw new Error('mail catcher did not start')
    await new Promise(r => setTimeout(r, 100))
  }
  return child
}

export function newCatcherDir(): string {
  return mkdtempSync(join(tmpdir(), 'rw-mail-'))
}

/** Messages caught so far, oldest first. */
export function caughtMail(dir: string): CaughtMail[] {
  return readdirSync(dir).filter(n => n.endsWith('.json')).sort().map(n => JSON.parse(readFileSync(join(dir, n), 'utf8')) as CaughtMail)
}

/** Waits until a message to `to` arrives (or fails after the timeout). */
export async function waitForMail(dir: string, to: string, timeoutMs = 20_000): Promise<CaughtMail> {
  const until = Date.now() + timeoutMs
  for (;;) {
    const found = caughtMail(dir).find(m => m.to.includes(to))
    if (found) return found
    if (Date.now() > until) throw new Error(`no mail to ${to} within ${timeoutMs} ms`)
    await new Promise(r => setTimeout(r, 100))
  }
}

/** Stops the catcher that keeps its messages in `dir` (whoever started it) and waits until its port is free. */
export async function stopCatcher(dir: string, port: number): Promise<void> {
  const pidFile = join(dir, 'catcher.pid')
  if (existsSync(pidFile)) {
    try {
      process.kill(Number(readFileSync(pidFile, 'utf8')), 'SIGTERM')
    } catch {
      // already gone
    }
  }
  const until = Date.now() + 10_000
  while (await listening(port)) {
    if (Date.now() > until) throw new Error('mail catcher did not stop')
    await new Promise(r => setTimeout(r, 50))
  }
}
