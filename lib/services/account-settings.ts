import 'server-only'
import { Op, UniqueConstraintError } from 'sequelize'
import { InvalidLinkError, issueAccountToken, useAccountToken } from '@/lib/auth/account-tokens'
import { describeDevice } from '@/lib/auth/device'
import { lucia } from '@/lib/auth/lucia'
import { hashPassword, isPasswordCorrect } from '@/lib/auth/password'
import { endSessionsOf, type CurrentUser } from '@/lib/auth/session'
import { database } from '@/lib/db'
import { ConflictError, UnauthenticatedError, ValidationError } from '@/lib/errors'
import { queueMail } from '@/lib/mail/outbox'
import { requireStrongPassword } from '@/lib/password-strength'
import { beginSignIn } from '@/lib/rate-limits'
import type { Role } from '@/lib/roles'
import type { EmailChangeInput, PasswordChangeInput } from '@/lib/schemas/account'
import { Pattern, PatternRevision, PatternStateChange, Session, User } from '@/models'
import { appLink, LINK_PATHS } from './accounts'
import { removeUploadsOf } from './uploads'
import { claimInvitationsOf } from './invitations'

/**
 * The account page: one's name, address, password, sessions, and leaving. Every function acts
 * on the signed-in person only (`actor`), so there is nobody else to authorize; what needs the
 * current password asks for it again.
 */

export interface SessionView {
  /** The browser and system, e.g. "Firefox 128 on Windows". */
  readonly device: string
  readonly lastSeenAt: string
  /** The session of the browser asking. */
  readonly current: boolean
}

export interface AccountOverview {
  readonly email: string
  readonly displayName: string
  readonly emailVerified: boolean
  readonly roles: readonly Role[]
  /** When a designer account was asked for and not yet granted; null otherwise. */
  readonly designerRequestedAt: string | null
  /** Newest first. Session ids are the cookie's secret and are never shown. */
  readonly sessions: readonly SessionView[]
}

async function loadUser(actor: CurrentUser): Promise<User> {
  database()
  const user = await User.findByPk(actor.id)
  if (!user || user.disabledAt) throw new UnauthenticatedError()
  return user
}

/** Where a request of the account page comes from, for the rate limits. */
export interface RequestContext {
  /** The client's address (lib/client-address.ts). */
  readonly clientAddress: string
}

/**
 * Throws a 422 on `currentPassword` unless it is the account's password. Each try counts as a
 * sign-in attempt (lib/rate-limits.ts), so a borrowed session cannot be used to guess the password.
 */
async function requirePassword(user: User, password: string, context: RequestContext): Promise<void> {
  const attempt = await beginSignIn(user.email, context.clientAddress)
  if (!(await isPasswordCorrect(user.passwordHash, password))) {
    throw new ValidationError([{ path: 'currentPassword', message: 'That is not your current password.' }])
  }
  await attempt.succeeded()
}

export async function getAccountOverview(actor: CurrentUser, currentSessionId: string | null): Promise<AccountOverview> {
  const user = await loadUser(actor)
  const sessions = await Session.findAll({ where: { userId: user.id, expiresAt: { [Op.gt]: new Date() } }, order: [['lastSeenAt', 'DESC']] })
  return {
    email: user.email,
    displayName: user.displayName,
    emailVerified: user.emailVerifiedAt !== null,
    roles: user.roles,
    designerRequestedAt: user.roles.includes('designer') ? null : (user.designerRequestedAt?.toISOString() ?? null),
    sessions: sessions.map((session) => ({
      device: describeDevice(session.userAgent),
      lastSeenAt: session.lastSeenAt.toISOString(),
      current: session.id === currentSessionId,
    })),
  }
}

export async function changeDisplayName(actor: CurrentUser, displayName: string): Promise<{ readonly displayName: string }> {
  const user = await loadUser(actor)
  await user.update({ displayName })
  return { displayName }
}

/** The answer to every address change, whether or not the new address is free. */
export const EMAIL_CHANGE_ANSWER = {
  message: 'We sent a link to the new address. Your address changes when you open it (within 24 hours); your current address has been told.',
} as const

/**
 * Starts moving the account to a new address: the current password is needed; the new address gets
 * a link (24 hours, once) and the current one a notice. Nothing changes until the link is used.
 * If the new address belongs to another account, no link is sent but the answer is the same, so
 * the form cannot be used to find out who has an account.
 */
