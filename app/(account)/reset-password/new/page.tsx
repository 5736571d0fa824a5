import type { Metadata } from 'next'
import { NewPasswordForm } from '@/components/account/new-password-form'

export const metadata: Metadata = { title: 'Choose a new password' }

/** Opened from the reset e-mail; the token is in the link's fragment (components/account/link-token.ts). */
export default function NewPasswordPage() {
  return (
    <>
      <h1 className="mb-6 text-2xl font-semibold">Choose a new password</h1>
      <NewPasswordForm />
    </>
  )
}
