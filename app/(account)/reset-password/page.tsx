import type { Metadata } from 'next'
import Link from 'next/link'
import { PasswordResetRequestForm } from '@/components/account/password-reset-request-form'

export const metadata: Metadata = { title: 'Forgotten password' }

export default function ResetPasswordPage() {
  return (
    <>
      <h1 className="mb-2 text-2xl font-semibold">Forgotten password</h1>
      <p className="mb-6 text-sm text-stone-600">Give the address you signed up with; we e-mail you a link to choose a new password.</p>
      <PasswordResetRequestForm />
      <p className="mt-6 text-sm text-stone-600">
        Remembered it?{' '}
        <Link href="/sign-in" className="text-thread-700 underline">
          Sign in
        </Link>
      </p>
    </>
  )
}
