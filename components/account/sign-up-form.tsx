'use client'

import { useRouter } from 'next/navigation'
import type { FormEvent } from 'react'
import { Field } from '@/components/ui/field'
import { safeRedirectPath } from '@/lib/safe-redirect'
import { signUpSchema } from '@/lib/schemas/account'
import { useApiForm } from './use-api-form'

/** `next`: the page that sent the person here, followed after the account is made. */
export function SignUpForm({ next = null }: { next?: string | null }) {
  const router = useRouter()
  const { errors, message, busy, submit } = useApiForm(signUpSchema, '/api/auth/sign-up', (account) => {
    router.push(safeRedirectPath(next, account.wantsDesignerAccount ? '/patterns' : '/'))
    router.refresh()
  })

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault()
    const form = new FormData(event.currentTarget)
    void submit({
      displayName: form.get('displayName'),
      email: form.get('email'),
      password: form.get('password'),
      wantsDesignerAccount: form.get('wantsDesignerAccount') === 'on',
    })
  }

  return (
    <form onSubmit={onSubmit} noValidate className="flex max-w-sm flex-col gap-4">
      <Field id="displayName" name="displayName" label="Your name" autoComplete="name" error={errors.displayName} />
      <Field id="email" name="email" type="email" label="E-mail address" autoComplete="email" error={errors.email} />
      <Field
        id="password"
        name="password"
        type="password"
        label="Password (at least 10 characters)"
        autoComplete="new-password"
        error={errors.password}
      />
      <label className="flex items-start gap-2 text-sm text-stone-700">
        <input type="checkbox" name="wantsDesignerAccount" className="mt-1" />
        <span>I design patterns and want a designer account (to draft, test and sell my own).</span>
      </label>
      {message && (
        <p role="alert" className="text-sm text-madder-700">
          {message}
        </p>
      )}
      <button type="submit" disabled={busy} className="rounded bg-thread-700 px-4 py-2 font-medium text-white hover:bg-thread-800 disabled:opacity-60">
        {busy ? 'Creating your account…' : 'Create account'}
      </button>
    </form>
  )
}
