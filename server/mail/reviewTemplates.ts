import { layout, text, type MailContent } from './templates'

/** A named reviewer is asked to review a study. */
export function reviewRequestMail(data: { reviewerName: string, requesterName: string, studyTitle: string, revision: number, url: string }): MailContent {
  const paragraphs = [
    `Hello ${data.reviewerName},`,
    `${data.requesterName} asks you to review “${data.studyTitle}” (revision ${data.revision}) on Rungwise.`,
    'Open the study to sign off or to request changes with a comment.'
  ]
  const action = { label: 'Open the study', url: data.url }
  return { subject: `Review requested: ${data.studyTitle}`, text: text(paragraphs, action), html: layout('A study waits for your review', paragraphs, action) }
}

/** The owner and the reviewers hear what was decided and why. */
export function decisionMail(data: { recipientName: string, deciderName: string, studyTitle: string, revision: number, candidate: string, rationale: string, url: string, waivers?: { label: string, by: string, reason: string }[] }): MailContent {
  const waivers = data.waivers ?? []
  const paragraphs = [
    `Hello ${data.recipientName},`,
    `${data.deciderName} recorded the decision on “${data.studyTitle}” (revision ${data.revision}): ${data.candidate}.`,
    `Why: ${data.rationale}`,
    ...(waivers.length
      ? [`The chosen candidate fails ${waivers.length} spec ${waivers.length === 1 ? 'line' : 'lines'}, each waived:`, ...waivers.map(w => `✕ ${w.label}: waived by ${w.by}, because ${w.reason}`)]
      : ['The chosen candidate meets every spec line.']),
    'The study is now read-only; notes stay open. The brief has the one-page summary.'
  ]
  const action = { label: 'Read the brief', url: data.url }
  return { subject: `Decided: ${data.studyTitle}`, text: text(paragraphs, action), html: layout('A study has been decided', paragraphs, action) }
}
