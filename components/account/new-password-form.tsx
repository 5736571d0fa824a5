'use client'

import Link from 'next/link'
import { useState, type FormEvent } from 'react'
import { Field } from '@/components/ui/field'
import { passwordResetConfirmSchema } from '@/lib/schemas/account'
import { useLinkToken } from './link-token'
import { useApiForm } from './use-api-form'

/** The reset link's page: a new password, checked for strength by the server (its reason shows on the field). */
export function NewPasswordForm() {
  const token = useLinkToken()
  const [changed, setChanged] = useState(false)
  const { errors, message, busy, submit } = useApiForm(passwordResetConfirmSchema, '/api/auth/password-reset/confirm', () => setChanged(true))

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault()
    void submit({ token: token ?? '', password: new FormData(event.currentTarget).get('password') })
  }

  if (changed) {
    return (
      <div role="status" className="flex flex-col gap-4">
        <p className="text-stone-700">Your password is changed. Every browser that was signed in has been signed out; sign in with the new password.</p>
        <Link href="/sign-in" className="self-start rounded bg-thread-700 px-4 py-2 font-medium text-white hover:bg-thread-800">
          Sign in
        </Link>
      </div>
    )
  }
  if (token === null) {
    return (
      <p role="alert" className="text-madder-700">
        This link carries no token. Open the link from the e-mail again, or <Link href="/reset-password" className="underline">ask for a new one</Link>.
      </p>
    )
  }
  return (
    <form onSubmit={onSubmit} noValidate className="flex max-w-sm flex-col gap-4">
      <Field id="password" name="password" type="password" label="New password (at least 10 characters)" autoComplete="new-password" error={errors.password} />
      {(message || errors.token) && (
        <p role="alert" className="text-sm text-madder-700">
          {errors.token ?? message}{' '}
          {message?.startsWith('This link') && (
            <Link href="/reset-password" className="underline">
              Ask for a new link.
            </Link>
          )}
        </p>
      )}
      <button type="submit" disabled={busy || token === undefined} className="rounded bg-thread-700 px-4 py-2 font-medium text-white hover:bg-thread-800 disabled:opacity-60">
        {busy ? 'Saving…' : 'Save the new password'}
      </button>
    </form>
  )
}
