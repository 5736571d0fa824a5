import type { Metadata } from 'next'
import Link from 'next/link'
import { SignUpForm } from '@/components/account/sign-up-form'
import { safeRedirectPath, signInPathFor } from '@/lib/safe-redirect'

export const metadata: Metadata = { title: 'Create an account' }

export default async function SignUpPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  // A page that sent a stranger to sign in may be reached through "Create an account" instead.
  const next = safeRedirectPath((await searchParams).next, '')
  return (
    <>
      <h1 className="mb-6 text-2xl font-semibold">Create an account</h1>
      <SignUpForm next={next || null} />
      <p className="mt-6 text-sm text-stone-600">
        Already sewing with us?{' '}
        <Link href={signInPathFor(next)} className="text-thread-700 underline">
          Sign in
        </Link>
      </p>
    </>
  )
}
