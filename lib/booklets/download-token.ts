import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto'

/**
 * The short-lived download link of a buyer's booklet: `?token=<payload>.<signature>`, the payload
 * naming the build, the person it was given to and when it stops working, signed with
 * HMAC-SHA-256 (RFC 2104) under a server secret. The route also asks the authorization rules, so a
 * link handed to someone else opens nothing; the token only keeps an old or made-up link shut.
 */

export interface DownloadGrant {
  readonly buildId: string
  readonly userId: string
  /** Seconds since 1970 when the link stops working. */
  readonly expiresAt: number
}

/** A secret made by this process when none is configured (links then work on this instance only). */
let processSecret: string | undefined

/** The configured secret, or this process's own. */
export function linkSecret(configured: string | null): string {
  if (configured) return configured
  processSecret ??= randomBytes(32).toString('base64url')
  return processSecret
}

function signature(payload: string, secret: string): Buffer {
  return createHmac('sha256', secret).update(`wreathwright-booklet-link\n${payload}`).digest()
}

/**
 * The token for a grant.
 *
 * @example signDownloadToken({ buildId: 'b1', userId: 'u1', expiresAt: 2000000000 }, 'a-secret').split('.').length // 2
 */
export function signDownloadToken(grant: DownloadGrant, secret: string): string {
  const payload = Buffer.from(JSON.stringify([grant.buildId, grant.userId, grant.expiresAt])).toString('base64url')
  return `${payload}.${signature(payload, secret).toString('base64url')}`
}

/**
 * The grant a token carries when its signature is right and it has not expired; null otherwise
 * (forged, altered, expired or garbled alike).
 *
 * @example verifyDownloadToken('not-a-token', 'a-secret', 0) // null
 */
export function verifyDownloadToken(token: string, secret: string, nowSeconds: number): DownloadGrant | null {
  const [payload, given, ...rest] = token.split('.')
  if (!payload || !given || rest.length > 0 || token.length > 1000) return null
  const expected = signature(payload, secret)
  const actual = Buffer.from(given, 'base64url')
  if (actual.length !== expected.length || !timingSafeEqual(actual, expected)) return null
  try {
    const [buildId, userId, expiresAt] = JSON.parse(Buffer.from(payload, 'base64url').toString('utf8')) as unknown[]
    if (typeof buildId !== 'string' || typeof userId !== 'string' || typeof expiresAt !== 'number') return null
    if (expiresAt <= nowSeconds) return null
    return { buildId, userId, expiresAt }
  } catch {
    return null
  }
}
