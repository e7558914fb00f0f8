import type { Knex } from 'knex'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { retryOnDeadlock } from '../../server/utils/retry'
import { testDb } from '../support/db'

// A real InnoDB deadlock (two transactions taking two row locks in opposite order): MariaDB rolls
// one back with ER_LOCK_DEADLOCK (1213), the code Galera also uses for a certification failure.
let db: Knex
beforeAll(async () => {
  db = testDb()
  await db.schema.dropTableIfExists('retry_probe')
  await db.schema.createTable('retry_probe', (t) => {
    t.increments('id').primary()
    t.integer('n').notNullable().defaultTo(0)
  })
  await db('retry_probe').insert([{ n: 0 }, { n: 0 }])
})
afterAll(async () => {
  await db.schema.dropTableIfExists('retry_probe')
  await db.destroy()
})

describe('retryOnDeadlock with MariaDB', () => {
  it('runs the deadlock victim again, so both transactions commit exactly once', async () => {
    const [x, y] = (await db('retry_probe').orderBy('id').select('id')).map(r => r.id as number)
    let bothLocked!: () => void
    const barrier = new Promise<void>(resolve => (bothLocked = resolve))
    let locked = 0
    const codes: string[] = []
    const transfer = (first: number, second: number) => retryOnDeadlock(() => db.transaction(async (trx) => {
      await trx('retry_probe').where({ id: first }).increment('n', 1)
      if (++locked === 2) bothLocked()
      if (locked <= 2) await barrier
      await trx('retry_probe').where({ id: second }).increment('n', 1)
    }), { onRetry: error => codes.push((error as { code: string }).code) })
    await Promise.all([transfer(x!, y!), transfer(y!, x!)])
    expect(codes).toEqual(['ER_LOCK_DEADLOCK'])
    // Each transaction added 1 to both rows, once: the rolled-back try left nothing behind.
    expect((await db('retry_probe').orderBy('id').select('n')).map(r => r.n)).toEqual([2, 2])
  })

  it('does not retry other errors (a duplicate key stays a failure at once)', async () => {
    let tries = 0
    const [row] = await db('retry_probe').orderBy('id').select('id')
    await expect(retryOnDeadlock(() => {
      tries += 1
      return db('retry_probe').insert({ id: row!.id, n: 0 })
    })).rejects.toMatchObject({ code: 'ER_DUP_ENTRY' })
    expect(tries).toBe(1)
  })
})
