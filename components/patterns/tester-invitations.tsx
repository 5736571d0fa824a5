'use client'

import { useRouter } from 'next/navigation'
import { useState, type FormEvent } from 'react'
import { Field } from '@/components/ui/field'
import { useApiForm } from '@/components/account/use-api-form'
import { ApiError, apiFetch } from '@/lib/api-client'
import { createInvitationSchema, type InvitationState, type InvitationView } from '@/lib/schemas/invitation'

const STATE_WORDS: Readonly<Record<InvitationState, string>> = {
  waiting: 'invited, no account confirmed yet',
  accepted: 'testing',
  expired: 'expired',
  withdrawn: 'withdrawn',
}

/**
 * The designer's testers of one pattern: invite an e-mail address, see each invitation's state,
 * withdraw one. `canInvite`: the pattern is a draft or in testing.
 *
 * @example <TesterInvitations patternId={pattern.id} invitations={invitations} canInvite />
 */
export function TesterInvitations({ patternId, invitations, canInvite }: { patternId: string; invitations: readonly InvitationView[]; canInvite: boolean }) {
  const router = useRouter()
  const [sentTo, setSentTo] = useState<string | null>(null)
  const [withdrawError, setWithdrawError] = useState<string | null>(null)
  const { errors, message, busy, submit } = useApiForm(createInvitationSchema, `/api/patterns/${patternId}/invitations`, (values) => {
    setSentTo(values.email)
    router.refresh()
  })

  function onSubmit(event: FormEvent<HTMLFormElement>): void {
    event.preventDefault()
    const form = event.currentTarget
    void submit({ email: new FormData(form).get('email') }).then(() => form.reset())
  }

  async function withdraw(invitation: InvitationView): Promise<void> {
    setWithdrawError(null)
    try {
      await apiFetch(`/api/patterns/${patternId}/invitations/${invitation.id}`, { method: 'DELETE' })
      router.refresh()
    } catch (caught) {
      setWithdrawError(caught instanceof ApiError ? caught.message : 'Could not reach Wreathwright. Try again.')
    }
  }

  return (
    <div className="space-y-4">
      {canInvite ? (
        <form onSubmit={onSubmit} noValidate className="flex flex-wrap items-end gap-3" aria-label="Invite a tester">
          <Field id="invite-email" name="email" type="email" label="Tester’s e-mail address" autoComplete="off" error={errors.email} />
          <button type="submit" disabled={busy} className="rounded bg-thread-700 px-4 py-2 text-white hover:bg-thread-800 disabled:opacity-60">
            {busy ? 'Inviting…' : 'Invite'}
          </button>
          {message && !errors.email && (
            <p role="alert" className="w-full text-sm text-madder-700">
              {message}
            </p>
          )}
          {sentTo && !message && (
            <p role="status" className="w-full text-sm text-stone-700">
              Invitation sent to {sentTo}.
            </p>
          )}
        </form>
      ) : (
        <p className="text-sm text-stone-600">Testers are invited while the pattern is a draft or in testing.</p>
      )}
      {invitations.length === 0 ? (
        <p className="text-sm text-stone-600">Nobody is invited yet.</p>
      ) : (
        <table className="w-full max-w-2xl text-left text-sm" data-testid="invitations">
          <thead>
            <tr className="text-stone-500">
              <th className="py-1 font-normal">Address</th>
              <th className="py-1 font-normal">Tester</th>
              <th className="py-1 font-normal">State</th>
              <th className="py-1 font-normal">Until</th>
              <th />
            </tr>
          </thead>
          <tbody>
            {invitations.map((invitation) => (
              <tr key={invitation.id} className="border-t border-linen-200">
                <td className="py-1">{invitation.email}</td>
                <td className="py-1">{invitation.testerName ?? '—'}</td>
                <td className="py-1">{STATE_WORDS[invitation.state]}</td>
                <td className="py-1">
                  <time dateTime={invitation.expiresAt}>{new Date(invitation.expiresAt).toLocaleDateString()}</time>
                </td>
                <td className="py-1 text-right">
                  {(invitation.state === 'waiting' || invitation.state === 'accepted') && (
                    <button type="button" onClick={() => void withdraw(invitation)} className="text-madder-700 hover:underline">
                      Withdraw
                    </button>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {withdrawError && (
        <p role="alert" className="text-sm text-madder-700">
          {withdrawError}
        </p>
      )}
    </div>
  )
}
