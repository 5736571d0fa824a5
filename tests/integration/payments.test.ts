import { afterAll, beforeEach, describe, expect, it } from 'vitest'
import { POST as checkout } from '@/app/api/shop/checkout/route'
import { GET as orderStatus } from '@/app/api/shop/orders/[id]/route'
import { POST as webhook } from '@/app/api/webhooks/payments/route'
import { GET as library } from '@/app/api/library/route'
import { GET as paymentLog } from '@/app/api/admin/payments/route'
import { libraryAnswerSchema } from '@/lib/schemas/shop'
import { Licence, Order, PaymentEvent, Pattern } from '@/models'
import { closeDatabase, freshDatabase } from '../support/database'
import { createPatternRow, createUser, sessionCookieFor } from '../support/factories'
import { clearMailQueue, clearMails, useMailWorker, waitForMail } from '../support/mail'
import { call } from '../support/requests'
import { clearPayments, eventually, payOnHostedPage, provider, resendEvent, sentEvents, signed, usePaymentFake } from '../support/payments'

useMailWorker()
usePaymentFake()

beforeEach(async () => {
  await freshDatabase()
  await clearPayments()
  await clearMails()
  await clearMailQueue()
})
afterAll(closeDatabase)

/** A designer's published pattern at 12.50 EUR, and a quilter with a session. */
async function shopScene(overrides: { state?: Pattern['state'] } = {}) {
  const designer = await createUser({ roles: ['quilter', 'designer'], displayName: 'Maren Holt', email: `maren-${Date.now()}@example.test` })
  const pattern = await createPatternRow(designer, { name: 'Hollyhock Ring', state: overrides.state ?? 'published' })
  await pattern.update({ priceCents: 1250, currency: 'EUR' })
  const quilter = await createUser({ displayName: 'Odile Brandt', email: `odile-${Date.now()}@example.test` })
  return { designer, pattern, quilter, cookie: await sessionCookieFor(quilter) }
}

async function startCheckout(cookie: string, body: object) {
  return call(checkout, { method: 'POST', cookie, body })
}

async function postEvent(body: string, signature: string | null) {
  return call(webhook, { method: 'POST', rawBody: body, origin: null, headers: signature ? { 'stripe-signature': signature } : {} })
}

/** A completed, paid checkout session event for `order`, as the provider would send it. */
function completedEvent(order: Order, paymentIntent: string, id = `evt_test_${Math.random().toString(36).slice(2)}`) {
  return {
    id,
    object: 'event',
    type: 'checkout.session.completed',
    created: Math.floor(Date.now() / 1000),
    livemode: false,
    data: {
      object: {
        id: order.checkoutSessionId,
        object: 'checkout.session',
        amount_total: order.amountCents,
        currency: order.currency.toLowerCase(),
        payment_status: 'paid',
        status: 'complete',
        payment_intent: paymentIntent,
      },
    },
  }
}

function refundedEvent(paymentIntent: string, amount: number) {
  return {
    id: `evt_test_${Math.random().toString(36).slice(2)}`,
    object: 'event',
    type: 'charge.refunded',
    created: Math.floor(Date.now() / 1000),
    livemode: false,
    data: { object: { id: 'ch_test_1', object: 'charge', amount, amount_refunded: amount, refunded: true, payment_intent: paymentIntent, currency: 'eur' } },
  }
}

describe('checkout', () => {
  it('charges the pattern’s own price even when the client sends another (read back from the provider)', async () => {
    const { pattern, cookie } = await shopScene()
    const answer = await startCheckout(cookie, { patternId: pattern.id, amountCents: 1, priceCents: 1, currency: 'USD' })
    expect(answer.status).toBe(201)
    const order = await Order.findByPk(answer.json!.orderId)
    expect(order).toMatchObject({ state: 'pending', amountCents: 1250, currency: 'EUR' })
    const session = await provider().checkout.sessions.retrieve(order!.checkoutSessionId)
    expect(session.amount_total).toBe(1250)
    expect(session.currency).toBe('eur')
    expect(session.url).toBe(answer.json!.url)
  })

  it('refuses a pattern that is not published or is hidden, one’s own pattern, and strangers', async () => {
    const { designer, pattern, cookie } = await shopScene({ state: 'testing' })
    expect((await startCheckout(cookie, { patternId: pattern.id })).status).toBe(404)
    await pattern.update({ state: 'retired' })
    expect((await startCheckout(cookie, { patternId: pattern.id })).status).toBe(404)
    // A listing an admin hid is not for sale either.
    await pattern.update({ state: 'published', hiddenAt: new Date() })
    expect((await startCheckout(cookie, { patternId: pattern.id })).status).toBe(404)
    await pattern.update({ hiddenAt: null })
    expect((await startCheckout(await sessionCookieFor(designer), { patternId: pattern.id })).status).toBe(403)
    expect((await call(checkout, { method: 'POST', body: { patternId: pattern.id } })).status).toBe(401)
    expect(await Order.count()).toBe(0)
  })
})

