import type { Metadata } from 'next'
import { notFound } from 'next/navigation'
import { Pager } from '@/components/admin/pager'
import { MonthlyTotals, SalesRows } from '@/components/sales/sales-tables'
import { SalesFilters } from '@/components/sales/sales-filters'
import { requireUser } from '@/lib/auth/current-user'
import { can } from '@/lib/authorization'
import { NotFoundError } from '@/lib/errors'
import { readSalesQuery, type SalesQuery } from '@/lib/schemas/sales'
import { listSales, salesPatternChoices } from '@/lib/services/sales'

export const metadata: Metadata = { title: 'Sales' }

/**
 * The designer's sales: totals per month and currency, every sale with its licence and refund,
 * and the same rows as a CSV file. The studio's layout lets designers and admins in; the service
 * shows a designer their own patterns' sales only.
 */
export default async function SalesPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const user = await requireUser('list-own-patterns', '/sales')
  const read = readSalesQuery(await searchParams)
  const query: SalesQuery = read.ok ? read.query : {}
  const [answer, patterns] = await Promise.all([
    // Another designer's pattern is not found, exactly like a missing one.
    listSales(user, query).catch((error: unknown) => (error instanceof NotFoundError ? notFound() : Promise.reject(error))),
    salesPatternChoices(user),
  ])
  const { limit: _limit, offset: _offset, ...filters } = query
  // The export holds every sale of the filter, not one page.
  const csv = new URLSearchParams(Object.entries(filters).filter((entry): entry is [string, string] => typeof entry[1] === 'string'))
  const { page } = answer
  const hrefFor = (number: number) => {
    const search = new URLSearchParams(csv)
    if (query.limit !== undefined) search.set('limit', String(page.limit))
    if (number > 1) search.set('offset', String((number - 1) * page.limit))
    return `/sales${search.size > 0 ? `?${search}` : ''}`
  }
  return (
    <article className="mx-auto max-w-5xl space-y-6">
      <h1 className="text-2xl font-semibold text-thread-800">Sales</h1>
      <p className="max-w-3xl text-stone-700">
        Every paid sale of {can(user, 'read-all-sales') ? 'every designer’s patterns' : 'your patterns'}, and each refund in the month it was made. Buyers are shown by the name they chose; their
        e-mail addresses stay private. Amounts in different currencies are totalled apart. The colourway is the one the buyer was looking at when they bought; their licence covers every colourway.
      </p>
      <SalesFilters query={query} patterns={patterns} />
      {!read.ok && (
        <p role="alert" className="text-madder-700">
          {read.issues.map((issue) => issue.message).join(' ')} Showing every sale instead.
        </p>
      )}
      {answer.sales.length === 0 && answer.totals.length === 0 ? (
        <p className="text-stone-600">No sales in these days yet.</p>
      ) : (
        <>
          <section className="space-y-2">
            <h2 className="text-lg font-semibold text-thread-800">Per month</h2>
            <MonthlyTotals totals={answer.totals} />
          </section>
          <section className="space-y-2">
            <div className="flex items-baseline justify-between">
              <h2 className="text-lg font-semibold text-thread-800">Each sale</h2>
              <a href={`/api/sales/csv${csv.size > 0 ? `?${csv}` : ''}`} download className="text-sm text-thread-700 hover:underline">
                Download as CSV
              </a>
            </div>
            <SalesRows sales={answer.sales} />
            <Pager page={Math.floor(page.offset / page.limit) + 1} pageCount={Math.max(1, Math.ceil(page.total / page.limit))} total={page.total} noun="sales" hrefFor={hrefFor} />
          </section>
        </>
      )}
    </article>
  )
}
