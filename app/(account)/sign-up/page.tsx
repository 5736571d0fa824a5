import type { Metadata } from 'next'
import Link from 'next/link'
import { SignUpForm } from '@/components/account/sign-up-form'

export const metadata: Metadata = { title: 'Create an account' }

export default function SignUpPage() {
  return (
    <>
      <h1 className="mb-6 text-2xl font-semibold">Create an account</h1>
      <SignUpForm />
      <p className="mt-6 text-sm text-stone-600">
        Already sewing with us?{' '}
        <Link href="/sign-in" className="text-thread-700 underline">
          Sign in
        </Link>
      </p>
    </>
  )
}
