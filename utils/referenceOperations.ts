/** The API reference page's reading of /api/openapi.json: operations grouped by tag, filtered by text. */
export interface ReferenceParameter { name: string, in: string, required?: boolean, schema?: { type?: string, minimum?: number, maximum?: number, enum?: string[] } }

export interface ReferenceOp {
  method: string
  path: string
  summary: string
  description: string
  scope: string | null
  parameters: ReferenceParameter[]
  example: unknown
  responses: { code: string, description: string }[]
}

interface RawOperation {
  'summary': string
  'description': string
  'tags': string[]
  'x-token-scope'?: string
  'parameters'?: ReferenceParameter[]
  'requestBody'?: { content: Record<string, { example?: unknown }> }
  'responses': Record<string, { description: string }>
}
export interface RawApiDocument { info: { version: string }, paths: Record<string, Record<string, RawOperation>> }

export function referenceGroups(doc: RawApiDocument | null | undefined, filter: string): [string, ReferenceOp[]][] {
  const out = new Map<string, ReferenceOp[]>()
  for (const [path, item] of Object.entries(doc?.paths ?? {})) {
    for (const [method, raw] of Object.entries(item)) {
      const op: ReferenceOp = {
        method: method.toUpperCase(), path, summary: raw.summary, description: raw.description, scope: raw['x-token-scope'] ?? null,
        parameters: raw.parameters ?? [], example: raw.requestBody?.content['application/json']?.example,
        responses: Object.entries(raw.responses).map(([code, r]) => ({ code, description: r.description.split(':')[0]! }))
      }
      if (filter && !`${op.method} ${op.path} ${op.summary}`.toLowerCase().includes(filter.toLowerCase())) continue
      const tag = raw.tags[0] ?? 'Other'
      out.set(tag, [...(out.get(tag) ?? []), op])
    }
  }
  return [...out.entries()]
}