describe('the payment webhook', () => {
  it('refuses a missing or wrong signature, logs it as refused and grants nothing', async () => {
    const { pattern, cookie } = await shopScene()
    const answer = await startCheckout(cookie, { patternId: pattern.id })
    const order = (await Order.findByPk(answer.json!.orderId))!
    const forged = signed(completedEvent(order, 'pi_forged'), 'whsec_someone_else')
    expect((await postEvent(forged.body, forged.signature)).status).toBe(400)
    expect((await postEvent(forged.body, null)).status).toBe(400)
    expect((await postEvent(forged.body, 't=1,v1=00')).status).toBe(400)
    expect(await PaymentEvent.count({ where: { state: 'refused' } })).toBe(3)
    expect(await PaymentEvent.count({ where: { state: 'received' } })).toBe(0)
    await new Promise((resolve) => setTimeout(resolve, 1500))
    expect(await Licence.count()).toBe(0)
    expect((await order.reload()).state).toBe('pending')
  })

  it('grants one licence for a payment on the provider’s page, sends the receipt and the sale notice, and counts a repeated event once', async () => {
    const { pattern, quilter, designer, cookie } = await shopScene()
    const answer = await startCheckout(cookie, { patternId: pattern.id })
    const back = await payOnHostedPage(answer.json!.url)
    expect(back).toContain(`/shop/checkout/done?order=${answer.json!.orderId}`)
    const licence = await eventually(async () => {
      const found = await Licence.findOne({ where: { userId: quilter.id } })
      if (!found) throw new Error('no licence yet')
      return found
    })
    expect(licence.number).toMatch(/^WL-\d{6}$/)
    const status = await call(orderStatus, { cookie, params: { id: answer.json!.orderId } })
    expect(status.json!.order).toMatchObject({ state: 'paid', licence: { number: licence.number, revoked: false } })

    const receipt = await waitForMail({ to: quilter.email, kind: 'purchase-receipt' })
    // 1250 cents of EUR, as Intl.NumberFormat('en') writes it.
    expect(receipt.text).toContain('€12.50')
    expect(receipt.text).toContain(licence.number)
    const sale = await waitForMail({ to: designer.email, kind: 'pattern-sold' })
    expect(sale.text).toContain('Hollyhock Ring')

    // The provider delivers the same event again; then someone replays it by hand.
    const sessionId = (await Order.findByPk(answer.json!.orderId))!.checkoutSessionId
    const [completed] = (await sentEvents()).filter((sent) => sent.event.type === 'checkout.session.completed' && sent.event.data.object.id === sessionId)
    await resendEvent(completed!.event.id)
    const replay = signed(completed!.event)
    const replayed = await postEvent(replay.body, replay.signature)
    expect(replayed.json).toEqual({ received: true, duplicate: true })
    await new Promise((resolve) => setTimeout(resolve, 1500))
    expect(await Licence.count({ where: { userId: quilter.id } })).toBe(1)
    expect(await PaymentEvent.count({ where: { providerEventId: completed!.event.id } })).toBe(1)

    const listed = libraryAnswerSchema.parse((await call(library, { cookie })).json)
    expect(listed.licences).toEqual([expect.objectContaining({ id: licence.id, number: licence.number, patternId: pattern.id, patternName: 'Hollyhock Ring', designer: 'Maren Holt' })])
    // Buying it again is refused: the licence is held.
    expect((await startCheckout(cookie, { patternId: pattern.id })).status).toBe(409)
  })

  it('revokes the licence when the provider refunds the payment', async () => {
    const { pattern, quilter, cookie } = await shopScene()
    const answer = await startCheckout(cookie, { patternId: pattern.id })
    await payOnHostedPage(answer.json!.url)
    const order = await eventually(async () => {
      const paid = await Order.findByPk(answer.json!.orderId)
      if (paid?.state !== 'paid') throw new Error('not paid yet')
      return paid
    })
    const refund = await provider().refunds.create({ payment_intent: order.paymentIntentId! })
    expect(refund.amount).toBe(1250)
    const licence = await eventually(async () => {
      const revoked = await Licence.findOne({ where: { userId: quilter.id } })
      if (!revoked?.revokedAt) throw new Error('not revoked yet')
      return revoked
    })
    expect(licence.revokedAt).toBeInstanceOf(Date)
    expect((await order.reload()).state).toBe('refunded')
    expect((await call(library, { cookie })).json!.licences).toEqual([])
  })

  it('ends revoked when the refund arrives before the payment', async () => {
    const { pattern, quilter, cookie } = await shopScene()
    const answer = await startCheckout(cookie, { patternId: pattern.id })
    const order = (await Order.findByPk(answer.json!.orderId))!
    const refund = signed(refundedEvent('pi_test_out_of_order', 1250))
    expect((await postEvent(refund.body, refund.signature)).status).toBe(200)
    await eventually(async () => {
      if ((await PaymentEvent.findOne({ where: { type: 'charge.refunded' } }))?.state !== 'processed') throw new Error('refund not processed yet')
    })
    const completed = signed(completedEvent(order, 'pi_test_out_of_order'))
    expect((await postEvent(completed.body, completed.signature)).status).toBe(200)
    const licence = await eventually(async () => {
      const found = await Licence.findOne({ where: { userId: quilter.id } })
      if (!found) throw new Error('no licence yet')
      return found
    })
    expect(licence.revokedAt).toBeInstanceOf(Date)
    expect((await order.reload()).state).toBe('refunded')
  })

  it('shows admins every call in the payment log, and nobody else', async () => {
    const { cookie } = await shopScene()
    await postEvent('{}', 't=1,v1=00')
    const admin = await createUser({ roles: ['quilter', 'admin'] })
    const log = await call(paymentLog, { cookie: await sessionCookieFor(admin), path: '/api/admin/payments?page=1' })
    expect(log.status).toBe(200)
    expect(log.json!.rows).toEqual([expect.objectContaining({ state: 'refused', note: expect.stringContaining('bad signature') })])
    expect((await call(paymentLog, { cookie, path: '/api/admin/payments?page=1' })).status).toBe(404)
  })
})
