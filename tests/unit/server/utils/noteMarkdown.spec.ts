import { describe, expect, it } from 'vitest'
import { mentionHandles, renderNoteMarkdown, resolveMentions } from '../../../../server/utils/noteMarkdown'

const MEMBERS = [
  { id: 1, email: 'architect@harrowlake.example' },
  { id: 2, email: 'sam@harrowlake.example' },
  { id: 3, email: 'sam@contractor.example' },
  { id: 4, email: 'dana.w@harrowlake.example' }
]

describe('note mentions', () => {
  it('reads @handles, not e-mail addresses written in the text, and drops a sentence\'s full stop', () => {
    expect(mentionHandles('Ask @Architect. Mail dana@example.org, or @dana.w; (@sam@contractor.example)')).toEqual(['architect', 'dana.w', 'sam@contractor.example'])
  })

  it('resolves a local part only when one member has it, and a whole address always', () => {
    expect(resolveMentions(['architect', 'sam', 'nobody'], MEMBERS)).toEqual([1])
    expect(resolveMentions(['sam@contractor.example', 'dana.w'], MEMBERS)).toEqual([3, 4])
  })
})

describe('note markdown', () => {
  it('escapes raw HTML and keeps links to http(s) only, marked nofollow', () => {
    expect(renderNoteMarkdown('<b onclick="x()">hi</b>')).toBe('<p>&lt;b onclick="x()"&gt;hi&lt;/b&gt;</p>\n')
    expect(renderNoteMarkdown('[a](javascript:alert(1)) [b](https://example.org)')).toBe('<p>[a](javascript:alert(1)) <a href="https://example.org" rel="noopener noreferrer nofollow">b</a></p>\n')
  })
})
