import type { Metadata } from 'next'
import { Pager } from '@/components/admin/pager'
import { pageNumber } from '@/components/admin/page-number'
import { RefundButton } from '@/components/admin/refund-button'
import { can } from '@/lib/authorization'
import { listPaymentEvents } from '@/lib/payments/log'
import { listOrdersForRefund, type AdminOrderRow } from '@/lib/services/refunds'
import { formatPrice } from '@/lib/shop/price'
import { deskTitle, requireAdmin } from '../../admin-guard'

export const generateMetadata = (): Promise<Metadata> => deskTitle('Payment log')

/**
 * Every call to the payment webhook: verified or refused, and what processing made of it (payloads
 * are not shown); below it the paid orders, each of which an admin may refund.
 */
export default async function PaymentLogPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const admin = await requireAdmin('read-payment-log')
  const search = await searchParams
  const ordersPage = pageNumber({ page: search.orders })
  const [log, orders] = await Promise.all([listPaymentEvents(admin, { page: pageNumber(search) }), listOrdersForRefund(admin, { page: ordersPage })])
  // Each list pages on its own (`page` the events, `orders` the orders), keeping the other's place.
  const pages = (events: number, ordersAt: number) => {
    const query = new URLSearchParams({ ...(events > 1 ? { page: String(events) } : {}), ...(ordersAt > 1 ? { orders: String(ordersAt) } : {}) }).toString()
    return query ? `/admin/payments?${query}` : '/admin/payments'
  }
  return (
    <section className="space-y-4">
      <h1 className="text-2xl font-semibold text-thread-800">Payment log</h1>
      <p className="max-w-3xl text-stone-700">
        Every event the payment provider sent, newest first. A refused call had a missing or wrong signature: nothing of it was trusted. A
        received event waits for the payment worker; a processed one says what it did.
      </p>
      {log.rows.length === 0 ? (
        <p className="text-stone-600">No payment events yet.</p>
      ) : (
        <table className="w-full border-collapse text-sm">
          <thead className="border-b border-linen-200 text-left text-stone-600">
            <tr>
              <th scope="col" className="px-2 py-2">Received</th>
              <th scope="col" className="px-2 py-2">Event</th>
              <th scope="col" className="px-2 py-2">State</th>
              <th scope="col" className="px-2 py-2">What happened</th>
              <th scope="col" className="px-2 py-2">Processed</th>
            </tr>
          </thead>
          <tbody>
            {log.rows.map((row) => (
              <tr key={row.id} className="border-b border-linen-100 align-top" data-testid="payment-event-row">
                <td className="px-2 py-2 whitespace-nowrap">{row.receivedAt.slice(0, 19).replace('T', ' ')} UTC</td>
                <td className="px-2 py-2">
                  {row.type ?? '—'}
                  {row.providerEventId && <span className="block font-mono text-xs text-stone-500">{row.providerEventId}</span>}
                </td>
                <td className={`px-2 py-2 ${row.state === 'refused' || row.state === 'failed' ? 'text-madder-700' : ''}`}>{row.state}</td>
                <td className="px-2 py-2">{row.note ?? '—'}</td>
                <td className="px-2 py-2 whitespace-nowrap">{row.processedAt ? `${row.processedAt.slice(0, 19).replace('T', ' ')} UTC` : '—'}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      <Pager page={log.page} pageCount={log.pageCount} total={log.total} noun="events" hrefFor={(page) => pages(page, orders.page)} />
      <h2 className="pt-4 text-xl font-semibold text-thread-800">Orders</h2>
      <p className="max-w-3xl text-stone-700">
        Paid and refunded orders, newest first. A refund is asked of the payment provider; the buyer’s licence is revoked when the provider’s refund event arrives above, as
        for a refund made at the provider. Every refund asked for here is in the audit log.
      </p>
      {orders.rows.length === 0 ? (
        <p className="text-stone-600">No paid orders yet.</p>
      ) : (
        <table className="w-full border-collapse text-sm">
          <thead className="border-b border-linen-200 text-left text-stone-600">
            <tr>
              <th scope="col" className="px-2 py-2">Paid (UTC)</th>
              <th scope="col" className="px-2 py-2">Pattern</th>
              <th scope="col" className="px-2 py-2">Buyer</th>
              <th scope="col" className="px-2 py-2">Licence</th>
              <th scope="col" className="px-2 py-2 text-right">Amount</th>
              <th scope="col" className="px-2 py-2">Refund</th>
            </tr>
          </thead>
          <tbody>
            {orders.rows.map((order) => (
              <tr key={order.id} className="border-b border-linen-100 align-top" data-testid="order-row" data-order-id={order.id}>
                <td className="px-2 py-2 whitespace-nowrap">{order.paidAt ? `${order.paidAt.slice(0, 19).replace('T', ' ')}` : '—'}</td>
                <td className="px-2 py-2">
                  {order.pattern}
                  {order.colorway && <span className="block text-xs text-stone-500">colourway {order.colorway}</span>}
                </td>
                <td className="px-2 py-2">{order.buyer ?? <span className="text-stone-500">A former customer</span>}</td>
                <td className="px-2 py-2 font-mono">{order.licenceNumber ?? '—'}</td>
                <td className="px-2 py-2 text-right whitespace-nowrap">{formatPrice(order.amountCents, order.currency)}</td>
                <td className="px-2 py-2" data-testid="order-refund">
                  <RefundCell order={order} canRefund={can(admin, 'refund-order')} />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      <Pager page={orders.page} pageCount={orders.pageCount} total={orders.total} noun="orders" hrefFor={(page) => pages(log.page, page)} />
    </section>
  )
}

/** Where an order's refund stands, or the button that asks for one. */
function RefundCell({ order, canRefund }: { order: AdminOrderRow; canRefund: boolean }) {
  if (order.state === 'refunded') return <span className="text-madder-700">refunded {order.refundedAt?.slice(0, 10) ?? ''}</span>
  if (order.refundRequestedAt) return <span className="text-stone-600">asked {order.refundRequestedAt.slice(0, 10)}; waiting for the provider</span>
  if (!canRefund) return <span className="text-stone-500">—</span>
  return <RefundButton orderId={order.id} amount={formatPrice(order.amountCents, order.currency)} buyer={order.buyer ?? 'a former customer'} pattern={order.pattern} />
}
