'use client'

import { useRouter } from 'next/navigation'
import { useState } from 'react'
import { ApiError, apiFetch } from '@/lib/api-client'
import type { DesignerRequestDecision } from '@/lib/schemas/admin'

/** Approve or decline one designer request (`POST /api/admin/designer-requests/:id`); the person is e-mailed either way. */
export function RequestDecision({ userId, displayName }: { userId: string; displayName: string }) {
  const router = useRouter()
  const [busy, setBusy] = useState(false)
  const [message, setMessage] = useState<string | null>(null)

  async function decide(decision: DesignerRequestDecision) {
    setBusy(true)
    setMessage(null)
    try {
      await apiFetch(`/api/admin/designer-requests/${userId}`, { method: 'POST', json: { decision } })
      router.refresh()
    } catch (error) {
      setMessage(error instanceof ApiError ? error.message : 'Could not reach Wreathwright; nothing was changed.')
    } finally {
      setBusy(false)
    }
  }

  return (
    <div className="flex flex-wrap items-center gap-2">
      <button type="button" disabled={busy} onClick={() => decide('approve')} aria-label={`Approve ${displayName} as a designer`} className="rounded bg-thread-700 px-3 py-1 text-sm text-white hover:bg-thread-800 disabled:opacity-50">
        Approve
      </button>
      <button type="button" disabled={busy} onClick={() => decide('decline')} aria-label={`Decline the designer request of ${displayName}`} className="rounded border border-stone-300 px-3 py-1 text-sm hover:bg-linen-100 disabled:opacity-50">
        Decline
      </button>
      {message && (
        <p role="alert" className="w-full text-sm text-madder-700">
          {message}
        </p>
      )}
    </div>
  )
}
