/**
 * Bad input on every route that takes a body (issue 17, item 3). The routes are found by walking
 * app/api, so a new one cannot be missed: a handler exporting POST, PUT or PATCH without an entry
 * in ROUTES below fails the first test. For each, fast-check sends bodies the route's schema
 * refuses — arbitrary values and JSON, text that is not JSON, the route's good body with one field
 * made wrong (another type, a huge string, deep nesting) — as a person allowed to use the route,
 * and checks that the answer is 400, 413 or 422 (never a 500, and never a 401, 403 or 404, which
 * would mean the body was not reached), that a 422 names each field path, and that no stored row
 * changed (a checksum of every table before and after).
 *
 * Runs are few per route (RUNS) so that the whole file stays within about a minute: the point is
 * breadth over every route; lib/schemas/design-fuzz.test.ts fuzzes the design parser harder.
 */
import fs from 'node:fs'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import fc from 'fast-check'
import type { z } from 'zod'
import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from 'vitest'
import { buildArrangement } from '@/geometry/arrangement'
import { planDesign } from '@/geometry/plan'
import { database } from '@/lib/db'
import { BODY_LIMITS, MAX_JSON_DEPTH } from '@/lib/http'
import { MAX_SEAMS } from '@/lib/limits'
import { MAX_UPLOAD_BYTES } from '@/lib/images'
import {
  accountDeletionSchema, displayNameChangeSchema, emailChangeSchema, passwordChangeSchema, passwordResetConfirmSchema,
  passwordResetRequestSchema, signInSchema, signUpSchema, verifyEmailSchema,
} from '@/lib/schemas/account'
import { designerRequestDecisionSchema, updateUserSchema } from '@/lib/schemas/admin'
import { bookletRequestSchema } from '@/lib/schemas/booklet-builds'
import type { DesignFile } from '@/lib/schemas/design'
import { createInvitationSchema } from '@/lib/schemas/invitation'
import { listingSettingsSchema } from '@/lib/schemas/listing-settings'
import { createPatternSchema, updatePatternSchema } from '@/lib/schemas/pattern'
import { createReportSchema, reportMessageSchema, updateReportSchema } from '@/lib/schemas/report'
import { newProjectSchema, stepUpdateSchema } from '@/lib/schemas/sewing-room'
import { checkoutSchema } from '@/lib/schemas/shop'
import { listingVisibilitySchema } from '@/lib/schemas/shop-listings'
import { DEMO_PATTERNS } from '@/scripts/demo-data'
import { buildWorld, type World } from '../support/authorization-world'
import { closeDatabase, freshDatabase } from '../support/database'
import { TEST_PASSWORD } from '../support/factories'
import { badBodies } from '../support/fuzz'
import { call } from '../support/requests'

// The geometry's entry points, watched: a design refused by its limits must not reach them.
vi.mock('@/geometry/plan', async (importOriginal) => {
  const original = await importOriginal<typeof import('@/geometry/plan')>()
  return { ...original, planDesign: vi.fn(original.planDesign) }
})
vi.mock('@/geometry/arrangement', async (importOriginal) => {
  const original = await importOriginal<typeof import('@/geometry/arrangement')>()
  return { ...original, buildArrangement: vi.fn(original.buildArrangement) }
})

/** Bodies per route. About 30 routes × RUNS requests, each with a checksum: about two minutes here. */
const RUNS = 25

type Handler = (request: Request, context: { params: Promise<Record<string, string>> }) => Promise<Response>
type Who = 'stranger' | 'quilter' | 'designer' | 'tester' | 'buyer' | 'admin'

interface JsonEntry {
  readonly body: 'json'
  readonly who: Who
  readonly schema: z.ZodType
  /** A body the schema accepts: the fuzzing makes one field of it wrong. */
  readonly sample: (world: World) => unknown
  readonly limit: number
  readonly params?: (world: World) => Record<string, string>
}
interface BytesEntry {
  readonly body: 'bytes'
  readonly who: Who
  readonly limit: number
  /** The query string the route needs besides the body (an upload's kind). */
  readonly query?: string
  /** A table the route writes a row to for every refusal, on purpose (`public.name`), and the check of those rows. */
  /** A table the route logs every call to, its time column, and what each row it logs must satisfy. */
  readonly logs?: { readonly table: string; readonly at: string; readonly check: string }
}
interface NoBodyEntry {
  /** The route takes no body: whatever comes within BODY_LIMITS.none is ignored, more is 413. */
  readonly body: 'none'
  readonly who: Who
  readonly params?: (world: World) => Record<string, string>
}
type Entry = JsonEntry | BytesEntry | NoBodyEntry

