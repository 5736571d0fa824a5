import { authorize } from '@/lib/authorization'
import { ValidationError } from '@/lib/errors'
import { BODY_LIMITS, route } from '@/lib/http'
import { readSalesQuery } from '@/lib/schemas/sales'
import { salesCsvStream } from '@/lib/services/sales'

/**
 * `GET /api/sales/csv?from=&to=&patternId=` → every sale that `GET /api/sales` pages through (not
 * one page: `limit` and `offset` are ignored), as a CSV file to download
 * (`sales-<from>-<to>.csv`), for the same people; sent as the rows are read, a batch at a time.
 */
export const GET = route(
  { bodyLimit: BODY_LIMITS.none, session: 'required', permit: ({ user }) => authorize(user, 'read-own-sales') },
  async ({ request, user }) => {
    const read = readSalesQuery(new URL(request.url).searchParams)
    if (!read.ok) throw new ValidationError(read.issues)
    const { limit: _limit, offset: _offset, ...query } = read.query
    const name = ['sales', query.from ?? 'start', query.to ?? 'today'].join('-')
    return new Response(await salesCsvStream(user, query), {
      headers: { 'content-type': 'text/csv; charset=utf-8', 'content-disposition': `attachment; filename="${name}.csv"`, 'cache-control': 'private, no-store' },
    })
  },
)
