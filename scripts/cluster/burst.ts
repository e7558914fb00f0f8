/**
 * The write burst of the cluster run: workers create studies (one transaction: study + audit
 * row) through two app instances in turn, like clients behind a load balancer. A request that
 * fails on one instance (its database node is gone: 503 or a dropped socket) is sent once to the
 * other, as a load balancer's retry would; what counts is what the client saw acknowledged (201).
 */
export interface BurstResult {
  acknowledged: { id: number, title: string, via: string }[]
  /** Failures an instance answered before the client moved to the other one. */
  failedOnFirstTry: { via: string, status: number | string, atMs: number }[]
  /** Requests that failed on both instances: the app did not serve them. */
  unserved: { status: number | string, atMs: number }[]
  slowestMs: number
  perInstance: Record<string, number>
}

async function createStudy(base: string, cookie: string, title: string, spec: unknown): Promise<{ status: number | string, id?: number }> {
  try {
    const res = await fetch(`${base}/api/studies`, {
      method: 'POST', headers: { cookie, 'content-type': 'application/json', 'accept': 'application/json' },
      body: JSON.stringify({ title, spec }), signal: AbortSignal.timeout(15_000)
    })
    const body = await res.json().catch(() => ({})) as { id?: number }
    return { status: res.status, id: body.id }
  } catch (error) {
    return { status: (error as Error).name }
  }
}

/** Runs `workers` loops until `stop()` resolves; titles are `${tag}-${worker}-${i}`. */
export async function writeBurst(instances: { name: string, url: string }[], cookie: string, spec: unknown, tag: string, workers: number, stop: Promise<void>): Promise<BurstResult> {
  const result: BurstResult = { acknowledged: [], failedOnFirstTry: [], unserved: [], slowestMs: 0, perInstance: {} }
  let stopped = false
  void stop.then(() => (stopped = true))
  const t0 = performance.now()
  const loop = async (w: number) => {
    for (let i = 0; !stopped; i++) {
      const title = `${tag}-${w}-${i}`
      const order = (w + i) % 2 ? [instances[1]!, instances[0]!] : [instances[0]!, instances[1]!]
      const started = performance.now()
      let done = false
      for (const instance of order) {
        const res = await createStudy(instance.url, cookie, title, spec)
        if (res.status === 201 && res.id) {
          result.acknowledged.push({ id: res.id, title, via: instance.name })
          result.perInstance[instance.name] = (result.perInstance[instance.name] ?? 0) + 1
          done = true
          break
        }
        if (instance === order[0]) result.failedOnFirstTry.push({ via: instance.name, status: res.status, atMs: performance.now() - t0 })
        else result.unserved.push({ status: res.status, atMs: performance.now() - t0 })
      }
      result.slowestMs = Math.max(result.slowestMs, performance.now() - started)
      if (!done) await new Promise(r => setTimeout(r, 100))
    }
  }
  await Promise.all(Array.from({ length: workers }, (_, w) => loop(w)))
  return result
}
