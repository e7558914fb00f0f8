import { z } from 'zod'
import { evaluateInputSchema, evaluateOutputSchema } from '#shared/core/contract/evaluate'
import { netlistInputSchema, netlistOutputSchema } from '#shared/core/contract/netlist'
import { solveInputSchema, solveOutputSchema } from '#shared/core/contract/solve'
import { benchBodySchema, benchParamsSchema, importBodySchema, netlistQuerySchema } from '#shared/schemas/io'
import { revisionCompareQuerySchema, revisionCreateSchema, revisionParamsSchema } from '#shared/schemas/revisions'
import { idParamSchema, studyCreateSchema, studyListQuerySchema } from '#shared/schemas/study'
import { BENCH_EXAMPLE, EVALUATE_EXAMPLE, LADDER_EXAMPLE, PROCESS_EXAMPLE, SPEC_EXAMPLE, type ApiOperation } from './types'

const EDITORS = 'admin, architect or engineer (an engineer edits their own studies)'
const jobQuery = z.object({ result: z.enum(['0', '1']).default('1') })
const IMPORT_CSV = 'title,bits,vrefV,updateRateHz,loadCapacitanceF,inlTargetLsb,dnlTargetLsb,yieldTarget,areaBudgetMm2,glitchLimitVs,powerBudgetW,sheetOhmPerSq,matchingPctUm,matchingConvention\nTrim DAC,4,2.5 V,1 MS/s,1 pF,0.5,0.5,99 %,0.05,100 pV·s,1 mW,1 kΩ,1 %·µm,pair\n'
const json = (description: string, status = 200) => ({ status, description })

/** The engine, evaluation jobs, studies, revisions, imports and exports. */
export const STUDY_OPERATIONS: ApiOperation[] = [
  { route: 'GET /api/health', summary: 'Health of this instance and its database', tag: 'Health', auth: 'public', ok: json('healthy (503 while the database is unreachable)') },
  { route: 'POST /api/solve', summary: 'Exact solve of one circuit, every code', tag: 'Engine', auth: 'user', body: solveInputSchema, example: LADDER_EXAMPLE, ok: { status: 200, description: 'the solve output', schema: solveOutputSchema } },
  { route: 'POST /api/evaluate', summary: 'Trade-study evaluation of a spec (synchronous)', tag: 'Engine', auth: 'user', body: evaluateInputSchema, example: EVALUATE_EXAMPLE, ok: { status: 200, description: 'the evaluate output (429 past the per-user cap of heavy requests)', schema: evaluateOutputSchema } },
  { route: 'POST /api/netlist', summary: 'SPICE netlist of a circuit or a sized candidate', tag: 'Engine', auth: 'user', body: netlistInputSchema, example: { circuit: LADDER_EXAMPLE }, ok: { status: 200, description: 'the netlist output', schema: netlistOutputSchema } },
  { route: 'POST /api/evaluations', summary: 'Start an evaluation job (Monte Carlo in the background)', tag: 'Engine', auth: 'user', body: evaluateInputSchema, example: EVALUATE_EXAMPLE, ok: json('the job, queued', 202) },
  { route: 'GET /api/evaluations/:id', summary: 'A job\'s state, progress and (result=1) output', tag: 'Engine', auth: 'user', params: idParamSchema, query: jobQuery, ok: json('the job') },
  { route: 'DELETE /api/evaluations/:id', summary: 'Cancel a job', tag: 'Engine', auth: 'user', roles: 'the job\'s owner or an admin', params: idParamSchema, ok: json('the cancelled job') },
  { route: 'GET /api/studies', summary: 'The team\'s studies, a page at a time', tag: 'Studies', auth: 'user', query: studyListQuerySchema, ok: json('a page of studies') },
  { route: 'POST /api/studies', summary: 'Create a study', tag: 'Studies', auth: 'user', roles: EDITORS, body: studyCreateSchema, example: { title: 'Trim DAC', blockName: 'DAC0', spec: SPEC_EXAMPLE }, ok: json('the study', 201) },
  { route: 'GET /api/studies/:id', summary: 'One study', tag: 'Studies', auth: 'user', params: idParamSchema, ok: json('the study (version = head revision number)') },
  { route: 'GET /api/studies/:id/revisions', summary: 'The study\'s revisions, newest first', tag: 'Revisions', auth: 'user', params: idParamSchema, ok: json('revision summaries') },
  {
    route: 'POST /api/studies/:id/revisions', summary: 'Save the next revision (409 when baseVersion is stale)', tag: 'Revisions', auth: 'user', roles: EDITORS,
    params: idParamSchema, body: revisionCreateSchema, example: { baseVersion: 0, spec: SPEC_EXAMPLE, process: PROCESS_EXAMPLE, options: { topologies: ['string'], trials: 0, seed: 1 }, note: 'first inputs' }, ok: json('the revision', 201)
  },
  { route: 'GET /api/studies/:id/revisions/:n', summary: 'One revision with its inputs and results', tag: 'Revisions', auth: 'user', params: revisionParamsSchema, ok: json('the revision') },
  { route: 'GET /api/studies/:id/revisions/compare', summary: 'Two revisions compared field by field', tag: 'Revisions', auth: 'user', params: idParamSchema, query: revisionCompareQuerySchema, ok: json('the differences') },
  { route: 'POST /api/studies/import/preview', summary: 'Check a CSV or JSON import (writes nothing)', tag: 'Imports and exports', auth: 'user', roles: EDITORS, body: importBodySchema, example: { text: IMPORT_CSV, format: 'csv' }, ok: json('every row with its problems') },
  { route: 'POST /api/studies/import', summary: 'Import studies (all rows or none)', tag: 'Imports and exports', auth: 'user', roles: EDITORS, body: importBodySchema, example: { text: IMPORT_CSV, format: 'csv', fileName: 'specs.csv' }, ok: json('the studies created', 201) },
  { route: 'GET /api/studies/:id/export', summary: 'The study document (JSON)', tag: 'Imports and exports', auth: 'user', params: idParamSchema, ok: json('the study document') },
  { route: 'GET /api/studies/:id/comparison', summary: 'The current revision\'s candidates as CSV', tag: 'Imports and exports', auth: 'user', params: idParamSchema, ok: { status: 200, description: 'CSV, rank order', type: 'text/csv' } },
  { route: 'GET /api/studies/:id/netlist', summary: 'A candidate of the current revision as a SPICE netlist file', tag: 'Imports and exports', auth: 'user', params: idParamSchema, query: netlistQuerySchema, ok: { status: 200, description: 'the netlist (413 above 16 MB)', type: 'text/plain' } },
  { route: 'GET /api/studies/:id/bench', summary: 'Bench measurements of the study', tag: 'Imports and exports', auth: 'user', params: idParamSchema, ok: json('the measurements') },
  { route: 'POST /api/studies/:id/bench', summary: 'Upload a measured transfer (CSV)', tag: 'Imports and exports', auth: 'user', roles: EDITORS, params: idParamSchema, body: benchBodySchema, example: { candidateId: 'r2r-voltage', fileName: 'bench.csv', text: BENCH_EXAMPLE }, ok: json('the measurement', 201) },
  { route: 'GET /api/studies/:id/bench/:benchId', summary: 'One measurement beside the prediction', tag: 'Imports and exports', auth: 'user', params: benchParamsSchema, ok: json('the measurement and the predicted linearity') }
]
