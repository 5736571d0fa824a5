/**
 * The authorization matrix on the built app (issue 17, items 1 and 2): every page under app/ opened
 * with plain fetch as each role (a fresh session cookie, no browser), against the outcome of
 * tests/integration/authorization-matrix.table.ts — 200, a redirect to sign in, the studio's
 * "denied" redirect, another redirect, or the not-found page. The pages are found by walking the
 * app folder: one without a row fails. Then every API row of the same table is called here too,
 * since the security headers come from proxy.ts and next.config.mjs, which only the built app
 * runs: the fixed headers on every answer, the API's closed Content-Security-Policy wherever the
 * proxy runs (requests without a body), no-store unless the row is a public cover, the flags of
 * every Set-Cookie (a dead session cookie is cleared), and 413 for a body over the row's limit.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { SESSION_COOKIE_NAME } from '@/lib/auth/lucia'
import { closeDatabase } from '@/lib/db'
import { API_CONTENT_SECURITY_POLICY } from '@/lib/security-headers'
import {
  API_MATRIX, exportedMethods, PAGE_MATRIX, pageFiles, routeFiles, serverActionFiles, type PageOutcome,
} from '../integration/authorization-matrix.table'
import { buildWorld, MATRIX_ROLES, type World } from '../support/authorization-world'
import { baseUrl } from '../support/browser'

let world: World

beforeAll(async () => {
  world = await buildWorld()
}, 60_000)
afterAll(() => closeDatabase())

/** Fills `:name` segments from the row's params. */
function fill(url: string, params: Record<string, string>): string {
  return url.replace(/:(\w+)/g, (_, name: string) => encodeURIComponent(params[name] ?? `missing-${name}`))
}

/** What a page answer was, in the table's words. */
function outcomeOf(response: Response): PageOutcome | number {
  if (response.status >= 300 && response.status < 400) {
    const location = new URL(response.headers.get('location') ?? '', baseUrl())
    if (location.pathname === '/sign-in') return 'sign-in'
    if (location.pathname === '/' && location.searchParams.get('denied') === '1') return 'denied'
    return { redirect: location.pathname }
  }
  return response.status
}

function matches(expected: PageOutcome, actual: PageOutcome | number): boolean {
  if (typeof expected === 'object') return typeof actual === 'object' && actual.redirect.startsWith(expected.redirect)
  return expected === actual
}

/** The flags every cookie the app sets must carry (SESSION_COOKIE_SECURE=false here: plain http on loopback). */
function cookieProblems(where: string, response: Response): string[] {
  const problems: string[] = []
  for (const value of response.headers.getSetCookie()) {
    const attributes = value.split(';').slice(1).map((part) => part.trim().toLowerCase())
    if (!attributes.includes('httponly')) problems.push(`${where}: no HttpOnly in ${value}`)
    if (!attributes.includes('path=/')) problems.push(`${where}: no Path=/ in ${value}`)
    if (!attributes.some((attribute) => attribute === 'samesite=lax' || attribute === 'samesite=strict')) problems.push(`${where}: no SameSite in ${value}`)
    if (attributes.includes('secure') !== (process.env.SESSION_COOKIE_SECURE === 'true')) problems.push(`${where}: Secure does not follow SESSION_COOKIE_SECURE in ${value}`)
  }
  return problems
}

/** The headers next.config.mjs puts on every answer. */
function fixedHeaderProblems(where: string, response: Response): string[] {
  const problems: string[] = []
  if (response.headers.get('x-content-type-options') !== 'nosniff') problems.push(`${where}: X-Content-Type-Options ${response.headers.get('x-content-type-options')}`)
  if (response.headers.get('x-frame-options') !== 'DENY') problems.push(`${where}: X-Frame-Options ${response.headers.get('x-frame-options')}`)
  if (response.headers.get('referrer-policy') !== 'strict-origin-when-cross-origin') problems.push(`${where}: Referrer-Policy ${response.headers.get('referrer-policy')}`)
  // Plain http on loopback: no HSTS (lib/security-headers.ts sends it over https only).
  if (response.headers.get('strict-transport-security') !== null) problems.push(`${where}: HSTS over http`)
  return problems
}

