import { execFile } from 'node:child_process'
import { mkdtempSync, rmSync, statSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { promisify } from 'node:util'
import knex, { type Knex } from 'knex'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { knexConfig } from '../../server/db/knexfile'
import { destroyTestDatabase, startTestDatabase, type TestDatabase } from '../support/mariadb'

/**
 * npm run db:backup on a seeded throwaway instance, npm run db:restore into a fresh one; every
 * table must come back with the same row count and the same CHECKSUM TABLE (MariaDB's own
 * content checksum, computed by the server on both sides).
 */
const root = fileURLToPath(new URL('../..', import.meta.url))
const exec = promisify(execFile)
let source: TestDatabase
let target: TestDatabase
let dir = ''

function script(args: string[], url: string) {
  return exec(process.execPath, ['--import', 'tsx', 'scripts/backup.ts', ...args], { cwd: root, env: { ...process.env, NUXT_DATABASE_URL: url } })
}

async function snapshot(db: Knex): Promise<Record<string, { rows: number, checksum: string }>> {
  const [tables] = await db.raw('SHOW FULL TABLES WHERE Table_type = \'BASE TABLE\'')
  const out: Record<string, { rows: number, checksum: string }> = {}
  for (const t of tables as Record<string, string>[]) {
    const name = Object.values(t)[0]!
    const [[count]] = await db.raw(`SELECT COUNT(*) AS n FROM \`${name}\``)
    const [[sum]] = await db.raw(`CHECKSUM TABLE \`${name}\``)
    out[name] = { rows: Number(count.n), checksum: String(sum.Checksum) }
  }
  return out
}

beforeAll(async () => {
  // Both start at once; if one fails, the other is still kept for afterAll to stop.
  const started = await Promise.allSettled([startTestDatabase(), startTestDatabase()])
  if (started[0].status === 'fulfilled') source = started[0].value
  if (started[1].status === 'fulfilled') target = started[1].value
  for (const s of started) if (s.status === 'rejected') throw s.reason
  dir = mkdtempSync(join(tmpdir(), 'rw-backup-test-'))
  for (const command of ['latest', 'seed']) {
    await exec(process.execPath, ['--import', 'tsx', 'scripts/migrate.ts', command], { cwd: root, env: { ...process.env, NUXT_DATABASE_URL: source.url } })
  }
}, 180_000)
afterAll(async () => {
  await Promise.all([source, target].filter(Boolean).map(db => destroyTestDatabase(db)))
  rmSync(dir, { recursive: true, force: true })
})

describe('backup and restore', () => {
  it('restores a dump into a fresh instance with equal row counts and checksums per table', async () => {
    const src = knex(knexConfig(source.url))
    const dst = knex(knexConfig(target.url))
    try {
      // Text that must survive the round trip byte for byte: 4-byte UTF-8, quotes, a backslash, RTL.
      const team = await src('teams').first('id')
      await src('audit_log').insert({ team_id: team.id, action: 'backup_probe', target_type: 'test', target_id: 'x', detail: JSON.stringify({ text: '😀 \'q\' "d" \\ \u05E9\u05DC\u05D5\u05DD' }) })
      const file = join(dir, 'dump.sql.gz')
      const out = await script(['backup', file], source.url)
      expect(out.stdout).toContain('Backed up rungwise_test')
      expect(statSync(file).size).toBeGreaterThan(1000)
      await script(['restore', file], target.url)
      const [before, after] = await Promise.all([snapshot(src), snapshot(dst)])
      expect(Object.keys(before).length).toBeGreaterThan(10)
      expect(before.studies!.rows).toBeGreaterThan(0)
      expect(after).toEqual(before)
    } finally {
      await Promise.all([src.destroy(), dst.destroy()])
    }
  }, 180_000)

  it('refuses a restore without a file, or of a file that does not exist, with a clear message', async () => {
    await expect(script(['restore'], target.url)).rejects.toMatchObject({ code: 2, stderr: expect.stringContaining('Name the backup to restore: npm run db:restore FILE') })
    await expect(script(['restore', join(dir, 'missing.sql.gz')], target.url)).rejects.toMatchObject({ code: 2, stderr: expect.stringContaining('No backup file at') })
  })
})
