'use client'

import { useRouter } from 'next/navigation'
import { useState } from 'react'
import { apiFetch } from '@/lib/api-client'

export function SignOutButton() {
  const router = useRouter()
  const [busy, setBusy] = useState(false)
  return (
    <button
      type="button"
      disabled={busy}
      className="rounded border border-stone-300 px-3 py-1.5 hover:bg-linen-100"
      onClick={async () => {
        setBusy(true)
        await apiFetch('/api/auth/sign-out', { method: 'POST' }).catch(() => undefined)
        router.push('/')
        router.refresh()
      }}
    >
      Sign out
    </button>
  )
}
