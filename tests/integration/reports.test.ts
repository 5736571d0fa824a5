/**
 * Test reports against the real PostgreSQL, object store and mail catcher: who files, who reads,
 * who answers and who resolves; places checked against the plan; photos shown only to the
 * pattern's designer, its testers and admins; mail to everyone in the test but the author.
 */
import sharp from 'sharp'
import { afterAll, beforeEach, describe, expect, it } from 'vitest'
import { GET as listRoute, POST as fileRoute } from '@/app/api/patterns/[id]/reports/route'
import { POST as answerRoute } from '@/app/api/reports/[id]/messages/route'
import { GET as reportRoute, PATCH as stateRoute } from '@/app/api/reports/[id]/route'
import { GET as readUpload } from '@/app/api/uploads/[id]/route'
import { POST as postUpload } from '@/app/api/uploads/route'
import { RATE_LIMITS } from '@/lib/rate-limits'
import type { Role } from '@/lib/roles'
import type { DesignFile } from '@/lib/schemas/design'
import { Invitation, Pattern } from '@/models'
import { DEMO_PATTERNS } from '@/scripts/demo-data'
import { closeDatabase, freshDatabase } from '../support/database'
import { createPatternRow, createUser, sessionCookieFor } from '../support/factories'
import { clearMailQueue, clearMails, caughtMails, useMailWorker, waitForMail } from '../support/mail'
import { emptyBucket } from '../support/object-store'
import { call, TEST_ORIGIN } from '../support/requests'

useMailWorker()
beforeEach(async () => {
  await freshDatabase()
  await Promise.all([emptyBucket(), clearMails(), clearMailQueue()])
})
afterAll(closeDatabase)

/** The demo's pattern in testing: four areas A1–A4 in one repeat of six (scripts/demo-data.ts). */
const LANTERN = DEMO_PATTERNS.find((demo) => demo.state === 'testing')!.design as DesignFile

async function person(roles: Role[], displayName = 'Test Person') {
  const user = await createUser({ roles, displayName })
  return { user, cookie: await sessionCookieFor(user) }
}

/** Makes `user` a tester of the pattern: an accepted, live invitation (lib/services/invitations.ts). */
async function makeTester(pattern: { id: string; ownerId: string | null }, user: { id: string; email: string }) {
  await Invitation.create({
    patternId: pattern.id,
    email: user.email,
    invitedById: pattern.ownerId,
    userId: user.id,
    acceptedAt: new Date(),
    withdrawnAt: null,
    expiresAt: new Date(Date.now() + 7 * 24 * 3600 * 1000),
  })
}

/** A designer's pattern in testing with two testers, and another pattern with a tester of its own. */
async function scene() {
  const designer = await person(['designer', 'quilter'], 'Dora Designer')
  const testerA = await person(['quilter'], 'Tess Tester')
  const testerB = await person(['quilter'], 'Tom Tester')
  const outsider = await person(['quilter'], 'Olga Outsider')
  const admin = await person(['admin'], 'Ada Admin')
  const stranger = await person(['quilter'], 'Sam Stranger')
  const pattern = await createPatternRow(designer.user, { name: 'Lantern Medallion', state: 'testing', design: LANTERN })
  const other = await createPatternRow(designer.user, { name: 'Other ring', state: 'testing', design: LANTERN })
  await makeTester(pattern, testerA.user)
  await makeTester(pattern, testerB.user)
  await makeTester(other, outsider.user)
  return { designer, testerA, testerB, outsider, admin, stranger, pattern, other }
}

const REPORT = { kind: 'cutting', severity: 'blocks-sewing', text: 'The rough-cut piece for A3 is too small to cover the area.', place: { area: 'A3' } }

function file(patternId: string, cookie: string | undefined, body: unknown = REPORT) {
  return call(fileRoute, { method: 'POST', path: `/api/patterns/${patternId}/reports`, params: { id: patternId }, cookie, body })
}
function list(patternId: string, cookie: string, query = '') {
  return call(listRoute, { path: `/api/patterns/${patternId}/reports${query}`, params: { id: patternId }, cookie })
}
function answer(reportId: string, cookie: string, text: string) {
  return call(answerRoute, { method: 'POST', path: `/api/reports/${reportId}/messages`, params: { id: reportId }, cookie, body: { text } })
}
function setState(reportId: string, cookie: string, state: string) {
  return call(stateRoute, { method: 'PATCH', path: `/api/reports/${reportId}`, params: { id: reportId }, cookie, body: { state } })
}

