'use client'

import Link from 'next/link'
import { useEffect, useState } from 'react'
import type { StepSyncState } from '@/lib/sewing-room-client/step-sync'

/**
 * The page's one line about saving: everything saved, how many ticks are not saved yet (and when
 * the next try is), or that the quilter must sign in again. Announced politely to screen readers.
 */
export function SaveStatus({ sync, waiting, refused, onRetry, signInPath }: { sync: StepSyncState; waiting: number; refused: number; onRetry: () => void; signInPath: string }) {
  const [now, setNow] = useState(() => Date.now())
  useEffect(() => {
    if (sync.nextRetryAt === null) return
    const timer = setInterval(() => setNow(Date.now()), 1_000)
    return () => clearInterval(timer)
  }, [sync.nextRetryAt])

  let tone = 'border-thread-600/30 bg-white text-thread-800'
  let body: React.ReactNode
  if (sync.signedOut) {
    tone = 'border-madder-600/40 bg-madder-600/10 text-madder-700'
    body = (
      <>
        Signed out: your ticks wait on this device.{' '}
        <Link href={`/sign-in?next=${encodeURIComponent(signInPath)}`} className="font-semibold underline">
          Sign in again
        </Link>
      </>
    )
  } else if (waiting > 0) {
    tone = 'border-amber-500/50 bg-amber-50 text-amber-900'
    const seconds = sync.nextRetryAt === null ? 0 : Math.max(0, Math.ceil((sync.nextRetryAt - now) / 1000))
    body = (
      <>
        <span className="font-semibold">{waiting === 1 ? '1 change not saved yet' : `${waiting} changes not saved yet`}</span>
        {seconds > 0 ? ` · trying again in ${seconds} s` : ' · saving…'}
        {seconds > 0 && (
          <button type="button" onClick={onRetry} className="ml-2 rounded px-2 py-1 font-semibold underline">
            Try now
          </button>
        )}
      </>
    )
  } else {
    body = (
      <>
        <span aria-hidden="true">✓ </span>
        {sync.lastSavedAt ? 'All changes saved' : 'Saved on the server, on every device'}
      </>
    )
  }
  return (
    <p role="status" aria-live="polite" data-testid="save-status" data-waiting={waiting} className={`rounded-full border px-3 py-1 text-sm ${tone}`}>
      {body}
      {refused > 0 && <span className="ml-2 text-madder-700">{refused === 1 ? '1 change refused' : `${refused} changes refused`}</span>}
    </p>
  )
}
