import { templateCreateSchema } from '#shared/schemas/library'
import type { TemplateDto } from '#shared/types/library'

export default defineApiHandler(async (event): Promise<TemplateDto> => {
  const user = await requireUser(event, ...LIBRARY_WRITER_ROLES)
  const body = await readBodyAs(event, templateCreateSchema)
  const db = useDb()
  const id = await withUniqueName('template', body.name, () => writeTransaction(async (trx) => {
    const [templateId] = await trx('spec_templates').insert({ team_id: user.teamId, name: body.name, description: body.description ?? null, spec: JSON.stringify(body.spec) })
    await writeAudit({ teamId: user.teamId, actorId: user.id, action: 'template_created', targetType: 'spec_template', targetId: templateId!, detail: { name: body.name } }, trx)
    return templateId!
  }))
  setResponseStatus(event, 201)
  return toTemplateDto(await db('spec_templates').where({ id }).first())
})
