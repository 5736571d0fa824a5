import type { Metadata } from 'next'
import { requireUser } from '@/lib/auth/current-user'
import { OrderProgress } from '../order-progress'

export const metadata: Metadata = { title: 'Payment cancelled' }

/** Where the payment provider sends the buyer back after "Cancel". */
export default async function CheckoutCancelledPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const { order } = await searchParams
  await requireUser()
  return (
    <article className="mx-auto max-w-2xl space-y-4">
      <h1 className="text-2xl font-semibold text-thread-800">Payment cancelled</h1>
      {typeof order === 'string' ? <OrderProgress orderId={order} cancelled /> : <p>No order was named.</p>}
    </article>
  )
}
