import { authorize } from '@/lib/authorization'
import { BODY_LIMITS, route } from '@/lib/http'
import { listPaymentEvents } from '@/lib/payments/log'
import { pageQuerySchema } from '@/lib/schemas/admin'
import { parseQuery } from '../query'

/** `GET /api/admin/payments?page=`: the payment log (webhook calls, verified or refused, and their processing; never payloads). */
export const GET = route(
  { bodyLimit: BODY_LIMITS.none, session: 'required', permit: ({ user }) => authorize(user, 'read-payment-log') },
  async ({ user, request }) => Response.json(await listPaymentEvents(user, parseQuery(pageQuerySchema, request))),
)
