import type { TemplateDto } from '#shared/types/library'

/** The team's spec templates, demo ones flagged (`isDemo`), by name. */
export default defineApiHandler(async (event): Promise<TemplateDto[]> => {
  const user = await requireUser(event)
  const rows = await useDb()('spec_templates').where({ team_id: user.teamId }).orderBy([{ column: 'is_demo', order: 'asc' }, { column: 'name' }])
  return rows.map(toTemplateDto)
})
