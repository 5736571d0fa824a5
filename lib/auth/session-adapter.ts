import type { Adapter, DatabaseSession, DatabaseUser } from 'lucia'
import { Op, QueryTypes } from 'sequelize'
import { database } from '@/lib/db'
import { KeptAnswers } from '@/lib/row-changes'
import { Session } from '@/models'

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

function toDatabaseSession(session: Session): DatabaseSession {
  const attributes: SessionAttributes = { userAgent: session.userAgent, lastSeenAt: session.lastSeenAt }
  return { id: session.id, userId: session.userId, expiresAt: session.expiresAt, attributes }
}

/** A row of getSessionAndUser's statement (dates as the driver gives them). */
interface SessionAndUserRow {
  id: string
  user_id: string
  expires_at: Date | string
  user_agent: string | null
  last_seen_at: Date | string
  email: string
  display_name: string
  roles: string[]
  email_verified_at: Date | string | null
  disabled_at: Date | string | null
}

/**
 * Sessions read lately, with their users, by session id: at most this many in a web process (about
 * a kilobyte each). Every write to a session or a user through the models drops it here at once,
 * and in other processes when the row change notice arrives.
 */
const keptSessions = new KeptAnswers<[DatabaseSession | null, DatabaseUser | null]>(50_000)

/** Lucia's storage, over our own Sequelize models so the app has one connection pool. */
export class SequelizeSessionAdapter implements Adapter {
  /**
   * The one read every signed-in request makes: kept in this process until the session or its user
   * changes (lib/row-changes.ts) or the session ends; read in one plain statement, the session and
   * the few user columns lucia keeps, without building model instances (`npm run load` measured the
   * model path at about a third of a millisecond of the web process's time per request). A disabled
   * account has no user, so its sessions are refused (lib/auth/session.ts). An unknown id is not
   * kept (forged cookies must not fill the memory).
   */
  async getSessionAndUser(sessionId: string): Promise<[DatabaseSession | null, DatabaseUser | null]> {
    return keptSessions.answer(sessionId, async () => {
      const [row] = await database().query<SessionAndUserRow>(
        `SELECT s.id, s.user_id, s.expires_at, s.user_agent, s.last_seen_at,
                u.email, u.display_name, u.roles, u.email_verified_at, u.disabled_at
           FROM sessions s JOIN users u ON u.id = s.user_id
          WHERE s.id = :sessionId`,
        { replacements: { sessionId }, type: QueryTypes.SELECT },
      )
      if (!row) return { value: [null, null], tags: null }
      const attributes: SessionAttributes = { userAgent: row.user_agent, lastSeenAt: new Date(row.last_seen_at) }
      const session: DatabaseSession = { id: row.id, userId: row.user_id, expiresAt: new Date(row.expires_at), attributes }
      const tags = [`sessions:${row.id}`, `users:${row.user_id}`]
      if (row.disabled_at !== null) return { value: [session, null], tags, until: session.expiresAt }
      const user: SessionUserAttributes = {
        email: row.email,
        displayName: row.display_name,
        roles: row.roles,
        emailVerifiedAt: row.email_verified_at === null ? null : new Date(row.email_verified_at),
      }
      return { value: [session, { id: row.user_id, attributes: user }], tags, until: session.expiresAt }
    })
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
