import Papa from 'papaparse'
import { afterAll, beforeEach, describe, expect, it } from 'vitest'
import { POST as refundRoute } from '@/app/api/admin/orders/[id]/refund/route'
import { GET as library } from '@/app/api/library/route'
import { GET as salesCsvRoute } from '@/app/api/sales/csv/route'
import { GET as salesRoute } from '@/app/api/sales/route'
import { POST as checkout } from '@/app/api/shop/checkout/route'
import { emptyDesign } from '@/lib/new-design'
import { AdminAuditEntry, Licence, Order, PaymentEvent } from '@/models'
import { emptyAdminLogs } from '../support/audit-log'
import { closeDatabase, freshDatabase } from '../support/database'
import { createPatternRow, createUser, sessionCookieFor } from '../support/factories'
import { clearMailQueue, clearMails, useMailWorker } from '../support/mail'
import { TEST_ORIGIN, call } from '../support/requests'
import { clearPayments, eventually, payOnHostedPage, usePaymentFake } from '../support/payments'

useMailWorker()
usePaymentFake()

beforeEach(async () => {
  await freshDatabase()
  await clearPayments()
  await clearMails()
  await clearMailQueue()
  await emptyAdminLogs()
})
afterAll(closeDatabase)

const HOLLY = { name: 'Holly', fabrics: { background: { name: 'Cream', color: '#f4ecd8' }, band: { name: 'Holly green', color: '#2f5540' } } }
const FROST = { name: 'Frost', fabrics: { background: { name: 'Snow', color: '#f6f1e7' }, band: { name: 'Ice blue', color: '#41607a' } } }

/** A designer's published pattern in two colourways at 12.50 EUR, a quilter and an admin, each with a session. */
async function scene() {
  const designer = await createUser({ roles: ['quilter', 'designer'], displayName: 'Maren Holt' })
  const pattern = await createPatternRow(designer, { name: 'Hollyhock Ring', state: 'published', design: { ...emptyDesign('Hollyhock Ring'), colorways: [HOLLY, FROST] } })
  await pattern.update({ priceCents: 1250, currency: 'EUR' })
  const quilter = await createUser({ displayName: 'Odile Brandt' })
  const admin = await createUser({ roles: ['admin'], displayName: 'Ada Desk' })
  return { designer, pattern, quilter, admin, cookie: await sessionCookieFor(quilter) }
}

/** Buys the pattern on the fake's page and waits for the licence the webhook grants. */
async function buy(cookie: string, body: object, quilterId: string) {
  const answer = await call(checkout, { method: 'POST', cookie, body })
  expect(answer.status).toBe(201)
  await payOnHostedPage(answer.json!.url)
  await eventually(async () => {
    if (!(await Licence.findOne({ where: { userId: quilterId, orderId: answer.json!.orderId } }))) throw new Error('no licence yet')
  })
  return (await Order.findByPk(answer.json!.orderId))!
}

describe('the colourway of an order', () => {
  it('refuses a colourway the pattern does not have, naming the field, and records nothing', async () => {
    const { pattern, cookie } = await scene()
    for (const colorway of ['Poppy', 2, -1, '', 'x'.repeat(121)]) {
      const answer = await call(checkout, { method: 'POST', cookie, body: { patternId: pattern.id, colorway } })
      expect(answer.status, String(colorway)).toBe(422)
      expect(answer.json!.error.issues.map((issue: { path: string }) => issue.path), String(colorway)).toEqual(['colorway'])
    }
    expect(await Order.count()).toBe(0)
  })

  it('records the colourway named or numbered; the designer sees it in the sales table and the CSV; the amount is still the server’s', async () => {
    const { designer, pattern, quilter, cookie } = await scene()
    // By place in the list (0 first), with an amount the server must ignore.
    const order = await buy(cookie, { patternId: pattern.id, colorway: 1, amountCents: 1 }, quilter.id)
    expect(order.colorway).toBe('Frost')
    expect(order.amountCents).toBe(1250)
    // By name, for another buyer; and a checkout naming none records none.
    const other = await createUser({ displayName: 'Ines Marlowe' })
    const byName = await buy(await sessionCookieFor(other), { patternId: pattern.id, colorway: 'Holly' }, other.id)
    expect(byName.colorway).toBe('Holly')
    const third = await createUser({ displayName: 'Teodor Lusk' })
    expect((await buy(await sessionCookieFor(third), { patternId: pattern.id }, third.id)).colorway).toBeNull()

    const designerCookie = await sessionCookieFor(designer)
    const sales = await call(salesRoute, { cookie: designerCookie, path: '/api/sales' })
    expect(sales.status).toBe(200)
    expect(Object.fromEntries(sales.json!.sales.map((row: { buyer: string; colorway: string | null }) => [row.buyer, row.colorway]))).toEqual({
      'Odile Brandt': 'Frost',
      'Ines Marlowe': 'Holly',
      'Teodor Lusk': null,
    })
    const csv = await salesCsvRoute(new Request(`${TEST_ORIGIN}/api/sales/csv`, { headers: { host: new URL(TEST_ORIGIN).host, cookie: designerCookie } }), { params: Promise.resolve({}) })
    const rows = Papa.parse<Record<string, string>>(await csv.text(), { header: true, skipEmptyLines: true }).data
    expect(Object.fromEntries(rows.map((row) => [row.Buyer, row.Colourway]))).toEqual({ 'Odile Brandt': 'Frost', 'Ines Marlowe': 'Holly', 'Teodor Lusk': '' })
  })
})