const LANTERN = DEMO_PATTERNS.find((demo) => demo.state === 'testing')!.design as DesignFile
const UUID = '6f1c2b3a-0d4e-4f5a-8b6c-7d8e9f0a1b2c'
const form = BODY_LIMITS.form
const id = (key: keyof World) => (world: World) => ({ id: world[key] as string })

/**
 * Every route handler that takes a body, by method and path. A DELETE with a body (deleting the
 * account) is listed too; DELETEs without one take BODY_LIMITS.none like every GET.
 */
const ROUTES: Record<string, Entry> = {
  'POST /api/account/email/confirm': { body: 'json', who: 'quilter', schema: verifyEmailSchema, sample: () => ({ token: 'a-token' }), limit: form },
  'POST /api/account/email': { body: 'json', who: 'quilter', schema: emailChangeSchema, sample: () => ({ newEmail: 'new@example.test', currentPassword: TEST_PASSWORD }), limit: form },
  'POST /api/account/password': { body: 'json', who: 'quilter', schema: passwordChangeSchema, sample: () => ({ currentPassword: TEST_PASSWORD, newPassword: 'another-long-password' }), limit: form },
  'PATCH /api/account': { body: 'json', who: 'quilter', schema: displayNameChangeSchema, sample: () => ({ displayName: 'New Name' }), limit: form },
  'DELETE /api/account': { body: 'json', who: 'quilter', schema: accountDeletionSchema, sample: () => ({ currentPassword: TEST_PASSWORD, confirm: 'DELETE' }), limit: form },
  'POST /api/account/sessions/end-others': { body: 'none', who: 'quilter' },
  'POST /api/admin/orders/:id/refund': { body: 'none', who: 'admin', params: id('orderId') },
  'POST /api/admin/designer-requests/:id': { body: 'json', who: 'admin', schema: designerRequestDecisionSchema, sample: () => ({ decision: 'decline' }), limit: form, params: id('personId') },
  'PATCH /api/admin/listings/:id': { body: 'json', who: 'admin', schema: listingVisibilitySchema, sample: () => ({ hidden: true }), limit: form, params: id('listedId') },
  'PATCH /api/admin/users/:id': { body: 'json', who: 'admin', schema: updateUserSchema, sample: () => ({ roles: ['quilter', 'tester'], disabled: false }), limit: form, params: id('personId') },
  'POST /api/auth/password-reset/confirm': { body: 'json', who: 'stranger', schema: passwordResetConfirmSchema, sample: () => ({ token: 'a-token', password: 'another-long-password' }), limit: form },
  'POST /api/auth/password-reset': { body: 'json', who: 'stranger', schema: passwordResetRequestSchema, sample: () => ({ email: 'someone@example.test' }), limit: form },
  'POST /api/auth/sign-in': { body: 'json', who: 'stranger', schema: signInSchema, sample: () => ({ email: 'someone@example.test', password: TEST_PASSWORD }), limit: form },
  'POST /api/auth/sign-out': { body: 'none', who: 'quilter' },
  'POST /api/auth/sign-up': { body: 'json', who: 'stranger', schema: signUpSchema, sample: () => ({ email: 'new@example.test', password: 'another-long-password', displayName: 'New Person', wantsDesigner: false }), limit: form },
  'POST /api/auth/verify-email/resend': { body: 'none', who: 'quilter' },
  'POST /api/auth/verify-email': { body: 'json', who: 'stranger', schema: verifyEmailSchema, sample: () => ({ token: 'a-token' }), limit: form },
  'POST /api/licences/:id/booklets': { body: 'json', who: 'buyer', schema: bookletRequestSchema, sample: () => ({ paper: 'a4', orientation: 'portrait', colorway: 'Harvest', diameterIn: 20 }), limit: form, params: id('licenceId') },
  'PATCH /api/patterns/:id/listing': { body: 'json', who: 'designer', schema: listingSettingsSchema, sample: () => ({ skillNotes: 'Curved seams.', coverUploadId: UUID }), limit: form, params: id('listedId') },
  'POST /api/patterns/:id/invitations': { body: 'json', who: 'designer', schema: createInvitationSchema, sample: () => ({ email: 'tester@example.test' }), limit: form, params: id('patternId') },
  'POST /api/patterns/:id/reports': {
    body: 'json', who: 'tester', schema: createReportSchema, limit: form, params: id('patternId'),
    sample: () => ({ kind: 'cutting', severity: 'minor', text: 'The piece is short.', place: { area: 'A1', step: 1, page: 1, point: [1, 2] }, photoIds: [UUID] }),
  },
  'PATCH /api/patterns/:id': {
    body: 'json', who: 'designer', schema: updatePatternSchema, limit: BODY_LIMITS.design, params: id('patternId'),
    sample: () => ({ revision: 1, name: 'Renamed', state: 'draft', design: LANTERN, price: { priceCents: 1200, currency: 'GBP' } }),
  },
  'POST /api/patterns': { body: 'json', who: 'designer', schema: createPatternSchema, sample: () => ({ name: 'New ring', design: LANTERN }), limit: BODY_LIMITS.design },
  'POST /api/reports/:id/messages': { body: 'json', who: 'designer', schema: reportMessageSchema, sample: () => ({ text: 'Thank you, fixed.' }), limit: form, params: id('reportId') },
  'PATCH /api/reports/:id': { body: 'json', who: 'designer', schema: updateReportSchema, sample: () => ({ state: 'resolved' }), limit: form, params: id('reportId') },
  'POST /api/sewing-room/projects': {
    body: 'json', who: 'buyer', schema: newProjectSchema, limit: form,
    sample: (world) => ({ licenceId: world.licenceId, colorway: 0, diameterIn: 18, paper: 'letter', name: 'My ring' }),
  },
  'PATCH /api/sewing-room/projects/:id/steps': { body: 'json', who: 'buyer', schema: stepUpdateSchema, sample: () => ({ stepId: 'r1:area:A1', done: true, note: 'Pressed.' }), limit: form, params: id('projectId') },
  'POST /api/shop/checkout': { body: 'json', who: 'quilter', schema: checkoutSchema, sample: () => ({ patternId: UUID, colorway: 0 }), limit: form },
  'POST /api/uploads': { body: 'bytes', who: 'designer', limit: MAX_UPLOAD_BYTES, query: '?kind=swatch' },
  // A call without a valid signature is refused (400) and logged as refused (lib/payments/webhook.ts).
  'POST /api/webhooks/payments': { body: 'bytes', who: 'stranger', limit: 64 * 1024, logs: { table: 'public.payment_events', at: 'received_at', check: "state = 'refused'" } },
}

const appRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../app')

/** Every route handler under app/api: `POST /api/patterns/:id` with its handler. */
async function apiRoutes(): Promise<{ key: string; method: string; handler: Handler }[]> {
  const folder = path.join(appRoot, 'api')
  const files = (fs.readdirSync(folder, { recursive: true }) as string[]).filter((file) => path.basename(file) === 'route.ts').sort()
  const routes = []
  for (const file of files) {
    const url = '/api/' + path.dirname(file).split(path.sep).join('/').replace(/\[(\w+)\]/g, ':$1')
    const handlers = (await import(path.join(folder, file))) as Record<string, Handler>
    for (const method of ['GET', 'POST', 'PUT', 'PATCH', 'DELETE']) if (handlers[method]) routes.push({ key: `${method} ${url}`, method, handler: handlers[method]! })
  }
  return routes
}

/** Tables a refusal may touch by design: attempts are counted before the body is read. */
const NOT_CHECKSUMMED = new Set(['public.rate_limits'])
/**
 * Columns a request may touch whatever its body: a session's last use, written when the session
 * is checked at most every 5 minutes (lib/auth/session.ts), which a slow run of this file can span.
 */
const COLUMNS_NOT_CHECKSUMMED: Record<string, readonly string[]> = { 'public.sessions': ['last_seen_at'] }

/** One checksum per table, of every row as text, in every schema of ours (pg-boss's too). */
async function checksums(except: readonly string[] = []): Promise<Record<string, string>> {
  const sequelize = database()
  const [tables] = (await sequelize.query(
    "SELECT table_schema || '.' || table_name AS name FROM information_schema.tables WHERE table_type = 'BASE TABLE' AND table_schema NOT IN ('pg_catalog', 'information_schema') ORDER BY 1",
  )) as [{ name: string }[], unknown]
  const names = tables.map((table) => table.name).filter((name) => !NOT_CHECKSUMMED.has(name) && !except.includes(name))
  const quoted = (name: string) => name.split('.').map((part) => `"${part}"`).join('.')
  const [rows] = (await sequelize.query(
    names
      .map((name) => {
        const row = COLUMNS_NOT_CHECKSUMMED[name] ? `(to_jsonb(t) - ${COLUMNS_NOT_CHECKSUMMED[name].map((column) => `'${column}'`).join(' - ')})::text` : 't::text'
        return `SELECT '${name}' AS name, md5(coalesce(string_agg(${row}, '|' ORDER BY ${row}), '')) AS sum FROM ${quoted(name)} t`
      })
      .join(' UNION ALL '),
  )) as [{ name: string; sum: string }[], unknown]
  return Object.fromEntries(rows.map((row) => [row.name, row.sum]))
}

