/**
 * The sewing room's writes are rate limited like the other costly routes (lib/rate-limits.ts,
 * counters in PostgreSQL): starting a project, and saving step changes. The limits are generous —
 * a quick quilter never meets them — and a refusal is a 429 with `Retry-After`.
 */
import { randomUUID } from 'node:crypto'
import { afterAll, beforeEach, describe, expect, it } from 'vitest'
import { PATCH as stepRoute } from '@/app/api/sewing-room/projects/[id]/steps/route'
import { POST as startRoute } from '@/app/api/sewing-room/projects/route'
import { RATE_LIMITS } from '@/lib/rate-limits'
import { Licence, Order, SewingProject, SewingStep } from '@/models'
import { hollyberryWreath } from '@/scripts/demo-wreath'
import { closeDatabase, freshDatabase } from '../support/database'
import { createPatternRow, createUser, sessionCookieFor } from '../support/factories'
import { call } from '../support/requests'

beforeEach(freshDatabase)
afterAll(closeDatabase)

/** A published wreath and two quilters, each holding a licence to it. */
async function scene() {
  const designer = await createUser({ roles: ['quilter', 'designer'] })
  const pattern = await createPatternRow(designer, { name: 'Hollyberry Wreath', state: 'published', design: hollyberryWreath })
  await pattern.update({ priceCents: 1200, currency: 'USD' })
  const quilter = async () => {
    const user = await createUser()
    const order = await Order.create({ id: randomUUID(), buyerId: user.id, patternId: pattern.id, amountCents: 1200, currency: 'USD', checkoutSessionId: `cs_test_${randomUUID()}`, state: 'paid' })
    const licence = await Licence.create({ userId: user.id, patternId: pattern.id, orderId: order.id })
    return { user, licence, cookie: await sessionCookieFor(user) }
  }
  return { first: await quilter(), second: await quilter() }
}

const start = (cookie: string, licenceId: string) => call(startRoute, { method: 'POST', cookie, body: { licenceId, colorway: 0, diameterIn: 18, paper: 'letter' } })
const tick = (cookie: string, id: string, stepId: string, done: boolean) => call(stepRoute, { method: 'PATCH', cookie, params: { id }, body: { stepId, done } })

/** Runs `count` calls, `batch` at a time (a phone's queue sends a few at once). */
async function inBatches<T>(count: number, batch: number, one: (index: number) => Promise<T>): Promise<T[]> {
  const answers: T[] = []
  for (let at = 0; at < count; at += batch) {
    answers.push(...(await Promise.all(Array.from({ length: Math.min(batch, count - at) }, (_, offset) => one(at + offset)))))
  }
  return answers
}

describe('sewing room rate limits', () => {
  it('refuses the start past the hourly limit with 429 and Retry-After, counting refused starts too, per person', async () => {
    const { first, second } = await scene()
    const limit = RATE_LIMITS.sewingProjectStartsPerUser.points
    // A licence that is not theirs is a 404, and still counts: probing ids is what the limit is for.
    expect((await start(first.cookie, second.licence.id)).status).toBe(404)
    const answers = await inBatches(limit - 1, 5, () => start(first.cookie, first.licence.id))
    expect(answers.map((answer) => answer.status)).toEqual(Array(limit - 1).fill(201))
    const refused = await start(first.cookie, first.licence.id)
    expect(refused.status).toBe(429)
    const retryAfter = Number(refused.headers.get('retry-after'))
    expect(retryAfter).toBeGreaterThan(0)
    expect(retryAfter).toBeLessThanOrEqual(RATE_LIMITS.sewingProjectStartsPerUser.windowSeconds)
    expect(refused.json!.error).toEqual({ message: expect.stringMatching(/^Too many new sewing projects; try again in \d+ minutes?\.$/), retryAfterSeconds: retryAfter })
    expect(await SewingProject.count({ where: { ownerId: first.user.id } })).toBe(limit - 1)
    // Someone else is counted apart.
    expect((await start(second.cookie, second.licence.id)).status).toBe(201)
  })

  it('lets a quilter tick fast up to the per-minute limit, then answers 429 with Retry-After and saves nothing more', async () => {
    const { first, second } = await scene()
    const started = await start(first.cookie, first.licence.id)
    expect(started.status).toBe(201)
    const projectId = started.json!.project.id as string
    const other = (await start(second.cookie, second.licence.id)).json!.project.id as string
    const limit = RATE_LIMITS.sewingStepChangesPerUser.points
    // Ticking and unticking the first step as fast as the route answers, four at a time as the sewing room sends.
    const stepId = 'leaves:leaf-light'
    const answers = await inBatches(limit, 4, (index) => tick(first.cookie, projectId, stepId, index % 2 === 0))
    expect(answers.filter((answer) => answer.status !== 200).map((answer) => answer.status)).toEqual([])
    const before = await SewingStep.findOne({ where: { projectId, stepId } })
    const refused = await tick(first.cookie, projectId, stepId, !before!.done)
    expect(refused.status).toBe(429)
    const retryAfter = Number(refused.headers.get('retry-after'))
    expect(retryAfter).toBeGreaterThan(0)
    expect(retryAfter).toBeLessThanOrEqual(RATE_LIMITS.sewingStepChangesPerUser.windowSeconds)
    expect(refused.json!.error.message).toMatch(/^Too many step changes; try again in 1 minute\.$/)
    expect((await SewingStep.findOne({ where: { projectId, stepId } }))!.done).toBe(before!.done)
    // Another quilter ticks on.
    expect((await tick(second.cookie, other, stepId, true)).status).toBe(200)
  })
})
