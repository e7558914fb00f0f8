import { templatePatchSchema } from '#shared/schemas/library'
import { idParamSchema } from '#shared/schemas/study'
import type { TemplateDto } from '#shared/types/library'

/** Edits a template if `version` is still current (409 otherwise, with the current version). */
export default defineApiHandler(async (event): Promise<TemplateDto> => {
  const user = await requireUser(event, ...LIBRARY_WRITER_ROLES)
  const { id } = paramsAs(event, idParamSchema)
  const body = await readBodyAs(event, templatePatchSchema)
  const values: Record<string, unknown> = {
    ...(body.name === undefined ? {} : { name: body.name }),
    ...(body.description === undefined ? {} : { description: body.description }),
    ...(body.spec ? { spec: JSON.stringify(body.spec) } : {})
  }
  const db = useDb()
  await withUniqueName('template', body.name, () => writeTransaction(async (trx) => {
    await updateVersioned(trx, 'spec_templates', user.teamId, id, body.version, values)
    await writeAudit({ teamId: user.teamId, actorId: user.id, action: 'template_updated', targetType: 'spec_template', targetId: id, detail: { fromVersion: body.version, fields: Object.keys(values) } }, trx)
  }))
  return toTemplateDto(await db('spec_templates').where({ id }).first())
})
