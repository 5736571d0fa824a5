'use client'

import Link from 'next/link'
import { useState, type FormEvent } from 'react'
import { Field } from '@/components/ui/field'
import { signInPathFor } from '@/lib/safe-redirect'
import { signUpSchema } from '@/lib/schemas/account'
import { useApiForm } from './use-api-form'

/**
 * `next`: the page that sent the person here, offered through sign-in afterwards. The server
 * answers every sign-up alike (it tells nobody whether an address has an account), so the form
 * always ends on "check your e-mail".
 */
export function SignUpForm({ next = null }: { next?: string | null }) {
  const [sentTo, setSentTo] = useState<string | null>(null)
  const { errors, message, busy, submit } = useApiForm(signUpSchema, '/api/auth/sign-up', (values) => setSentTo(values.email))

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault()
    const form = new FormData(event.currentTarget)
    void submit({
      displayName: form.get('displayName'),
      email: form.get('email'),
      password: form.get('password'),
      wantsDesigner: form.get('wantsDesigner') === 'on',
    })
  }

  if (sentTo) {
    return (
      <div role="status" className="flex flex-col gap-4">
        <h2 className="text-lg font-semibold">Check your e-mail</h2>
        <p className="text-stone-700">
          We sent a message to <strong>{sentTo}</strong>. Open the link in it to confirm your address; it works for 24 hours.
        </p>
        <p className="text-stone-700">You can sign in now; a reminder stays at the top of the page until the address is confirmed.</p>
        <Link href={signInPathFor(next ?? '/')} className="self-start rounded bg-thread-700 px-4 py-2 font-medium text-white hover:bg-thread-800">
          Sign in
        </Link>
      </div>
    )
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
        <input type="checkbox" name="wantsDesigner" className="mt-1" />
        <span>I design patterns and would like a designer account (to draft, test and sell my own). An admin looks at each request.</span>
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
