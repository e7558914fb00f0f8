import { describe, expect, it } from 'vitest'
import { runInSlots } from '#shared/core/evaluation/dispatch'

// Reference: the behaviour the pool relies on (derived): at most `slots` tasks in flight, started in plan order.
describe('runInSlots', () => {
  it('keeps at most `slots` tasks in flight, starts them in order and returns results in task order', async () => {
    let inFlight = 0
    let most = 0
    const started: number[] = []
    const delays = [30, 5, 5, 20, 1, 1, 10]
    const results = await runInSlots(delays, 2, async (ms, i) => {
      started.push(i)
      inFlight += 1
      most = Math.max(most, inFlight)
      await new Promise(r => setTimeout(r, ms))
      inFlight -= 1
      return i * 10
    })
    expect(most).toBe(2)
    expect(started).toEqual([0, 1, 2, 3, 4, 5, 6])
    expect(results).toEqual([0, 10, 20, 30, 40, 50, 60])
  })

  it('runs everything with one slot, and passes a failure on', async () => {
    expect(await runInSlots([1, 2, 3], 1, async x => x + 1)).toEqual([2, 3, 4])
    await expect(runInSlots([1, 2], 4, async (x) => {
      if (x === 2) throw new Error('task 2 failed')
      return x
    })).rejects.toThrow('task 2 failed')
  })
})
