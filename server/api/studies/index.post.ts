import { studyCreateSchema } from '#shared/schemas/study'
import { STUDY_EDITOR_ROLES } from '#shared/types/auth'
import type { StudyDto } from '#shared/types/studies'

export default defineApiHandler(async (event): Promise<StudyDto> => {
  const user = await requireUser(event, ...STUDY_EDITOR_ROLES)
  const body = await readBodyAs(event, studyCreateSchema)
  // Read back inside the transaction: the created study is never answered with an error afterwards.
  const row = await writeTransaction(async (trx) => {
    const [studyId] = await trx('studies').insert({
      team_id: user.teamId, owner_id: user.id, title: body.title, block_name: body.blockName ?? null, spec: JSON.stringify(body.spec)
    })
    await writeAudit({ teamId: user.teamId, actorId: user.id, action: 'study_created', targetType: 'study', targetId: studyId! }, trx)
    return await teamStudies(trx, user.teamId).where('s.id', studyId!).first()
  })
  setResponseStatus(event, 201)
  return toStudyDto(row)
})
