import 'server-only'
import { setTimeout as sleep } from 'node:timers/promises'
import { UniqueConstraintError, type Transaction } from 'sequelize'
import { issueAccountToken, InvalidLinkError, revokeAccountTokens, useAccountToken } from '@/lib/auth/account-tokens'
import { lucia } from '@/lib/auth/lucia'
import { hashPassword, isPasswordCorrect } from '@/lib/auth/password'
import { endSessionsOf, type CurrentUser } from '@/lib/auth/session'
import { database } from '@/lib/db'
import { originSettings } from '@/lib/env'
import { ConflictError, ServiceError, UnauthenticatedError } from '@/lib/errors'
import { queueMail } from '@/lib/mail/outbox'
import { requireStrongPassword } from '@/lib/password-strength'
import { beginSignIn, countPasswordReset, countSignUp, countVerificationResend } from '@/lib/rate-limits'
import { rolesAtSignUp, type Role } from '@/lib/roles'
import type { SignInInput, SignUpInput } from '@/lib/schemas/account'
import { User } from '@/models'
import { afterClaimPath, claimInvitationsOf } from './invitations'

/**
 * Signing up, in and out, verifying an address, resetting a password, and disabling an account.
 * Sign-up and reset answer the same, in about the same time, whether or not an address has an
 * account (issue 12): only the e-mail that follows differs, and only its owner reads it.
 */

export interface AccountView {
  readonly id: string
  readonly email: string
  readonly displayName: string
  readonly roles: readonly Role[]
}

export interface SignedIn {
  readonly account: AccountView
  /** The Set-Cookie header value that carries the new session. */
  readonly sessionCookie: string
}

function toAccountView(user: User): AccountView {
  return { id: user.id, email: user.email, displayName: user.displayName, roles: user.roles }
}

/** Where a sign-in or sign-up comes from, as the route sees it. */
export interface SignInContext {
  /** The client's address (lib/client-address.ts), for the rate limits. */
  readonly clientAddress: string
  /** The session of the cookie the request carried, if any: the new session replaces it. */
  readonly replacingSessionId: string | null
  /** The browser's User-Agent, to name the device on the account page. */
  readonly userAgent?: string | null
}

/**
 * Sign-up and reset requests answer no sooner than this after they arrive. The work behind them
 * differs with the address (an account created and a link stored, or only a notice queued), and
 * this floor hides the difference: it is several times the slowest path seen here (an argon2 hash
 * of ~40 ms plus a few inserts), with room for a busy machine.
 */
export const UNIFORM_ANSWER_MS = 400

/** Waits until `UNIFORM_ANSWER_MS` after `startedAt` (a `performance.now()` reading). */
async function answerNoSoonerThan(startedAt: number): Promise<void> {
  const left = UNIFORM_ANSWER_MS - (performance.now() - startedAt)
  if (left > 0) await sleep(left)
}

/** An absolute link into the app, from its public origin (PUBLIC_URL; lib/env.ts). */
export function appLink(path: string): string {
  return new URL(path, originSettings().origins[0]).toString()
}

/**
 * Link paths. The token rides in the fragment (`#token=`), which browsers never send to a server,
 * so it stays out of access logs and Referer headers; the page reads it and posts it.
 */
export const LINK_PATHS = {
  verifyEmail: '/verify-email',
  resetPassword: '/reset-password/new',
  changeEmail: '/account/confirm-email',
} as const

const tokenLink = (path: string, token: string) => appLink(`${path}#token=${token}`)

function disabledAccountError(): ServiceError {
  return new ServiceError('This account has been disabled. Write to the Wreathwright team if you think this is a mistake.', 403)
}

/**
 * Opens a session for `user`. The session the browser held before (someone else's, or an older
 * one of the same person) ends, so that signing in again never leaves two live sessions behind
 * one cookie, and a session id planted in the browser beforehand is worth nothing afterwards.
 */
async function startSession(user: User, context: SignInContext): Promise<SignedIn> {
  if (context.replacingSessionId) await lucia().invalidateSession(context.replacingSessionId)
  const session = await lucia().createSession(user.id, { userAgent: context.userAgent?.slice(0, 512) ?? null })
  return { account: toAccountView(user), sessionCookie: lucia().createSessionCookie(session.id).serialize() }
}

