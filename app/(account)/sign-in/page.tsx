import type { Metadata } from 'next'
import Link from 'next/link'
import { SignInForm } from '@/components/account/sign-in-form'

export const metadata: Metadata = { title: 'Sign in' }

/** Only paths inside the site are followed after signing in. */
function safeNext(next: string | string[] | undefined): string {
  return typeof next === 'string' && next.startsWith('/') && !next.startsWith('//') ? next : '/'
}

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const { next } = await searchParams
  return (
    <>
      <h1 className="mb-6 text-2xl font-semibold">Sign in</h1>
      <SignInForm next={safeNext(next)} />
      <p className="mt-6 text-sm text-stone-600">
        New here?{' '}
        <Link href="/sign-up" className="text-thread-700 underline">
          Create an account
        </Link>
      </p>
    </>
  )
}
