import { describe, expect, it } from 'vitest'
import { signUpSchema } from './account'
import { createPatternSchema } from './pattern'
import { text } from './text'

const name = text({ max: 10 })
const issueOf = (result: { success: boolean; error?: { issues: { message: string }[] } }) => result.error?.issues[0]?.message

describe('text', () => {
  it('normalises to NFC and trims, so the store and the reply hold the same string', () => {
    // "e" + U+0301 COMBINING ACUTE ACCENT composes to U+00E9 under NFC (Unicode UAX #15, standard).
    expect(name.parse('  Cafe\u0301\t')).toBe('Caf\u00e9')
    expect(name.parse('Caf\u00e9')).toBe('Caf\u00e9')
  })

  it('refuses NUL and other control characters, which PostgreSQL text cannot hold or a name should not', () => {
    for (const value of ['a\u0000b', 'a\u0007b', 'a\tb', 'a\nb', 'a\u007fb', 'a\u0085b']) {
      expect(issueOf(name.safeParse(value)), JSON.stringify(value)).toMatch(/control characters/)
    }
  })

  it('allows tab and line breaks inside text of several lines, not NUL', () => {
    const notes = text({ max: 100, multiline: true })
    expect(notes.parse('one\ntwo\tthree')).toBe('one\ntwo\tthree')
    expect(issueOf(notes.safeParse('one\u0000two'))).toMatch(/control characters/)
  })

  it('refuses a lone surrogate but keeps a pair (one astral character)', () => {
    // U+D83C alone is half of a UTF-16 pair (Unicode §3.9, D91: ill-formed; standard).
    expect(issueOf(name.safeParse('leaf \ud83c'))).toMatch(/lone surrogate/)
    expect(issueOf(name.safeParse('\udc00 leaf'))).toMatch(/lone surrogate/)
    expect(name.parse('leaf \ud83c\udf41')).toBe('leaf \u{1f341}')
  })

  it('names the limits in plain words', () => {
    expect(issueOf(name.safeParse('   '))).toBe('must not be empty')
    expect(issueOf(name.safeParse('x'.repeat(11)))).toBe('at most 10 characters')
  })
})

describe('every free-text field of the inputs uses it', () => {
  it('refuses NUL in a pattern name, naming the field', () => {
    const result = createPatternSchema.safeParse({ name: 'Acorn\u0000 ring' })
    expect(result.error?.issues[0]?.path).toEqual(['name'])
  })

  it('refuses a lone surrogate in a display name and a control character in an e-mail address', () => {
    const result = signUpSchema.safeParse({ email: 'a\u0000@example.test', password: 'a-long-password', displayName: 'Marguerite \ud800' })
    expect(result.error?.issues.map((issue) => issue.path.join('.')).sort()).toEqual(['displayName', 'email'])
  })

  it('normalises the sign-up name the same way', () => {
    const result = signUpSchema.parse({ email: ' Ann@Example.test ', password: 'a-long-password', displayName: ' Rene\u0301e ' })
    expect([result.email, result.displayName]).toEqual(['ann@example.test', 'Ren\u00e9e'])
  })
})
