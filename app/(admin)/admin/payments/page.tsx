import type { Metadata } from 'next'
import { Pager } from '@/components/admin/pager'
import { pageNumber } from '@/components/admin/page-number'
import { listPaymentEvents } from '@/lib/payments/log'
import { deskTitle, requireAdmin } from '../../admin-guard'

export const generateMetadata = (): Promise<Metadata> => deskTitle('Payment log')

/** Every call to the payment webhook: verified or refused, and what processing made of it. Payloads are not shown. */
export default async function PaymentLogPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const admin = await requireAdmin('read-payment-log')
  const log = await listPaymentEvents(admin, { page: pageNumber(await searchParams) })
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
      <Pager page={log.page} pageCount={log.pageCount} total={log.total} noun="events" hrefFor={(page) => `/admin/payments?page=${page}`} />
    </section>
  )
}
