import { QueryTypes } from 'sequelize'
import { afterAll, afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { POST as signIn } from '@/app/api/auth/sign-in/route'
import { POST as signUp } from '@/app/api/auth/sign-up/route'
import { PEER_ADDRESS_HEADER } from '@/lib/client-address'
import { database } from '@/lib/db'
import { createMigrator } from '@/lib/migrator'
import { countPasswordReset, RATE_LIMITS } from '@/lib/rate-limits'
import { Session } from '@/models'
import { closeDatabase, freshDatabase } from '../support/database'
import { createUser, TEST_PASSWORD } from '../support/factories'
import { TEST_ORIGIN } from '../support/requests'

/**
 * The limits of lib/rate-limits.ts against the real route handlers and PostgreSQL. Time is moved
 * with vitest's fake Date (rate-limiter-flexible computes every window from Date.now()), never by
 * waiting; only Date is faked so that pg, argon2 and Sequelize keep their real timers.
 */

const MINUTE_MS = 60_000
const OWNER = 'ada@example.test'
const ATTACKER = '203.0.113.9'
const OWNER_ADDRESS = '198.51.100.7'

/** Posts JSON to a route handler from a page of this site, with extra headers (the client address). */
async function post(handler: typeof signIn, body: unknown, headers: Record<string, string>) {
  const request = new Request(`${TEST_ORIGIN}/`, {
    method: 'POST',
    headers: { host: new URL(TEST_ORIGIN).host, origin: TEST_ORIGIN, 'content-type': 'application/json', ...headers },
    body: JSON.stringify(body),
  })
  const response = await handler(request, { params: Promise.resolve({}) })
  return { status: response.status, headers: response.headers, json: (await response.json()) as { error?: { message: string } } }
}

function signInFrom(address: string, email: string, password: string) {
  return post(signIn, { email, password }, { [PEER_ADDRESS_HEADER]: address })
}

function signUpFrom(address: string, n: number) {
  const body = { email: `quilter-${n}@example.test`, password: 'a-long-enough-password', displayName: `Quilter ${n}` }
  return post(signUp, body, { [PEER_ADDRESS_HEADER]: address })
}

const statusCounts = (statuses: number[]) => statuses.reduce<Record<number, number>>((counts, s) => ({ ...counts, [s]: (counts[s] ?? 0) + 1 }), {})

beforeEach(async () => {
  await freshDatabase()
  vi.useFakeTimers({ toFake: ['Date'] })
  vi.setSystemTime(new Date('2026-12-02T09:00:00Z'))
})
afterEach(() => {
  vi.useRealTimers()
})
afterAll(closeDatabase)

describe('sign-in rate limits', () => {
  it('refuses the 31st quick wrong password and then the right one with 429 and Retry-After until the window passes', async () => {
    await createUser({ email: OWNER })
    // 30 at once, as the probe sent them: the count is taken before each hash, so exactly the
    // allowance gets through however they interleave.
    const burst = await Promise.all(Array.from({ length: 30 }, () => signInFrom(ATTACKER, OWNER, 'not-the-password')))
    expect(statusCounts(burst.map((response) => response.status))).toEqual({ 401: RATE_LIMITS.signInPerAccountAndAddress.points, 429: 20 })

    const thirtyFirst = await signInFrom(ATTACKER, OWNER, 'not-the-password')
    expect(thirtyFirst.status).toBe(429)
    // The window is 15 minutes from the first failure and no time has passed: 900 s.
    expect(thirtyFirst.headers.get('retry-after')).toBe('900')
    expect(thirtyFirst.json.error?.message).toBe('Too many sign-in attempts; try again in 15 minutes.')

    const right = await signInFrom(ATTACKER, 'ADA@example.test', TEST_PASSWORD)
    expect(right.status).toBe(429)
    expect(right.headers.get('set-cookie')).toBeNull()
    expect(await Session.count()).toBe(0)

    vi.setSystemTime(Date.now() + 14 * MINUTE_MS)
    const stillEarly = await signInFrom(ATTACKER, OWNER, TEST_PASSWORD)
    expect(stillEarly.status).toBe(429)
    expect(stillEarly.headers.get('retry-after')).toBe('60')
    expect(stillEarly.json.error?.message).toBe('Too many sign-in attempts; try again in 1 minute.')

    vi.setSystemTime(Date.now() + MINUTE_MS + 1000)
    const afterWindow = await signInFrom(ATTACKER, OWNER, TEST_PASSWORD)
    expect(afterWindow.status).toBe(200)
    expect(await Session.count()).toBe(1)
  })

  it('does not lock the owner out when one other address guesses wrong', async () => {
    await createUser({ email: OWNER })
    for (let i = 0; i < 30; i++) await signInFrom(ATTACKER, OWNER, `guess-${i}`)
    expect((await signInFrom(OWNER_ADDRESS, OWNER, TEST_PASSWORD)).status).toBe(200)
  })

  it('refuses an account guessed at from many addresses, once all of them together reach the account limit', async () => {
    await createUser({ email: OWNER })
    const { points } = RATE_LIMITS.signInPerAccount
    const perAddress = RATE_LIMITS.signInPerAccountAndAddress.points
    for (let i = 0; i < points; i++) {
      const response = await signInFrom(`192.0.2.${Math.floor(i / perAddress) + 1}`, OWNER, `guess-${i}`)
      expect(response.status).toBe(401)
    }
    const fresh = await signInFrom('192.0.2.200', OWNER, 'one-more-guess')
    expect(fresh.status).toBe(429)
    expect(fresh.headers.get('retry-after')).toBe('3600')
    expect(fresh.json.error?.message).toBe('Too many sign-in attempts for this account; try again in 60 minutes.')
  })

  it('counts failures per address across accounts, and a success there does not clear them', async () => {
    const own = await createUser({ email: 'attacker-own@example.test' })
    const { points } = RATE_LIMITS.signInPerAddress
    // Unknown addresses count exactly as known ones do.
    for (let i = 0; i < points - 1; i++) expect((await signInFrom(ATTACKER, `person-${i}@example.test`, 'password-1')).status).toBe(401)
    // Signing in to an account of one's own gives back only that attempt's count...
    expect((await signInFrom(ATTACKER, own.email, TEST_PASSWORD)).status).toBe(200)
    // ...so one more failure is allowed, and the next is refused.
    expect((await signInFrom(ATTACKER, 'person-last@example.test', 'password-1')).status).toBe(401)
    const refused = await signInFrom(ATTACKER, own.email, TEST_PASSWORD)
    expect(refused.status).toBe(429)
    expect(refused.json.error?.message).toMatch(/^Too many sign-in attempts from this address; try again in 15 minutes\.$/)
    // Another address is not affected.
    expect((await signInFrom(OWNER_ADDRESS, own.email, TEST_PASSWORD)).status).toBe(200)
  })

  it('ignores X-Forwarded-For unless TRUST_PROXY is set, so a client cannot pick a new address per attempt', async () => {
    await createUser({ email: OWNER })
    for (let i = 0; i < 12; i++) {
      await post(signIn, { email: OWNER, password: 'not-the-password' }, { [PEER_ADDRESS_HEADER]: ATTACKER, 'x-forwarded-for': `198.18.0.${i}` })
    }
    expect((await signInFrom(ATTACKER, OWNER, TEST_PASSWORD)).status).toBe(429)
  })

  it('keeps no e-mail or client address in the counters table', async () => {
    await signInFrom(ATTACKER, OWNER, 'not-the-password')
    const rows = await database().query<{ key: string }>('SELECT key FROM rate_limits', { type: QueryTypes.SELECT })
    expect(rows.length).toBe(3)
    for (const { key } of rows) {
      expect(key).not.toContain('ada')
      expect(key).not.toContain(ATTACKER)
    }
  })
})

describe('sign-up rate limit', () => {
  it('refuses the 11th account from one address within the hour with 429 and Retry-After, not another address', async () => {
    const { points } = RATE_LIMITS.signUpPerAddress
    for (let n = 0; n < points; n++) expect((await signUpFrom(ATTACKER, n)).status).toBe(202)
    const refused = await signUpFrom(ATTACKER, points)
    expect(refused.status).toBe(429)
    expect(refused.headers.get('retry-after')).toBe('3600')
    expect(refused.json.error?.message).toBe('Too many new accounts from this address; try again in 60 minutes.')
    expect((await signUpFrom(OWNER_ADDRESS, points)).status).toBe(202)

    vi.setSystemTime(Date.now() + 60 * MINUTE_MS + 1000)
    expect((await signUpFrom(ATTACKER, points + 1)).status).toBe(202)
  })
})

describe('password-reset rate limit', () => {
  it('allows three requests per account an hour, then refuses with the time to wait', async () => {
    for (let i = 0; i < RATE_LIMITS.passwordResetPerAccount.points; i++) await countPasswordReset(OWNER, OWNER_ADDRESS)
    await expect(countPasswordReset(OWNER, OWNER_ADDRESS)).rejects.toMatchObject({
      status: 429,
      retryAfterSeconds: 3600,
      message: 'Too many password reset requests for this account; try again in 60 minutes.',
    })
  })
})

describe('the rate_limits migration', () => {
  it('goes down and up again', async () => {
    const migrator = createMigrator(database())
    const tableExists = async () =>
      (await database().query("SELECT to_regclass('rate_limits') AS name", { type: QueryTypes.SELECT }))[0] as { name: string | null }
    await migrator.down({ to: '20261202-0010-create-rate-limits.ts' })
    expect((await tableExists()).name).toBeNull()
    await migrator.up()
    expect((await tableExists()).name).toBe('rate_limits')
  })
})