describe('an admin’s refund', () => {
  const refund = async (user: { id: string } | null, orderId: string) =>
    call(refundRoute, { method: 'POST', cookie: user ? await sessionCookieFor(user) : undefined, params: { id: orderId } })

  it('is refused to strangers (401) and to anyone but an admin (404, like the rest of the admin desk), and changes nothing', async () => {
    const { designer, pattern, quilter, cookie } = await scene()
    const order = await buy(cookie, { patternId: pattern.id }, quilter.id)
    expect((await refund(null, order.id)).status).toBe(401)
    expect((await refund(quilter, order.id)).status).toBe(404)
    // Not even the pattern's designer.
    expect((await refund(designer, order.id)).status).toBe(404)
    await new Promise((resolve) => setTimeout(resolve, 1000))
    expect((await order.reload()).refundRequestedAt).toBeNull()
    expect(await PaymentEvent.count({ where: { type: 'charge.refunded' } })).toBe(0)
    expect(await AdminAuditEntry.count()).toBe(0)
  })

  it('asks the provider; the licence is revoked only when the refund event arrives; the audit log has it; twice is 409', async () => {
    const { pattern, quilter, admin, cookie } = await scene()
    const order = await buy(cookie, { patternId: pattern.id, colorway: 'Frost' }, quilter.id)
    const asked = await refund(admin, order.id)
    expect(asked.status).toBe(202)
    expect(asked.json).toMatchObject({ id: order.id, state: 'paid' })
    // The refund is the provider's to confirm: the licence goes when its event is processed.
    const licence = await eventually(async () => {
      const revoked = await Licence.findOne({ where: { orderId: order.id } })
      if (!revoked?.revokedAt) throw new Error('not revoked yet')
      return revoked
    })
    expect(licence.revokedAt).toBeInstanceOf(Date)
    expect((await order.reload()).state).toBe('refunded')
    const event = await PaymentEvent.findOne({ where: { type: 'charge.refunded' } })
    expect(event).toMatchObject({ state: 'processed', paymentIntentId: order.paymentIntentId })
    expect(event!.note).toContain(`licence ${licence.number} revoked`)
    expect((await call(library, { cookie })).json!.licences).toEqual([])

    const entries = await AdminAuditEntry.findAll()
    expect(entries).toHaveLength(1)
    expect(entries[0]).toMatchObject({ actorId: admin.id, action: 'refund-order', targetId: order.id, details: { orderId: order.id, amountCents: 1250, currency: 'EUR' } })
    expect(entries[0]!.targetLabel).toContain('Hollyhock Ring')

    // Again: 409, and no second request reaches the provider.
    const again = await refund(admin, order.id)
    expect(again.status).toBe(409)
    await new Promise((resolve) => setTimeout(resolve, 1000))
    expect(await PaymentEvent.count({ where: { type: 'charge.refunded' } })).toBe(1)
    expect(await AdminAuditEntry.count()).toBe(1)
  })

  it('is 409 while an asked-for refund waits for the provider, and for an order never paid; 404 for no such order', async () => {
    const { pattern, quilter, admin, cookie } = await scene()
    const order = await buy(cookie, { patternId: pattern.id }, quilter.id)
    // As if the refund were asked and its event not yet here.
    await order.update({ refundRequestedAt: new Date() })
    expect((await refund(admin, order.id)).status).toBe(409)
    const other = await createUser({ displayName: 'Ines Marlowe' })
    const pending = await call(checkout, { method: 'POST', cookie: await sessionCookieFor(other), body: { patternId: pattern.id } })
    expect((await refund(admin, pending.json!.orderId)).status).toBe(409)
    expect((await refund(admin, '00000000-0000-4000-8000-000000000000')).status).toBe(404)
    expect((await refund(admin, 'not-an-id')).status).toBe(404)
    expect(await AdminAuditEntry.count()).toBe(0)
  })
})
