'use client'

import { useRouter } from 'next/navigation'
import { useState } from 'react'
import { ApiError, apiFetch } from '@/lib/api-client'

export interface SessionRow {
  readonly device: string
  readonly lastSeenAt: string
  readonly current: boolean
}

const dateTime = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' })

/** Where the person is signed in, with "sign out everywhere else". */
export function AccountSessions({ sessions }: { sessions: readonly SessionRow[] }) {
  const router = useRouter()
  const [state, setState] = useState<{ busy: boolean; note: string | null }>({ busy: false, note: null })
  const others = sessions.filter((session) => !session.current).length

  async function endOthers() {
    setState({ busy: true, note: null })
    try {
      const { endedSessions } = await apiFetch<{ endedSessions: number }>('/api/account/sessions/end-others', { method: 'POST' })
      setState({ busy: false, note: `Signed out of ${endedSessions} other ${endedSessions === 1 ? 'browser' : 'browsers'}.` })
      router.refresh()
    } catch (error) {
      setState({ busy: false, note: error instanceof ApiError ? error.message : 'Could not reach Wreathwright. Try again.' })
    }
  }

  return (
    <div className="flex flex-col gap-3">
      <ul className="divide-y divide-linen-200 rounded border border-linen-200" aria-label="Signed-in browsers">
        {sessions.map((session, index) => (
          <li key={index} className="flex items-baseline justify-between gap-3 px-3 py-2 text-sm">
            <span>
              {session.device}
              {session.current && <span className="ml-2 rounded bg-linen-100 px-1.5 text-xs text-stone-600">this browser</span>}
            </span>
            <span className="text-stone-500">last seen {dateTime.format(new Date(session.lastSeenAt))}</span>
          </li>
        ))}
      </ul>
      <button
        type="button"
        disabled={state.busy || others === 0}
        onClick={() => void endOthers()}
        className="self-start rounded border border-stone-300 px-3 py-1.5 text-sm hover:bg-linen-100 disabled:opacity-60"
      >
        Sign out everywhere else
      </button>
      {state.note && (
        <p role="status" className="text-sm text-thread-800">
          {state.note}
        </p>
      )}
    </div>
  )
}
