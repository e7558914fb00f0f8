import { presetPatchSchema } from '#shared/schemas/library'
import { idParamSchema } from '#shared/schemas/study'
import type { PresetDto } from '#shared/types/library'

/** Edits a preset if `version` is still current (409 otherwise, with the current version). */
export default defineApiHandler(async (event): Promise<PresetDto> => {
  const user = await requireUser(event, ...LIBRARY_WRITER_ROLES)
  const { id } = paramsAs(event, idParamSchema)
  const body = await readBodyAs(event, presetPatchSchema)
  const values: Record<string, unknown> = {
    ...(body.name === undefined ? {} : { name: body.name }),
    ...(body.description === undefined ? {} : { description: body.description }),
    ...(body.process ? presetColumns(body.process) : {})
  }
  const db = useDb()
  await withUniqueName('preset', body.name, () => writeTransaction(async (trx) => {
    await updateVersioned(trx, 'process_presets', user.teamId, id, body.version, values)
    await writeAudit({ teamId: user.teamId, actorId: user.id, action: 'preset_updated', targetType: 'process_preset', targetId: id, detail: { fromVersion: body.version, fields: Object.keys(values) } }, trx)
  }))
  return toPresetDto(await db('process_presets').where({ id }).first())
})
