import 'server-only'
import type Stripe from 'stripe'
import { QueryTypes } from 'sequelize'
import { database } from '@/lib/db'
import { paymentSettings } from '@/lib/env'
import { ServiceError } from '@/lib/errors'
import { PAYMENT_EVENTS_QUEUE, queueJob } from '@/lib/jobs/queue'
import { PaymentEvent } from '@/models'
import { paymentProvider } from './provider'

/**
 * The payment webhook's receiving end (`POST /api/webhooks/payments`). It answers fast: it checks
 * the signature with the SDK over the raw bytes, stores the event once (the provider's event id is
 * unique, so a second delivery changes nothing) and queues its processing (lib/payments/process.ts)
 * in the same transaction. Nothing is granted here.
 *
 * A call with a missing or wrong signature is refused (400) and logged as refused, with the reason
 * and nothing of its body: an unverified body is nobody's word.
 */

/** The event types the shop acts on (names from the SDK's `Stripe.Event.Type`). */
export const HANDLED_EVENT_TYPES = ['checkout.session.completed', 'charge.refunded'] as const

/** The signature header the provider sends (its SDK's `constructEvent` reads it). */
export const SIGNATURE_HEADER = 'stripe-signature'

async function refuse(note: string, status: number, message: string): Promise<never> {
  database()
  await PaymentEvent.create({ providerEventId: null, type: null, state: 'refused', note })
  console.warn(`payments: a webhook call was refused (${note})`)
  throw new ServiceError(message, status)
}

/** The payment intent an event is about, so a refund and its payment can be matched whatever their order. */
function paymentIntentOf(event: Stripe.Event): string | null {
  const object = event.data.object as { payment_intent?: unknown }
  if (typeof object.payment_intent === 'string') return object.payment_intent
  if (typeof object.payment_intent === 'object' && object.payment_intent && 'id' in object.payment_intent) return String(object.payment_intent.id)
  return null
}

export interface ReceivedEvent {
  received: true
  /** True when this event was stored before: nothing was done again. */
  duplicate: boolean
}

/**
 * Verifies, stores and queues one webhook call.
 *
 * @example await receivePaymentEvent(bytes, request.headers.get('stripe-signature')) // { received: true, duplicate: false }
 */
export async function receivePaymentEvent(body: Uint8Array, signature: string | null): Promise<ReceivedEvent> {
  const { webhookSecret } = paymentSettings()
  if (!webhookSecret) return refuse('no webhook secret is set here (PAYMENTS_WEBHOOK_SECRET)', 503, 'Payments are not set up here.')
  if (!signature) return refuse('no signature', 400, 'The event has no signature.')
  let event: Stripe.Event
  try {
    event = paymentProvider().webhooks.constructEvent(Buffer.from(body), signature, webhookSecret)
  } catch (error) {
    const reason = (error as Error).message.split('\n')[0]!.slice(0, 200)
    return refuse(`bad signature: ${reason}`, 400, 'The event signature does not match.')
  }
  const handled = (HANDLED_EVENT_TYPES as readonly string[]).includes(event.type)
  const sequelize = database()
  return sequelize.transaction(async (transaction) => {
    const rows = await sequelize.query<{ id: string }>(
      `INSERT INTO payment_events (provider_event_id, type, state, note, payment_intent_id, payload, received_at, processed_at)
       VALUES (:eventId, :type, :state, :note, :paymentIntentId, CAST(:payload AS jsonb), now(), :processedAt)
       ON CONFLICT (provider_event_id) DO NOTHING RETURNING id`,
      {
        replacements: {
          eventId: event.id,
          type: event.type,
          state: handled ? 'received' : 'processed',
          note: handled ? null : 'not an event the shop acts on',
          paymentIntentId: paymentIntentOf(event),
          payload: JSON.stringify(event),
          processedAt: handled ? null : new Date(),
        },
        type: QueryTypes.SELECT,
        transaction,
      },
    )
    const stored = rows[0]
    if (!stored) return { received: true, duplicate: true } as const
    if (handled) await queueJob(PAYMENT_EVENTS_QUEUE, { eventId: String(stored.id) }, transaction)
    return { received: true, duplicate: false } as const
  })
}
