import { randomUUID } from 'node:crypto'
import { afterAll, beforeEach, describe, expect, it } from 'vitest'
import { DELETE as deleteRoute, GET as projectRoute } from '@/app/api/sewing-room/projects/[id]/route'
import { PATCH as stepRoute } from '@/app/api/sewing-room/projects/[id]/steps/route'
import { GET as listRoute, POST as startRoute } from '@/app/api/sewing-room/projects/route'
import { MAX_SEWING_NOTE_LENGTH } from '@/lib/limits'
import type { PlanAnswer } from '@/lib/schemas/sewing-room'
import { readPlan } from '@/lib/sewing-room/plan-answer'
import { Invitation, Licence, Order, SewingProject, SewingStep, User } from '@/models'
import { seedDemoData } from '@/scripts/demo-data'
import { DEMO_SEWING } from '@/scripts/demo-season'
import { hollyberryWreath } from '@/scripts/demo-wreath'
import { closeDatabase, freshDatabase } from '../support/database'
import { createPatternRow, createUser, sessionCookieFor } from '../support/factories'
import { clearPayments } from '../support/payments'
import { call } from '../support/requests'

beforeEach(async () => {
  await freshDatabase()
  await clearPayments()
})
afterAll(closeDatabase)

/** A published demo wreath, a buyer holding a licence to it (as a processed payment leaves them), another quilter. */
async function scene() {
  const designer = await createUser({ roles: ['quilter', 'designer'], displayName: 'Marta Lindqvist' })
  const pattern = await createPatternRow(designer, { name: 'Hollyberry Wreath', state: 'published', design: hollyberryWreath })
  await pattern.update({ priceCents: 1200, currency: 'USD' })
  const buyer = await createUser({ displayName: 'Tamsin Orr' })
  const other = await createUser({ displayName: 'Ivo Brand' })
  const licence = await grantLicence(buyer, pattern.id)
  return { designer, pattern, buyer, other, licence, buyerCookie: await sessionCookieFor(buyer), otherCookie: await sessionCookieFor(other) }
}

async function grantLicence(user: { id: string }, patternId: string) {
  const order = await Order.create({ id: randomUUID(), buyerId: user.id, patternId, amountCents: 1200, currency: 'USD', checkoutSessionId: `cs_test_${randomUUID()}`, state: 'paid' })
  return Licence.create({ userId: user.id, patternId, orderId: order.id })
}

const start = (cookie: string, body: Record<string, unknown>) => call(startRoute, { method: 'POST', cookie, body })
const patch = (cookie: string, id: string, body: Record<string, unknown>) => call(stepRoute, { method: 'PATCH', cookie, params: { id }, body })
const read = (cookie: string | undefined, id: string) => call(projectRoute, { cookie, params: { id } })
/** The plan as the page reads it. */
const plan = async (cookie: string, id: string) => readPlan((await read(cookie, id)).json! as PlanAnswer)

