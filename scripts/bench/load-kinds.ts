/**
 * The traffic mix of `npm run bench:load`, one row per kind of request. Each row gets its own
 * autocannon instance with `connections` of the 50, all running at the same time (the rows'
 * connections add up to 50). Adding a kind is one more row here.
 */
import type { Request } from 'autocannon'

export type Role = 'admin' | 'architect' | 'engineer' | 'manager'
export type Group = 'read' | 'write' | 'evaluation'

/** What the rows can use: cookies per role, demo study ids, studies reserved for writes. */
export interface LoadFixtures {
  cookies: Record<Role, string>
  readStudyIds: number[]
  /** Studies only the write kind touches, with their current version (baseVersion). */
  writeStudies: { id: number, version: number }[]
  /** spec/process/options of a demo revision: the body of every revision save. */
  revisionInputs: { spec: unknown, process: unknown, options: unknown }
  evaluationInput: unknown
}

export interface TrafficKind {
  name: string
  group: Group
  connections: number
  /** Requests per second over all its connections (unset: as fast as answers come back). */
  rate?: number
  /** Statuses that are the designed answer, counted apart and not as errors (e.g. the job cap's 429). */
  designed?: number[]
  requests: (f: LoadFixtures) => Request[]
}

const json = (cookie: string) => ({ cookie, 'accept': 'application/json', 'content-type': 'application/json' })

function rotate<T>(items: readonly T[]): () => T {
  let i = 0
  return () => items[i++ % items.length]!
}

export const TRAFFIC: TrafficKind[] = [
  {
    name: 'study list', group: 'read', connections: 18,
    requests: (f) => {
      const cookie = rotate([f.cookies.manager, f.cookies.admin])
      return [{ method: 'GET', path: '/api/studies?page=1&pageSize=25', setupRequest: req => ({ ...req, headers: { cookie: cookie(), accept: 'application/json' } }) }]
    }
  },
  {
    name: 'study read', group: 'read', connections: 18,
    requests: (f) => {
      const id = rotate(f.readStudyIds)
      const cookie = rotate([f.cookies.manager, f.cookies.architect])
      return [{ method: 'GET', setupRequest: req => ({ ...req, path: `/api/studies/${id()}`, headers: { cookie: cookie(), accept: 'application/json' } }) }]
    }
  },
  {
    // Revision save (audit-logged, one transaction); each in-flight save takes a study no other
    // connection is saving, so no 409 is expected.
    name: 'revision save', group: 'write', connections: 5,
    requests: (f) => {
      const free = [...f.writeStudies]
      return [{
        method: 'POST',
        setupRequest: (req, context: { study?: unknown }) => {
          const study = free.shift()
          if (!study) throw new Error('revision save: no free study (more connections than reserved studies)')
          context.study = study
          return { ...req, path: `/api/studies/${study.id}/revisions`, headers: json(f.cookies.engineer), body: JSON.stringify({ baseVersion: study.version, ...f.revisionInputs, note: 'load run' }) }
        },
        onResponse: (status, _body, context) => {
          const study = (context as { study: { id: number, version: number } }).study
          free.push(status === 201 ? { id: study.id, version: study.version + 1 } : study)
        }
      }]
    }
  },
  {
    // A short note on a study (one transaction: note row, no mention, audit row); notes have no
    // version to race on, so the connections may share studies and no 409 is expected.
    name: 'note post', group: 'write', connections: 3,
    requests: (f) => {
      const id = rotate(f.writeStudies.map(s => s.id))
      let n = 0
      return [{ method: 'POST', setupRequest: req => ({ ...req, path: `/api/studies/${id()}/notes`, headers: json(f.cookies.engineer), body: JSON.stringify({ body: `Load run note ${++n}: INL margin looks fine.` }) }) }]
    }
  },
  {
    // Monte Carlo jobs: at most 2 queued or running per user, so most of these are a designed 429.
    name: 'evaluation job', group: 'evaluation', connections: 6, rate: 30, designed: [429],
    requests: (f) => {
      const cookie = rotate([f.cookies.architect, f.cookies.engineer, f.cookies.admin])
      return [{ method: 'POST', path: '/api/evaluations', setupRequest: req => ({ ...req, headers: json(cookie()), body: JSON.stringify(f.evaluationInput) }) }]
    }
  }
]
