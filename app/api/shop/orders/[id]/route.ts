import { BODY_LIMITS, route } from '@/lib/http'
import { getOrderStatus } from '@/lib/services/shop'

/** `GET /api/shop/orders/:id` → where the buyer's order stands and its licence once granted (the checkout result page polls it). */
export const GET = route(
  { params: ['id'], bodyLimit: BODY_LIMITS.none, session: 'required', permit: ({ user, params }) => getOrderStatus(user, params.id) },
  async ({ resource }) => Response.json({ order: resource }, { headers: { 'cache-control': 'no-store' } }),
)
