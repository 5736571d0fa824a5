'use client'

import { useState } from 'react'
import { ApiError, apiFetch } from '@/lib/api-client'

/** Shown to a signed-in person until their address is confirmed, with "send it again". */
export function VerifyEmailBanner({ email }: { email: string }) {
  const [state, setState] = useState<{ busy: boolean; note: string | null }>({ busy: false, note: null })

  async function resend() {
    setState({ busy: true, note: null })
    try {
      await apiFetch('/api/auth/verify-email/resend', { method: 'POST' })
      setState({ busy: false, note: `Sent. Open the newest message to ${email}; older links no longer work.` })
    } catch (error) {
      setState({ busy: false, note: error instanceof ApiError ? error.message : 'Could not reach Wreathwright. Try again.' })
    }
  }

  return (
    <div role="region" aria-label="Confirm your e-mail address" className="border-b border-amber-200 bg-amber-50 text-sm text-amber-900">
      <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-3 px-4 py-2">
        <span>
          Please confirm your e-mail address: open the link we sent to <strong>{email}</strong>.
        </span>
        <button
          type="button"
          disabled={state.busy}
          onClick={() => void resend()}
          className="rounded border border-amber-300 bg-white px-2 py-1 hover:bg-amber-100 disabled:opacity-60"
        >
          {state.busy ? 'Sending…' : 'Send it again'}
        </button>
        {state.note && <span aria-live="polite">{state.note}</span>}
      </div>
    </div>
  )
}
