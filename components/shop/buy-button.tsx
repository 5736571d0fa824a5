'use client'

import { useState } from 'react'
import { ApiError, apiFetch } from '@/lib/api-client'
import { checkoutAnswerSchema } from '@/lib/schemas/shop'

/**
 * "Buy": starts a checkout for the pattern (`POST /api/shop/checkout`, which charges the pattern's
 * own price) and follows the payment provider's page it answers with. A stranger is sent to sign
 * in first, and back here after; that link works without JavaScript.
 */
export function BuyButton({ patternId, price, signInHref }: { patternId: string; price: string; signInHref: string | null }) {
  const [busy, setBusy] = useState(false)
  const [message, setMessage] = useState<string | null>(null)
  const style = 'inline-block rounded bg-thread-700 px-5 py-2 text-white hover:bg-thread-800 disabled:opacity-50'
  if (signInHref) {
    return (
      <a href={signInHref} className={style}>
        Sign in to buy · {price}
      </a>
    )
  }

  async function buy() {
    setBusy(true)
    setMessage(null)
    try {
      const { url } = await apiFetch('/api/shop/checkout', { method: 'POST', json: { patternId }, schema: checkoutAnswerSchema })
      window.location.assign(url)
    } catch (error) {
      setMessage(error instanceof ApiError ? (error.issues[0]?.message ?? error.message) : 'Could not reach Wreathwright; nothing was bought.')
      setBusy(false)
    }
  }

  return (
    <div className="space-y-2">
      <button type="button" className={style} disabled={busy} onClick={buy}>
        {busy ? 'Opening the payment page…' : `Buy · ${price}`}
      </button>
      {message && (
        <p role="alert" className="text-sm text-madder-700">
          {message}
        </p>
      )}
    </div>
  )
}
