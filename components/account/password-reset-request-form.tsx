'use client'

import { useState, type FormEvent } from 'react'
import { Field } from '@/components/ui/field'
import { passwordResetRequestSchema } from '@/lib/schemas/account'
import { useApiForm } from './use-api-form'

/** Asks for a reset link. The answer is the same for every address, so the page says "if". */
export function PasswordResetRequestForm() {
  const [sentTo, setSentTo] = useState<string | null>(null)
  const { errors, message, busy, submit } = useApiForm(passwordResetRequestSchema, '/api/auth/password-reset', (values) => setSentTo(values.email))

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault()
    void submit({ email: new FormData(event.currentTarget).get('email') })
  }

  if (sentTo) {
    return (
      <p role="status" className="text-stone-700">
        If an account has the address <strong>{sentTo}</strong>, we sent it a link to choose a new password. The link works for one hour, once.
      </p>
    )
  }
  return (
    <form onSubmit={onSubmit} noValidate className="flex max-w-sm flex-col gap-4">
      <Field id="email" name="email" type="email" label="E-mail address" autoComplete="email" error={errors.email} />
      {message && (
        <p role="alert" className="text-sm text-madder-700">
          {message}
        </p>
      )}
      <button type="submit" disabled={busy} className="rounded bg-thread-700 px-4 py-2 font-medium text-white hover:bg-thread-800 disabled:opacity-60">
        {busy ? 'Sending…' : 'Send me a link'}
      </button>
    </form>
  )
}
