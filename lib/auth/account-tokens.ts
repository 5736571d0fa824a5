import 'server-only'
import { createHash, randomBytes } from 'node:crypto'
import { Op, QueryTypes, type Transaction } from 'sequelize'
import { database } from '@/lib/db'
import { ServiceError } from '@/lib/errors'
import { AccountToken } from '@/models'
import type { AccountTokenPurpose } from '@/models/account-token'

/**
 * Single-use links sent by e-mail. The token is 32 random bytes (256 bits, base64url) and only its
 * SHA-256 hash is stored: a leaked database row opens nothing. A hash without a salt is enough for
 * a secret this random (there is nothing to guess), and it lets the row be found by the hash.
 */

const HOUR_MS = 60 * 60 * 1000

/** How long each kind of link works: 24 h to verify an address, 1 h to reset a password (issue 12). */
export const TOKEN_LIFETIME_MS: Record<AccountTokenPurpose, number> = {
  'verify-email': 24 * HOUR_MS,
  'reset-password': HOUR_MS,
  'change-email': 24 * HOUR_MS,
}

/** One answer for a link that is forged, mistyped, used already or too old: nothing tells them apart. */
export class InvalidLinkError extends ServiceError {
  constructor() {
    super('This link does not work any more: it was used already, it expired, or it was copied incompletely. Ask for a new one.', 400)
  }
}

/**
 * The stored form of a token.
 *
 * @example hashToken('abc') // 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad'
 */
export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex')
}

/**
 * Makes a new link token for `userId` and returns it (the only time it exists in clear). Earlier
 * unused tokens of the same purpose stop working, so only the newest e-mail's link opens.
 */
export async function issueAccountToken(
  userId: string,
  purpose: AccountTokenPurpose,
  options: { transaction: Transaction; newEmail?: string },
): Promise<string> {
  database()
  const now = new Date()
  await AccountToken.update(
    { usedAt: now },
    { where: { userId, purpose, usedAt: null }, transaction: options.transaction },
  )
  const token = randomBytes(32).toString('base64url')
  await AccountToken.create(
    {
      userId,
      purpose,
      tokenHash: hashToken(token),
      newEmail: purpose === 'change-email' ? (options.newEmail ?? null) : null,
      expiresAt: new Date(now.getTime() + TOKEN_LIFETIME_MS[purpose]),
      usedAt: null,
    },
    { transaction: options.transaction },
  )
  return token
}

export interface UsedToken {
  readonly userId: string
  readonly newEmail: string | null
}

/**
 * Uses a token once: one UPDATE marks it used only if it is unused and unexpired, so two requests
 * racing with the same link cannot both pass. Throws InvalidLinkError otherwise. Inside a
 * transaction a later failure (a weak new password) gives the link back.
 */
export async function useAccountToken(token: string, purpose: AccountTokenPurpose, options: { transaction: Transaction }): Promise<UsedToken> {
  const rows = await database().query<{ user_id: string; new_email: string | null }>(
    `UPDATE account_tokens SET used_at = now()
      WHERE token_hash = :hash AND purpose = :purpose AND used_at IS NULL AND expires_at > now()
      RETURNING user_id, new_email`,
    { replacements: { hash: hashToken(token), purpose }, type: QueryTypes.SELECT, transaction: options.transaction },
  )
  const row = rows[0]
  if (!row) throw new InvalidLinkError()
  return { userId: row.user_id, newEmail: row.new_email }
}

/** Ends every unused link of a user (e.g. when the account is disabled). */
export async function revokeAccountTokens(userId: string, options: { transaction: Transaction }): Promise<void> {
  database()
  await AccountToken.update({ usedAt: new Date() }, { where: { userId, usedAt: { [Op.is]: null } }, transaction: options.transaction })
}
