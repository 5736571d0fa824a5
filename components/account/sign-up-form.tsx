'use client'

import { useRouter } from 'next/navigation'
import { useState, type FormEvent } from 'react'
import { Field } from '@/components/ui/field'
import { ApiError, apiFetch } from '@/lib/api-client'
import { errorsByField } from '@/lib/form-errors'
import { signUpSchema } from '@/lib/schemas/account'

export function SignUpForm() {
  const router = useRouter()
  const [errors, setErrors] = useState<Record<string, string>>({})
  const [message, setMessage] = useState<string | null>(null)
  const [busy, setBusy] = useState(false)

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault()
    const form = new FormData(event.currentTarget)
    const parsed = signUpSchema.safeParse({
      displayName: form.get('displayName'),
      email: form.get('email'),
      password: form.get('password'),
      wantsDesignerAccount: form.get('wantsDesignerAccount') === 'on',
    })
    if (!parsed.success) return setErrors(errorsByField(parsed.error.issues))
    setErrors({})
    setMessage(null)
    setBusy(true)
    try {
      await apiFetch('/api/auth/sign-up', { method: 'POST', json: parsed.data })
      router.push(parsed.data.wantsDesignerAccount ? '/patterns' : '/')
      router.refresh()
    } catch (error) {
      setBusy(false)
      if (error instanceof ApiError) {
        setErrors(errorsByField(error.issues))
        setMessage(error.message)
      } else setMessage('Could not reach Wreathwright. Check your connection and try again.')
    }
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
