import type { Metadata } from 'next'
import { LinkAction } from '@/components/account/link-action'

export const metadata: Metadata = { title: 'Confirm your e-mail address' }

/** Opened from the verification e-mail: the page posts the link's token (see components/account/link-token.ts). */
export default function VerifyEmailPage() {
  return (
    <>
      <h1 className="mb-6 text-2xl font-semibold">Confirm your e-mail address</h1>
      <LinkAction
        url="/api/auth/verify-email"
        done={{ message: 'Thank you: your e-mail address is confirmed.', href: '/', label: 'Go to Wreathwright' }}
        retry={{ href: '/account', label: 'Sign in and ask for a new link from the reminder at the top of the page' }}
      />
    </>
  )
}
