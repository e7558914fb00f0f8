import PDFDocument from 'pdfkit'
import type { BriefDto } from '#shared/types/brief'

const INK = '#12323A'
const SLATE = '#5B6B70'
const MARGIN = 48
const STATUS: Record<string, string> = { draft: 'Draft', in_review: 'In review', decided: 'Decided', archived: 'Archived' }
const MARK: Record<string, string> = { fail: 'x Fails spec', warn: '! Risk', advice: 'Suggestion', note: 'Note' }
const day = (iso: string) => `${iso.slice(0, 10)} ${iso.slice(11, 16)} UTC`
/** The latin subset of Lexend (and Helvetica) has no Ω: write the unit's name. */
const safe = (s: string) => s.replace(/Ω/g, ' ohm').replace(/ {2}/g, ' ')
const clip = (s: string, n: number) => (s.length > n ? `${s.slice(0, n - 1)}…` : s)

/** Lexend 400/600 from server/assets/fonts (fontkit reads WOFF); Helvetica when they are missing. */
async function fonts(): Promise<{ regular: Buffer | string, bold: Buffer | string }> {
  const storage = useStorage('assets:server')
  const [regular, bold] = await Promise.all(['fonts:lexend-latin-400-normal.woff', 'fonts:lexend-latin-600-normal.woff'].map(k => storage.getItemRaw(k).catch(() => null)))
  if (!regular || !bold) return { regular: 'Helvetica', bold: 'Helvetica-Bold' }
  return { regular: Buffer.from(regular as Uint8Array), bold: Buffer.from(bold as Uint8Array) }
}

type Doc = InstanceType<typeof PDFDocument>

/** Writes a paragraph only while it fits above the bottom margin, so the brief stays on one page. */
function para(doc: Doc, text: string, opts: { font?: string, size?: number, color?: string, gap?: number } = {}): void {
  doc.font(opts.font ?? 'regular').fontSize(opts.size ?? 9.5).fillColor(opts.color ?? INK)
  const width = doc.page.width - 2 * MARGIN
  const height = doc.heightOfString(safe(text), { width })
  if (doc.y + height > doc.page.height - MARGIN) return
  doc.text(safe(text), MARGIN, doc.y, { width })
  doc.moveDown(opts.gap ?? 0.25)
}

function heading(doc: Doc, text: string) {
  doc.moveDown(0.4)
  para(doc, text, { font: 'bold', size: 11.5, gap: 0.2 })
}

function sections(doc: Doc, b: BriefDto) {
  heading(doc, 'What was asked')
  for (const s of b.asked) para(doc, s)
  heading(doc, 'What was chosen and why')
  if (b.decision) {
    para(doc, `Chosen: ${b.decision.label} (${b.decision.candidateId}), decided by ${b.decision.decidedBy} on ${day(b.decision.decidedAt)}, resting on revision ${b.decision.revision}.`, { font: 'bold' })
    para(doc, `Why: ${clip(b.decision.rationale, 900)}`)
    for (const w of b.decision.waivers.slice(0, 4)) para(doc, `FAILS ${w.label}: waived by ${clip(w.by, 80)}, because ${clip(w.reason, 200)}`)
    if (b.decision.waivers.length > 4) para(doc, `and ${b.decision.waivers.length - 4} more waivers in Rungwise.`, { color: SLATE })
  } else para(doc, 'No decision has been recorded yet.')
  if (b.recommendation) para(doc, `The rules recommend ${b.recommendation.label}: ${b.recommendation.reasons.slice(0, 3).join('; ')}.`)
  for (const x of b.topFindings) para(doc, `${MARK[x.severity] ?? x.severity}: ${x.title} (${x.label})`, { color: SLATE })
  heading(doc, 'Area and risk against the spec')
  if (b.subject) {
    for (const l of b.subject.lines) para(doc, `${l.unsettled ? 'NOT SETTLED' : l.meets === null ? '-' : l.meets ? 'meets' : 'FAILS'}  ${l.label}: ${l.value} (target ${l.target})`)
  } else para(doc, b.evaluated ? 'No candidate meets the spec.' : 'Not evaluated yet: no saved revision has results.')
  heading(doc, 'What is open')
  const open = b.open.unresolved
  if (b.failCount !== null) para(doc, `Failing findings: ${b.failCount}.`)
  if (open.length === 0) para(doc, 'No failing or risk finding is open for this candidate.')
  for (const x of open.slice(0, 5)) para(doc, `${MARK[x.severity] ?? x.severity}: ${x.title}`)
  if (open.length > 5) para(doc, `and ${open.length - 5} more in Rungwise.`, { color: SLATE })
  heading(doc, 'Who signed off')
  if (b.signOffs.length === 0) para(doc, 'Nobody has signed off the current revision.')
  for (const s of b.signOffs.slice(0, 4)) para(doc, `${s.name}, revision ${s.revision}, ${day(s.at)}${s.comment ? `: “${clip(s.comment, 240)}”` : ''}`)
}

/** The brief as a one-page A4 PDF (pdfkit). */
export async function renderBriefPdf(b: BriefDto): Promise<Buffer> {
  const { regular, bold } = await fonts()
  const doc = new PDFDocument({ size: 'A4', margin: MARGIN, info: { Title: `Brief: ${b.study.title}`, Creator: 'Rungwise' } })
  doc.registerFont('regular', regular as string)
  doc.registerFont('bold', bold as string)
  const done = new Promise<Buffer>((resolve, reject) => {
    const chunks: Buffer[] = []
    doc.on('data', (c: Buffer) => chunks.push(c))
    doc.on('end', () => resolve(Buffer.concat(chunks)))
    doc.on('error', reject)
  })
  para(doc, 'Rungwise brief', { size: 9, color: SLATE, gap: 0.1 })
  para(doc, b.study.title, { font: 'bold', size: 17, gap: 0.15 })
  para(doc, `${b.study.blockName ?? 'No block named'} · owner ${b.study.owner} · ${STATUS[b.study.status]} · revision ${b.study.revision}`, { color: SLATE })
  sections(doc, b)
  doc.moveDown(0.6)
  para(doc, b.caution, { size: 8.5, color: SLATE })
  para(doc, `Generated ${day(b.generatedAt)}.`, { size: 8, color: SLATE })
  doc.end()
  return done
}
