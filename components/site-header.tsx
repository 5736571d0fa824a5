import Link from 'next/link'
import { getCurrentUser } from '@/lib/auth/current-user'
import { can } from '@/lib/authorization'
import { SignOutButton } from '@/components/account/sign-out-button'
import { VerifyEmailBanner } from '@/components/account/verify-email-banner'

export async function SiteHeader() {
  const user = await getCurrentUser()
  return (
    <header className="border-b border-linen-200 bg-white/70">
      <nav aria-label="Main" className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-3">
        <Link href="/" className="text-lg font-semibold text-thread-800">
          Wreathwright
        </Link>
        <Link href="/shop" className="text-sm text-stone-700 hover:text-thread-700">
          Shop
        </Link>
        {can(user, 'read-own-library') && (
          <Link href="/library" className="text-sm text-stone-700 hover:text-thread-700">
            My library
          </Link>
        )}
        {user && (
          <Link href="/sewing-room" className="text-sm text-stone-700 hover:text-thread-700">
            Sewing room
          </Link>
        )}
        {can(user, 'list-own-patterns') && (
          <Link href="/patterns" className="text-sm text-stone-700 hover:text-thread-700">
            Pattern shelf
          </Link>
        )}
        {can(user, 'read-own-sales') && (
          <Link href="/sales" className="text-sm text-stone-700 hover:text-thread-700">
            Sales
          </Link>
        )}
        {can(user, 'list-patterns-to-test') && (
          <Link href="/testing" className="text-sm text-stone-700 hover:text-thread-700">
            Patterns to test
          </Link>
        )}
        {can(user, 'manage-users') && (
          <Link href="/admin" className="text-sm text-stone-700 hover:text-thread-700">
            Admin desk
          </Link>
        )}
        <div className="ml-auto flex items-center gap-4 text-sm">
          {user ? (
            <>
              <Link href="/account" className="text-stone-600 hover:text-thread-700" data-testid="signed-in-as" title="Your account">
                {user.displayName} <span className="text-stone-400">({user.roles.join(', ')})</span>
              </Link>
              <SignOutButton />
            </>
          ) : (
            <>
              <Link href="/sign-in" className="hover:text-thread-700">
                Sign in
              </Link>
              <Link href="/sign-up" className="rounded bg-thread-700 px-3 py-1.5 text-white hover:bg-thread-800">
                Create an account
              </Link>
            </>
          )}
        </div>
      </nav>
      {user && !user.emailVerified && <VerifyEmailBanner email={user.email} />}
    </header>
  )
}