/** How deeply JSON text nests arrays and objects (brackets in strings not counted). */
function depthOf(text: string): number {
  let depth = 0
  let deepest = 0
  let inString = false
  for (let index = 0; index < text.length; index += 1) {
    const character = text[index]
    if (inString) {
      if (character === '\\') index += 1
      else if (character === '"') inString = false
    } else if (character === '"') inString = true
    else if (character === '[' || character === '{') deepest = Math.max(deepest, ++depth)
    else if (character === ']' || character === '}') depth -= 1
  }
  return deepest
}

/**
 * What the route must answer a body: 413 past the limit; 400 if it nests deeper than
 * MAX_JSON_DEPTH or is not JSON; else 422 if the schema refuses it. `null` when the schema accepts
 * it: such a body may change data, and is not a refusal to test.
 */
function expectedStatus(schema: z.ZodType, text: string, limit: number): number | null {
  if (Buffer.byteLength(text) > limit) return 413
  if (depthOf(text) > MAX_JSON_DEPTH) return 400
  let json: unknown
  try {
    json = JSON.parse(text)
  } catch {
    return 400
  }
  return schema.safeParse(json).success ? null : 422
}

/**
 * The people and rows the routes act on (tests/support/authorization-world.ts, as the authorization
 * matrix uses them), made once: the fuzzing must leave them as they are. "designer" here is the
 * designer who owns the patterns (the matrix's "owner").
 */
let world: World
/** One session per person for the whole file. */
let cookies: Record<Exclude<Who, 'stranger'>, string>
let routes: Awaited<ReturnType<typeof apiRoutes>>

beforeAll(async () => {
  await freshDatabase()
  world = await buildWorld()
  const roleOf = { designer: 'owner', quilter: 'quilter', tester: 'tester', buyer: 'buyer', admin: 'admin' } as const
  cookies = Object.fromEntries(await Promise.all(Object.entries(roleOf).map(async ([who, role]) => [who, (await world.cookie(role))!]))) as typeof cookies
  routes = await apiRoutes()
}, 120_000)
afterAll(closeDatabase)
beforeEach(() => vi.clearAllMocks())

/** Sends one body; rate-limit counters are emptied first, so that only the body is being judged. */
async function send(handler: Handler, method: string, entry: Entry, text: string | Uint8Array, query = '') {
  await database().query('TRUNCATE rate_limits')
  const params = 'params' in entry && entry.params ? entry.params(world) : {}
  const headers: Record<string, string> = {}
  if (text instanceof Uint8Array) headers['content-type'] = 'application/octet-stream'
  const body = typeof text === 'string' ? text : new ReadableStream<Uint8Array>({ start: (controller) => (controller.enqueue(text), controller.close()) })
  return call(handler, {
    method,
    path: `/x${query}`,
    cookie: entry.who === 'stranger' ? undefined : cookies[entry.who],
    params,
    ...(typeof body === 'string' ? { rawBody: body, headers: { 'content-type': 'application/json' } } : { stream: body, headers }),
  })
}

describe('every route that takes a body is fuzzed', () => {
  it('has an entry for every POST, PUT and PATCH handler under app/api (and no entry for a route that is gone)', () => {
    const writes = routes.filter((route) => ['POST', 'PUT', 'PATCH'].includes(route.method)).map((route) => route.key)
    expect(writes.filter((key) => !(key in ROUTES))).toEqual([])
    const all = new Set(routes.map((route) => route.key))
    expect(Object.keys(ROUTES).filter((key) => !all.has(key))).toEqual([])
  })
})

