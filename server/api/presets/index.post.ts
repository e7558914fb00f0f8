import { presetCreateSchema } from '#shared/schemas/library'
import type { PresetDto } from '#shared/types/library'

export default defineApiHandler(async (event): Promise<PresetDto> => {
  const user = await requireUser(event, ...LIBRARY_WRITER_ROLES)
  const body = await readBodyAs(event, presetCreateSchema)
  const db = useDb()
  const id = await withUniqueName('preset', body.name, () => writeTransaction(async (trx) => {
    const [presetId] = await trx('process_presets').insert({ team_id: user.teamId, name: body.name, description: body.description ?? null, ...presetColumns(body.process) })
    await writeAudit({ teamId: user.teamId, actorId: user.id, action: 'preset_created', targetType: 'process_preset', targetId: presetId!, detail: { name: body.name } }, trx)
    return presetId!
  }))
  setResponseStatus(event, 201)
  return toPresetDto(await db('process_presets').where({ id }).first())
})
