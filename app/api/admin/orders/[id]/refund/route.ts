import { authorize } from '@/lib/authorization'
import { BODY_LIMITS, route } from '@/lib/http'
import { refundOrder } from '@/lib/services/refunds'

/**
 * `POST /api/admin/orders/:id/refund` → 202 `{ id, state, refundRequestedAt }`: asks the payment
 * provider to refund the order in full. The licence is revoked when the provider's refund event
 * arrives through the webhook, not here. Admins only (404 for anyone else, like every
 * address of the admin desk); 409 when the order was
 * refunded already, its refund was already asked for, or it was never paid; 502 when the provider
 * does not refund it.
 */
export const POST = route(
  { params: ['id'], bodyLimit: BODY_LIMITS.none, session: 'required', permit: ({ user }) => authorize(user, 'refund-order') },
  async ({ user, params }) => Response.json(await refundOrder(user, params.id), { status: 202 }),
)
