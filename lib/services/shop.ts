import 'server-only'
import { randomUUID } from 'node:crypto'
import { authorize, type Actor } from '@/lib/authorization'
import { database } from '@/lib/db'
import { originSettings } from '@/lib/env'
import { ConflictError, NotFoundError, ServiceError, ValidationError } from '@/lib/errors'
import { paymentProvider } from '@/lib/payments/provider'
import { countCheckout } from '@/lib/rate-limits'
import type { CheckoutInput, OrderStatus } from '@/lib/schemas/shop'
import { Licence, Order, Pattern, User } from '@/models'
import { liveLicenceOf } from './licences'

/**
 * Checkout (issue 14): a signed-in quilter asks to buy a published pattern; the server reads its
 * price, records a pending order and opens a checkout session at the payment provider, whose hosted
 * page the buyer is sent to. Nothing is granted here or on the way back from that page: only a
 * verified webhook does (lib/payments/).
 */

/** The checkout result pages, on the app's own address (the provider sends the buyer back there). */
function resultUrls(orderId: string): { success: string; cancel: string } {
  const base = originSettings().origins[0]!
  return { success: `${base}/shop/checkout/done?order=${orderId}`, cancel: `${base}/shop/checkout/cancelled?order=${orderId}` }
}

/**
 * The name of the colourway a checkout names, by name or by place (0 first), checked against the
 * pattern's colourways as the shop lists them (kept beside the pattern on every save of its
 * design); null when none is named. An unknown one is refused, naming the field `colorway`.
 *
 * @example colorwayOf({ colorwaySwatches: [{ name: 'Holly', colours: [] }, { name: 'Frost', colours: [] }] }, 1) // 'Frost'
 */
export function colorwayOf(pattern: { colorwaySwatches: readonly { name: string }[] }, named: string | number | undefined): string | null {
  if (named === undefined) return null
  const names = pattern.colorwaySwatches.map((colorway) => colorway.name)
  const found = typeof named === 'number' ? names[named] : names.find((name) => name === named)
  if (found === undefined) {
    const message = typeof named === 'number' ? `This pattern has no colourway number ${named + 1}.` : `This pattern has no colourway named “${named}”.`
    throw new ValidationError([{ path: 'colorway', message }])
  }
  return found
}

/**
 * Starts buying a pattern; answers the provider's payment page. The colourway the buyer was looking
 * at, if named, is recorded on the order (a licence covers them all). Refused: strangers (401), a
 * pattern not in the shop (404: a draft, one in testing, a retired, hidden or unpriced one), one's
 * own pattern (403), a colourway the pattern does not have (422), a pattern one already holds a
 * licence to (409), too many checkouts (429).
 *
 * @example await startCheckout(quilter, { patternId }) // { url: 'http://127.0.0.1:54333/pay/cs_test_…', orderId: '…' }
 */
export async function startCheckout(actor: Actor, input: CheckoutInput): Promise<{ url: string; orderId: string }> {
  authorize(actor, 'read-own-library')
  database()
  const pattern = await Pattern.findByPk(input.patternId, { attributes: ['id', 'name', 'ownerId', 'state', 'priceCents', 'currency', 'hiddenAt', 'colorwaySwatches'] })
  // Only what the shop lists can be bought: a listing an admin hid is not for sale.
  if (!pattern || pattern.state !== 'published' || pattern.hiddenAt !== null || pattern.priceCents === null || pattern.currency === null) {
    throw new NotFoundError('No such pattern in the shop.')
  }
  authorize(actor, 'buy-pattern', pattern)
  const colorway = colorwayOf(pattern, input.colorway)
  const held = await liveLicenceOf(actor.id, pattern.id)
  if (held) throw new ConflictError(`You already hold licence ${held.number} for this pattern; it is in your library.`, { licenceId: held.id })
  await countCheckout(actor.id)
  const buyer = await User.findByPk(actor.id, { attributes: ['id', 'email'] })
  const orderId = randomUUID()
  const urls = resultUrls(orderId)
  let session
  try {
    session = await paymentProvider().checkout.sessions.create(
      {
        mode: 'payment',
        line_items: [
          {
            quantity: 1,
            price_data: {
              // The pattern's own price, never one from the request.
              unit_amount: pattern.priceCents,
              currency: pattern.currency.toLowerCase(),
              product_data: { name: `${pattern.name} (pattern licence)` },
            },
          },
        ],
        success_url: urls.success,
        cancel_url: urls.cancel,
        client_reference_id: orderId,
        ...(buyer ? { customer_email: buyer.email } : {}),
        metadata: { orderId, patternId: pattern.id },
        payment_intent_data: { metadata: { orderId } },
      },
      // The provider answers a repeated create with the same session.
      { idempotencyKey: `checkout-${orderId}` },
    )
  } catch (error) {
    console.error(`payments: the provider refused or did not answer a checkout (${(error as Error).message})`)
    throw new ServiceError('The payment provider did not answer; nothing was charged. Try again in a moment.', 502)
  }
  if (!session.url) throw new ServiceError('The payment provider gave no payment page; nothing was charged.', 502)
  await Order.create({
    id: orderId,
    buyerId: actor.id,
    patternId: pattern.id,
    amountCents: pattern.priceCents,
    currency: pattern.currency,
    checkoutSessionId: session.id,
    colorway,
  })
  return { url: session.url, orderId }
}

/** Where an order stands, for its buyer (and admins); others get 404. */
export async function getOrderStatus(actor: Actor, orderId: string): Promise<OrderStatus> {
  authorize(actor, 'read-own-library')
  database()
  const order = /^[0-9a-f-]{36}$/i.test(orderId) ? await Order.findByPk(orderId) : null
  if (!order) throw new NotFoundError('No such order.')
  authorize(actor, 'read-order', order)
  const [pattern, licence] = await Promise.all([
    Pattern.findByPk(order.patternId, { attributes: ['name'] }),
    Licence.findOne({ where: { orderId: order.id } }),
  ])
  return {
    id: order.id,
    state: order.state,
    patternName: pattern?.name ?? '',
    amountCents: order.amountCents,
    currency: order.currency,
    licence: licence ? { id: licence.id, number: licence.number, revoked: licence.revokedAt !== null } : null,
  }
}
