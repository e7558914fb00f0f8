import { describe, expect, it } from 'vitest'
import { apiErrorMessage } from '../../../composables/useApiError'

const http400 = (message: string, path: string) => ({ statusCode: 400, data: { data: { message, issues: [{ path, message: message.slice(path.length + 2) }] } } })

// The API's own 400 shape (DEVELOPERS.md "Errors"): the message starts with the refused field's path.
describe('apiErrorMessage', () => {
  it('drops a whole-file field\'s path and puts a catalogue field\'s label in place of its path', () => {
    expect(apiErrorMessage(http400('text: bench.csv: 1 problem, nothing was stored.', 'text'))).toBe('bench.csv: 1 problem, nothing was stored.')
    expect(apiErrorMessage(http400('spec.bits: must be an integer from 2 to 16', 'spec.bits'))).toMatch(/^Resolution must be an integer from 2 to 16$|^[A-Z][^.:]* must be an integer from 2 to 16$/)
  })

  it('keeps messages that do not start with the path, and says so for an outage', () => {
    expect(apiErrorMessage({ statusCode: 409, data: { data: { message: 'someone saved first' } } })).toBe('someone saved first')
    expect(apiErrorMessage({ statusCode: 503, data: { message: 'x' } })).toBe('The database is unavailable; try again in a moment.')
  })
})