export async function requestEmailChange(actor: CurrentUser, input: EmailChangeInput, context: RequestContext): Promise<typeof EMAIL_CHANGE_ANSWER> {
  const user = await loadUser(actor)
  await requirePassword(user, input.currentPassword, context)
  if (input.newEmail === user.email) throw new ValidationError([{ path: 'newEmail', message: 'That is your current address already.' }])
  const taken = (await User.count({ where: { email: input.newEmail } })) > 0
  await database().transaction(async (transaction) => {
    if (!taken) {
      const token = await issueAccountToken(user.id, 'change-email', { transaction, newEmail: input.newEmail })
      await queueMail(
        {
          to: input.newEmail,
          kind: 'email-change-verify',
          data: { displayName: user.displayName, newEmail: input.newEmail, verifyUrl: appLink(`${LINK_PATHS.changeEmail}#token=${token}`) },
          userId: user.id,
        },
        { transaction },
      )
    }
    await queueMail({ to: user.email, kind: 'email-change-notice', data: { displayName: user.displayName, newEmail: input.newEmail }, userId: user.id }, { transaction })
  })
  return EMAIL_CHANGE_ANSWER
}

/** Moves the account to the address the link was sent to (which is thereby verified). */
export async function confirmEmailChange(token: string): Promise<{ readonly email: string }> {
  try {
    return await database().transaction(async (transaction) => {
      const { userId, newEmail } = await useAccountToken(token, 'change-email', { transaction })
      const user = await User.findByPk(userId, { transaction, lock: transaction.LOCK.UPDATE })
      if (!user || user.disabledAt || !newEmail) throw new InvalidLinkError()
      await user.update({ email: newEmail, emailVerifiedAt: new Date() }, { transaction })
      // The new address is proven: tester invitations sent to it are now this person's.
      await claimInvitationsOf(user, transaction)
      return { email: newEmail }
    })
  } catch (error) {
    if (error instanceof UniqueConstraintError) throw new ConflictError('Another account has taken that address in the meantime; nothing was changed.')
    throw error
  }
}

/**
 * Changes the password (the current one is needed; the new one must pass the strength check).
 * Every other session ends; this browser stays signed in. The owner is told by e-mail.
 */
export async function changePassword(
  actor: CurrentUser,
  currentSessionId: string | null,
  input: PasswordChangeInput,
  context: RequestContext,
): Promise<{ readonly endedSessions: number }> {
  const user = await loadUser(actor)
  await requirePassword(user, input.currentPassword, context)
  await requireStrongPassword(input.newPassword, [user.email, user.displayName], 'newPassword')
  const passwordHash = await hashPassword(input.newPassword)
  return database().transaction(async (transaction) => {
    await user.update({ passwordHash }, { transaction })
    const endedSessions = await endSessionsOf(user.id, { transaction, exceptSessionId: currentSessionId })
    await queueMail({ to: user.email, kind: 'password-changed', data: { displayName: user.displayName }, userId: user.id }, { transaction })
    return { endedSessions }
  })
}

/** "Sign out everywhere else": ends every session of the person but this one. */
export async function endOtherSessions(actor: CurrentUser, currentSessionId: string | null): Promise<{ readonly endedSessions: number }> {
  const user = await loadUser(actor)
  return { endedSessions: await endSessionsOf(user.id, { exceptSessionId: currentSessionId }) }
}

/**
 * Deletes the account (the current password is needed). With it go: its sessions, links, uploaded
 * images, and its patterns that are drafts or in testing. A published pattern is retired (it
 * leaves the shop), and retired patterns stay, without an owner, for the people who hold a
 * licence to them (migration 20261202-0081); their revisions and history forget who saved them.
 * Returns the Set-Cookie value that clears this browser's cookie.
 */
export async function deleteAccount(actor: CurrentUser, currentPassword: string, context: RequestContext): Promise<{ readonly clearedCookie: string }> {
  const user = await loadUser(actor)
  await requirePassword(user, currentPassword, context)
  // First, while the row still names them: the images in the object store (the foreign key would
  // remove only their rows).
  await removeUploadsOf(user.id)
  await database().transaction(async (transaction) => {
    await Pattern.destroy({ where: { ownerId: user.id, state: ['draft', 'testing'] }, transaction })
    // A published pattern leaves the shop (nobody would receive its sales) as a retirement of
    // its own, with its revision and history row like any other state change.
    const published = await Pattern.findAll({ where: { ownerId: user.id, state: 'published' }, transaction, lock: transaction.LOCK.UPDATE })
    for (const pattern of published) {
      pattern.set({ state: 'retired', revision: pattern.revision + 1 })
      await pattern.save({ transaction })
      await PatternRevision.create(
        { patternId: pattern.id, revision: pattern.revision, name: pattern.name, state: 'retired', design: pattern.design, savedById: user.id },
        { transaction },
      )
      await PatternStateChange.create({ patternId: pattern.id, fromState: 'published', toState: 'retired', changedById: user.id }, { transaction })
    }
    await user.destroy({ transaction })
  })
  return { clearedCookie: lucia().createBlankSessionCookie().serialize() }
}
