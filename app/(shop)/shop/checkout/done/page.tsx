import type { Metadata } from 'next'
import { requireUser } from '@/lib/auth/current-user'
import { OrderProgress } from '../order-progress'

export const metadata: Metadata = { title: 'Your payment' }

/** Where the payment provider sends the buyer back after paying; the licence is granted by its webhook, not by this visit. */
export default async function CheckoutDonePage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const { order } = await searchParams
  await requireUser()
  return (
    <article className="mx-auto max-w-2xl space-y-4">
      <h1 className="text-2xl font-semibold text-thread-800">Thank you</h1>
      {typeof order === 'string' ? <OrderProgress orderId={order} cancelled={false} /> : <p>No order was named.</p>}
    </article>
  )
}
