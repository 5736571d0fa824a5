import 'server-only'
import { createHash } from 'node:crypto'
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible'
import type { Sequelize } from 'sequelize'
import { database } from '@/lib/db'
import { TooManyRequestsError } from '@/lib/errors'

/**
 * Every rate limit of the app, in one place. Counters live in PostgreSQL (table `rate_limits`,
 * created by migrations/20261202-0010-create-rate-limits.ts) through rate-limiter-flexible's
 * RateLimiterPostgres, so they hold across app instances and restarts. Each window is fixed: it
 * starts with the first counted attempt and ends `windowSeconds` later, whatever happens in it.
 * A refusal is a 429 with `Retry-After` (lib/http.ts) and a plain message.
 *
 * Sign-in counts failures three ways, each checked (and counted) before the password hash is
 * verified, so parallel guesses cannot slip past a count that has not been written yet:
 * - per account and address: the usual brute-force guard. It is the lowest, and a successful
 *   sign-in from that address clears it (that person knows the password).
 * - per account, from every address together: against guessing spread over many addresses. It is
 *   higher than the one above, so one address alone cannot lock the owner out.
 * - per address, over every account: against trying one password on many accounts. A success
 *   gives back only its own count and never clears the rest, so signing in to an account of one's
 *   own does not buy more guesses at others.
 * An unknown e-mail address is counted exactly like a known one, so the limits reveal no accounts.
 */

export interface RateLimit {
  /** How many attempts the window allows; the next one is refused. */
  readonly points: number
  readonly windowSeconds: number
  /** What is counted, for the refusal's message: "Too many {what}; try again in N minutes." */
  readonly what: string
}

const MINUTE = 60
const HOUR = 60 * MINUTE

/**
 * The numbers. Sources: OWASP Authentication Cheat Sheet ("Login Throttling", "Account Lockout":
 * count per account, lock for a period rather than for good), NIST SP 800-63B §5.2.2 (no more than
 * 100 consecutive failures per account); the figures themselves are common practice.
 */
export const RATE_LIMITS = {
  /** Wrong passwords for one e-mail address from one client address. */
  signInPerAccountAndAddress: { points: 10, windowSeconds: 15 * MINUTE, what: 'sign-in attempts' },
  /** Wrong passwords for one e-mail address from all addresses together. */
  signInPerAccount: { points: 50, windowSeconds: HOUR, what: 'sign-in attempts for this account' },
  /** Failed sign-ins from one client address, whatever the account. */
  signInPerAddress: { points: 50, windowSeconds: 15 * MINUTE, what: 'sign-in attempts from this address' },
  /** Accounts created from one client address. */
  signUpPerAddress: { points: 10, windowSeconds: HOUR, what: 'new accounts from this address' },
  /** Password-reset requests from one client address (for the reset route to come). */
  passwordResetPerAddress: { points: 10, windowSeconds: HOUR, what: 'password reset requests from this address' },
  /** Password-reset requests for one e-mail address, so nobody's inbox is flooded with reset mail. */
  passwordResetPerAccount: { points: 3, windowSeconds: HOUR, what: 'password reset requests for this account' },
  /** "Send it again" for the verification e-mail, per account. */
  verificationResendPerAccount: { points: 3, windowSeconds: HOUR, what: 'verification e-mails for this account' },
  /**
   * Images one designer uploads, every attempt counted (each costs a decode on the server): 30 in
   * 10 minutes, a few a minute kept up for a while. Our choice, common practice for uploads.
   */
  uploadsPerUser: { points: 30, windowSeconds: 10 * MINUTE, what: 'uploads' },
  /**
   * Tester invitations one designer sends (each is an e-mail to an address they typed): 30 an hour,
   * a generous test round at once, yet no mailing-list cannon. Our choice.
   */
  invitationsPerDesigner: { points: 30, windowSeconds: HOUR, what: 'tester invitations' },
  /**
   * Checkouts one person starts: each opens a session at the payment provider. 20 an hour is more
   * than anyone buying patterns needs. Our choice.
   */
  checkoutsPerUser: { points: 20, windowSeconds: HOUR, what: 'checkouts' },
  /** Test reports one person files: 20 an hour, more than a careful tester writes in a sitting. Our choice. */
  reportsPerUser: { points: 20, windowSeconds: HOUR, what: 'reports' },
  /** Answers one person writes in reports' threads: 60 an hour. Our choice. */
  reportMessagesPerUser: { points: 60, windowSeconds: HOUR, what: 'answers' },
  /**
   * Booklets one buyer asks the server to build (each costs a worker a second or more; asking again
   * for one already built is counted too, cheap as it is): 30 an hour, every paper and colourway
   * of a few patterns. Our choice.
   */
  bookletBuildsPerUser: { points: 30, windowSeconds: HOUR, what: 'booklet requests' },
  /**
   * Sewing projects one person starts (each works out a checklist from the pattern's plan): 30 an
   * hour, far past anyone trying sizes and colourways of a few patterns at once. Our choice.
   */
  sewingProjectStartsPerUser: { points: 30, windowSeconds: HOUR, what: 'new sewing projects' },
  /**
   * Step ticks, unticks and notes one person saves, over all their projects: 600 a minute, ten a
   * second kept up for a whole minute. A quilter ticking as fast as a thumb can, or a phone sending
   * a few hundred ticks it kept while offline, stays under it; a script hammering the route does
   * not. The sewing room waits out a 429 and sends again (lib/sewing-room-client/step-sync.ts), so
   * even a refusal loses no tick. Our choice.
   */
  sewingStepChangesPerUser: { points: 600, windowSeconds: MINUTE, what: 'step changes' },
} as const satisfies Record<string, RateLimit>

