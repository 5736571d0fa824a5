import 'server-only'
import { cookies, headers } from 'next/headers'
import { redirect } from 'next/navigation'
import { cache } from 'react'
import { can, type Action } from '@/lib/authorization'
import { REQUESTED_PATH_HEADER, signInPathFor } from '@/lib/safe-redirect'
import { lucia } from './lucia'
import { checkSession, type CurrentUser } from './session'

/**
 * The person signed in for this page render, or null. Cached per request so a layout and its page
 * share one lookup. Pages cannot set cookies, so a refreshed session is written by the next API call.
 */
export const getCurrentUser = cache(async (): Promise<CurrentUser | null> => {
  const cookieStore = await cookies()
  const sessionId = cookieStore.get(lucia().sessionCookieName)?.value ?? null
  const { user } = await checkSession(sessionId)
  return user
})

/**
 * For pages that need a signed-in person allowed to take `action`: sends others to sign in, and
 * from there back to `from` — by default the page asked for, as proxy.ts passes it on.
 */
export async function requireUser(action?: Extract<Action, 'create-pattern' | 'list-own-patterns' | 'manage-users'>, from?: string): Promise<CurrentUser> {
  const user = await getCurrentUser()
  if (!user) redirect(signInPathFor(from ?? (await headers()).get(REQUESTED_PATH_HEADER)))
  if (action && !can(user, action)) redirect('/?denied=1')
  return user
}
