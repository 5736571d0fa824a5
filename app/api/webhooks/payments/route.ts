import { route } from '@/lib/http'
import { receivePaymentEvent, SIGNATURE_HEADER } from '@/lib/payments/webhook'

/**
 * `POST /api/webhooks/payments`: the payment provider's events. No session and no browser origin:
 * the caller proves itself by the signature over the raw body, which the SDK checks
 * (lib/payments/webhook.ts). Bad or missing: 400, logged as refused. 64 KiB is far above the
 * events the shop receives (a few KiB).
 */
export const POST = route(
  { bodyLimit: 64 * 1024, session: 'optional', origin: 'signed', body: 'bytes' },
  async ({ request, body }) => Response.json(await receivePaymentEvent(body, request.headers.get(SIGNATURE_HEADER))),
)