export type RateLimitName = keyof typeof RATE_LIMITS

/** The table the counters live in (see the migration). */
const TABLE = 'rate_limits'

type Limiters = Record<RateLimitName, RateLimiterPostgres>
let limiters: { for: Sequelize; limiters: Limiters } | undefined

/** The limiters over the shared connection pool, made again if the pool was replaced (tests). */
function limitersNow(): Limiters {
  const sequelize = database()
  if (limiters?.for !== sequelize) {
    const make = (name: RateLimitName) =>
      new RateLimiterPostgres({
        storeClient: sequelize,
        storeType: 'sequelize',
        tableName: TABLE,
        // The migration made the table: the library must not try DDL at run time.
        tableCreated: true,
        // Every limiter would delete ended windows from the shared table every 5 minutes; one is enough.
        clearExpiredByTimeout: name === 'signInPerAddress',
        keyPrefix: name,
        points: RATE_LIMITS[name].points,
        duration: RATE_LIMITS[name].windowSeconds,
      })
    const all = Object.fromEntries(Object.keys(RATE_LIMITS).map((name) => [name, make(name as RateLimitName)])) as Limiters
    limiters = { for: sequelize, limiters: all }
  }
  return limiters.limiters
}

/**
 * The stored key for what is counted: a hash, so the table holds no e-mail or client addresses and
 * every key fits the library's 255-character column.
 *
 * @example counterKey('ada@example.test', '192.0.2.7').length // 64
 */
export function counterKey(...parts: readonly string[]): string {
  return createHash('sha256').update(parts.join('\n')).digest('hex')
}

/**
 * The refusal's message, in whole minutes (rounded up) as people read them.
 *
 * @example refusalMessage('sign-in attempts', 61) // 'Too many sign-in attempts; try again in 2 minutes.'
 */
export function refusalMessage(what: string, retryAfterSeconds: number): string {
  const minutes = Math.max(1, Math.ceil(retryAfterSeconds / MINUTE))
  return `Too many ${what}; try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`
}

/** Counts one attempt against a limit; throws TooManyRequestsError when the window is used up. */
async function consume(name: RateLimitName, key: string): Promise<void> {
  try {
    await limitersNow()[name].consume(key)
  } catch (error) {
    // The library rejects with its result object when the limit is reached, with an Error when the store fails.
    if (!(error instanceof RateLimiterRes)) throw error
    const retryAfterSeconds = Math.max(1, Math.ceil(error.msBeforeNext / 1000))
    throw new TooManyRequestsError(refusalMessage(RATE_LIMITS[name].what, retryAfterSeconds), retryAfterSeconds)
  }
}

