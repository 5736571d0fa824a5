import { ValidationError } from '@/lib/errors'
import { BODY_LIMITS, route } from '@/lib/http'
import { readShopQuery } from '@/lib/schemas/shop-listings'
import { listShopPatterns } from '@/lib/services/shop-listings'

/**
 * `GET /api/shop/patterns?q=&designer=&colour=&repeats=&minPriceCents=&maxPriceCents=&sort=&page=`
 * → `{ patterns, page, pageSize, pageCount, total }`: the shop's listings, open to everyone; 422
 * naming each parameter it refuses.
 */
export const GET = route({ bodyLimit: BODY_LIMITS.none, session: 'optional' }, async ({ request }) => {
  const read = readShopQuery(new URL(request.url).searchParams)
  if (!read.ok) throw new ValidationError(read.issues)
  return Response.json(await listShopPatterns(read.query))
})