describe('starting a project', () => {
  it('lets the licence holder start one (twice for one pattern) and lists only their own', async () => {
    const { buyerCookie, otherCookie, licence, pattern } = await scene()
    const first = await start(buyerCookie, { licenceId: licence.id, colorway: 1, diameterIn: 24, paper: 'a4', name: 'For the hall' })
    expect(first.status).toBe(201)
    expect(first.json!.project).toMatchObject({
      patternId: pattern.id,
      patternName: 'Hollyberry Wreath',
      designerName: 'Marta Lindqvist',
      colorway: { index: 1, name: hollyberryWreath.colorways![1]!.name },
      diameterIn: 24,
      paper: 'a4',
      name: 'For the hall',
      licenceId: licence.id,
      invitationId: null,
      done: 0,
      nextStepLabel: expect.stringMatching(/^Fold 16 leaves from /),
    })
    expect(first.json!.project.total).toBeGreaterThan(50)
    const second = await start(buyerCookie, { licenceId: licence.id, colorway: 0, diameterIn: 18, paper: 'letter' })
    expect(second.status).toBe(201)
    const mine = await call(listRoute, { cookie: buyerCookie })
    expect(mine.json!.projects.map((project: { id: string }) => project.id).sort()).toEqual([first.json!.project.id, second.json!.project.id].sort())
    expect((await call(listRoute, { cookie: otherCookie })).json!.projects).toEqual([])
    expect((await call(listRoute, {})).status).toBe(401)
  })

  it('refuses another quilter, a revoked licence, a colourway the pattern lacks and a body naming both grants', async () => {
    const { buyerCookie, otherCookie, licence } = await scene()
    expect((await start(otherCookie, { licenceId: licence.id, colorway: 0, diameterIn: 18, paper: 'letter' })).status).toBe(404)
    const colourless = await start(buyerCookie, { licenceId: licence.id, colorway: 5, diameterIn: 18, paper: 'letter' })
    expect(colourless.status).toBe(422)
    expect(colourless.json!.error.issues).toEqual([expect.objectContaining({ path: 'colorway' })])
    const both = await start(buyerCookie, { licenceId: licence.id, invitationId: randomUUID(), colorway: 0, diameterIn: 18, paper: 'letter' })
    expect(both.status).toBe(422)
    expect(both.json!.error.issues[0].path).toBe('licenceId')
    const badPaper = await start(buyerCookie, { licenceId: licence.id, colorway: 0, diameterIn: 18, paper: 'napkin' })
    expect(badPaper.json!.error.issues[0].path).toBe('paper')
    await licence.update({ revokedAt: new Date() })
    expect((await start(buyerCookie, { licenceId: licence.id, colorway: 0, diameterIn: 18, paper: 'letter' })).status).toBe(404)
    expect(await SewingProject.count()).toBe(0)
  })

  it('lets a tester start one under an accepted invitation while the pattern is in testing', async () => {
    const designer = await createUser({ roles: ['quilter', 'designer'] })
    const pattern = await createPatternRow(designer, { name: 'Hollyberry Wreath', state: 'testing', design: hollyberryWreath })
    const tester = await createUser({ displayName: 'Priya Shah' })
    const testerCookie = await sessionCookieFor(tester)
    const invitation = await Invitation.create({
      patternId: pattern.id, email: tester.email, invitedById: designer.id, userId: tester.id, acceptedAt: new Date(), withdrawnAt: null, expiresAt: new Date(Date.now() + 7 * 86_400_000),
    })
    const started = await start(testerCookie, { invitationId: invitation.id, colorway: 0, diameterIn: 18, paper: 'letter' })
    expect(started.status).toBe(201)
    expect(started.json!.project.invitationId).toBe(invitation.id)
    const stranger = await createUser()
    expect((await start(await sessionCookieFor(stranger), { invitationId: invitation.id, colorway: 0, diameterIn: 18, paper: 'letter' })).status).toBe(404)
    // Withdrawn: the tester's project closes.
    await invitation.update({ withdrawnAt: new Date() })
    expect((await read(testerCookie, started.json!.project.id)).status).toBe(404)
    expect((await call(listRoute, { cookie: testerCookie })).json!.projects).toEqual([])
  })
})