describe('the matrix covers every page', () => {
  it('has a row for every page under app/, and none for a page that is gone', () => {
    const found = pageFiles()
    expect(found.filter((file) => !(file in PAGE_MATRIX)), 'pages without a row in authorization-matrix.table.ts').toEqual([])
    expect(Object.keys(PAGE_MATRIX).filter((file) => !found.includes(file)), 'rows without a page').toEqual([])
  })

  it('finds no server actions (a file with "use server" needs rows of its own)', () => {
    expect(serverActionFiles()).toEqual([])
  })
})

describe('each role gets what the table says of each page, with the page headers', () => {
  it.each(Object.entries(PAGE_MATRIX))('%s', async (file, entry) => {
    const wrong: string[] = []
    const path = entry.path(world)
    for (const role of MATRIX_ROLES) {
      const cookie = await world.cookie(role)
      const response = await fetch(`${baseUrl()}${path}`, { redirect: 'manual', headers: cookie ? { cookie } : {} })
      await response.arrayBuffer()
      const actual = outcomeOf(response)
      if (!matches(entry.expect[role], actual)) wrong.push(`${role}: expected ${JSON.stringify(entry.expect[role])}, got ${JSON.stringify(actual)}`)
      wrong.push(...fixedHeaderProblems(`${role} ${path}`, response), ...cookieProblems(`${role} ${path}`, response))
      const policy = response.headers.get('content-security-policy') ?? ''
      if (!/script-src [^;]*'nonce-[^']+'/.test(policy) || !policy.includes("frame-ancestors 'none'")) wrong.push(`${role} ${path}: Content-Security-Policy ${policy}`)
    }
    expect(wrong).toEqual([])
  })
})

describe('every API row on the built app: headers, cookie flags, body limits', () => {
  it('the API rows are the route files and methods on disk', () => {
    const read = routeFiles().flatMap(({ file, url }) => exportedMethods(file).map((method) => `${method} ${url}`)).sort()
    expect(read).toEqual(Object.keys(API_MATRIX).sort())
  })

  it.each(Object.entries(API_MATRIX))('%s', async (key, entry) => {
    const [method, url] = key.split(' ') as [string, string]
    const address = `${baseUrl()}${fill(url, entry.params ? await entry.params(world) : {})}${entry.query ? entry.query(world) : ''}`
    const problems: string[] = []
    for (const role of ['stranger', 'owner'] as const) {
      const cookie = role === 'stranger' ? `${SESSION_COOKIE_NAME}=no-such-session` : (await world.cookie(role))!
      const withBody = method !== 'GET' && entry.body !== 'none'
      const response = await fetch(address, {
        method,
        redirect: 'manual',
        headers: { cookie, origin: baseUrl(), ...(withBody ? { 'content-type': 'application/json' } : {}) },
        body: withBody ? '{}' : undefined,
      })
      await response.arrayBuffer()
      const where = `${role} ${key} (${response.status})`
      if (response.status >= 500) problems.push(`${where}: a server error`)
      problems.push(...fixedHeaderProblems(where, response), ...cookieProblems(where, response))
      // Every API answer, read or write, carries the API's closed policy (next.config.mjs); never a page's.
      const policy = response.headers.get('content-security-policy')
      if (policy !== API_CONTENT_SECURITY_POLICY) problems.push(`${where}: Content-Security-Policy ${policy}`)
      const cache = response.headers.get('cache-control') ?? ''
      if (!entry.publicCache && !cache.includes('no-store')) problems.push(`${where}: Cache-Control ${cache}`)
      if (role === 'stranger' && entry.limit !== null && !response.headers.getSetCookie().some((value) => value.startsWith(`${SESSION_COOKIE_NAME}=`))) {
        problems.push(`${where}: the dead session cookie was not cleared`)
      }
    }
    if (entry.limit !== null && method !== 'GET') {
      const over = await fetch(address, {
        method, headers: { origin: baseUrl(), 'content-type': 'application/json' }, body: 'x'.repeat(entry.limit + 1),
      })
      await over.arrayBuffer()
      if (over.status !== 413) problems.push(`${key}: a stranger's body one byte over ${entry.limit} answered ${over.status}, not 413`)
      problems.push(...fixedHeaderProblems(`${key} (413)`, over))
    }
    expect(problems).toEqual([])
  })
})
