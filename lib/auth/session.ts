import type { Session, User } from 'lucia'
import { isRole, type Role } from '@/lib/roles'
import { lucia } from './lucia'

/** The signed-in person as the app uses them. */
export interface CurrentUser {
  readonly id: string
  readonly email: string
  readonly displayName: string
  readonly roles: readonly Role[]
}

export interface SessionCheck {
  readonly user: CurrentUser | null
  readonly session: Session | null
  /** A Set-Cookie value to send back: a refreshed session, or a blank one clearing a dead cookie. */
  readonly setCookie: string | null
}

function toCurrentUser(user: User): CurrentUser {
  return { id: user.id, email: user.email, displayName: user.displayName, roles: user.roles.filter(isRole) }
}

/**
 * Checks a session id from a cookie. An unknown, forged or expired id yields no user (and a cookie
 * that clears it); a session in its second half is extended.
 */
export async function checkSession(sessionId: string | null): Promise<SessionCheck> {
  if (!sessionId) return { user: null, session: null, setCookie: null }
  const { session, user } = await lucia().validateSession(sessionId)
  if (!session || !user) {
    return { user: null, session: null, setCookie: lucia().createBlankSessionCookie().serialize() }
  }
  const setCookie = session.fresh ? lucia().createSessionCookie(session.id).serialize() : null
  return { user: toCurrentUser(user), session, setCookie }
}

/** Reads the session id from a request's Cookie header. */
export function sessionIdFromRequest(request: Request): string | null {
  return lucia().readSessionCookie(request.headers.get('cookie') ?? '')
}
