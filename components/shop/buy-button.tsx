'use client'

import { useState } from 'react'
import { ApiError, apiFetch } from '@/lib/api-client'
import { checkoutAnswerSchema } from '@/lib/schemas/shop'

/**
 * "Buy": starts a checkout for the pattern (`POST /api/shop/checkout`, which charges the pattern's
 * own price) and follows the payment provider's page it answers with. A stranger is sent to sign
 * in first, and back here after; that link works without JavaScript. With the pattern's
 * colourways, the buyer picks the one they are looking at (the first at the start), and the
 * checkout records it for the designer's sales; the licence covers every colourway all the same.
 */
export function BuyButton({ patternId, price, signInHref, colorways = [] }: { patternId: string; price: string; signInHref: string | null; colorways?: readonly string[] }) {
  const [colorway, setColorway] = useState<string | undefined>(colorways[0])
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
      const { url } = await apiFetch('/api/shop/checkout', { method: 'POST', json: { patternId, ...(colorway === undefined ? {} : { colorway }) }, schema: checkoutAnswerSchema })
      window.location.assign(url)
    } catch (error) {
      setMessage(error instanceof ApiError ? (error.issues[0]?.message ?? error.message) : 'Could not reach Wreathwright; nothing was bought.')
      setBusy(false)
    }
  }

  return (
    <div className="space-y-2">
      {colorways.length > 1 && (
        <label className="block text-sm text-stone-700">
          Colourway{' '}
          <select className="rounded border border-stone-300 px-2 py-1" value={colorway} onChange={(event) => setColorway(event.target.value)} disabled={busy}>
            {colorways.map((name) => (
              <option key={name} value={name}>
                {name}
              </option>
            ))}
          </select>
          <span className="block text-xs text-stone-500">Your licence covers every colourway.</span>
        </label>
      )}
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
