'use client'

import { useRouter } from 'next/navigation'
import type { FormEvent } from 'react'
import { Field } from '@/components/ui/field'
import { accountDeletionSchema } from '@/lib/schemas/account'
import { useApiForm } from './use-api-form'

/** Deleting one's account: the password and the word DELETE, so one stray click deletes nothing. */
export function DeleteAccountForm({ isDesigner }: { isDesigner: boolean }) {
  const router = useRouter()
  const { errors, message, busy, submit } = useApiForm(
    accountDeletionSchema,
    '/api/account',
    () => {
      router.push('/')
      router.refresh()
    },
    'DELETE',
  )
  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault()
    const form = new FormData(event.currentTarget)
    void submit({ currentPassword: form.get('currentPassword'), confirm: form.get('confirm') })
  }
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3">
      <p className="text-sm text-stone-700">
        This deletes your account, your sessions and your uploaded images at once; it cannot be undone.
        {isDesigner &&
          ' Your drafts and patterns in testing are deleted too. A published pattern leaves the shop; it and your retired patterns stay, without your name, for the people who bought a licence.'}
      </p>
      <Field id="deleteCurrentPassword" name="currentPassword" type="password" label="Current password" autoComplete="current-password" error={errors.currentPassword} />
      <Field id="confirm" name="confirm" label="Type DELETE to confirm" autoComplete="off" error={errors.confirm} />
      {message && (
        <p role="alert" className="text-sm text-madder-700">
          {message}
        </p>
      )}
      <button type="submit" disabled={busy} className="self-start rounded bg-madder-700 px-4 py-2 font-medium text-white hover:bg-madder-600 disabled:opacity-60">
        {busy ? 'Deleting…' : 'Delete my account'}
      </button>
    </form>
  )
}
