import { z } from 'zod'
import { rangedInteger } from './study'
import { MAX_SAMPLE_INDEX, NETLIST_DECKS } from '../core/contract/netlist'
import { says } from '../core/contract/fields'
import { MAX_BENCH_CHARS } from '../io/benchCsv'

/** Most characters of an import file (200 CSV lines or a study document with its results). */
export const MAX_IMPORT_CHARS = 8 * 2 ** 20

const fileName = z.string(says('must be a file name of at most 255 characters')).trim()
  .max(255, says('must be a file name of at most 255 characters')).regex(/^[^\p{Cc}/\\]*$/u, says('must be a file name without slashes or control characters'))

/** Body of `POST /api/studies/import` and its preview: the file's text as uploaded or pasted. */
export const importBodySchema = z.strictObject({
  text: z.string(says(`must be the file's text, at most ${MAX_IMPORT_CHARS} characters`)).min(1, says('must not be empty; paste the CSV or JSON, or choose a file'))
    .max(MAX_IMPORT_CHARS, says(`must be the file's text, at most ${MAX_IMPORT_CHARS} characters`)),
  format: z.enum(['csv', 'json', 'auto'], says('must be "csv", "json" or "auto"')).default('auto'),
  fileName: fileName.optional()
})

/** Body of `POST /api/studies/:id/bench`. */
export const benchBodySchema = z.strictObject({
  candidateId: z.string(says('must be a candidate id such as "segmented-m4"')).regex(/^[a-z0-9-]{1,60}$/, says('must be a candidate id such as "segmented-m4"')),
  fileName: fileName.min(1, says('must be a file name of 1 to 255 characters')),
  text: z.string(says(`must be the file's text, at most ${MAX_BENCH_CHARS} characters`)).max(MAX_BENCH_CHARS, says(`must be the file's text, at most ${MAX_BENCH_CHARS} characters`))
})

/** Query of `GET /api/studies/:id/netlist`: a candidate of the current revision, nominal or one sample. */
export const netlistQuerySchema = z.object({
  candidate: z.string(says('must be a candidate id such as "segmented-m4"')).regex(/^[a-z0-9-]{1,60}$/, says('must be a candidate id such as "segmented-m4"')),
  seed: rangedInteger(0, 2 ** 32 - 1, true).optional(),
  index: rangedInteger(0, MAX_SAMPLE_INDEX, true).optional(),
  /** 'portable': a plain SPICE deck for any simulator instead of the ngspice deck */
  deck: z.enum(NETLIST_DECKS, says('must be "ngspice" or "portable"')).optional()
})

export const benchParamsSchema = z.object({
  id: rangedInteger(1, 2 ** 31 - 1, true),
  benchId: rangedInteger(1, 2 ** 31 - 1, true)
})