/** A sign-in attempt that passed the limits; tell it when the password was right. */
export interface SignInAttempt {
  /** Gives back this attempt's count and clears the account-and-address count. */
  succeeded(): Promise<void>
}

/**
 * Counts a sign-in attempt for `email` (normalised, as the schema gives it) from `address`
 * (lib/client-address.ts) before the password is checked; a failure simply stays counted.
 */
export async function beginSignIn(email: string, address: string): Promise<SignInAttempt> {
  const keys = {
    signInPerAddress: counterKey(address),
    signInPerAccountAndAddress: counterKey(email, address),
    signInPerAccount: counterKey(email),
  } as const
  // In this order: a refused address never reaches the account's counts.
  await consume('signInPerAddress', keys.signInPerAddress)
  await consume('signInPerAccountAndAddress', keys.signInPerAccountAndAddress)
  await consume('signInPerAccount', keys.signInPerAccount)
  return {
    async succeeded() {
      const all = limitersNow()
      await Promise.all([
        all.signInPerAddress.reward(keys.signInPerAddress, 1),
        all.signInPerAccount.reward(keys.signInPerAccount, 1),
        all.signInPerAccountAndAddress.delete(keys.signInPerAccountAndAddress),
      ])
    },
  }
}

/** Counts a sign-up from `address`; throws TooManyRequestsError past the limit. */
export async function countSignUp(address: string): Promise<void> {
  await consume('signUpPerAddress', counterKey(address))
}

/**
 * Counts a password-reset request for `email` from `address`; throws TooManyRequestsError past
 * either limit.
 */
export async function countPasswordReset(email: string, address: string): Promise<void> {
  await consume('passwordResetPerAddress', counterKey(address))
  await consume('passwordResetPerAccount', counterKey(email))
}

/** Counts a "send the verification e-mail again" for an account; throws TooManyRequestsError past the limit. */
export async function countVerificationResend(userId: string): Promise<void> {
  await consume('verificationResendPerAccount', counterKey(userId))
}

/** Counts a tester invitation sent by a designer (their user id); throws TooManyRequestsError past the limit. */
export async function countInvitation(userId: string): Promise<void> {
  await consume('invitationsPerDesigner', counterKey(userId))
}

/** Counts an upload attempt by a person (their user id); throws TooManyRequestsError past the limit. */
export async function countUpload(userId: string): Promise<void> {
  await consume('uploadsPerUser', counterKey(userId))
}

/** Counts a test report filed by a person (their user id); throws TooManyRequestsError past the limit. */
export async function countReport(userId: string): Promise<void> {
  await consume('reportsPerUser', counterKey(userId))
}

/** Counts an answer written in a report's thread; throws TooManyRequestsError past the limit. */
export async function countReportMessage(userId: string): Promise<void> {
  await consume('reportMessagesPerUser', counterKey(userId))
}

/** Counts a checkout started by a person (their user id); throws TooManyRequestsError past the limit. */
export async function countCheckout(userId: string): Promise<void> {
  await consume('checkoutsPerUser', counterKey(userId))
}

/** Counts a buyer's booklet request (lib/services/booklets.ts). */
export async function countBookletBuild(userId: string): Promise<void> {
  await consume('bookletBuildsPerUser', counterKey(userId))
}

/** Counts a sewing project started by a person (their user id); throws TooManyRequestsError past the limit. */
export async function countSewingProjectStart(userId: string): Promise<void> {
  await consume('sewingProjectStartsPerUser', counterKey(userId))
}

/** Counts a step change (tick, untick, note) saved by a person; throws TooManyRequestsError past the limit. */
export async function countStepChange(userId: string): Promise<void> {
  await consume('sewingStepChangesPerUser', counterKey(userId))
}
