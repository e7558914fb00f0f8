/**
 * Runs an evaluation's tasks with at most `slots` in flight, in the planner's order (the Monte
 * Carlo chunks, the long ones, first; then the short analytic tasks): each task starts when a
 * slot frees. Handing a pool every task at once let it start short ones before the last chunks,
 * so a run ended with one thread on a late chunk while the other idled. Results in task order.
 */
export async function runInSlots<T, R>(tasks: readonly T[], slots: number, run: (task: T, index: number) => Promise<R>): Promise<R[]> {
  const results = new Array<R>(tasks.length)
  let next = 0
  const lane = async (): Promise<void> => {
    while (next < tasks.length) {
      const i = next++
      results[i] = await run(tasks[i]!, i)
    }
  }
  await Promise.all(Array.from({ length: Math.max(1, Math.min(slots, tasks.length)) }, lane))
  return results
}
