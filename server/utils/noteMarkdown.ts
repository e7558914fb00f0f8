import MarkdownIt from 'markdown-it'
import sanitizeHtml from 'sanitize-html'

/**
 * Note bodies are Markdown. markdown-it renders them with raw HTML off (a `<script>` in the source
 * comes out as text) and refuses `javascript:`/`vbscript:`/`data:` links; sanitize-html then keeps
 * only the tags and attributes below, as a second fence, so no markup we did not choose reaches a page.
 */
const md = new MarkdownIt({ html: false, linkify: true, breaks: true })

const SANITIZE: sanitizeHtml.IOptions = {
  allowedTags: ['p', 'br', 'strong', 'em', 's', 'code', 'pre', 'blockquote', 'ul', 'ol', 'li', 'a', 'h3', 'h4', 'h5', 'h6', 'hr', 'table', 'thead', 'tbody', 'tr', 'th', 'td'],
  allowedAttributes: { a: ['href', 'title', 'rel'], ol: ['start'], th: ['style'], td: ['style'] },
  allowedStyles: { '*': { 'text-align': [/^(left|right|center)$/] } },
  allowedSchemes: ['http', 'https', 'mailto'],
  allowProtocolRelative: false,
  // Headings of a note never outrank the page's own.
  transformTags: {
    h1: 'h3', h2: 'h4',
    a: sanitizeHtml.simpleTransform('a', { rel: 'noopener noreferrer nofollow' })
  },
  disallowedTagsMode: 'escape'
}

/** Markdown source → sanitised HTML. */
export function renderNoteMarkdown(source: string): string {
  return sanitizeHtml(md.render(source), SANITIZE)
}

const MENTION = /(^|[^\w@.+-])@([\w.+-]+(?:@[\w-]+(?:\.[\w-]+)+)?)/g

/** The handles written as `@handle` (an e-mail address or its part before the @), lower-cased. */
export function mentionHandles(source: string): string[] {
  const found = new Set<string>()
  for (const m of source.matchAll(MENTION)) found.add(m[2]!.replace(/[.]+$/, '').toLowerCase())
  return [...found]
}

/**
 * Team members named by the handles: a full address matches that member, a local part matches the
 * member whose address starts with it when exactly one member of the team does.
 */
export function resolveMentions(handles: string[], members: { id: number, email: string }[]): number[] {
  const ids = new Set<number>()
  for (const handle of handles) {
    const exact = members.filter(m => m.email.toLowerCase() === handle)
    const local = members.filter(m => m.email.toLowerCase().split('@')[0] === handle)
    const match = exact.length === 1 ? exact : local.length === 1 ? local : []
    for (const m of match) ids.add(m.id)
  }
  return [...ids]
}
