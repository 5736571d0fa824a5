import { randomUUID } from 'node:crypto'
import { afterAll, beforeEach, describe, expect, it } from 'vitest'
import { POST as confirmReset } from '@/app/api/auth/password-reset/confirm/route'
import { POST as requestReset } from '@/app/api/auth/password-reset/route'
import { POST as signIn } from '@/app/api/auth/sign-in/route'
import { POST as signUp } from '@/app/api/auth/sign-up/route'
import { POST as resendVerification } from '@/app/api/auth/verify-email/resend/route'
import { POST as verifyEmail } from '@/app/api/auth/verify-email/route'
import { GET as listPatterns } from '@/app/api/patterns/route'
import { PEER_ADDRESS_HEADER } from '@/lib/client-address'
import { PASSWORD_RESET_ANSWER, setAccountDisabled, SIGN_UP_ANSWER, UNIFORM_ANSWER_MS } from '@/lib/services/accounts'
import { AccountToken, OutgoingMail, Session, User } from '@/models'
import { closeDatabase, freshDatabase } from '../support/database'
import { createUser, sessionCookieFor, TEST_PASSWORD } from '../support/factories'
import { firstLink, useMailWorker, waitForMail } from '../support/mail'
import { call, sessionFromSetCookie } from '../support/requests'

/**
 * The e-mail rules of accounts (issue 12) against the real route handlers, PostgreSQL, the mail
 * queue and the mail catcher: links work once and for a while, answers do not tell who has an
 * account, a reset or a disabled account ends sessions.
 */

useMailWorker()
beforeEach(freshDatabase)
afterAll(closeDatabase)

/** An address no other test (or earlier run, the catcher keeps its mail) has used. */
const freshAddress = (name: string) => `${name}.${randomUUID().slice(0, 8)}@example.test`

/** The token a message's link carries in its fragment (`…#token=…`). */
function tokenIn(link: string): string {
  const token = new URLSearchParams(new URL(link).hash.slice(1)).get('token')
  if (!token) throw new Error(`no token in ${link}`)
  return token
}

/** Each request from its own client address, so the rate limits stay out of the way. */
const fromAddress = () => ({ [PEER_ADDRESS_HEADER]: `198.51.100.${Math.floor(Math.random() * 250) + 1}` })

async function signUpAs(email: string, password = 'pressing-seams-open') {
  return call(signUp, { method: 'POST', body: { email, password, displayName: 'Wren Hollis' }, headers: fromAddress() })
}

async function signInAs(email: string, password: string) {
  return call(signIn, { method: 'POST', body: { email, password }, headers: fromAddress() })
}

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)]!

async function timed<T>(run: () => Promise<T>): Promise<{ result: T; ms: number }> {
  const started = performance.now()
  const result = await run()
  return { result, ms: performance.now() - started }
}

describe('verifying an address', () => {
  it('verifies once with the e-mailed link; the same link again is refused', async () => {
    const email = freshAddress('wren')
    expect((await signUpAs(email)).status).toBe(202)
    const mail = await waitForMail({ to: email, kind: 'verify-email' })
    const token = tokenIn(firstLink(mail, '/verify-email'))
    // The token itself is never stored, only its SHA-256 hash.
    expect(await AccountToken.count({ where: { tokenHash: token } })).toBe(0)

    const first = await call(verifyEmail, { method: 'POST', body: { token } })
    expect(first.status).toBe(200)
    expect((await User.findOne({ where: { email } }))?.emailVerifiedAt).toBeInstanceOf(Date)

    const again = await call(verifyEmail, { method: 'POST', body: { token } })
    expect(again.status).toBe(400)
    expect(again.json?.error.message).toMatch(/^This link does not work any more/)
  })

  it('refuses an expired link and a forged one with the same answer', async () => {
    const email = freshAddress('wren')
    await signUpAs(email)
    const token = tokenIn(firstLink(await waitForMail({ to: email, kind: 'verify-email' }), '/verify-email'))
    const user = await User.findOne({ where: { email } })
    await AccountToken.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { userId: user!.id } })

    const expired = await call(verifyEmail, { method: 'POST', body: { token } })
    const forged = await call(verifyEmail, { method: 'POST', body: { token: 'x'.repeat(43) } })
    expect(expired.status).toBe(400)
    expect(forged.status).toBe(400)
    expect(expired.json).toEqual(forged.json)
    expect((await User.findByPk(user!.id))?.emailVerifiedAt).toBeNull()
  })

  it('lets an unverified person sign in, and "send it again" replaces the earlier link', async () => {
    const email = freshAddress('wren')
    await signUpAs(email)
    const oldToken = tokenIn(firstLink(await waitForMail({ to: email, kind: 'verify-email' }), '/verify-email'))
    const signedIn = await signInAs(email, 'pressing-seams-open')
    expect(signedIn.status).toBe(200)
    const cookie = sessionFromSetCookie(signedIn.headers)!

    expect((await call(resendVerification, { method: 'POST' })).status).toBe(401)
    expect((await call(resendVerification, { method: 'POST', cookie })).status).toBe(202)
    await expect.poll(async () => (await OutgoingMail.count({ where: { toAddress: email, kind: 'verify-email' } }))).toBe(2)
    const user = await User.findOne({ where: { email } })
    // The newest of the two links: the worker may deliver them in either order, so it is read from the database.
    const unused = await AccountToken.findAll({ where: { userId: user!.id, usedAt: null } })
    expect(unused).toHaveLength(1)

    expect((await call(verifyEmail, { method: 'POST', body: { token: oldToken } })).status).toBe(400)
  })
})

