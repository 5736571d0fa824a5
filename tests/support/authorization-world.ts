/**
 * The people and rows the authorization matrix (tests/integration/authorization-matrix.table.ts)
 * acts on: one of each role, a pattern in testing with its tester, a published pattern with a
 * buyer's licence, order, sewing project and booklet, a report, a swatch and a shop cover. Made
 * through the factories and, where a row needs the service's own work (a report, a project, an
 * upload, a booklet), through the route handlers in this process. Used by the integration matrix
 * (after freshDatabase) and by the e2e page-access test (against the built app's database, next
 * to the demo data: every address here is new).
 */
import { randomUUID } from 'node:crypto'
import sharp from 'sharp'
import { POST as requestBookletRoute } from '@/app/api/licences/[id]/booklets/route'
import { PATCH as listingRoute } from '@/app/api/patterns/[id]/listing/route'
import { POST as fileReportRoute } from '@/app/api/patterns/[id]/reports/route'
import { POST as startProjectRoute } from '@/app/api/sewing-room/projects/route'
import { POST as uploadRoute } from '@/app/api/uploads/route'
import { database } from '@/lib/db'
import { objectKey, putObject } from '@/lib/object-store'
import { bookletStatus } from '@/lib/services/booklets'
import type { Role } from '@/lib/roles'
import type { DesignFile } from '@/lib/schemas/design'
import { BookletBuild, Invitation, Licence, Order } from '@/models'
import { DEMO_PATTERNS } from '@/scripts/demo-data'
import { createPatternRow, createUser, sessionCookieFor } from './factories'
import { call, TEST_ORIGIN } from './requests'

/**
 * Who calls: nobody signed in; a quilter with nothing; a quilter holding a licence (the buyer:
 * owner of the order, project and booklet); a quilter invited to test the pattern; the designer
 * who owns the patterns; another designer; an admin.
 */
export const MATRIX_ROLES = ['stranger', 'quilter', 'buyer', 'tester', 'owner', 'designer', 'admin'] as const
export type MatrixRole = (typeof MATRIX_ROLES)[number]

export interface World {
  readonly users: Record<Exclude<MatrixRole, 'stranger'>, { id: string; email: string }>
  /** The owner's pattern in testing, with the tester's accepted invitation. */
  readonly patternId: string
  /** The owner's published pattern: in the shop, the buyer holds a licence. */
  readonly listedId: string
  readonly reportId: string
  readonly licenceId: string
  readonly orderId: string
  readonly projectId: string
  readonly bookletId: string
  /** The buyer's download token for the booklet (it is ready, its PDF stored). */
  readonly bookletToken: string
  /** The owner's swatch. */
  readonly swatchId: string
  /** The listed pattern's cover (public: the shop shows it). */
  readonly coverId: string
  /** A quilter waiting for a designer account (the admin's decisions act on them). */
  readonly personId: string
  /** A fresh session of `role` (a new one every call: sign-out, ending sessions and password changes touch only it). */
  cookie(role: MatrixRole): Promise<string | undefined>
  /** Rows a destructive call may use up: a pattern like patternId, an invitation of it, a project of the buyer's. */
  readonly make: {
    pattern(): Promise<string>
    invitation(): Promise<string>
    project(): Promise<string>
  }
}

const LANTERN = DEMO_PATTERNS.find((demo) => demo.state === 'testing')!.design as DesignFile
const WEEK_MS = 7 * 24 * 3600 * 1000

async function png(): Promise<Uint8Array> {
  return new Uint8Array(await sharp({ create: { width: 24, height: 16, channels: 3, background: { r: 180, g: 60, b: 90 } } }).png().toBuffer())
}

async function upload(cookie: string, kind: string): Promise<string> {
  const request = new Request(`${TEST_ORIGIN}/api/uploads?kind=${kind}`, {
    method: 'POST',
    headers: { origin: TEST_ORIGIN, 'content-type': 'image/png', cookie },
    body: new Blob([new Uint8Array(await png())]),
  })
  const response = await uploadRoute(request)
  const json = (await response.json()) as { upload?: { id: string }; error?: unknown }
  if (response.status !== 201) throw new Error(`upload of a ${kind} answered ${response.status}: ${JSON.stringify(json)}`)
  return json.upload!.id
}

function must<T>(answer: { status: number; json: Record<string, unknown> | null }, status: number, what: string): T {
  if (answer.status !== status) throw new Error(`${what} answered ${answer.status}: ${JSON.stringify(answer.json)}`)
  return answer.json as T
}

