import { describe, expect, it } from 'vitest'
import { DEFAULT_AFTER_SIGN_IN, safeRedirectPath, signInPathFor } from './safe-redirect'

/**
 * The refused forms are the open-redirect bypasses listed in common practice (OWASP "Unvalidated
 * Redirects and Forwards Cheat Sheet" and its test guide, WSTG-CLNT-04), plus the two found in
 * this app by probing (issue 10: `/%5Cevil.example/`, `/%09/evil.example/`). Values are as the
 * page receives them, i.e. after the query string was decoded once.
 */
const BYPASSES: Record<string, string> = {
  'protocol-relative': '//evil.example/',
  'protocol-relative with three slashes': '///evil.example/',
  'backslash after the slash (the URL parser reads \\ as /)': '/\\evil.example/',
  'the probe /%5Cevil.example/ as the page receives it': decodeURIComponent('/%5Cevil.example/'),
  'the probe /%09/evil.example/ as the page receives it (a tab the parser strips)': decodeURIComponent('/%09/evil.example/'),
  'backslash then slash': '\\/evil.example/',
  'two backslashes': '\\\\evil.example',
  'absolute https URL': 'https://evil.example/',
  'absolute http URL with no slashes': 'http:evil.example',
  'scheme-relative with a backslash': '/\\/evil.example',
  'javascript: scheme': 'javascript:alert(1)',
  'javascript: behind a slash-less trick': ' javascript:alert(1)',
  'data: URL': 'data:text/html,<script>alert(1)</script>',
  'encoded slashes, decoded later into //': '/%2F%2Fevil.example',
  'encoded slash after the first': '/%2fevil.example',
  'encoded backslash': '/%5cevil.example',
  'doubly encoded backslash left encoded once': '/%5Cevil.example/',
  'a leading tab': '\t//evil.example',
  'a newline in the middle': '/\n/evil.example',
  'a carriage return in the middle': '/\r/evil.example',
  'an encoded newline': '/%0a/evil.example',
  'an encoded carriage return and newline (header splitting)': '/%0d%0aSet-Cookie:x=1',
  'a NUL character': '/\u0000/evil.example',
  'DEL': '/\u007f/evil.example',
  'a leading space': ' /evil.example',
  'a space inside': '/ /evil.example',
  'a no-break space inside': '/\u00a0/evil.example',
  'a line separator inside': '/\u2028/evil.example',
  'an encoded space': '/%20/evil.example',
  'a dot segment that collapses into //': '/.//evil.example',
  'dot-dot segments that collapse into //': '/a/..//evil.example',
  'credentials-like @ after a scheme-relative start': '//user@evil.example',
  'a bare host': 'evil.example',
  'empty': '',
}

describe('safeRedirectPath', () => {
  it.each(Object.entries(BYPASSES))('refuses %s', (_name, next) => {
    expect(safeRedirectPath(next)).toBe(DEFAULT_AFTER_SIGN_IN)
  })

  it('follows a path of this app with its query and fragment', () => {
    expect(safeRedirectPath('/patterns/6f1c2b8e-0000-4000-8000-000000000001')).toBe('/patterns/6f1c2b8e-0000-4000-8000-000000000001')
    expect(safeRedirectPath('/patterns/42/print?paper=a4#tiles')).toBe('/patterns/42/print?paper=a4#tiles')
    expect(safeRedirectPath('/')).toBe('/')
  })

  it('keeps an @ inside a path on this site (it is no authority after a single slash)', () => {
    // WHATWG URL: after one leading slash the parser is in the path state, so `@` is a path character.
    expect(safeRedirectPath('/@evil.example')).toBe('/@evil.example')
    expect(safeRedirectPath('/patterns@evil.example/x')).toBe('/patterns@evil.example/x')
  })

  it('returns the normalised path, so the value followed is the one checked', () => {
    expect(safeRedirectPath('/patterns/./42/../43')).toBe('/patterns/43')
    expect(safeRedirectPath('/patterns/ü')).toBe('/patterns/%C3%BC')
  })

  it('refuses what is not a string, and overlong values', () => {
    expect(safeRedirectPath(undefined)).toBe('/')
    expect(safeRedirectPath(['/patterns', '//evil.example'])).toBe('/')
    expect(safeRedirectPath(`/${'a'.repeat(5000)}`)).toBe('/')
  })

  it('uses the fallback it is given', () => {
    expect(safeRedirectPath('//evil.example', '/patterns')).toBe('/patterns')
  })

  it('never returns a value that a browser resolves to another origin', () => {
    // Every answer, for every bypass above, checked again with the URL parser against a real origin.
    const origin = 'http://127.0.0.1:3000'
    for (const next of Object.values(BYPASSES)) {
      expect(new URL(safeRedirectPath(next), origin).origin).toBe(origin)
    }
  })
})

describe('signInPathFor', () => {
  it('carries the page asked for', () => {
    expect(signInPathFor('/patterns/42/board')).toBe('/sign-in?next=%2Fpatterns%2F42%2Fboard')
  })

  it('carries nothing for the home page, a missing path or a foreign one', () => {
    expect(signInPathFor('/')).toBe('/sign-in')
    expect(signInPathFor(null)).toBe('/sign-in')
    expect(signInPathFor('//evil.example')).toBe('/sign-in')
  })
})