describe('answers that do not tell who has an account', () => {
  it('answers sign-up alike for a known and an unknown address, in similar time, and tells the known address\'s owner', async () => {
    const owner = await createUser({ email: freshAddress('ada'), displayName: 'Ada Quill' })
    const known: { status: number; body: unknown; ms: number }[] = []
    const unknown: typeof known = []
    for (let i = 0; i < 5; i++) {
      const a = await timed(() => signUpAs(owner.email, `another-long-password-${i}`))
      known.push({ status: a.result.status, body: a.result.json, ms: a.ms })
      const b = await timed(() => signUpAs(freshAddress('newcomer')))
      unknown.push({ status: b.result.status, body: b.result.json, ms: b.ms })
    }
    for (const answer of [...known, ...unknown]) {
      expect(answer.status).toBe(202)
      expect(answer.body).toEqual(SIGN_UP_ANSWER)
    }
    // Generous: the two medians within a factor of 1.5 of each other, both at least the floor.
    const [knownMs, unknownMs] = [median(known.map((a) => a.ms)), median(unknown.map((a) => a.ms))]
    expect(Math.max(knownMs, unknownMs) / Math.min(knownMs, unknownMs)).toBeLessThan(1.5)
    expect(Math.min(knownMs, unknownMs)).toBeGreaterThanOrEqual(UNIFORM_ANSWER_MS - 5)

    const notice = await waitForMail({ to: owner.email, kind: 'sign-up-attempt' })
    expect(notice.text).toContain('Ada Quill')
    expect((await User.findByPk(owner.id))?.passwordHash).toBe(owner.passwordHash)
  })

  it('answers a reset request alike for a known and an unknown address, in similar time, and mails only the known one', async () => {
    const known: { status: number; body: unknown; ms: number }[] = []
    const unknown: typeof known = []
    const strangers: string[] = []
    for (let i = 0; i < 5; i++) {
      const user = await createUser({ email: freshAddress('ada') })
      const a = await timed(() => call(requestReset, { method: 'POST', body: { email: user.email }, headers: fromAddress() }))
      known.push({ status: a.result.status, body: a.result.json, ms: a.ms })
      const stranger = freshAddress('nobody')
      strangers.push(stranger)
      const b = await timed(() => call(requestReset, { method: 'POST', body: { email: stranger }, headers: fromAddress() }))
      unknown.push({ status: b.result.status, body: b.result.json, ms: b.ms })
    }
    for (const answer of [...known, ...unknown]) {
      expect(answer.status).toBe(202)
      expect(answer.body).toEqual(PASSWORD_RESET_ANSWER)
    }
    const [knownMs, unknownMs] = [median(known.map((a) => a.ms)), median(unknown.map((a) => a.ms))]
    expect(Math.max(knownMs, unknownMs) / Math.min(knownMs, unknownMs)).toBeLessThan(1.5)
    expect(await OutgoingMail.count({ where: { kind: 'password-reset' } })).toBe(5)
    expect(await OutgoingMail.count({ where: { toAddress: strangers } })).toBe(0)
  })
})

