import type { PresetDto } from '#shared/types/library'

/** The team's process presets, demo ones flagged (`isDemo`), by name. */
export default defineApiHandler(async (event): Promise<PresetDto[]> => {
  const user = await requireUser(event)
  const rows = await useDb()('process_presets').where({ team_id: user.teamId }).orderBy([{ column: 'is_demo', order: 'asc' }, { column: 'name' }])
  return rows.map(toPresetDto)
})
