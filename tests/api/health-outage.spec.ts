import { describe, expect, inject, it } from 'vitest'
import { startInstance, stopInstance } from '../support/mariadb'
import { api, DEMO, signIn } from '../support/http'

describe('database outage', () => {
  // Against an external database (the cluster run) there is no instance of ours to stop; the
  // cluster run kills a node itself.
  it.skipIf(!inject('databaseCnf'))('reports 503 while MariaDB is down, fails requests fast with a clear message, and recovers by itself', async () => {
    const cookie = await signIn(DEMO.engineer)
    expect((await api('/api/health')).body).toMatchObject({ app: 'ok', database: 'ok' })
    await stopInstance(inject('databaseCnf'))
    try {
      const health = await api<{ database: string }>('/api/health')
      expect(health.status).toBe(503)
      expect(health.body.database).toBe('unavailable')
      const started = Date.now()
      const list = await api<{ statusMessage: string }>('/api/studies', { cookie })
      expect(list.status).toBe(503)
      expect(list.body.statusMessage).toMatch(/database is unavailable/i)
      expect(Date.now() - started).toBeLessThan(10_000)
    } finally {
      await startInstance(inject('databaseCnf'))
    }
    // No restart of the app: the pool reconnects on its own.
    const deadline = Date.now() + 15_000
    let status = 0
    while (Date.now() < deadline && status !== 200) {
      status = (await api('/api/health')).status
      if (status !== 200) await new Promise(r => setTimeout(r, 200))
    }
    expect(status).toBe(200)
    expect((await api('/api/studies', { cookie })).status).toBe(200)
  })
})
