import Link from 'next/link'
import { getCurrentUser } from '@/lib/auth/current-user'
import { can } from '@/lib/authorization'

export default async function HomePage() {
  const user = await getCurrentUser()
  return (
    <section className="mx-auto max-w-6xl">
      <div className="max-w-3xl space-y-6">
      <h1 className="text-3xl font-semibold text-thread-800">Rings, wreaths and medallions, sewn flip-and-sew.</h1>
      <p className="text-lg text-stone-700">
        Wreathwright is a studio for designers of circular foundation-paper-pieced quilt patterns: draft one repeat,
        see the whole ring, prove every foundation can be sewn, and print booklets at true scale for testers and
        quilters.
      </p>
      {user ? (
        can(user, 'list-own-patterns') ? (
          <Link href="/patterns" className="inline-block rounded bg-thread-700 px-4 py-2 text-white hover:bg-thread-800">
            Go to your pattern shelf
          </Link>
        ) : (
          <div className="space-y-3">
            <p className="text-stone-700">Welcome back, {user.displayName}. Pick up where you left off, or find your next ring in the shop.</p>
            <div className="flex flex-wrap gap-3">
              <Link href="/sewing-room" className="rounded bg-thread-700 px-4 py-2 text-white hover:bg-thread-800">
                Go to your sewing room
              </Link>
              <Link href="/shop" className="rounded border border-stone-300 px-4 py-2 hover:bg-linen-100">
                Browse the shop
              </Link>
            </div>
          </div>
        )
      ) : (
        <div className="flex gap-4">
          <Link href="/sign-in" className="rounded bg-thread-700 px-4 py-2 text-white hover:bg-thread-800">
            Sign in
          </Link>
          <Link href="/sign-up" className="rounded border border-stone-300 px-4 py-2 hover:bg-linen-100">
            Create an account
          </Link>
        </div>
      )}
      </div>
    </section>
  )
}
