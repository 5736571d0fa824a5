import 'server-only'
import { UniqueConstraintError } from 'sequelize'
import { lucia } from '@/lib/auth/lucia'
import { hashPassword, isPasswordCorrect } from '@/lib/auth/password'
import { database } from '@/lib/db'
import { UnauthenticatedError, ValidationError } from '@/lib/errors'
import { beginSignIn, countSignUp } from '@/lib/rate-limits'
import { rolesAtSignUp, type Role } from '@/lib/roles'
import type { SignInInput, SignUpInput } from '@/lib/schemas/account'
import { User } from '@/models'

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
}

/**
 * Opens a session for `user`. The session the browser held before (someone else's, or an older
 * one of the same person) ends, so that signing in again never leaves two live sessions behind
 * one cookie, and a session id planted in the browser beforehand is worth nothing afterwards.
 */
async function startSession(user: User, replacingSessionId: string | null): Promise<SignedIn> {
  if (replacingSessionId) await lucia().invalidateSession(replacingSessionId)
  const session = await lucia().createSession(user.id, {})
  return { account: toAccountView(user), sessionCookie: lucia().createSessionCookie(session.id).serialize() }
}

/** Creates an account (quilter, and designer when asked for) and signs it in. */
export async function signUp(input: SignUpInput, context: SignInContext): Promise<SignedIn> {
  database()
  // Counted before the (deliberately slow) hash, and whether or not the address is taken.
  await countSignUp(context.clientAddress)
  const passwordHash = await hashPassword(input.password)
  try {
    const user = await User.create({
      email: input.email,
      displayName: input.displayName,
      passwordHash,
      roles: rolesAtSignUp(input.wantsDesignerAccount),
      emailVerifiedAt: null,
      designerRequestedAt: input.wantsDesignerAccount ? new Date() : null,
    })
    return await startSession(user, context.replacingSessionId)
  } catch (error) {
    if (error instanceof UniqueConstraintError) {
      throw new ValidationError([{ path: 'email', message: 'An account with this e-mail address already exists.' }])
    }
    throw error
  }
}

/**
 * A hash of a password nobody has, checked when the e-mail is unknown so that a wrong address
 * takes as long as a wrong password and does not reveal who has an account.
 */
let decoyHash: Promise<string> | undefined

/**
 * Signs in with e-mail and password; one message for every kind of mismatch. The rate limits
 * (lib/rate-limits.ts) count the attempt before the password is checked.
 */
export async function signIn(input: SignInInput, context: SignInContext): Promise<SignedIn> {
  database()
  const attempt = await beginSignIn(input.email, context.clientAddress)
  const user = await User.findOne({ where: { email: input.email } })
  decoyHash ??= hashPassword('no account has this password')
  const correct = await isPasswordCorrect(user?.passwordHash ?? (await decoyHash), input.password)
  if (!user || !correct) throw new UnauthenticatedError('That e-mail address and password do not match an account.')
  await attempt.succeeded()
  return startSession(user, context.replacingSessionId)
}

/** Ends one session; returns the Set-Cookie header value that clears the cookie. */
export async function signOut(sessionId: string | null): Promise<string> {
  if (sessionId) await lucia().invalidateSession(sessionId)
  return lucia().createBlankSessionCookie().serialize()
}