/** The answer to every sign-up, whatever became of it. */
export const SIGN_UP_ANSWER = {
  message: 'Check your e-mail: we sent a message to the address you gave. Open its link to confirm the address, then sign in.',
} as const

/** Queues the verification e-mail for `user`'s address with a new link. */
async function sendVerification(user: User, transaction: Transaction): Promise<void> {
  const token = await issueAccountToken(user.id, 'verify-email', { transaction })
  await queueMail(
    { to: user.email, kind: 'verify-email', data: { displayName: user.displayName, verifyUrl: tokenLink(LINK_PATHS.verifyEmail, token) }, userId: user.id },
    { transaction },
  )
}

/** Tells the owner of `user`'s address that someone tried to sign up with it. */
async function sendSignUpAttempt(user: User, transaction?: Transaction): Promise<void> {
  await queueMail(
    {
      to: user.email,
      kind: 'sign-up-attempt',
      data: { displayName: user.displayName, signInUrl: appLink('/sign-in'), resetUrl: appLink('/reset-password') },
      userId: user.id,
    },
    { transaction },
  )
}

/**
 * Creates an account (a quilter; a designer wish becomes a request for an admin) and e-mails a
 * verification link; if the address has an account already, nothing changes and its owner is told
 * by e-mail. Either way the answer is the same and comes no sooner than `UNIFORM_ANSWER_MS`; no
 * session is opened (the person signs in, and may do so before verifying).
 */
export async function signUp(input: SignUpInput, context: { readonly clientAddress: string }): Promise<typeof SIGN_UP_ANSWER> {
  const startedAt = performance.now()
  database()
  // Counted before the (deliberately slow) hash, and whether or not the address is taken.
  await countSignUp(context.clientAddress)
  await requireStrongPassword(input.password, [input.email, input.displayName])
  // Hashed in both cases, so that the time taken tells nothing.
  const passwordHash = await hashPassword(input.password)
  const existing = await User.findOne({ where: { email: input.email } })
  try {
    await database().transaction(async (transaction) => {
      if (existing) return sendSignUpAttempt(existing, transaction)
      const user = await User.create(
        {
          email: input.email,
          displayName: input.displayName,
          passwordHash,
          roles: rolesAtSignUp(),
          emailVerifiedAt: null,
          designerRequestedAt: input.wantsDesigner ? new Date() : null,
        },
        { transaction },
      )
      await sendVerification(user, transaction)
    })
  } catch (error) {
    // Two sign-ups with one address at the same moment: the second is an attempt on a known address.
    if (!(error instanceof UniqueConstraintError)) throw error
    const winner = await User.findOne({ where: { email: input.email } })
    if (winner) await sendSignUpAttempt(winner)
  }
  await answerNoSoonerThan(startedAt)
  return SIGN_UP_ANSWER
}

/**
 * A hash of a password nobody has, checked when the e-mail is unknown so that a wrong address
 * takes as long as a wrong password and does not reveal who has an account.
 */
let decoyHash: Promise<string> | undefined

/**
 * Signs in with e-mail and password; one message for every kind of mismatch. The rate limits
 * (lib/rate-limits.ts) count the attempt before the password is checked. A disabled account is
 * refused with its own message, but only after the right password (so it reveals nothing more).
 */
export async function signIn(input: SignInInput, context: SignInContext): Promise<SignedIn> {
  database()
  const attempt = await beginSignIn(input.email, context.clientAddress)
  const user = await User.findOne({ where: { email: input.email } })
  decoyHash ??= hashPassword('no account has this password')
  const correct = await isPasswordCorrect(user?.passwordHash ?? (await decoyHash), input.password)
  if (!user || !correct) throw new UnauthenticatedError('That e-mail address and password do not match an account.')
  await attempt.succeeded()
  if (user.disabledAt) throw disabledAccountError()
  return startSession(user, context)
}

/** Ends one session; returns the Set-Cookie header value that clears the cookie. */
export async function signOut(sessionId: string | null): Promise<string> {
  if (sessionId) await lucia().invalidateSession(sessionId)
  return lucia().createBlankSessionCookie().serialize()
}

/**
 * Marks the address of the link's account as verified. The link works once, for 24 hours. The
 * address now proven, the tester invitations sent to it are claimed (lib/services/invitations.ts);
 * `next` is then the page of the newest one, for the confirmation page to lead to.
 */
