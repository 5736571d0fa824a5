import type { Adapter, DatabaseSession, DatabaseUser } from 'lucia'
import { Op } from 'sequelize'
import { database } from '@/lib/db'
import { Session, User } from '@/models'

/** What lucia keeps of a user next to the session: enough to decide permissions without a query. */
export interface SessionUserAttributes {
  email: string
  displayName: string
  roles: string[]
  emailVerifiedAt: Date | null
}

/** What is kept beside a session: the device, for the account page's list of sessions. */
export interface SessionAttributes {
  /** The browser's User-Agent header when the session began. */
  userAgent?: string | null
  /** Set by the store; when the session was last used, to a few minutes. */
  lastSeenAt?: Date
}

function toDatabaseUser(user: User): DatabaseUser {
  return {
    id: user.id,
    attributes: {
      email: user.email,
      displayName: user.displayName,
      roles: user.roles,
      emailVerifiedAt: user.emailVerifiedAt,
    } satisfies SessionUserAttributes,
  }
}

function toDatabaseSession(session: Session): DatabaseSession {
  const attributes: SessionAttributes = { userAgent: session.userAgent, lastSeenAt: session.lastSeenAt }
  return { id: session.id, userId: session.userId, expiresAt: session.expiresAt, attributes }
}

/** Lucia's storage, over our own Sequelize models so the app has one connection pool. */
export class SequelizeSessionAdapter implements Adapter {
  async getSessionAndUser(sessionId: string): Promise<[DatabaseSession | null, DatabaseUser | null]> {
    database()
    const session = await Session.findByPk(sessionId, { include: [{ model: User, required: true }] })
    if (!session) return [null, null]
    const user = (session as Session & { User: User }).User
    // A disabled account has no live session: lucia deletes a session returned without its user.
    if (user.disabledAt) return [toDatabaseSession(session), null]
    return [toDatabaseSession(session), toDatabaseUser(user)]
  }

  async getUserSessions(userId: string): Promise<DatabaseSession[]> {
    database()
    const sessions = await Session.findAll({ where: { userId } })
    return sessions.map(toDatabaseSession)
  }

  async setSession(session: DatabaseSession): Promise<void> {
    database()
    const { userAgent } = session.attributes as SessionAttributes
    await Session.create({ id: session.id, userId: session.userId, expiresAt: session.expiresAt, userAgent: userAgent ?? null, lastSeenAt: new Date() })
  }

  async updateSessionExpiration(sessionId: string, expiresAt: Date): Promise<void> {
    database()
    await Session.update({ expiresAt }, { where: { id: sessionId } })
  }

  async deleteSession(sessionId: string): Promise<void> {
    database()
    await Session.destroy({ where: { id: sessionId } })
  }

  async deleteUserSessions(userId: string): Promise<void> {
    database()
    await Session.destroy({ where: { userId } })
  }

  async deleteExpiredSessions(): Promise<void> {
    database()
    await Session.destroy({ where: { expiresAt: { [Op.lte]: new Date() } } })
  }
}
