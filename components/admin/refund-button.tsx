'use client'

import { useRouter } from 'next/navigation'
import { useState } from 'react'
import { ApiError, apiFetch } from '@/lib/api-client'

/**
 * "Refund…" on the payment log's orders: asks first, naming the amount and the buyer, then asks
 * the payment provider to refund the order in full (`POST /api/admin/orders/:id/refund`). The
 * licence is revoked when the provider's refund event arrives, so the row says the refund is on
 * its way until then. Once asked, the button is not offered again, not even while the page refreshes.
 */
export function RefundButton({ orderId, amount, buyer, pattern }: { orderId: string; amount: string; buyer: string; pattern: string }) {
  const router = useRouter()
  const [confirming, setConfirming] = useState(false)
  const [busy, setBusy] = useState(false)
  const [message, setMessage] = useState<string | null>(null)
  // Set once the provider took the request: the refreshed row says so, but until it arrives this must not offer "Refund…" again.
  const [asked, setAsked] = useState(false)

  async function refund() {
    setBusy(true)
    setMessage(null)
    try {
      await apiFetch(`/api/admin/orders/${orderId}/refund`, { method: 'POST' })
      setAsked(true)
      setConfirming(false)
      router.refresh()
    } catch (error) {
      setMessage(error instanceof ApiError ? error.message : 'Could not reach Wreathwright; nothing was refunded.')
    } finally {
      setBusy(false)
    }
  }

  const quiet = 'rounded border border-stone-300 px-3 py-1 text-sm hover:bg-linen-100 disabled:opacity-50'
  if (asked) return <span className="text-stone-600">Refund asked; waiting for the provider</span>
  return (
    <div className="space-y-2">
      {confirming ? (
        <div role="group" aria-label="Confirm the refund" className="space-y-2">
          <p className="text-sm text-stone-800">
            Refund {amount} to {buyer} for “{pattern}”? Their licence is revoked when the payment provider confirms the refund.
          </p>
          <div className="flex gap-2">
            <button type="button" disabled={busy} onClick={refund} className="rounded bg-madder-700 px-3 py-1 text-sm text-white hover:bg-madder-600 disabled:opacity-50">
              {busy ? 'Refunding…' : `Yes, refund ${amount}`}
            </button>
            <button type="button" disabled={busy} onClick={() => setConfirming(false)} className={quiet}>
              Keep the sale
            </button>
          </div>
        </div>
      ) : (
        <button type="button" onClick={() => setConfirming(true)} aria-label={`Refund the order of ${buyer} for ${pattern}`} className={quiet}>
          Refund…
        </button>
      )}
      {message && (
        <p role="alert" className="text-sm text-madder-700">
          {message}
        </p>
      )}
    </div>
  )
}
