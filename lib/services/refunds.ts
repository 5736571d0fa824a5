import 'server-only'
import Stripe from 'stripe'
import { Op, Transaction } from 'sequelize'
import { authorize, type Actor } from '@/lib/authorization'
import { database } from '@/lib/db'
import { ConflictError, NotFoundError, ServiceError } from '@/lib/errors'
import { paymentProvider } from '@/lib/payments/provider'
import { ADMIN_PAGE_SIZE, type Page, type PageQuery } from '@/lib/schemas/admin'
import { formatPrice } from '@/lib/shop/price'
import { AdminAuditEntry, Licence, Order, Pattern, User } from '@/models'
import type { OrderState } from '@/models/order'

/**
 * Refunds an admin makes from the payment log (issue 14): the admin asks the payment provider,
 * through its SDK, to refund a paid order in full. Nothing else changes here: the order stays
 * 'paid' and its licence live until the provider's `charge.refunded` event arrives through the
 * verified webhook, exactly as for a refund made at the provider (lib/payments/process.ts). The
 * request is recorded on the order (`refundRequestedAt`, so a second one is refused before it
 * reaches the provider) and in the audit log, in one transaction.
 */

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i

/** One order as the payment log's orders table shows it. */
export interface AdminOrderRow {
  id: string
  createdAt: string
  paidAt: string | null
  state: OrderState
  pattern: string
  /** The buyer's display name; null once they deleted their account. */
  buyer: string | null
  amountCents: number
  currency: string
  colorway: string | null
  licenceNumber: string | null
  /** When an admin asked for a refund that the provider has not confirmed yet (or confirmed: then `refundedAt` is set too). */
  refundRequestedAt: string | null
  refundedAt: string | null
}

type OrderWithParts = Order & { pattern?: Pattern; buyer?: User | null }

/**
 * The shop's paid and refunded orders, newest first, a page at a time (admins only: 404 for
 * others, as the whole desk).
 *
 * @example await listOrdersForRefund(admin, { page: 1 }) // { rows: [ { pattern: 'Hollyberry Wreath', state: 'paid', … } ], page: 1, pageSize: 50, total: 12, pageCount: 1 }
 */
export async function listOrdersForRefund(actor: Actor, query: PageQuery): Promise<Page<AdminOrderRow>> {
  authorize(actor, 'read-payment-log')
  database()
  const { rows, count } = await Order.findAndCountAll({
    where: { state: { [Op.in]: ['paid', 'refunded'] } },
    include: [
      { model: Pattern, as: 'pattern', attributes: ['name'], required: true },
      { model: User, as: 'buyer', attributes: ['displayName'], required: false },
    ],
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
    limit: ADMIN_PAGE_SIZE,
    offset: (query.page - 1) * ADMIN_PAGE_SIZE,
  })
  const orders = rows as OrderWithParts[]
  const licences = orders.length === 0 ? [] : await Licence.findAll({ where: { orderId: { [Op.in]: orders.map((order) => order.id) } }, attributes: ['orderId', 'number'] })
  const numberOf = new Map(licences.map((licence) => [licence.orderId, licence.number]))
  return {
    rows: orders.map((order) => ({
      id: order.id,
      createdAt: order.createdAt.toISOString(),
      paidAt: order.paidAt?.toISOString() ?? null,
      state: order.state,
      pattern: order.pattern!.name,
      buyer: order.buyer?.displayName ?? null,
      amountCents: order.amountCents,
      currency: order.currency,
      colorway: order.colorway,
      licenceNumber: numberOf.get(order.id) ?? null,
      refundRequestedAt: order.refundRequestedAt?.toISOString() ?? null,
      refundedAt: order.refundedAt?.toISOString() ?? null,
    })),
    page: query.page,
    pageSize: ADMIN_PAGE_SIZE,
    total: count,
    pageCount: Math.max(1, Math.ceil(count / ADMIN_PAGE_SIZE)),
  }
}

/** `POST /api/admin/orders/:id/refund`'s answer: the refund is asked for; the licence goes when the provider confirms it. */
export interface RefundRequested {
  id: string
  state: OrderState
  refundRequestedAt: string
}

/**
 * Asks the provider to refund an order in full (`POST /api/admin/orders/:id/refund`). Refused:
 * strangers (401), anyone but an admin (403), a missing order (404), an order refunded already, or
 * whose refund is already asked for, or that was never paid (409), the provider refusing or not
 * answering (502; nothing is recorded, and asking again is safe: the request carries the same
 * idempotency key).
 *
 * @example await refundOrder(admin, orderId) // { id: orderId, state: 'paid', refundRequestedAt: '2026-12-02T12:00:00.000Z' }
 */
export async function refundOrder(actor: Actor, orderId: string): Promise<RefundRequested> {
  authorize(actor, 'refund-order')
  const sequelize = database()
  return sequelize.transaction(async (transaction) => {
    // The row stays locked while the provider is asked, so two admins pressing at once make one request.
    const order = UUID.test(orderId) ? await Order.findByPk(orderId, { lock: Transaction.LOCK.UPDATE, transaction }) : null
    if (!order) throw new NotFoundError('No such order.')
    if (order.state === 'refunded') throw new ConflictError('This order was refunded already; its licence is revoked.', { refundedAt: order.refundedAt?.toISOString() ?? null })
    if (order.refundRequestedAt) {
      throw new ConflictError('A refund of this order was asked for already; the licence is revoked when the payment provider confirms it.', { refundRequestedAt: order.refundRequestedAt.toISOString() })
    }
    if (order.state !== 'paid' || !order.paymentIntentId) throw new ConflictError('This order was never paid: there is nothing to refund.')
    // One after another: a transaction is one connection, which runs one statement at a time.
    const admin = await User.findByPk(actor.id, { transaction })
    const buyer = order.buyerId ? await User.findByPk(order.buyerId, { attributes: ['displayName', 'email'], transaction }) : null
    const pattern = await Pattern.findByPk(order.patternId, { attributes: ['name'], transaction })
    if (!admin) throw new NotFoundError('Your account no longer exists.')
    try {
      await paymentProvider().refunds.create(
        { payment_intent: order.paymentIntentId, metadata: { orderId: order.id } },
        // The provider answers a repeated request with the same refund (a retry after a lost answer).
        { idempotencyKey: `refund-${order.id}` },
      )
    } catch (error) {
      // The provider says so when the charge was refunded at its end (its dashboard, say) and the event is still on its way.
      if (error instanceof Stripe.errors.StripeInvalidRequestError && /already been refunded/i.test(error.message)) {
        throw new ConflictError('The payment provider says this payment was refunded already; the licence is revoked when its event arrives.')
      }
      console.error(`payments: the provider refused or did not answer a refund of order ${order.id} (${(error as Error).message})`)
      throw new ServiceError('The payment provider did not refund it; nothing was changed. Try again in a moment.', 502)
    }
    const refundRequestedAt = new Date()
    await order.update({ refundRequestedAt }, { transaction })
    await AdminAuditEntry.create(
      {
        actorId: admin.id,
        actorLabel: `${admin.displayName} <${admin.email}>`,
        action: 'refund-order',
        targetId: order.id,
        targetLabel: `order for “${pattern?.name ?? 'a pattern'}” bought by ${buyer ? `${buyer.displayName} <${buyer.email}>` : 'a former customer'} (${formatPrice(order.amountCents, order.currency)})`,
        details: { orderId: order.id, amountCents: order.amountCents, currency: order.currency },
      },
      { transaction },
    )
    return { id: order.id, state: order.state, refundRequestedAt: refundRequestedAt.toISOString() }
  })
}
