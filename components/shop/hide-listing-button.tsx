'use client'

import { useRouter } from 'next/navigation'
import { useState } from 'react'
import { ApiError, apiFetch } from '@/lib/api-client'

/** For admins on a pattern's shop page: take the listing out of the shop, or put it back (`PATCH /api/admin/listings/:id`). */
export function HideListingButton({ patternId, hidden }: { patternId: string; hidden: boolean }) {
  const router = useRouter()
  const [busy, setBusy] = useState(false)
  const [message, setMessage] = useState<string | null>(null)

  async function toggle() {
    setBusy(true)
    setMessage(null)
    try {
      await apiFetch(`/api/admin/listings/${patternId}`, { method: 'PATCH', json: { hidden: !hidden } })
      router.refresh()
    } catch (error) {
      setMessage(error instanceof ApiError ? error.message : 'Could not reach Wreathwright; nothing was changed.')
    } finally {
      setBusy(false)
    }
  }

  return (
    <div className="space-y-1 rounded border border-dashed border-stone-300 p-3 text-sm">
      <p className="text-stone-600">{hidden ? 'Admin: this listing is hidden from the shop.' : 'Admin: this listing is in the shop.'}</p>
      <button type="button" disabled={busy} onClick={toggle} className="rounded border border-stone-300 px-3 py-1 hover:bg-linen-100 disabled:opacity-50">
        {hidden ? 'Put back in the shop' : 'Hide from the shop'}
      </button>
      {message && (
        <p role="alert" className="text-madder-700">
          {message}
        </p>
      )}
    </div>
  )
}
