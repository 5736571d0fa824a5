'use client'

import { useRouter } from 'next/navigation'
import { useState } from 'react'
import { ApiError, apiFetch } from '@/lib/api-client'
import type { Role } from '@/lib/roles'
import type { AdminUserRow, UpdateUserInput } from '@/lib/schemas/admin'

/** The roles the desk grants and revokes with one click; the API takes any known role. */
const TOGGLED_ROLES = ['designer', 'tester'] as const satisfies readonly Role[]

/**
 * A row's buttons: grant or revoke designer and tester, disable or re-enable the account. Each
 * sends `PATCH /api/admin/users/:id` and reloads the page's data; a refusal is shown beside them.
 */
export function UserActions({ user, isSelf }: { user: AdminUserRow; isSelf: boolean }) {
  const router = useRouter()
  const [busy, setBusy] = useState(false)
  const [message, setMessage] = useState<string | null>(null)

  async function change(update: UpdateUserInput) {
    setBusy(true)
    setMessage(null)
    try {
      await apiFetch(`/api/admin/users/${user.id}`, { method: 'PATCH', json: update })
      router.refresh()
    } catch (error) {
      setMessage(error instanceof ApiError ? (error.issues[0]?.message ?? error.message) : 'Could not reach Wreathwright; nothing was changed.')
    } finally {
      setBusy(false)
    }
  }

  const button = 'rounded border border-stone-300 px-2 py-1 text-xs hover:bg-linen-100 disabled:opacity-50'
  return (
    <div className="flex flex-wrap items-center gap-1">
      {TOGGLED_ROLES.map((role) => {
        const has = user.roles.includes(role)
        return (
          <button
            key={role}
            type="button"
            className={button}
            disabled={busy}
            aria-label={`${has ? 'Revoke' : 'Grant'} ${role} ${has ? 'from' : 'to'} ${user.displayName}`}
            onClick={() => change({ roles: has ? user.roles.filter((other) => other !== role) : [...user.roles, role] })}
          >
            {has ? `Revoke ${role}` : `Grant ${role}`}
          </button>
        )
      })}
      {!isSelf && (
        <button
          type="button"
          className={button}
          disabled={busy}
          aria-label={`${user.disabledAt ? 'Re-enable' : 'Disable'} the account of ${user.displayName}`}
          onClick={() => change({ disabled: user.disabledAt === null })}
        >
          {user.disabledAt ? 'Re-enable' : 'Disable'}
        </button>
      )}
      {message && (
        <p role="alert" className="w-full text-xs text-madder-700">
          {message}
        </p>
      )}
    </div>
  )
}
