import type { Metadata } from 'next'
import { cookies } from 'next/headers'
import type { ReactNode } from 'react'
import { AccountSessions } from '@/components/account/account-sessions'
import { DisplayNameForm, EmailChangeForm, PasswordChangeForm } from '@/components/account/account-forms'
import { DeleteAccountForm } from '@/components/account/delete-account-form'
import { requireUser } from '@/lib/auth/current-user'
import { lucia } from '@/lib/auth/lucia'
import { getAccountOverview } from '@/lib/services/account-settings'

export const metadata: Metadata = { title: 'Your account' }

function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section className="flex flex-col gap-3 border-t border-linen-200 pt-5" aria-labelledby={`${title}-heading`}>
      <h2 id={`${title}-heading`} className="text-lg font-semibold">
        {title}
      </h2>
      {children}
    </section>
  )
}

export default async function AccountPage() {
  const user = await requireUser(undefined, '/account')
  const sessionId = (await cookies()).get(lucia().sessionCookieName)?.value ?? null
  const account = await getAccountOverview(user, sessionId)
  return (
    <div className="flex flex-col gap-6">
      <div>
        <h1 className="text-2xl font-semibold">Your account</h1>
        <p className="mt-1 text-sm text-stone-600">
          {account.roles.join(', ')}
          {account.designerRequestedAt && ' · designer account requested, waiting for an admin'}
          {!account.emailVerified && ' · e-mail address not confirmed yet'}
        </p>
      </div>
      <Section title="Name">
        <DisplayNameForm displayName={account.displayName} />
      </Section>
      <Section title="E-mail address">
        <EmailChangeForm email={account.email} />
      </Section>
      <Section title="Password">
        <PasswordChangeForm />
      </Section>
      <Section title="Where you are signed in">
        <AccountSessions sessions={account.sessions} />
      </Section>
      <Section title="Delete the account">
        <DeleteAccountForm isDesigner={account.roles.includes('designer')} />
      </Section>
    </div>
  )
}
