import { authorize } from '@/lib/authorization'
import { ValidationError } from '@/lib/errors'
import { BODY_LIMITS, route } from '@/lib/http'
import { readSalesQuery } from '@/lib/schemas/sales'
import { listSales, salesCsv } from '@/lib/services/sales'

/**
 * `GET /api/sales/csv?from=&to=&patternId=` → the same sales as `GET /api/sales`, as a CSV file
 * to download (`sales-<from>-<to>.csv`), for the same people.
 */
export const GET = route(
  { bodyLimit: BODY_LIMITS.none, session: 'required', permit: ({ user }) => authorize(user, 'read-own-sales') },
  async ({ request, user }) => {
    const read = readSalesQuery(new URL(request.url).searchParams)
    if (!read.ok) throw new ValidationError(read.issues)
    const { sales } = await listSales(user, read.query)
    const name = ['sales', read.query.from ?? 'start', read.query.to ?? 'today'].join('-')
    return new Response(salesCsv(sales), {
      headers: { 'content-type': 'text/csv; charset=utf-8', 'content-disposition': `attachment; filename="${name}.csv"`, 'cache-control': 'private, no-store' },
    })
  },
)
