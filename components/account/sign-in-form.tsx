'use client'

import { useRouter } from 'next/navigation'
import type { FormEvent } from 'react'
import { Field } from '@/components/ui/field'
import { safeRedirectPath } from '@/lib/safe-redirect'
import { signInSchema } from '@/lib/schemas/account'
import { useApiForm } from './use-api-form'

export function SignInForm({ next }: { next: string }) {
  const router = useRouter()
  const { errors, message, busy, submit } = useApiForm(signInSchema, '/api/auth/sign-in', () => {
    // Checked again here: the value is followed in the browser, whatever rendered the form.
    router.push(safeRedirectPath(next))
    router.refresh()
  })

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault()
    const form = new FormData(event.currentTarget)
    void submit({ email: form.get('email'), password: form.get('password') })
  }

  return (
    <form onSubmit={onSubmit} noValidate className="flex max-w-sm flex-col gap-4">
      <Field id="email" name="email" type="email" label="E-mail address" autoComplete="email" error={errors.email} />
      <Field id="password" name="password" type="password" label="Password" autoComplete="current-password" error={errors.password} />
      {message && (
        <p role="alert" className="text-sm text-madder-700">
          {message}
        </p>
      )}
      <button type="submit" disabled={busy} className="rounded bg-thread-700 px-4 py-2 font-medium text-white hover:bg-thread-800 disabled:opacity-60">
        {busy ? 'Signing in…' : 'Sign in'}
      </button>
    </form>
  )
}
