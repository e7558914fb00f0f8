/**
 * The study document: a study exported as JSON that imports again as a new study. Versioned by
 * `format` and `version`; the inputs of every revision and the results of the current one, with
 * the engine version that computed them. Ids, authors and timestamps are informative only.
 */
import { z } from 'zod'
import { evaluateInputSchema, evaluateOutputSchema, type EvaluateInput, type EvaluateOutput } from '../core/contract/evaluate'
import { formatIssues, type FormattedIssue } from '../core/contract/errors'

export const STUDY_DOCUMENT_FORMAT = 'rungwise-study'
export const STUDY_DOCUMENT_VERSION = 1
/** Most revisions one document carries. */
export const MAX_DOCUMENT_REVISIONS = 500

const text = (max: number) => z.string({ error: `must be text of at most ${max} characters` }).max(max, { error: `must be text of at most ${max} characters` })

const revisionSchema = z.object({
  number: z.number({ error: 'must be a revision number from 1' }).int().min(1),
  note: text(500).nullable().default(null),
  engineVersion: text(40),
  createdAt: z.string().optional(),
  inputs: z.unknown()
})

export const studyDocumentSchema = z.object({
  format: z.literal(STUDY_DOCUMENT_FORMAT, { error: `must be "${STUDY_DOCUMENT_FORMAT}"` }),
  version: z.literal(STUDY_DOCUMENT_VERSION, { error: `must be ${STUDY_DOCUMENT_VERSION}; this version of Rungwise reads study documents of version ${STUDY_DOCUMENT_VERSION}` }),
  exportedAt: z.string().optional(),
  engineVersion: text(40).nullable(),
  study: z.object({
    id: z.number().optional(),
    title: z.unknown(),
    blockName: z.unknown().optional(),
    status: z.string().optional()
  }),
  revisions: z.array(revisionSchema, { error: `must be a list of 1 to ${MAX_DOCUMENT_REVISIONS} revisions` })
    .min(1, { error: `must be a list of 1 to ${MAX_DOCUMENT_REVISIONS} revisions` }).max(MAX_DOCUMENT_REVISIONS, { error: `must be a list of 1 to ${MAX_DOCUMENT_REVISIONS} revisions` }),
  results: z.object({ revision: z.number().int(), output: z.unknown() }).nullable()
})

export type StudyDocument = z.input<typeof studyDocumentSchema>

export interface StudyDocumentRead {
  title: unknown
  blockName: unknown
  revisions: { note: string | null, engineVersion: string, inputs: EvaluateInput }[]
  /** the head revision's results, kept only when computed by this engine version for exactly its inputs */
  results: { output: EvaluateOutput, engineVersion: string } | null
  /** why the results were not kept, if they were not */
  resultsDropped: string | null
}

export function isStudyDocument(value: unknown): boolean {
  return value !== null && typeof value === 'object' && !Array.isArray(value) && 'format' in value
}

/** Validates a document: every revision's inputs with the engine's schema, the results with its output schema. */
export function readStudyDocument(value: unknown, engineVersion?: string): { ok: true, document: StudyDocumentRead } | { ok: false, issues: FormattedIssue[] } {
  const doc = studyDocumentSchema.safeParse(value)
  if (!doc.success) return { ok: false, issues: formatIssues(doc.error).issues }
  const issues: FormattedIssue[] = []
  const revisions = [...doc.data.revisions].sort((a, b) => a.number - b.number).map((r, i) => {
    const inputs = evaluateInputSchema.safeParse(r.inputs)
    if (!inputs.success) issues.push(...formatIssues(inputs.error).issues.map(x => ({ ...x, path: `revisions[${i}].inputs.${x.path}` })))
    return { note: r.note, engineVersion: r.engineVersion, inputs: inputs.data as EvaluateInput }
  })
  if (issues.length) return { ok: false, issues }
  const head = doc.data.revisions.reduce((a, b) => (b.number > a.number ? b : a))
  let results: StudyDocumentRead['results'] = null
  let resultsDropped: string | null = null
  if (doc.data.results) {
    const output = evaluateOutputSchema.safeParse(doc.data.results.output)
    if (doc.data.results.revision !== head.number) resultsDropped = `the results are of revision ${doc.data.results.revision}, not of the current revision ${head.number}`
    else if (!output.success) resultsDropped = 'the results do not have the engine\'s output shape'
    else if (engineVersion !== undefined && output.data.engineVersion !== engineVersion) resultsDropped = `the results were computed by engine ${output.data.engineVersion}, this is engine ${engineVersion}; run Monte Carlo again`
    else results = { output: output.data, engineVersion: output.data.engineVersion }
  }
  return { ok: true, document: { title: doc.data.study.title, blockName: doc.data.study.blockName ?? null, revisions, results, resultsDropped } }
}
