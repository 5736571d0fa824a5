import type { Session, User } from 'lucia'
import { Op, type Transaction } from 'sequelize'
import { database } from '@/lib/db'
import { isRole, type Role } from '@/lib/roles'
import { Session as SessionRow } from '@/models'
import { lucia } from './lucia'

/** The signed-in person as the app uses them. */
export interface CurrentUser {
  readonly id: string
  readonly email: string
  readonly displayName: string
  readonly roles: readonly Role[]
  /** False until the person opened the link sent to their address (the header shows a banner). */
  readonly emailVerified: boolean
}

export interface SessionCheck {
  readonly user: CurrentUser | null
  readonly session: Session | null
  /** A Set-Cookie value to send back: a refreshed session, or a blank one clearing a dead cookie. */
  readonly setCookie: string | null
}

/**
 * A session's "last seen" is written at most this often, so that a busy page (the drafting board
 * saves every few seconds) does not write to the sessions table on every request.
 */
export const LAST_SEEN_RESOLUTION_MS = 5 * 60 * 1000

function toCurrentUser(user: User): CurrentUser {
  return {
    id: user.id,
    email: user.email,
    displayName: user.displayName,
    roles: user.roles.filter(isRole),
    emailVerified: user.emailVerifiedAt !== null,
  }
}

async function noteSeen(session: Session): Promise<void> {
  const now = Date.now()
  if (session.lastSeenAt && now - session.lastSeenAt.getTime() < LAST_SEEN_RESOLUTION_MS) return
  database()
  await SessionRow.update({ lastSeenAt: new Date(now) }, { where: { id: session.id } })
}

/**
 * Checks a session id from a cookie. An unknown, forged or expired id, or a session of a disabled
 * account (lib/auth/session-adapter.ts), yields no user (and a cookie that clears it); a session in
 * its second half is extended.
 */
export async function checkSession(sessionId: string | null): Promise<SessionCheck> {
  if (!sessionId) return { user: null, session: null, setCookie: null }
  const { session, user } = await lucia().validateSession(sessionId)
  if (!session || !user) {
    return { user: null, session: null, setCookie: lucia().createBlankSessionCookie().serialize() }
  }
  await noteSeen(session)
  const setCookie = session.fresh ? lucia().createSessionCookie(session.id).serialize() : null
  return { user: toCurrentUser(user), session, setCookie }
}

/** Reads the session id from a request's Cookie header. */
export function sessionIdFromRequest(request: Request): string | null {
  return lucia().readSessionCookie(request.headers.get('cookie') ?? '')
}

/**
 * Ends every session of a user, but `exceptSessionId` (the one making the request, when it should
 * stay), inside the caller's transaction. A cookie of an ended session is refused at once.
 */
export async function endSessionsOf(userId: string, options: { transaction?: Transaction; exceptSessionId?: string | null } = {}): Promise<number> {
  database()
  const where = options.exceptSessionId ? { userId, id: { [Op.ne]: options.exceptSessionId } } : { userId }
  return SessionRow.destroy({ where, transaction: options.transaction })
}
