import { authorize } from '@/lib/authorization'
import { ValidationError } from '@/lib/errors'
import { BODY_LIMITS, route } from '@/lib/http'
import { readSalesQuery } from '@/lib/schemas/sales'
import { listSales } from '@/lib/services/sales'

/**
 * `GET /api/sales?from=&to=&patternId=&limit=&offset=` → `{ sales: [ { orderId, date, patternId,
 * pattern, colorway, buyer, amountCents, currency, refundedAt, licenceNumber } ], totals: [ { month,
 * currency, sales, grossCents, refunds, refundsCents, netCents } ], page: { limit, offset, total,
 * nextOffset } }`: one page of the designer's own sales (an admin's: all), newest first, 50 a page
 * unless `limit` (at most 500) says otherwise; the totals are over every sale, not the page's.
 * 403 for people who are not designers, 404 for a pattern that is not theirs, 422 naming a bad parameter.
 */
export const GET = route(
  { bodyLimit: BODY_LIMITS.none, session: 'required', permit: ({ user }) => authorize(user, 'read-own-sales') },
  async ({ request, user }) => {
    const read = readSalesQuery(new URL(request.url).searchParams)
    if (!read.ok) throw new ValidationError(read.issues)
    return Response.json(await listSales(user, read.query))
  },
)