/** A generated photo (a coloured square, never a real photo), uploaded as a report photo. */
async function uploadPhoto(cookie: string, colour = '#b5523b'): Promise<string> {
  const bytes = await sharp({ create: { width: 64, height: 64, channels: 3, background: colour } }).png().toBuffer()
  const headers = new Headers({ origin: TEST_ORIGIN, 'content-type': 'image/png', cookie })
  const response = await postUpload(new Request(`${TEST_ORIGIN}/api/uploads?kind=report-photo`, { method: 'POST', headers, body: new Blob([new Uint8Array(bytes)]) }))
  expect(response.status).toBe(201)
  return ((await response.json()) as { upload: { id: string } }).upload.id
}

async function readPhoto(id: string, cookie: string) {
  return (await readUpload(new Request(`${TEST_ORIGIN}/api/uploads/${id}`, { headers: { cookie } }), { params: Promise.resolve({ id }) })).status
}

describe('filing a report', () => {
  it('is for the testers of the pattern only: the designer 403, others 404, strangers 401', async () => {
    const { designer, testerA, outsider, admin, stranger, pattern } = await scene()
    const filed = await file(pattern.id, testerA.cookie)
    expect(filed.status).toBe(201)
    expect(filed.json!.report).toMatchObject({ kind: 'cutting', severity: 'blocks-sewing', state: 'open', place: { area: 'A3' }, revision: 1, tester: { displayName: 'Tess Tester' } })
    expect((await file(pattern.id, designer.cookie)).status).toBe(403)
    expect((await file(pattern.id, admin.cookie)).status).toBe(403)
    expect((await file(pattern.id, outsider.cookie)).status).toBe(404)
    expect((await file(pattern.id, stranger.cookie)).status).toBe(404)
    expect((await file(pattern.id, undefined)).status).toBe(401)
  })

  it('is limited per person: past the reports limit a 429 with Retry-After, counted before the body is read', async () => {
    const { testerA, testerB, pattern } = await scene()
    // Refused bodies count too: the limit is on attempts (lib/rate-limits.ts).
    for (let i = 0; i < RATE_LIMITS.reportsPerUser.points; i += 1) expect((await file(pattern.id, testerA.cookie, { kind: 'fit' })).status).toBe(422)
    const refused = await file(pattern.id, testerA.cookie)
    expect(refused.status).toBe(429)
    expect(Number(refused.headers.get('retry-after'))).toBeGreaterThan(0)
    // Another tester is counted apart.
    expect((await file(pattern.id, testerB.cookie)).status).toBe(201)
  })

  it('is refused once the pattern is back in draft, although the invitation stands', async () => {
    const { testerA, pattern } = await scene()
    await Pattern.update({ state: 'draft' }, { where: { id: pattern.id } })
    expect((await file(pattern.id, testerA.cookie)).status).toBe(404)
  })

  it('refuses an area label the plan does not have, a step past its last, and a bad kind, naming each field', async () => {
    const { testerA, pattern } = await scene()
    const unknownArea = await file(pattern.id, testerA.cookie, { ...REPORT, place: { area: 'A9' } })
    expect(unknownArea.status).toBe(422)
    expect(unknownArea.json!.error.issues).toEqual([expect.objectContaining({ path: 'place.area', message: expect.stringContaining('no area A9') })])
    // Four areas in the plan: four steps.
    const step = await file(pattern.id, testerA.cookie, { ...REPORT, place: { step: 5 } })
    expect(step.json!.error.issues).toEqual([expect.objectContaining({ path: 'place.step' })])
    const kind = await file(pattern.id, testerA.cookie, { ...REPORT, kind: 'seam-ripper' })
    expect(kind.status).toBe(422)
    expect(kind.json!.error.issues.map((field: { path: string }) => field.path)).toEqual(['kind'])
    const nowhere = await file(pattern.id, testerA.cookie, { ...REPORT, place: {} })
    expect(nowhere.json!.error.issues.map((field: { path: string }) => field.path)).toEqual(['place.area'])
    const outside = await file(pattern.id, testerA.cookie, { ...REPORT, place: { point: [30, 0] } })
    expect(outside.json!.error.issues.map((field: { path: string }) => field.path)).toEqual(['place.point'])
    expect((await list(pattern.id, testerA.cookie)).json!.reports).toEqual([])
  })

  it('pins an area at its label point, a step at its area, a point where it was clicked; a page alone has no pin', async () => {
    const { testerA, pattern } = await scene()
    const area = (await file(pattern.id, testerA.cookie)).json!.report
    // A3's label point in the first repeat, from the plan (geometry/plan.ts rounds it).
    expect(area.pin.area).toBe('A3')
    expect(area.pin.point[0]).toBeCloseTo(6.19, 2)
    expect(area.pin.point[1]).toBeCloseTo(1.84, 2)
    const step = (await file(pattern.id, testerA.cookie, { ...REPORT, place: { step: 3 } })).json!.report
    expect(step.pin).toEqual(area.pin)
    const point = (await file(pattern.id, testerA.cookie, { ...REPORT, place: { point: [6.19, 1.84] } })).json!.report
    expect(point.pin).toEqual({ point: [6.19, 1.84], area: 'A3' })
    // Repeat 1 of a mirrored ring of six is repeat 0 reflected across the radius at 60°:
    // (x, y) → (x cos 120° + y sin 120°, x sin 120° − y cos 120°) = (−1.502, 6.281) for A3's point.
    const mirrored = (await file(pattern.id, testerA.cookie, { ...REPORT, place: { point: [-1.502, 6.281] } })).json!.report
    expect(mirrored.pin.area).toBe('A3')
    const page = (await file(pattern.id, testerA.cookie, { ...REPORT, place: { page: 2 } })).json!.report
    expect(page.pin).toBeNull()
    for (const report of [area, step, point, page]) expect(report.changedSince).toBe(false)
  })

  it('says the design has changed at a pin whose area was redrawn, keeping its point', async () => {
    const { testerA, designer, pattern } = await scene()
    const filed = (await file(pattern.id, testerA.cookie)).json!.report
    // The designer takes every seam out: one area is left, A1, and A3 no longer exists.
    await Pattern.update({ design: { ...LANTERN, seams: [], leaves: [], order: undefined }, revision: 2 }, { where: { id: pattern.id } })
    const [report] = (await list(pattern.id, designer.cookie)).json!.reports
    expect(report.id).toBe(filed.id)
    expect(report.changedSince).toBe(true)
    expect(report.pin).toEqual(filed.pin)
  })
})