describe('a project and its steps', () => {
  async function started() {
    const world = await scene()
    const answer = await start(world.buyerCookie, { licenceId: world.licence.id, colorway: 0, diameterIn: 18, paper: 'letter' })
    return { ...world, projectId: answer.json!.project.id as string }
  }

  it('shows the checklist with progress and the picture to its owner only', async () => {
    const { buyerCookie, otherCookie, designer, projectId } = await started()
    const detail = await read(buyerCookie, projectId)
    expect(detail.status).toBe(200)
    const { groups, steps, picture, nextStepId } = readPlan(detail.json! as PlanAnswer)
    expect(groups.map((group: { id: string }) => group.id)).toEqual(['prepare-leaves', 'cut', 'repeat-1', 'repeat-2', 'repeat-3', 'repeat-4', 'join-sections', 'join-repeats', 'finishing'])
    expect(nextStepId).toBe(steps[0]!.id)
    expect(steps.find((step) => step.id === 'r3:area:A4')).toMatchObject({ group: 'repeat-3', repeat: 3, done: false, note: null, areas: [expect.stringMatching(/^area-/)] })
    expect(picture.viewBox).toEqual([-9, -9, 18, 18])
    expect(picture.areas.length).toBe(11)
    expect(picture.repeats.length).toBe(4)
    // Each instruction is sent once: the four repeats say the same things.
    expect(detail.json!.words.length).toBeLessThan(steps.length / 2)
    // Another quilter, the designer (not even they), and nobody signed in.
    expect((await read(otherCookie, projectId)).status).toBe(404)
    expect((await read(await sessionCookieFor(designer), projectId)).status).toBe(404)
    expect((await read(undefined, projectId)).status).toBe(401)
    expect((await read(buyerCookie, randomUUID())).status).toBe(404)
    expect((await read(buyerCookie, 'not-a-uuid')).status).toBe(404)
  })

  it('ticks, notes and unticks one step at a time, idempotently', async () => {
    const { buyerCookie, projectId } = await started()
    const ticked = await patch(buyerCookie, projectId, { stepId: 'r1:area:A1', done: true })
    expect(ticked.status).toBe(200)
    expect(ticked.json!.step).toMatchObject({ id: 'r1:area:A1', done: true, note: null })
    expect((await patch(buyerCookie, projectId, { stepId: 'r1:area:A1', done: true })).json!.step).toMatchObject({ done: true })
    const noted = await patch(buyerCookie, projectId, { stepId: 'r1:area:A1', note: '  used the darker white  ' })
    // A note leaves the tick as it was.
    expect(noted.json!.step).toMatchObject({ done: true, note: 'used the darker white' })
    expect((await patch(buyerCookie, projectId, { stepId: 'r1:area:A1', done: false })).json!.step).toMatchObject({ done: false, note: 'used the darker white' })
    expect((await patch(buyerCookie, projectId, { stepId: 'r1:area:A1', note: null })).json!.step).toMatchObject({ note: null })
    expect(await SewingStep.count()).toBe(1)
    await patch(buyerCookie, projectId, { stepId: 'leaves:leaf-dark', done: true })
    const detail = (await read(buyerCookie, projectId)).json!
    expect(detail.project.done).toBe(1)
    expect(detail.groups[0]).toMatchObject({ id: 'prepare-leaves', done: 1, total: 2 })
    expect(detail.nextStepId).toBe('leaves:leaf-light')
  })

  it('answers a page asking again with the tag of what it has 304, without the plan, until a tick changes it', async () => {
    const { buyerCookie, otherCookie, projectId } = await started()
    const first = await read(buyerCookie, projectId)
    const etag = first.headers.get('etag')!
    expect(etag).toMatch(/^"[\w-]+"$/)
    const again = (cookie: string, tag: string) => call(projectRoute, { cookie, params: { id: projectId }, headers: { 'if-none-match': tag } })
    const unchanged = await again(buyerCookie, etag)
    expect(unchanged.status).toBe(304)
    expect(unchanged.text).toBe('')
    // The tag opens nothing: someone else asking with it is still told there is no such project.
    expect((await again(otherCookie, etag)).status).toBe(404)
    await patch(buyerCookie, projectId, { stepId: 'r1:area:A1', done: true })
    const changed = await again(buyerCookie, etag)
    expect(changed.status).toBe(200)
    expect(changed.headers.get('etag')).not.toBe(etag)
    expect(changed.json!.project.done).toBe(1)
  })

  it('keeps both of two ticks of different steps sent at once', async () => {
    const { buyerCookie, projectId } = await started()
    const ids = ['r1:area:A1', 'r1:area:A2', 'r2:area:B3', 'finish:binding', 'cut:background', 'ring:join:2']
    const answers = await Promise.all(ids.map((stepId) => patch(buyerCookie, projectId, { stepId, done: true })))
    expect(answers.map((answer) => answer.status)).toEqual(ids.map(() => 200))
    const detail = await plan(buyerCookie, projectId)
    expect(detail.steps.filter((step) => step.done).map((step) => step.id).sort()).toEqual([...ids].sort())
    // The same step from two devices: one state, the last write's.
    await Promise.all([patch(buyerCookie, projectId, { stepId: 'r1:area:A3', done: true }), patch(buyerCookie, projectId, { stepId: 'r1:area:A3', note: 'pressed twice' })])
    const a3 = (await plan(buyerCookie, projectId)).steps.find((step) => step.id === 'r1:area:A3')
    expect(a3).toMatchObject({ done: true, note: 'pressed twice' })
  })

  it('refuses a step the checklist lacks, a note too long and an empty change, naming the field', async () => {
    const { buyerCookie, projectId } = await started()
    const unknown = await patch(buyerCookie, projectId, { stepId: 'r9:area:Z9', done: true })
    expect(unknown.status).toBe(422)
    expect(unknown.json!.error.issues).toEqual([expect.objectContaining({ path: 'stepId' })])
    const long = await patch(buyerCookie, projectId, { stepId: 'r1:area:A1', note: 'x'.repeat(MAX_SEWING_NOTE_LENGTH + 1) })
    expect(long.status).toBe(422)
    expect(long.json!.error.issues[0].path).toBe('note')
    const empty = await patch(buyerCookie, projectId, { stepId: 'r1:area:A1' })
    expect(empty.status).toBe(422)
    expect(await SewingStep.count()).toBe(0)
  })

  it('lets only the owner holding the licence change it; a refund closes it, and the owner may still delete it', async () => {
    const { buyerCookie, otherCookie, licence, projectId } = await started()
    expect((await patch(otherCookie, projectId, { stepId: 'r1:area:A1', done: true })).status).toBe(404)
    expect((await call(deleteRoute, { method: 'DELETE', cookie: otherCookie, params: { id: projectId } })).status).toBe(404)
    await licence.update({ revokedAt: new Date() })
    expect((await patch(buyerCookie, projectId, { stepId: 'r1:area:A1', done: true })).status).toBe(404)
    expect((await read(buyerCookie, projectId)).status).toBe(404)
    expect((await call(listRoute, { cookie: buyerCookie })).json!.projects).toEqual([])
    expect(await SewingStep.count()).toBe(0)
    const deleted = await call(deleteRoute, { method: 'DELETE', cookie: buyerCookie, params: { id: projectId } })
    expect(deleted.status).toBe(200)
    expect(await SewingProject.count()).toBe(0)
  })

  it('goes with its owner when the account is deleted', async () => {
    const { buyer, buyerCookie, projectId } = await started()
    await patch(buyerCookie, projectId, { stepId: 'r1:area:A1', done: true })
    await buyer.destroy()
    expect(await SewingProject.count()).toBe(0)
    expect(await SewingStep.count()).toBe(0)
  })
})

describe('the demo', () => {
  it('has a buyer part way through the demo wreath', async () => {
    await seedDemoData()
    const elsie = await User.findOne({ where: { email: DEMO_SEWING.buyer } })
    const cookie = await sessionCookieFor(elsie!)
    const { projects } = (await call(listRoute, { cookie })).json!
    expect(projects).toEqual([expect.objectContaining({ patternName: DEMO_SEWING.pattern, name: DEMO_SEWING.name, diameterIn: 18 })])
    const detail = await plan(cookie, projects[0].id)
    // The leaves and the cutting done, then the first three areas of repeat 1; the fourth is next.
    expect(detail.groups.slice(0, 3)).toEqual([
      expect.objectContaining({ id: 'prepare-leaves', done: 2, total: 2 }),
      expect.objectContaining({ id: 'cut', done: detail.groups[1]!.total }),
      expect.objectContaining({ id: 'repeat-1', done: 3 }),
    ])
    expect(detail.nextStepId).toBe('r1:area:A4')
    expect(detail.steps.find((step) => step.id === DEMO_SEWING.note.stepId)!.note).toBe(DEMO_SEWING.note.text)
    // Loading the demo again adds nothing.
    await seedDemoData()
    expect(await SewingProject.count()).toBe(1)
  })
})
