import { describe, expect, it } from 'vitest'
import { isSameOrigin } from './http'

const request = (headers: Record<string, string>) => new Request('http://127.0.0.1:3000/api/patterns', { method: 'POST', headers })
const own = { origins: ['https://wreathwright.example'], trustProxy: false }

// Origins compared as RFC 6454 serialises them (scheme, host, port): standard.
describe('isSameOrigin', () => {
  it('takes the configured origin and refuses another scheme, host or port', () => {
    expect(isSameOrigin(request({ origin: 'https://wreathwright.example' }), own)).toBe(true)
    expect(isSameOrigin(request({ origin: 'https://wreathwright.example:443' }), own)).toBe(true)
    expect(isSameOrigin(request({ origin: 'http://wreathwright.example' }), own)).toBe(false)
    expect(isSameOrigin(request({ origin: 'https://wreathwright.example:8443' }), own)).toBe(false)
    expect(isSameOrigin(request({ origin: 'https://evil.example' }), own)).toBe(false)
    expect(isSameOrigin(request({ origin: 'null' }), own)).toBe(false)
    expect(isSameOrigin(request({}), own)).toBe(false)
  })

  it('ignores forwarded headers unless the proxy is trusted', () => {
    const forged = request({ origin: 'https://evil.example', 'x-forwarded-host': 'evil.example', 'x-forwarded-proto': 'https', host: 'evil.example' })
    expect(isSameOrigin(forged, own)).toBe(false)
    expect(isSameOrigin(forged, { ...own, trustProxy: true })).toBe(true)
  })

  it('with a trusted proxy, compares the scheme it forwarded too', () => {
    const trusted = { origins: [], trustProxy: true }
    const forwarded = { 'x-forwarded-host': 'shop.example', 'x-forwarded-proto': 'https' }
    expect(isSameOrigin(request({ origin: 'https://shop.example', ...forwarded }), trusted)).toBe(true)
    expect(isSameOrigin(request({ origin: 'http://shop.example', ...forwarded }), trusted)).toBe(false)
    // A list (proxy chain) counts by its first entry, the one the client used.
    expect(isSameOrigin(request({ origin: 'https://shop.example', 'x-forwarded-host': 'shop.example, inner', 'x-forwarded-proto': 'https, http' }), trusted)).toBe(true)
  })
})
