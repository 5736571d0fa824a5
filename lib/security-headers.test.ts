import { NextRequest } from 'next/server'
import { afterEach, describe, expect, it, vi } from 'vitest'
import nextConfig from '@/next.config.mjs'
import { config as proxyConfig, proxy } from '@/proxy'
import { API_CONTENT_SECURITY_POLICY, contentSecurityPolicy, HSTS_VALUE, newNonce, securityOptionsFromEnv } from './security-headers'

/** The policy as a map from directive name to its source list. */
function directives(policy: string): Map<string, string[]> {
  return new Map(policy.split(';').map((part) => {
    const [name = '', ...sources] = part.trim().split(/\s+/)
    return [name, sources]
  }))
}

describe('the Content-Security-Policy of a page', () => {
  const production = directives(contentSecurityPolicy('bm9uY2U=', { development: false, https: false }))

  it('lets only scripts with the nonce run, and never eval outside development', () => {
    // CSP3 §6.1.1 script-src, §8.2 'strict-dynamic'; Next.js's CSP guide: 'unsafe-eval' only for `next dev`.
    expect(production.get('script-src')).toEqual(["'self'", "'nonce-bm9uY2U='", "'strict-dynamic'"])
    expect([...production.values()].flat()).not.toContain("'unsafe-eval'")
    expect(production.get('script-src')).not.toContain("'unsafe-inline'")
    const development = directives(contentSecurityPolicy('bm9uY2U=', { development: true, https: false }))
    expect(development.get('script-src')).toContain("'unsafe-eval'")
  })

  it('forbids framing, plugins and a foreign base URL', () => {
    // CSP3 §6.4.2 frame-ancestors: 'none' is the policy form of X-Frame-Options: DENY.
    expect(production.get('frame-ancestors')).toEqual(["'none'"])
    expect(production.get('object-src')).toEqual(["'none'"])
    expect(production.get('base-uri')).toEqual(["'self'"])
    expect(production.get('form-action')).toEqual(["'self'"])
  })

  it('lets in what the board and the print room need, and nothing from elsewhere', () => {
    expect(production.get('default-src')).toEqual(["'self'"])
    expect(production.get('worker-src')).toEqual(["'self'", 'blob:'])
    expect(production.get('img-src')).toEqual(["'self'", 'blob:', 'data:'])
    expect(production.get('font-src')).toEqual(["'self'"])
    // Style elements need the nonce in production; style attributes (React's style={…}) are allowed.
    expect(production.get('style-src')).toEqual(["'self'", "'nonce-bm9uY2U='"])
    expect(production.get('style-src-attr')).toEqual(["'unsafe-inline'"])
  })

  it('asks for https subresources only when the site is https', () => {
    expect(production.has('upgrade-insecure-requests')).toBe(false)
    const https = directives(contentSecurityPolicy('bm9uY2U=', { development: false, https: true }))
    expect(https.has('upgrade-insecure-requests')).toBe(true)
  })
})

describe('nonces', () => {
  it('are 128 random bits in base64, new every time', () => {
    const nonces = new Set(Array.from({ length: 100 }, newNonce))
    expect(nonces.size).toBe(100)
    // CSP3 §2.3.1: a nonce-source is base64 (or base64url); 16 bytes are 24 characters with padding.
    for (const nonce of nonces) expect(nonce).toMatch(/^[A-Za-z0-9+/]{22}==$/)
  })
})

describe('the settings', () => {
  it('count a site as https from its public URL, else from the Secure session cookie', () => {
    expect(securityOptionsFromEnv({ NODE_ENV: 'production', PUBLIC_URL: 'https://shop.example' }).https).toBe(true)
    expect(securityOptionsFromEnv({ NODE_ENV: 'production', PUBLIC_URL: 'http://127.0.0.1:3000' }).https).toBe(false)
    // The demo and the end-to-end tests: production build, plain http on loopback.
    expect(securityOptionsFromEnv({ NODE_ENV: 'production', SESSION_COOKIE_SECURE: 'false' }).https).toBe(false)
    expect(securityOptionsFromEnv({ NODE_ENV: 'production' }).https).toBe(true)
    expect(securityOptionsFromEnv({ NODE_ENV: 'development' })).toEqual({ development: true, https: false })
  })

  it('keep HSTS for two years', () => {
    // hstspreload.org asks for max-age of at least one year (31536000); two years is common practice.
    expect(HSTS_VALUE).toBe('max-age=63072000; includeSubDomains')
  })
})

describe('the proxy (proxy.ts)', () => {
  afterEach(() => {
    vi.unstubAllEnvs()
  })

  it('hands the page policy with its nonce to Next.js and sends HSTS when the public URL is https', () => {
    vi.stubEnv('NODE_ENV', 'production')
    vi.stubEnv('PUBLIC_URL', 'https://wreathwright.example')
    const response = proxy(new NextRequest('https://wreathwright.example/patterns'))
    const policy = response.headers.get('content-security-policy')
    expect(policy).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/]{22}==' 'strict-dynamic'/)
    expect(policy).toContain('upgrade-insecure-requests')
    // Next.js reads the nonce from the request's policy; NextResponse.next passes it on this way.
    expect(response.headers.get('x-middleware-request-content-security-policy')).toBe(policy)
    // RFC 6797 §6.1: Strict-Transport-Security with max-age.
    expect(response.headers.get('strict-transport-security')).toBe(HSTS_VALUE)
  })

  it('sends no HSTS over plain http', () => {
    vi.stubEnv('NODE_ENV', 'production')
    vi.stubEnv('PUBLIC_URL', 'http://127.0.0.1:3000')
    const response = proxy(new NextRequest('http://127.0.0.1:3000/shop'))
    expect(response.headers.get('strict-transport-security')).toBeNull()
  })

  it('runs for pages, not for the API, whose answers get the closed policy from next.config.mjs', async () => {
    const [matcher] = proxyConfig.matcher
    const runsFor = (path: string) => new RegExp(`^${matcher!.source}$`).test(path)
    expect(runsFor('/shop')).toBe(true)
    expect(runsFor('/')).toBe(true)
    expect(runsFor('/api/patterns')).toBe(false)
    expect(runsFor('/_next/static/chunks/app.js')).toBe(false)
    const rules = await nextConfig.headers!()
    const api = rules.find((rule) => rule.source === '/api/:path*')
    expect(api?.headers.find((header) => header.key === 'Content-Security-Policy')?.value).toBe(API_CONTENT_SECURITY_POLICY)
  })
})
