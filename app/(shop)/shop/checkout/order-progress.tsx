'use client'

import Link from 'next/link'
import { useEffect, useState } from 'react'
import { ApiError, apiFetch } from '@/lib/api-client'
import { orderStatusSchema, type OrderStatus } from '@/lib/schemas/shop'
import { z } from 'zod'

const answerSchema = z.object({ order: orderStatusSchema })

/** How often the page asks again, and for how long (the webhook usually lands within seconds). */
const POLL_MS = 1000
const GIVE_UP_MS = 5 * 60 * 1000

/**
 * Where the buyer's order stands, asked of the server every second until its licence exists: the
 * way back from the payment page proves nothing; only the provider's verified event grants it.
 */
export function OrderProgress({ orderId, cancelled }: { orderId: string; cancelled: boolean }) {
  const [order, setOrder] = useState<OrderStatus | null>(null)
  const [problem, setProblem] = useState<string | null>(null)
  const [gaveUp, setGaveUp] = useState(false)

  useEffect(() => {
    let stopped = false
    const started = Date.now()
    let timer: ReturnType<typeof setTimeout> | undefined
    const ask = async () => {
      try {
        const { order: next } = await apiFetch(`/api/shop/orders/${orderId}`, { schema: answerSchema, cache: 'no-store' })
        if (stopped) return
        setOrder(next)
        setProblem(null)
        if (next.licence || next.state === 'refunded') return
      } catch (error) {
        if (stopped) return
        if (error instanceof ApiError && error.status === 404) return setProblem('We found no such order of yours.')
        setProblem('Could not reach Wreathwright just now; trying again.')
      }
      if (Date.now() - started > GIVE_UP_MS) return setGaveUp(true)
      timer = setTimeout(() => void ask(), POLL_MS)
    }
    void ask()
    return () => {
      stopped = true
      if (timer) clearTimeout(timer)
    }
  }, [orderId])

  if (order?.licence && !order.licence.revoked) {
    return (
      <div className="space-y-3" data-testid="order-state" data-state="granted">
        <p className="text-stone-800">
          Payment confirmed. <strong>{order.patternName}</strong> is yours: licence number{' '}
          <strong data-testid="licence-number">{order.licence.number}</strong>.
        </p>
        <Link href="/library" className="inline-block rounded bg-thread-700 px-4 py-2 text-white hover:bg-thread-800">
          Open my library
        </Link>
      </div>
    )
  }
  if (order?.state === 'refunded') {
    return (
      <p className="text-stone-800" data-testid="order-state" data-state="refunded">
        This payment was refunded, so no licence is held for {order.patternName}.
      </p>
    )
  }
  return (
    <div className="space-y-2" data-testid="order-state" data-state="waiting">
      <p className="text-stone-800" role="status">
        {cancelled
          ? 'You left the payment page without paying. If you paid after all, we are waiting for the payment to be confirmed.'
          : 'Waiting for the payment to be confirmed…'}
      </p>
      <p className="text-sm text-stone-600">
        {cancelled
          ? 'Nothing is charged for a cancelled payment. This page keeps looking for a little while.'
          : 'The payment provider tells us directly; this usually takes a few seconds. You may leave this page: the licence will be in your library, and a receipt in your mail.'}
      </p>
      {problem && <p className="text-sm text-madder-700">{problem}</p>}
      {gaveUp && <p className="text-sm text-stone-600">Still nothing. Look in your library later; your receipt comes by e-mail once it is confirmed.</p>}
    </div>
  )
}
