import Link from 'next/link'
import type { SalesQuery } from '@/lib/schemas/sales'

const field = 'rounded border border-stone-300 bg-white px-2 py-1.5 text-sm'
const label = 'flex flex-col gap-1 text-xs font-medium text-stone-600'

/**
 * The sales table's days and pattern: a plain GET form to /sales, so it works without JavaScript;
 * its fields are the query string's parameters, the same the API and the CSV download read.
 */
export function SalesFilters({ query, patterns }: { query: SalesQuery; patterns: readonly { id: string; name: string }[] }) {
  return (
    <form method="get" action="/sales" aria-label="Which sales" className="flex flex-wrap items-end gap-3 rounded-lg border border-linen-200 bg-white/70 p-4">
      <div className={label}>
        <label htmlFor="sales-from">From</label>
        <input type="date" id="sales-from" name="from" defaultValue={query.from ?? ''} className={field} />
      </div>
      <div className={label}>
        <label htmlFor="sales-to">To</label>
        <input type="date" id="sales-to" name="to" defaultValue={query.to ?? ''} className={field} />
      </div>
      <div className={label}>
        <label htmlFor="sales-pattern">Pattern</label>
        <select id="sales-pattern" name="patternId" defaultValue={query.patternId ?? ''} className={field}>
          <option value="">Every pattern</option>
          {patterns.map((pattern) => (
            <option key={pattern.id} value={pattern.id}>
              {pattern.name}
            </option>
          ))}
        </select>
      </div>
      <button type="submit" className="rounded bg-thread-700 px-4 py-1.5 text-sm text-white hover:bg-thread-800">
        Show sales
      </button>
      <Link href="/sales" className="py-1.5 text-sm text-thread-700 hover:underline">
        Clear
      </Link>
    </form>
  )
}
