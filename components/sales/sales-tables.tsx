import type { SaleRow, SalesMonthTotal } from '@/lib/schemas/sales'
import { formatPrice } from '@/lib/shop/price'

const head = 'px-2 py-2'
const cell = 'px-2 py-2'
const MONTH_NAMES = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December']

/** `2026-03` → `March 2026`. */
const monthName = (month: string) => `${MONTH_NAMES[Number(month.slice(5, 7)) - 1]} ${month.slice(0, 4)}`

/** One line per month and currency: what sold, what was refunded, what is left. Currencies are never added together. */
export function MonthlyTotals({ totals }: { totals: readonly SalesMonthTotal[] }) {
  return (
    <table className="w-full border-collapse text-sm" aria-label="Totals per month">
      <thead className="border-b border-linen-200 text-left text-stone-600">
        <tr>
          <th scope="col" className={head}>Month</th>
          <th scope="col" className={head}>Currency</th>
          <th scope="col" className={`${head} text-right`}>Sales</th>
          <th scope="col" className={`${head} text-right`}>Gross</th>
          <th scope="col" className={`${head} text-right`}>Refunds</th>
          <th scope="col" className={`${head} text-right`}>Net</th>
        </tr>
      </thead>
      <tbody>
        {totals.map((total) => (
          <tr key={`${total.month} ${total.currency}`} className="border-b border-linen-100" data-testid="sales-month">
            <th scope="row" className={`${cell} text-left font-medium text-stone-800`}>{monthName(total.month)}</th>
            <td className={cell}>{total.currency}</td>
            <td className={`${cell} text-right`}>{total.sales}</td>
            <td className={`${cell} text-right`}>{formatPrice(total.grossCents, total.currency)}</td>
            <td className={`${cell} text-right`}>
              {total.refunds > 0 ? `${formatPrice(total.refundsCents, total.currency)} (${total.refunds})` : '—'}
            </td>
            <td className={`${cell} text-right font-medium`}>{formatPrice(total.netCents, total.currency)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  )
}

/** Every sale, newest first: the colourway the buyer was looking at, the buyer by display name only, the licence the sale granted, and a refund if there was one. */
export function SalesRows({ sales }: { sales: readonly SaleRow[] }) {
  return (
    <table className="w-full border-collapse text-sm" aria-label="Sales">
      <thead className="border-b border-linen-200 text-left text-stone-600">
        <tr>
          <th scope="col" className={head}>Date</th>
          <th scope="col" className={head}>Pattern</th>
          <th scope="col" className={head}>Colourway</th>
          <th scope="col" className={head}>Buyer</th>
          <th scope="col" className={head}>Licence</th>
          <th scope="col" className={`${head} text-right`}>Amount</th>
          <th scope="col" className={head}>Refunded</th>
        </tr>
      </thead>
      <tbody>
        {sales.map((sale) => (
          <tr key={sale.orderId} className="border-b border-linen-100" data-testid="sale-row">
            <td className={`${cell} whitespace-nowrap`}>{sale.date.slice(0, 10)}</td>
            <td className={`${cell} font-medium text-stone-800`}>{sale.pattern}</td>
            <td className={cell} data-testid="sale-colorway">{sale.colorway ?? <span className="text-stone-500">—</span>}</td>
            <td className={cell}>{sale.buyer ?? <span className="text-stone-500">A former customer</span>}</td>
            <td className={`${cell} font-mono`}>{sale.licenceNumber ?? '—'}</td>
            <td className={`${cell} text-right whitespace-nowrap ${sale.refundedAt ? 'text-stone-500 line-through' : ''}`}>
              {formatPrice(sale.amountCents, sale.currency)}
            </td>
            <td className={`${cell} whitespace-nowrap ${sale.refundedAt ? 'text-madder-700' : ''}`} data-testid="sale-refunded">{sale.refundedAt ? sale.refundedAt.slice(0, 10) : '—'}</td>
          </tr>
        ))}
      </tbody>
    </table>
  )
}