export async function verifyEmail(token: string): Promise<{ readonly verified: true; readonly next?: string }> {
  const next = await database().transaction(async (transaction) => {
    const { userId } = await useAccountToken(token, 'verify-email', { transaction })
    const user = await User.findByPk(userId, { transaction })
    if (!user || user.disabledAt) throw new InvalidLinkError()
    if (!user.emailVerifiedAt) await user.update({ emailVerifiedAt: new Date() }, { transaction })
    return afterClaimPath(await claimInvitationsOf(user, transaction))
  })
  return next ? { verified: true, next } : { verified: true }
}

/** Sends the signed-in person a new verification link ("send it again"); earlier links stop working. */
export async function resendVerification(actor: CurrentUser): Promise<{ readonly sent: boolean }> {
  database()
  await countVerificationResend(actor.id)
  const user = await User.findByPk(actor.id)
  if (!user) throw new UnauthenticatedError()
  if (user.emailVerifiedAt) throw new ConflictError('Your e-mail address is verified already.')
  await database().transaction((transaction) => sendVerification(user, transaction))
  return { sent: true }
}

/** The answer to every reset request. */
export const PASSWORD_RESET_ANSWER = {
  message: 'If an account has this address, we sent it a link to choose a new password. The link works for one hour.',
} as const

/**
 * Sends a password-reset link (valid 1 hour, once) when the address has an account that is not
 * disabled. The answer is the same either way and comes no sooner than `UNIFORM_ANSWER_MS`.
 */
export async function requestPasswordReset(email: string, context: { readonly clientAddress: string }): Promise<typeof PASSWORD_RESET_ANSWER> {
  const startedAt = performance.now()
  database()
  await countPasswordReset(email, context.clientAddress)
  const user = await User.findOne({ where: { email } })
  if (user && !user.disabledAt) {
    await database().transaction(async (transaction) => {
      const token = await issueAccountToken(user.id, 'reset-password', { transaction })
      await queueMail(
        { to: user.email, kind: 'password-reset', data: { displayName: user.displayName, resetUrl: tokenLink(LINK_PATHS.resetPassword, token) }, userId: user.id },
        { transaction },
      )
    })
  }
  await answerNoSoonerThan(startedAt)
  return PASSWORD_RESET_ANSWER
}

/**
 * Sets a new password from a reset link: the password must be strong enough (a 422 naming
 * `password` with the reason; the link still works then), every session of the account ends, and
 * the owner is told by e-mail. Opening the link proves the address, so it counts as verified.
 */
export async function confirmPasswordReset(token: string, password: string): Promise<{ readonly changed: true }> {
  await database().transaction(async (transaction) => {
    const { userId } = await useAccountToken(token, 'reset-password', { transaction })
    const user = await User.findByPk(userId, { transaction, lock: transaction.LOCK.UPDATE })
    if (!user || user.disabledAt) throw new InvalidLinkError()
    // A weak password throws here and the rollback gives the link back.
    await requireStrongPassword(password, [user.email, user.displayName])
    await user.update({ passwordHash: await hashPassword(password), emailVerifiedAt: user.emailVerifiedAt ?? new Date() }, { transaction })
    await endSessionsOf(user.id, { transaction })
    await queueMail({ to: user.email, kind: 'password-changed', data: { displayName: user.displayName }, userId: user.id }, { transaction })
  })
  return { changed: true }
}

/**
 * Disables or re-enables an account, for the admin desk (which authorizes and audits the change).
 * Disabling ends every session of the account at once and every unused e-mail link; a disabled
 * account cannot sign in, and a session it still had would be refused anyway
 * (lib/auth/session-adapter.ts).
 *
 * @example await setAccountDisabled(user.id, true, { transaction })
 */
export async function setAccountDisabled(userId: string, disabled: boolean, options: { transaction?: Transaction } = {}): Promise<void> {
  database()
  const run = async (transaction: Transaction) => {
    const user = await User.findByPk(userId, { transaction, lock: transaction.LOCK.UPDATE })
    if (!user) throw new ServiceError('No such account.', 404)
    if (disabled === Boolean(user.disabledAt)) return
    await user.update({ disabledAt: disabled ? new Date() : null }, { transaction })
    if (disabled) {
      await revokeAccountTokens(userId, { transaction })
      await endSessionsOf(userId, { transaction })
    }
  }
  if (options.transaction) await run(options.transaction)
  else await database().transaction(run)
}
