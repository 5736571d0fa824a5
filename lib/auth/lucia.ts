import { Lucia, TimeSpan } from 'lucia'
import { isSessionCookieSecure } from '@/lib/env'
import { SequelizeSessionAdapter, type SessionAttributes, type SessionUserAttributes } from './session-adapter'

export const SESSION_COOKIE_NAME = 'wreathwright_session'

let instance: Lucia<SessionAttributes, SessionUserAttributes> | undefined

/**
 * The session manager. Cookie: HttpOnly and SameSite=Lax (lucia's defaults), Secure outside
 * development; sessions last 30 days and are extended when used in their second half.
 */
export function lucia() {
  instance ??= new Lucia(new SequelizeSessionAdapter(), {
    sessionExpiresIn: new TimeSpan(30, 'd'),
    sessionCookie: { name: SESSION_COOKIE_NAME, attributes: { secure: isSessionCookieSecure() } },
    getSessionAttributes: (attributes) => attributes,
    getUserAttributes: (attributes) => attributes,
  })
  return instance
}

declare module 'lucia' {
  interface Register {
    Lucia: ReturnType<typeof lucia>
    DatabaseUserAttributes: SessionUserAttributes
    DatabaseSessionAttributes: SessionAttributes
  }
}
