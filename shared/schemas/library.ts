import { z } from 'zod'
import { evaluateProcessSchema, evaluateSpecSchema } from '../core/contract/evaluate'
import { intInRange, says } from '../core/contract/fields'
import { rangedInteger } from './study'

/**
 * Bodies of the team library routes: process presets (`/api/presets`) and spec templates
 * (`/api/templates`). The process and spec are the engine's own schemas, so a preset or a
 * template always loads into a valid study.
 */
const NAME_RULE = 'must be text of 1 to 120 characters'
const name = z.string(says(NAME_RULE)).trim().min(1, says(NAME_RULE)).max(120, says(NAME_RULE))
const description = z.string(says('must be text of at most 2000 characters')).trim()
  .max(2000, says('must be text of at most 2000 characters')).nullish()
/** The row version the client last read (optimistic concurrency). */
export const versionField = intInRange(1, 2 ** 31 - 1)

/** The process fields a preset keeps (one column each); the engine's defaults fill gaps. */
export const presetProcessSchema = evaluateProcessSchema.pick({
  sheetOhmPerSq: true, matchingPctUm: true, matchingConvention: true, unitOhm: true, switchOhm: true,
  switchSkewS: true, switchChargeC: true, switchAreaUm2: true, gateAreaUm2: true, layoutOverhead: true,
  minWidthUm: true, minLengthUm: true
})

export const presetCreateSchema = z.strictObject({ name, description, process: presetProcessSchema })
export const presetPatchSchema = z.strictObject({ version: versionField, name: name.optional(), description, process: presetProcessSchema.optional() })

export const templateCreateSchema = z.strictObject({ name, description, spec: evaluateSpecSchema })
export const templatePatchSchema = z.strictObject({ version: versionField, name: name.optional(), description, spec: evaluateSpecSchema.optional() })

export type PresetProcess = z.infer<typeof presetProcessSchema>
export type PresetCreate = z.infer<typeof presetCreateSchema>
export type PresetPatch = z.infer<typeof presetPatchSchema>
export type TemplateCreate = z.infer<typeof templateCreateSchema>
export type TemplatePatch = z.infer<typeof templatePatchSchema>

/** DELETE ?version=N: refuse (409) when the item changed since the caller saw it; omitted = delete whatever is there. */
export const libraryDeleteQuerySchema = z.object({ version: rangedInteger(1, 2 ** 31 - 1, true).optional() })
