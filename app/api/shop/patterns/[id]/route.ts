import { BODY_LIMITS, route } from '@/lib/http'
import { getShopPattern } from '@/lib/services/shop-listings'

/**
 * `GET /api/shop/patterns/:id` → `{ pattern, hidden }`: one listing, open to everyone; 404 unless
 * it is listed (an admin also gets a hidden one, with `hidden: true`).
 */
export const GET = route({ params: ['id'], bodyLimit: BODY_LIMITS.none, session: 'optional' }, async ({ user, params }) => {
  const { listing, hidden } = await getShopPattern(user, params.id)
  return Response.json({ pattern: listing, hidden })
})