describe('reading reports', () => {
  it('shows a pattern’s reports to its designer, all its testers and admins, never to another pattern’s tester', async () => {
    const { designer, testerA, testerB, outsider, admin, stranger, pattern, other } = await scene()
    const filed = (await file(pattern.id, testerA.cookie)).json!.report
    await file(other.id, outsider.cookie)
    for (const reader of [designer, testerA, testerB, admin]) {
      const listed = await list(pattern.id, reader.cookie)
      expect(listed.status).toBe(200)
      expect(listed.json!.reports.map((report: { id: string }) => report.id)).toEqual([filed.id])
    }
    expect((await list(pattern.id, outsider.cookie)).status).toBe(404)
    expect((await list(pattern.id, stranger.cookie)).status).toBe(404)
    expect((await call(reportRoute, { path: `/api/reports/${filed.id}`, params: { id: filed.id }, cookie: outsider.cookie })).status).toBe(404)
    expect((await call(reportRoute, { path: `/api/reports/${filed.id}`, params: { id: filed.id }, cookie: testerB.cookie })).status).toBe(200)
    // The outsider's own pattern lists only its own report.
    expect((await list(other.id, outsider.cookie)).json!.reports).toHaveLength(1)
  })

  it('filters by state, kind and tester and sorts by date', async () => {
    const { designer, testerA, testerB, pattern } = await scene()
    const first = (await file(pattern.id, testerA.cookie)).json!.report
    const second = (await file(pattern.id, testerB.cookie, { ...REPORT, kind: 'printing', place: { page: 3 } })).json!.report
    const third = (await file(pattern.id, testerA.cookie, { ...REPORT, kind: 'fit', place: { area: 'A1' } })).json!.report
    await setState(second.id, designer.cookie, 'resolved')
    const ids = async (query: string) => (await list(pattern.id, designer.cookie, query)).json!.reports.map((report: { id: string }) => report.id)
    expect(await ids('')).toEqual([third.id, second.id, first.id])
    expect(await ids('?sort=oldest')).toEqual([first.id, second.id, third.id])
    expect(await ids('?state=resolved')).toEqual([second.id])
    expect(await ids('?state=open&sort=oldest')).toEqual([first.id, third.id])
    expect(await ids('?kind=fit')).toEqual([third.id])
    expect(await ids(`?tester=${testerB.user.id}`)).toEqual([second.id])
    const bad = await list(pattern.id, designer.cookie, '?state=closed')
    expect(bad.status).toBe(422)
    expect(bad.json!.error.issues.map((field: { path: string }) => field.path)).toEqual(['state'])
  })
})

