import { idParamSchema } from '#shared/schemas/study'

/** The brief as a one-page PDF download (every role of the team may export it). */
export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  const { id } = paramsAs(event, idParamSchema)
  const brief = await studyBrief(useDb(), user, id)
  const pdf = await renderBriefPdf(brief)
  const name = brief.study.title.replace(/[^\w.-]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 80) || 'study'
  setResponseHeader(event, 'content-type', 'application/pdf')
  setResponseHeader(event, 'content-disposition', `attachment; filename="rungwise-brief-${brief.study.id}-${name}.pdf"`)
  return pdf
})
