import type { Metadata } from 'next'
import Link from 'next/link'
import { SignInForm } from '@/components/account/sign-in-form'
import { safeRedirectPath } from '@/lib/safe-redirect'

export const metadata: Metadata = { title: 'Sign in' }

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  // Only paths of this site are followed after signing in (lib/safe-redirect.ts).
  const next = safeRedirectPath((await searchParams).next)
  return (
    <>
      <h1 className="mb-6 text-2xl font-semibold">Sign in</h1>
      <SignInForm next={next} />
      <p className="mt-4 text-sm">
        <Link href="/reset-password" className="text-thread-700 underline">
          Forgot your password?
        </Link>
      </p>
      <p className="mt-6 text-sm text-stone-600">
        New here?{' '}
        <Link href={next === '/' ? '/sign-up' : `/sign-up?next=${encodeURIComponent(next)}`} className="text-thread-700 underline">
          Create an account
        </Link>
      </p>
    </>
  )
}
