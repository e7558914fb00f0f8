import { importBodySchema } from '#shared/schemas/io'
import { importIsValid, readSpecImport, type ImportPreview } from '#shared/io/specImport'
import { STUDY_EDITOR_ROLES } from '#shared/types/auth'

/** Reads an import file and answers every row with its problems; writes nothing. */
export default defineApiHandler(async (event): Promise<ImportPreview & { valid: boolean }> => {
  await requireUser(event, ...STUDY_EDITOR_ROLES)
  const body = await readBodyAs(event, importBodySchema)
  const preview = readSpecImport(body.text, body.format)
  return { ...preview, valid: importIsValid(preview) }
})