describe('bad bodies never answer 500 and never change stored data', () => {
  it.each(Object.entries(ROUTES).filter(([, entry]) => entry.body === 'json') as [string, JsonEntry][])('%s', async (key, entry) => {
    const { method, handler } = routes.find((route) => route.key === key)!
    const sample = entry.sample(world)
    expect(entry.schema.safeParse(sample).success).toBe(true)
    const before = await checksums()
    await fc.assert(
      fc.asyncProperty(badBodies(sample, { limit: entry.limit }), async (text) => {
        const expected = expectedStatus(entry.schema, text, entry.limit)
        fc.pre(expected !== null)
        const response = await send(handler, method, entry, text)
        expect(response.status).toBe(expected)
        if (response.status === 422) {
          expect(response.json?.error?.issues?.length).toBeGreaterThan(0)
          for (const issue of response.json!.error.issues as { path: unknown; message: unknown }[]) {
            expect(issue.path).toEqual(expect.stringMatching(/\S/))
            expect(issue.message).toEqual(expect.stringMatching(/\S/))
          }
        }
        expect(await checksums()).toEqual(before)
      }),
      { numRuns: RUNS },
    )
  }, 120_000)

  it.each(Object.entries(ROUTES).filter(([, entry]) => entry.body === 'bytes') as [string, BytesEntry][])('%s (raw bytes)', async (key, entry) => {
    const { method, handler } = routes.find((route) => route.key === key)!
    const before = await checksums(entry.logs ? [entry.logs.table] : [])
    // Only the rows this test logs are judged: other files' tests leave processed events behind.
    const [[started]] = (await database().query('SELECT now() AS since')) as [{ since: Date }[], unknown]
    await fc.assert(
      fc.asyncProperty(fc.oneof(fc.uint8Array({ maxLength: 4096 }), fc.string({ maxLength: 400 }), fc.json()), async (bytes) => {
        const response = await send(handler, method, entry, bytes, entry.query)
        expect([400, 413, 415, 422]).toContain(response.status)
        expect(await checksums(entry.logs ? [entry.logs.table] : [])).toEqual(before)
      }),
      { numRuns: RUNS },
    )
    if (entry.logs) {
      const [rows] = (await database().query(`SELECT count(*)::int AS n FROM ${entry.logs.table} t WHERE t.${entry.logs.at} >= :since AND NOT (${entry.logs.check})`, {
        replacements: { since: started!.since },
      })) as [{ n: number }[], unknown]
      expect(rows[0]!.n).toBe(0)
    }
  })

  it.each(Object.entries(ROUTES).filter(([, entry]) => entry.body === 'none') as [string, NoBodyEntry][])('%s (takes no body: more than a few bytes is 413)', async (key, entry) => {
    const { method, handler } = routes.find((route) => route.key === key)!
    const before = await checksums()
    await fc.assert(
      fc.asyncProperty(fc.integer({ min: BODY_LIMITS.none + 1, max: 64 * 1024 }), fc.boolean(), async (size, json) => {
        const text = json ? JSON.stringify({ padding: 'x'.repeat(size) }) : 'x'.repeat(size)
        const response = await send(handler, method, entry, text)
        expect(response.status).toBe(413)
        expect(await checksums()).toEqual(before)
      }),
      { numRuns: 5 },
    )
  })
})

describe('a body of nested brackets', () => {
  it(`is refused (400) before it is parsed when it nests deeper than ${MAX_JSON_DEPTH} levels, even within a design's size`, async () => {
    const { handler } = routes.find((route) => route.key === 'PATCH /api/patterns/:id')!
    // 1,000,000 levels, 2 MB: JSON.parse alone took about 10 s of the web process for this.
    const text = `{"revision":1,"design":${'['.repeat(1_000_000)}${']'.repeat(1_000_000)}}`
    const before = await checksums()
    const response = await call(handler, { method: 'PATCH', cookie: cookies.designer, params: { id: world.patternId }, rawBody: text })
    expect(response.status).toBe(400)
    expect(response.json?.error?.message).toContain(`deeper than ${MAX_JSON_DEPTH} levels`)
    expect(await checksums()).toEqual(before)
  })
})

describe('a design over the seam limit', () => {
  it(`is refused when saved (422 naming design.seams and the limit of ${MAX_SEAMS}) before any geometry runs, and nothing changes`, async () => {
    const { handler } = routes.find((route) => route.key === 'PATCH /api/patterns/:id')!
    const seams = Array.from({ length: MAX_SEAMS + 1 }, (_, i) => ({ id: `s${i}`, from: [1 + (i % 7), 0], to: [0, 2 + (i % 5)] }))
    const before = await checksums()
    const response = await call(handler, {
      method: 'PATCH', cookie: cookies.designer, params: { id: world.patternId },
      body: { revision: 1, design: { ...LANTERN, leaves: [], seams } },
    })
    expect(response.status).toBe(422)
    expect(response.json?.error?.issues).toContainEqual({ path: 'design.seams', message: `at most ${MAX_SEAMS} seams` })
    expect(planDesign).not.toHaveBeenCalled()
    expect(buildArrangement).not.toHaveBeenCalled()
    expect(await checksums()).toEqual(before)
  })
})
