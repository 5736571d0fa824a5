import type { Metadata } from 'next'
import { LinkAction } from '@/components/account/link-action'

export const metadata: Metadata = { title: 'Confirm your new e-mail address' }

/** Opened from the e-mail sent to a new address; the page posts the link's token. No sign-in needed. */
export default function ConfirmEmailChangePage() {
  return (
    <>
      <h1 className="mb-6 text-2xl font-semibold">Confirm your new e-mail address</h1>
      <LinkAction
        url="/api/account/email/confirm"
        done={{ message: 'Your account now uses this address.', href: '/account', label: 'Go to your account' }}
        retry={{ href: '/account', label: 'Ask for a new link on your account page' }}
      />
    </>
  )
}