describe('resetting a password', () => {
  async function resetLinkFor(email: string): Promise<string> {
    expect((await call(requestReset, { method: 'POST', body: { email }, headers: fromAddress() })).status).toBe(202)
    return tokenIn(firstLink(await waitForMail({ to: email, kind: 'password-reset' }), '/reset-password/new'))
  }

  it('refuses a weak password with the reason and keeps the link; a strong one ends every session and is mailed about', async () => {
    const user = await createUser({ email: freshAddress('ada'), roles: ['designer'] })
    const [laptop, phone] = [await sessionCookieFor(user), await sessionCookieFor(user)]
    const token = await resetLinkFor(user.email)

    const weak = await call(confirmReset, { method: 'POST', body: { token, password: 'password1234' } })
    expect(weak.status).toBe(422)
    expect(weak.json?.error.issues).toEqual([{ path: 'password', message: expect.stringContaining('commonly used password') }])
    expect((await call(listPatterns, { cookie: laptop })).status).toBe(200)

    const strong = await call(confirmReset, { method: 'POST', body: { token, password: 'a-brand-new-binding-stitch' } })
    expect(strong.status).toBe(200)
    expect((await call(listPatterns, { cookie: laptop })).status).toBe(401)
    expect((await call(listPatterns, { cookie: phone })).status).toBe(401)
    expect(await Session.count({ where: { userId: user.id } })).toBe(0)
    await waitForMail({ to: user.email, kind: 'password-changed' })

    expect((await signInAs(user.email, TEST_PASSWORD)).status).toBe(401)
    expect((await signInAs(user.email, 'a-brand-new-binding-stitch')).status).toBe(200)

    const twice = await call(confirmReset, { method: 'POST', body: { token, password: 'yet-another-binding-stitch' } })
    expect(twice.status).toBe(400)
  })

  it('refuses an expired reset link (1 hour) and a forged one', async () => {
    const user = await createUser({ email: freshAddress('ada') })
    const token = await resetLinkFor(user.email)
    const issued = await AccountToken.findOne({ where: { userId: user.id, purpose: 'reset-password' } })
    // 1 hour, as issue 12 asks; checked here so a longer lifetime fails this test.
    expect(issued!.expiresAt.getTime() - issued!.createdAt.getTime()).toBeLessThanOrEqual(60 * 60 * 1000 + 1000)
    await issued!.update({ expiresAt: new Date(Date.now() - 1000) })

    const expired = await call(confirmReset, { method: 'POST', body: { token, password: 'a-brand-new-binding-stitch' } })
    const forged = await call(confirmReset, { method: 'POST', body: { token: 'forged-token', password: 'a-brand-new-binding-stitch' } })
    expect(expired.status).toBe(400)
    expect(forged.json).toEqual(expired.json)
    expect((await signInAs(user.email, TEST_PASSWORD)).status).toBe(200)
  })
})

describe('disabled accounts', () => {
  it('cannot sign in, and a live session stops working at once; enabled again, they can', async () => {
    const user = await createUser({ email: freshAddress('ada'), roles: ['designer'] })
    const cookie = await sessionCookieFor(user)
    expect((await call(listPatterns, { cookie })).status).toBe(200)

    await setAccountDisabled(user.id, true)
    const live = await call(listPatterns, { cookie })
    expect(live.status).toBe(401)
    expect(live.headers.get('set-cookie')).toMatch(/Max-Age=0/)
    const refused = await signInAs(user.email, TEST_PASSWORD)
    expect(refused.status).toBe(403)
    expect(refused.headers.get('set-cookie')).toBeNull()
    expect(await Session.count({ where: { userId: user.id } })).toBe(0)

    await setAccountDisabled(user.id, false)
    expect((await signInAs(user.email, TEST_PASSWORD)).status).toBe(200)
  })

  it('refuses a session that survived in the table (e.g. made while being disabled)', async () => {
    const user = await createUser({ email: freshAddress('ada'), roles: ['designer'] })
    const cookie = await sessionCookieFor(user)
    await User.update({ disabledAt: new Date() }, { where: { id: user.id } })
    expect((await call(listPatterns, { cookie })).status).toBe(401)
  })

  it('gets no reset link', async () => {
    const user = await createUser({ email: freshAddress('ada') })
    await setAccountDisabled(user.id, true)
    const answer = await call(requestReset, { method: 'POST', body: { email: user.email }, headers: fromAddress() })
    expect(answer.json).toEqual(PASSWORD_RESET_ANSWER)
    expect(await OutgoingMail.count({ where: { toAddress: user.email } })).toBe(0)
  })
})
