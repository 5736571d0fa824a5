import { BODY_LIMITS, route } from '@/lib/http'
import { getShopPattern } from '@/lib/services/shop-listings'

/** `GET /api/shop/patterns/:id` → `{ pattern }`: one listing, open to everyone; 404 unless it is listed. */
export const GET = route({ params: ['id'], bodyLimit: BODY_LIMITS.none, session: 'optional' }, async ({ params }) =>
  Response.json({ pattern: await getShopPattern(params.id) }),
)
