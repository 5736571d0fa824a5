/**
 * The authorization matrix (issue 17, items 1 and 2), in this process: every route handler under
 * app/api, each method it exports, called as each role of tests/support/authorization-world.ts —
 * a stranger, a quilter, a buyer, the pattern's tester, its owner, another designer, an admin —
 * against the expected outcome of authorization-matrix.table.ts. The handlers are found by walking
 * app/api: one without a row fails the first test. Then, for every row:
 *   - its body limit: a Content-Length one byte over the limit is 413 for a stranger (before the
 *     session is looked at), and exactly the limit is not 413 (so the table's limit is the route's);
 *   - its cookies: a dead session cookie is cleared with the session cookie's flags, and every
 *     Set-Cookie any call answered carries HttpOnly, SameSite=Lax or Strict, Path=/ and, where the
 *     app's settings say so, Secure.
 * The security headers are added by proxy.ts and next.config.mjs, i.e. only by the built app: the
 * e2e test tests/e2e/page-access.test.ts checks them on every row there, with the pages.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { POST as signInRoute } from '@/app/api/auth/sign-in/route'
import { SESSION_COOKIE_NAME } from '@/lib/auth/lucia'
import { database } from '@/lib/db'
import { isSessionCookieSecure } from '@/lib/env'
import { buildWorld, MATRIX_ROLES, type MatrixRole, type World } from '../support/authorization-world'
import { closeDatabase, freshDatabase } from '../support/database'
import { TEST_PASSWORD } from '../support/factories'
import { call } from '../support/requests'
import { API_MATRIX, exportedMethods, routeFiles, serverActionFiles, type ApiEntry, type ApiOutcome } from './authorization-matrix.table'

type Handler = (request: Request, context: { params: Promise<Record<string, string>> }) => Promise<Response>

/** Statuses that come only after the permission step let the caller through (see the table). */
const PASSED = new Set([400, 409, 415, 422])
const isAllowed = (status: number) => (status >= 200 && status < 300) || PASSED.has(status)

let world: World
const handlers = new Map<string, Handler>()
/** Every Set-Cookie answered by any call of this file, with where it came from. */
const setCookies: { where: string; value: string }[] = []

beforeAll(async () => {
  await freshDatabase()
  world = await buildWorld()
  for (const { file, url } of routeFiles()) {
    const exported = (await import(file)) as Record<string, unknown>
    for (const method of ['GET', 'POST', 'PUT', 'PATCH', 'DELETE', 'HEAD', 'OPTIONS']) {
      if (typeof exported[method] === 'function') handlers.set(`${method} ${url}`, exported[method] as Handler)
    }
  }
}, 120_000)
afterAll(closeDatabase)

interface Send {
  readonly cookie?: string
  readonly body?: 'json' | 'bytes' | 'none' | { readonly size: number; readonly announce: number }
}

/** One call of a row's handler; rate-limit counters are emptied first, so only permissions are judged. */
async function send(key: string, entry: ApiEntry, options: Send) {
  await database().query('TRUNCATE rate_limits')
  const [method] = key.split(' ')
  const handler = handlers.get(key)!
  const params = entry.params ? await entry.params(world) : {}
  const path = `/x${entry.query ? entry.query(world) : ''}`
  const body = options.body ?? 'none'
  const base = { method, path, params, cookie: options.cookie }
  let response
  if (body === 'json') response = await call(handler, { ...base, body: {} })
  else if (body === 'bytes') response = await call(handler, { ...base, rawBody: '', headers: { 'content-type': 'application/octet-stream' } })
  else if (body === 'none') response = await call(handler, base)
  else {
    // GET cannot carry a body in a Request: the announced length alone is what the route judges first.
    const raw = method === 'GET' ? undefined : 'x'.repeat(body.size)
    response = await call(handler, { ...base, rawBody: raw, headers: { 'content-length': String(body.announce), 'content-type': 'application/json' } })
  }
  for (const value of response.headers.getSetCookie()) setCookies.push({ where: `${key} (${options.cookie ? 'signed in' : 'stranger'})`, value })
  return response
}

