import { randomUUID } from 'node:crypto'
import { afterAll, beforeEach, describe, expect, it } from 'vitest'
import { GET as licensedPattern } from '@/app/api/library/[id]/route'
import { GET as library } from '@/app/api/library/route'
import { can } from '@/lib/authorization'
import { patternFactsWithLicence } from '@/lib/services/licences'
import { Licence, Order } from '@/models'
import { closeDatabase, freshDatabase } from '../support/database'
import { createPatternRow, createUser, sessionCookieFor } from '../support/factories'
import { clearPayments } from '../support/payments'
import { call } from '../support/requests'

beforeEach(async () => {
  await freshDatabase()
  await clearPayments()
})
afterAll(closeDatabase)

/** A published pattern, a buyer holding a licence to it (as a processed payment leaves them), and another quilter. */
async function scene() {
  const designer = await createUser({ roles: ['quilter', 'designer'] })
  const pattern = await createPatternRow(designer, { name: 'Marigold Crown', state: 'published' })
  await pattern.update({ priceCents: 900, currency: 'GBP' })
  const buyer = await createUser({ displayName: 'Tamsin Orr' })
  const other = await createUser()
  const order = await Order.create({ id: randomUUID(), buyerId: buyer.id, patternId: pattern.id, amountCents: 900, currency: 'GBP', checkoutSessionId: `cs_test_${randomUUID()}`, state: 'paid' })
  const licence = await Licence.create({ userId: buyer.id, patternId: pattern.id, orderId: order.id })
  await licence.reload()
  return { designer, pattern, buyer, other, licence }
}

describe('the design file behind a licence', () => {
  it('opens to its holder and to nobody else; a revoked licence opens nothing', async () => {
    const { buyer, other, licence, pattern } = await scene()
    const mine = await call(licensedPattern, { cookie: await sessionCookieFor(buyer), params: { id: licence.id } })
    expect(mine.status).toBe(200)
    expect(mine.json).toMatchObject({ licence: { number: licence.number }, pattern: { id: pattern.id, name: 'Marigold Crown' } })
    expect(mine.json!.pattern.design.format).toBe('wreathwright-design')
    // Another quilter knowing the licence's id gets what a missing one gets.
    expect((await call(licensedPattern, { cookie: await sessionCookieFor(other), params: { id: licence.id } })).status).toBe(404)
    expect((await call(licensedPattern, { params: { id: licence.id } })).status).toBe(401)
    await licence.update({ revokedAt: new Date() })
    expect((await call(licensedPattern, { cookie: await sessionCookieFor(buyer), params: { id: licence.id } })).status).toBe(404)
    expect((await call(library, { cookie: await sessionCookieFor(buyer) })).json!.licences).toEqual([])
  })

  it('lets a holder print (and read) the pattern by the rules, also once it is retired, and nobody without a licence', async () => {
    const { buyer, other, pattern, licence } = await scene()
    expect(can(buyer, 'print-pattern', await patternFactsWithLicence(buyer, pattern))).toBe(true)
    expect(can(buyer, 'read-pattern', await patternFactsWithLicence(buyer, pattern))).toBe(true)
    expect(can(other, 'print-pattern', await patternFactsWithLicence(other, pattern))).toBe(false)
    expect(can(other, 'read-pattern', await patternFactsWithLicence(other, pattern))).toBe(false)
    await pattern.update({ state: 'retired' })
    expect(can(buyer, 'print-pattern', await patternFactsWithLicence(buyer, pattern))).toBe(true)
    const retired = await call(licensedPattern, { cookie: await sessionCookieFor(buyer), params: { id: licence.id } })
    expect(retired.status).toBe(200)
    expect((await call(library, { cookie: await sessionCookieFor(buyer) })).json!.licences).toEqual([
      expect.objectContaining({ id: licence.id, patternState: 'retired', patternName: 'Marigold Crown' }),
    ])
  })
})
