import { libraryDeleteQuerySchema } from '#shared/schemas/library'
import { idParamSchema } from '#shared/schemas/study'

export default defineApiHandler(async (event) => {
  const user = await requireUser(event, ...LIBRARY_WRITER_ROLES)
  const { id } = paramsAs(event, idParamSchema)
  const { version } = queryAs(event, libraryDeleteQuerySchema)
  await writeTransaction(async (trx) => {
    const row = await trx('process_presets').where({ id, team_id: user.teamId }).forUpdate().first('name', 'version')
    if (!row) throw notFound()
    if (version !== undefined && row.version !== version) {
      throw conflict(`version: this preset was changed by someone else (you saw version ${version}, the current one is ${row.version}); reload it before deleting`, row.version)
    }
    await trx('process_presets').where({ id }).delete()
    await writeAudit({ teamId: user.teamId, actorId: user.id, action: 'preset_deleted', targetType: 'process_preset', targetId: id, detail: { name: row.name } }, trx)
  })
  setResponseStatus(event, 204)
  return null
})