describe('the matrix covers the app', () => {
  it('has a row for every route handler and method under app/api, and none for one that is gone', () => {
    const found = [...handlers.keys()].sort()
    expect(found.filter((key) => !(key in API_MATRIX)), 'handlers without a row in authorization-matrix.table.ts').toEqual([])
    expect(Object.keys(API_MATRIX).filter((key) => !handlers.has(key)), 'rows without a handler').toEqual([])
    // The e2e test reads the methods from the files' text: the two ways agree.
    const read = routeFiles().flatMap(({ file, url }) => exportedMethods(file).map((method) => `${method} ${url}`)).sort()
    expect(read).toEqual(found)
  })

  it('finds no server actions (a file with "use server" needs rows of its own here)', () => {
    expect(serverActionFiles()).toEqual([])
  })
})

describe('each role gets what the table says', () => {
  it.each(Object.entries(API_MATRIX))('%s', async (key, entry) => {
    const wrong: string[] = []
    for (const role of MATRIX_ROLES) {
      const expected: ApiOutcome = entry.expect[role]
      const response = await send(key, entry, { cookie: await world.cookie(role), body: entry.body })
      const ok = expected === 'allowed' ? isAllowed(response.status) : response.status === expected
      if (!ok) wrong.push(`${role}: expected ${expected}, got ${response.status} ${JSON.stringify(response.json?.error?.message ?? '')}`)
    }
    expect(wrong).toEqual([])
  })
})

describe('body limits come before the session', () => {
  it.each(Object.entries(API_MATRIX).filter(([, entry]) => entry.limit !== null))('%s', async (key, entry) => {
    const limit = entry.limit!
    const over = await send(key, entry, { body: { size: limit + 1, announce: limit + 1 } })
    expect(over.status, 'one byte over the limit, from a stranger').toBe(413)
    // Exactly the limit passes the size check: a stranger then meets the session check (or the route's own answer).
    const at = await send(key, entry, { body: { size: limit, announce: limit } })
    expect(at.status, 'exactly the limit').not.toBe(413)
    // Someone allowed gets 413 too, for a body that lies about its length.
    const allowedRole = (Object.keys(entry.expect) as MatrixRole[]).find((role) => entry.expect[role] === 'allowed')!
    const [method] = key.split(' ')
    if (method !== 'GET') {
      const lying = await call(handlers.get(key)!, {
        method, path: `/x${entry.query ? entry.query(world) : ''}`, params: entry.params ? await entry.params(world) : {},
        cookie: await world.cookie(allowedRole), rawBody: 'x'.repeat(limit + 1), headers: { 'content-length': '2', 'content-type': 'application/json' },
      })
      expect(lying.status, 'a body over the limit that announced 2 bytes, from someone allowed').toBe(413)
    }
  })
})

describe('cookies', () => {
  const expectFlags = (where: string, value: string) => {
    const attributes = value.split(';').slice(1).map((part) => part.trim().toLowerCase())
    expect(attributes, where).toContain('httponly')
    expect(attributes, where).toContain('path=/')
    expect(attributes.some((attribute) => attribute === 'samesite=lax' || attribute === 'samesite=strict'), `${where}: SameSite`).toBe(true)
    // Secure outside development, unless SESSION_COOKIE_SECURE says otherwise (lib/env.ts).
    expect(attributes.includes('secure'), `${where}: Secure`).toBe(isSessionCookieSecure())
  }

  it.each(Object.entries(API_MATRIX).filter(([, entry]) => entry.limit !== null))('%s clears a dead session cookie with the session cookie flags', async (key, entry) => {
    const response = await send(key, entry, { cookie: `${SESSION_COOKIE_NAME}=no-such-session-${key.length}`, body: entry.body })
    const cleared = response.headers.getSetCookie().find((value) => value.startsWith(`${SESSION_COOKIE_NAME}=`))
    expect(cleared, 'a Set-Cookie clearing the dead session').toBeDefined()
    expectFlags(key, cleared!)
    expect(cleared!.toLowerCase()).toMatch(/max-age=0|expires=thu, 01 jan 1970/)
  })

  it('signing in sets the session cookie with its flags', async () => {
    const response = await call(signInRoute, { method: 'POST', body: { email: world.users.quilter.email, password: TEST_PASSWORD } })
    expect(response.status).toBe(200)
    const [cookie] = response.headers.getSetCookie()
    expect(cookie).toMatch(new RegExp(`^${SESSION_COOKIE_NAME}=[^;]+`))
    expectFlags('sign-in', cookie!)
  })

  it('every Set-Cookie the matrix met carries the flags', () => {
    expect(setCookies.length).toBeGreaterThan(0)
    for (const { where, value } of setCookies) expectFlags(where, value)
  })
})