describe('threads and states', () => {
  it('lets the designer, the testers and admins answer; only the designer or an admin resolves and reopens', async () => {
    const { designer, testerA, testerB, outsider, admin, pattern } = await scene()
    const filed = (await file(pattern.id, testerA.cookie)).json!.report
    expect((await answer(filed.id, designer.cookie, 'Thanks — is it short along the sewing line?')).status).toBe(201)
    expect((await answer(filed.id, testerA.cookie, 'Yes, by about 1/4 in.')).status).toBe(201)
    expect((await answer(filed.id, testerB.cookie, 'Same on mine.')).status).toBe(201)
    expect((await answer(filed.id, outsider.cookie, 'Hello?')).status).toBe(404)
    const thread = (await answer(filed.id, admin.cookie, 'Noted.')).json!.report.messages
    expect(thread.map((message: { authorRole: string; author: { displayName: string } }) => [message.authorRole, message.author.displayName])).toEqual([
      ['designer', 'Dora Designer'],
      ['tester', 'Tess Tester'],
      ['tester', 'Tom Tester'],
      ['admin', 'Ada Admin'],
    ])
    const empty = await answer(filed.id, designer.cookie, '   ')
    expect(empty.status).toBe(422)
    expect(empty.json!.error.issues.map((field: { path: string }) => field.path)).toEqual(['text'])

    expect((await setState(filed.id, testerA.cookie, 'resolved')).status).toBe(403)
    expect((await setState(filed.id, outsider.cookie, 'resolved')).status).toBe(404)
    const resolved = await setState(filed.id, designer.cookie, 'resolved')
    expect([resolved.status, resolved.json!.report.state]).toEqual([200, 'resolved'])
    expect((await setState(filed.id, admin.cookie, 'open')).json!.report.state).toBe('open')
    expect((await setState(filed.id, designer.cookie, 'closed')).status).toBe(422)
  })
})

describe('report photos', () => {
  it('are readable by the pattern’s designer, its testers and admins only; others get 404', async () => {
    const { designer, testerA, testerB, outsider, admin, stranger, pattern } = await scene()
    const photo = await uploadPhoto(testerA.cookie)
    // Before it is attached, only its owner (and admins) see it.
    expect(await readPhoto(photo, designer.cookie)).toBe(404)
    const filed = await file(pattern.id, testerA.cookie, { ...REPORT, photoIds: [photo] })
    expect(filed.json!.report.photos).toEqual([{ id: photo, url: `/api/uploads/${photo}` }])
    for (const reader of [testerA, designer, testerB, admin]) expect(await readPhoto(photo, reader.cookie)).toBe(200)
    for (const other of [outsider, stranger]) expect(await readPhoto(photo, other.cookie)).toBe(404)
  })

  it('must be the tester’s own report photos', async () => {
    const { testerA, testerB, pattern } = await scene()
    const own = await uploadPhoto(testerA.cookie)
    const theirs = await uploadPhoto(testerB.cookie, '#2f5d50')
    const refused = await file(pattern.id, testerA.cookie, { ...REPORT, photoIds: [own, theirs] })
    expect(refused.status).toBe(422)
    expect(refused.json!.error.issues.map((field: { path: string }) => field.path)).toEqual(['photoIds.1'])
  })
})

describe('mail', () => {
  it('tells the designer and the other testers of a new report, and everyone but its author of an answer', async () => {
    const { designer, testerA, testerB, pattern } = await scene()
    const filed = (await file(pattern.id, testerA.cookie)).json!.report
    const toDesigner = await waitForMail({ to: designer.user.email, kind: 'report-filed' })
    expect(toDesigner.subject).toBe('New test report on Lantern Medallion: area A3')
    expect(toDesigner.text).toContain('Tess Tester filed a report')
    expect(toDesigner.html).toContain(`/patterns/${pattern.id}/reports?report=${filed.id}`)
    await waitForMail({ to: testerB.user.email, kind: 'report-filed' })

    await answer(filed.id, designer.cookie, 'Fixed in the next revision: the margin is now 1/2 in.')
    const toTester = await waitForMail({ to: testerA.user.email, kind: 'report-answered' })
    expect(toTester.text).toContain('Fixed in the next revision')
    await waitForMail({ to: testerB.user.email, kind: 'report-answered' })
    // Nobody is told of what they wrote themselves.
    const mails = await caughtMails()
    expect(mails.filter((mail) => mail.to.includes(testerA.user.email.toLowerCase()) && mail.kind === 'report-filed')).toEqual([])
    expect(mails.filter((mail) => mail.to.includes(designer.user.email.toLowerCase()) && mail.kind === 'report-answered')).toEqual([])
  })
})
