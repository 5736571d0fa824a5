import 'server-only'
import type Stripe from 'stripe'
import { Op, Transaction } from 'sequelize'
import { database } from '@/lib/db'
import { originSettings } from '@/lib/env'
import { queueMail } from '@/lib/mail/outbox'
import { Licence, Order, Pattern, PaymentEvent, User } from '@/models'
import { formatPrice } from '@/lib/shop/price'

/**
 * Applies one stored, verified payment event (queued by lib/payments/webhook.ts; run by the job
 * worker, lib/jobs/worker.ts), in one transaction with its effects:
 * - `checkout.session.completed`, paid, for the order's amount: the order is paid and its buyer
 *   gets a licence; the receipt and the designer's sale notice are queued in the same transaction.
 * - `charge.refunded`, fully: the order is refunded and its licence revoked.
 * Events may come in any order: a refund whose payment is not applied yet changes nothing, and the
 * payment, when it comes, finds the refund among the stored events and ends revoked. Both take a
 * lock on their payment intent first, so the two never pass each other. Applying an event twice
 * changes nothing the second time.
 */

/** The app's own address, for links in messages. */
const appUrl = () => originSettings().origins[0]!

/** Whether a full refund of this payment intent has been received (processed or not). */
async function refundReceivedFor(paymentIntentId: string, transaction: Transaction): Promise<boolean> {
  const refunds = await PaymentEvent.findAll({
    where: { type: 'charge.refunded', paymentIntentId, state: { [Op.ne]: 'refused' } },
    attributes: ['payload'],
    transaction,
  })
  return refunds.some((event) => (event.payload as Stripe.ChargeRefundedEvent).data.object.refunded)
}

async function revoke(order: Order, transaction: Transaction): Promise<string | null> {
  const now = new Date()
  await order.update({ state: 'refunded', refundedAt: order.refundedAt ?? now }, { transaction })
  const licence = await Licence.findOne({ where: { orderId: order.id }, transaction })
  if (licence && !licence.revokedAt) await licence.update({ revokedAt: now }, { transaction })
  return licence?.number ?? null
}

async function applyCheckoutCompleted(session: Stripe.Checkout.Session, transaction: Transaction): Promise<string> {
  const order = await Order.findOne({ where: { checkoutSessionId: session.id }, lock: Transaction.LOCK.UPDATE, transaction })
  if (!order) return 'no order has this checkout session; nothing granted'
  if (session.payment_status !== 'paid') return `payment status is ${session.payment_status}; nothing granted yet`
  if (session.amount_total !== order.amountCents || session.currency?.toUpperCase() !== order.currency) {
    return `paid ${session.amount_total} ${session.currency}, but the order is for ${order.amountCents} ${order.currency}; nothing granted`
  }
  const paymentIntentId = typeof session.payment_intent === 'string' ? session.payment_intent : (session.payment_intent?.id ?? null)
  if (order.state === 'pending') await order.update({ state: 'paid', paidAt: new Date(), paymentIntentId }, { transaction })
  const existing = await Licence.findOne({ where: { orderId: order.id }, transaction })
  if (existing) return `licence ${existing.number} was granted before; nothing changed`
  if (!order.buyerId) return 'the buyer’s account is gone; no licence granted'
  const licence = await Licence.create({ userId: order.buyerId, patternId: order.patternId, orderId: order.id }, { transaction })
  await licence.reload({ transaction })
  if (order.state === 'refunded' || (paymentIntentId && (await refundReceivedFor(paymentIntentId, transaction)))) {
    await revoke(order, transaction)
    return `licence ${licence.number} granted and revoked at once: the payment was already refunded`
  }
  // One after another: a transaction is one connection, which runs one statement at a time.
  const buyer = await User.findByPk(order.buyerId, { transaction })
  const pattern = await Pattern.findByPk(order.patternId, { transaction, attributes: ['id', 'name', 'ownerId'] })
  const amount = formatPrice(order.amountCents, order.currency)
  if (buyer && pattern) {
    await queueMail(
      { to: buyer.email, userId: buyer.id, kind: 'purchase-receipt', data: { displayName: buyer.displayName, patternName: pattern.name, amount, licenceNumber: licence.number, libraryUrl: `${appUrl()}/library` } },
      { transaction },
    )
  }
  const designer = pattern?.ownerId ? await User.findByPk(pattern.ownerId, { transaction }) : null
  if (designer && pattern) {
    await queueMail(
      { to: designer.email, userId: designer.id, kind: 'pattern-sold', data: { displayName: designer.displayName, patternName: pattern.name, amount, patternUrl: `${appUrl()}/patterns/${pattern.id}` } },
      { transaction },
    )
  }
  return `licence ${licence.number} granted`
}

async function applyChargeRefunded(charge: Stripe.Charge, transaction: Transaction): Promise<string> {
  if (!charge.refunded) return `partly refunded (${charge.amount_refunded} of ${charge.amount}); the licence stays`
  const paymentIntentId = typeof charge.payment_intent === 'string' ? charge.payment_intent : (charge.payment_intent?.id ?? null)
  const order = paymentIntentId ? await Order.findOne({ where: { paymentIntentId }, lock: Transaction.LOCK.UPDATE, transaction }) : null
  if (!order) return 'no paid order has this payment yet; the refund applies when its payment is confirmed'
  if (order.state === 'refunded') return 'refunded before; nothing changed'
  const number = await revoke(order, transaction)
  return number ? `refunded: licence ${number} revoked` : 'refunded; no licence had been granted'
}

/** Applies the stored event `eventId`; throws (so the queue tries again) when that fails. */
export async function processPaymentEvent(eventId: string): Promise<void> {
  const sequelize = database()
  await sequelize.transaction(async (transaction) => {
    const row = await PaymentEvent.findByPk(eventId, { lock: Transaction.LOCK.UPDATE, transaction })
    if (!row || row.state === 'processed' || row.state === 'refused') return
    // A payment and its refund wait for each other here, whichever came first.
    if (row.paymentIntentId) {
      await sequelize.query('SELECT pg_advisory_xact_lock(hashtext(:key))', { replacements: { key: `payment:${row.paymentIntentId}` }, transaction })
    }
    const event = row.payload as Stripe.Event
    let note: string
    if (event.type === 'checkout.session.completed') note = await applyCheckoutCompleted(event.data.object, transaction)
    else if (event.type === 'charge.refunded') note = await applyChargeRefunded(event.data.object, transaction)
    else note = 'not an event the shop acts on'
    await row.update({ state: 'processed', note, processedAt: new Date(), attempts: row.attempts + 1 }, { transaction })
    console.info(`payments: event ${row.providerEventId} (${row.type}): ${note}`)
  })
}

/** Records a failed try; after the queue's last one the event is 'failed' in the payment log. */
export async function recordFailedProcessing(eventId: string, error: unknown, last: boolean): Promise<void> {
  const message = error instanceof Error ? error.message : String(error)
  // One transaction: the count and the note (and 'failed' after the last try) change together.
  await database().transaction(async (transaction) => {
    await PaymentEvent.increment('attempts', { where: { id: eventId }, transaction })
    await PaymentEvent.update({ note: `processing failed: ${message.slice(0, 200)}`, ...(last ? { state: 'failed' as const } : {}) }, { where: { id: eventId }, transaction })
  })
}