export async function buildWorld(): Promise<World> {
  database()
  const person = (roles: Role[]) => createUser({ roles, email: `matrix-${roles.join('-')}-${randomUUID()}@example.test` })
  const users = {
    quilter: await person(['quilter']),
    buyer: await person(['quilter']),
    tester: await person(['quilter']),
    owner: await person(['designer', 'quilter']),
    designer: await person(['designer', 'quilter']),
    admin: await person(['admin']),
  }
  const waiting = await person(['quilter'])
  await waiting.update({ designerRequestedAt: new Date() })
  const cookie = async (role: MatrixRole) => (role === 'stranger' ? undefined : sessionCookieFor(users[role]))
  const ownerCookie = (await cookie('owner'))!

  const invite = (patternId: string, email: string, userId: string | null) =>
    Invitation.create({
      patternId, email, invitedById: users.owner.id, userId, acceptedAt: userId ? new Date() : null, withdrawnAt: null, expiresAt: new Date(Date.now() + WEEK_MS),
    })
  const makePattern = async () => {
    const pattern = await createPatternRow(users.owner, { name: 'Lantern Medallion', state: 'testing', design: LANTERN })
    await invite(pattern.id, users.tester.email, users.tester.id)
    return pattern.id
  }
  const patternId = await makePattern()
  const listed = await createPatternRow(users.owner, { name: 'Listed ring', state: 'published', design: LANTERN })
  await listed.update({ priceCents: 1200, currency: 'GBP' })

  const report = must<{ report: { id: string } }>(
    await call(fileReportRoute, {
      method: 'POST', cookie: (await cookie('tester'))!, params: { id: patternId },
      body: { kind: 'cutting', severity: 'minor', text: 'The rough-cut piece is short.', place: { page: 1 } },
    }),
    201, 'filing a report',
  )
  const order = await Order.create({ id: randomUUID(), buyerId: users.buyer.id, patternId: listed.id, amountCents: 1200, currency: 'GBP', checkoutSessionId: `cs_test_${randomUUID()}`, state: 'paid' })
  const licence = await Licence.create({ userId: users.buyer.id, patternId: listed.id, orderId: order.id })
  const makeProject = async () =>
    must<{ project: { id: string } }>(
      await call(startProjectRoute, { method: 'POST', cookie: (await cookie('buyer'))!, body: { licenceId: licence.id, colorway: 0, diameterIn: 18, paper: 'letter' } }),
      201, 'starting a project',
    ).project.id
  const projectId = await makeProject()

  const asked = must<{ id: string }>(
    await call(requestBookletRoute, { method: 'POST', cookie: (await cookie('buyer'))!, params: { id: licence.id }, body: { paper: 'letter', orientation: 'portrait', colorway: LANTERN.colorways?.[0]?.name ?? 'Default', diameterIn: 18 } }),
    202, 'asking for a booklet',
  )
  // Ready at once, its PDF stored: the worker's part is not what the matrix is about.
  const key = objectKey(`booklets/${asked.id}.pdf`)
  await putObject(key, new TextEncoder().encode('%PDF-1.4\n%%EOF\n'), 'application/pdf')
  await BookletBuild.update({ state: 'ready', objectKey: key, pageCount: 1, pagesDone: 1 }, { where: { id: asked.id } })
  const status = await bookletStatus({ id: users.buyer.id, roles: ['quilter'] } as Parameters<typeof bookletStatus>[0], asked.id)
  const bookletToken = new URL(status.url!, TEST_ORIGIN).searchParams.get('token')!

  const swatchId = await upload(ownerCookie, 'swatch')
  const coverId = await upload(ownerCookie, 'cover')
  must(await call(listingRoute, { method: 'PATCH', cookie: ownerCookie, params: { id: listed.id }, body: { skillNotes: 'Curved seams.', coverUploadId: coverId } }), 200, 'setting the cover')

  return {
    users,
    patternId,
    listedId: listed.id,
    reportId: report.report.id,
    licenceId: licence.id,
    orderId: order.id,
    projectId,
    bookletId: asked.id,
    bookletToken,
    swatchId,
    coverId,
    personId: waiting.id,
    cookie,
    make: {
      pattern: makePattern,
      invitation: async () => (await invite(patternId, `invited-${randomUUID()}@example.test`, null)).id,
      project: makeProject,
    },
  }
}
