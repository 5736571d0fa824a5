import { afterAll, beforeEach, describe, expect, it } from 'vitest'
import { POST as signIn } from '@/app/api/auth/sign-in/route'
import { POST as signOut } from '@/app/api/auth/sign-out/route'
import { POST as signUp } from '@/app/api/auth/sign-up/route'
import { GET as listPatterns, POST as createPattern } from '@/app/api/patterns/route'
import { lucia } from '@/lib/auth/lucia'
import { SIGN_UP_ANSWER } from '@/lib/services/accounts'
import { Session, User } from '@/models'
import { closeDatabase, freshDatabase } from '../support/database'
import { createUser, sessionCookieFor, TEST_PASSWORD } from '../support/factories'
import { call, sessionFromSetCookie } from '../support/requests'

const newAccount = (overrides: Record<string, unknown> = {}) => ({
  email: 'Wren.Hollis@Example.test',
  password: 'pressing-seams-open',
  displayName: 'Wren Hollis',
  ...overrides,
})

beforeEach(freshDatabase)
afterAll(closeDatabase)

describe('sign up', () => {
  it('answers 202 without a session and creates an unverified quilter', async () => {
    const response = await call(signUp, { method: 'POST', body: newAccount() })
    expect(response.status).toBe(202)
    expect(response.json).toEqual(SIGN_UP_ANSWER)
    expect(response.headers.get('set-cookie')).toBeNull()
    expect(await Session.count()).toBe(0)
    const user = await User.findOne({ where: { email: 'wren.hollis@example.test' } })
    expect(user?.roles).toEqual(['quilter'])
    expect(user?.emailVerifiedAt).toBeNull()
  })

  it('records a wish for a designer account as a request, without granting the role', async () => {
    const response = await call(signUp, { method: 'POST', body: newAccount({ wantsDesigner: true }) })
    expect(response.status).toBe(202)
    const user = await User.findOne({ where: { email: 'wren.hollis@example.test' } })
    expect(user?.roles).toEqual(['quilter'])
    expect(user?.designerRequestedAt).toBeInstanceOf(Date)
  })

  it('stores an argon2id hash with the OWASP minimum parameters (m=19456 KiB, t=2, p=1)', async () => {
    await call(signUp, { method: 'POST', body: newAccount() })
    const user = await User.findOne({ where: { email: 'wren.hollis@example.test' } })
    // OWASP Password Storage Cheat Sheet, "Argon2id": m=19456 (19 MiB), t=2, p=1; PHC string format.
    expect(user?.passwordHash).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/)
    expect(user?.passwordHash).not.toContain('pressing-seams-open')
  })

  it('answers a second sign-up with the same address in other letter case alike, changing nothing', async () => {
    await call(signUp, { method: 'POST', body: newAccount() })
    const before = await User.findOne({ where: { email: 'wren.hollis@example.test' } })
    const again = await call(signUp, { method: 'POST', body: newAccount({ email: 'WREN.HOLLIS@EXAMPLE.TEST', displayName: 'Someone Else', password: 'another-long-password' }) })
    expect(again.status).toBe(202)
    expect(again.json).toEqual(SIGN_UP_ANSWER)
    expect(await User.count()).toBe(1)
    const after = await User.findOne({ where: { email: 'wren.hollis@example.test' } })
    expect(after?.displayName).toBe('Wren Hollis')
    expect(after?.passwordHash).toBe(before?.passwordHash)
  })

  it('refuses a password that is long enough but easy to guess, with the estimator\'s reason', async () => {
    // "password1234" is in zxcvbn's list of common passwords (score 1 of 4).
    const response = await call(signUp, { method: 'POST', body: newAccount({ password: 'password1234' }) })
    expect(response.status).toBe(422)
    expect(response.json?.error.issues).toEqual([{ path: 'password', message: expect.stringContaining('commonly used password') }])
    expect(await User.count()).toBe(0)
  })

  it('names every bad field of the body with 422', async () => {
    const response = await call(signUp, { method: 'POST', body: { email: 'not-an-address', password: 'short', displayName: '' } })
    expect(response.status).toBe(422)
    const paths = response.json?.error.issues.map((issue: { path: string }) => issue.path).sort()
    expect(paths).toEqual(['displayName', 'email', 'password'])
    expect(await User.count()).toBe(0)
  })

  it('answers malformed JSON with 400', async () => {
    const response = await call(signUp, { method: 'POST', rawBody: '{"email": ' })
    expect(response.status).toBe(400)
  })
})

describe('sign in and out', () => {
  it('signs in with the right password and an HttpOnly, SameSite=Lax, Secure session cookie that opens protected routes', async () => {
    await createUser({ email: 'ada@example.test', roles: ['designer'] })
    const response = await call(signIn, { method: 'POST', body: { email: 'ADA@example.test', password: TEST_PASSWORD } })
    expect(response.status).toBe(200)
    const setCookie = response.headers.get('set-cookie') ?? ''
    expect(setCookie).toMatch(/^wreathwright_session=\w+/)
    expect(setCookie).toMatch(/HttpOnly/i)
    expect(setCookie).toMatch(/SameSite=Lax/i)
    // NODE_ENV is "test" here, i.e. not development, so the cookie must be Secure.
    expect(setCookie).toMatch(/Secure/i)
    const cookie = sessionFromSetCookie(response.headers)!
    const list = await call(listPatterns, { cookie })
    expect(list.status).toBe(200)
    expect(list.json?.patterns).toEqual([])
  })

  it('refuses a wrong password and an unknown address with the same message, creating no session', async () => {
    await createUser({ email: 'ada@example.test' })
    const wrongPassword = await call(signIn, { method: 'POST', body: { email: 'ada@example.test', password: 'not-the-password' } })
    const unknownEmail = await call(signIn, { method: 'POST', body: { email: 'nobody@example.test', password: TEST_PASSWORD } })
    expect(wrongPassword.status).toBe(401)
    expect(unknownEmail.status).toBe(401)
    expect(wrongPassword.json?.error.message).toBe(unknownEmail.json?.error.message)
    expect(wrongPassword.headers.get('set-cookie')).toBeNull()
    expect(await Session.count()).toBe(0)
  })

  it('ends the session it replaces when signing in again, with the same account or another', async () => {
    // OWASP Session Management Cheat Sheet, "Renew the Session ID After Any Privilege Level Change".
    await createUser({ email: 'ada@example.test', roles: ['designer'] })
    const other = await createUser({ email: 'bea@example.test', roles: ['designer'] })
    const first = sessionFromSetCookie((await call(signIn, { method: 'POST', body: { email: 'ada@example.test', password: TEST_PASSWORD } })).headers)!
    const again = await call(signIn, { method: 'POST', cookie: first, body: { email: 'ada@example.test', password: TEST_PASSWORD } })
    expect(again.status).toBe(200)
    const second = sessionFromSetCookie(again.headers)!
    expect(second).not.toBe(first)
    expect((await call(listPatterns, { cookie: first })).status).toBe(401)
    expect((await call(listPatterns, { cookie: second })).status).toBe(200)

    const asOther = await call(signIn, { method: 'POST', cookie: second, body: { email: 'bea@example.test', password: TEST_PASSWORD } })
    expect(asOther.status).toBe(200)
    expect((await call(listPatterns, { cookie: second })).status).toBe(401)
    expect(await Session.count()).toBe(1)
    expect((await Session.findOne())?.userId).toBe(other.id)
  })

  it('signs out: the session is gone and the cookie is cleared', async () => {
    const user = await createUser({ roles: ['designer'] })
    const cookie = await sessionCookieFor(user)
    const response = await call(signOut, { method: 'POST', cookie })
    expect(response.status).toBe(200)
    expect(response.headers.get('set-cookie')).toMatch(/wreathwright_session=;.*Max-Age=0/i)
    expect(await Session.count()).toBe(0)
    expect((await call(listPatterns, { cookie })).status).toBe(401)
  })
})

describe('sessions that must not work', () => {
  it('treats an expired session as signed out and clears its cookie', async () => {
    const user = await createUser({ roles: ['designer'] })
    const cookie = await sessionCookieFor(user)
    await Session.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { userId: user.id } })
    const response = await call(listPatterns, { cookie })
    expect(response.status).toBe(401)
    expect(response.headers.get('set-cookie')).toMatch(/Max-Age=0/)
  })

  it('treats a forged session id as signed out', async () => {
    await createUser({ roles: ['designer'] })
    const response = await call(listPatterns, { cookie: `${lucia().sessionCookieName}=forgedforgedforgedforgedforgedfo` })
    expect(response.status).toBe(401)
  })

  it('extends a session that is in the second half of its life', async () => {
    const user = await createUser({ roles: ['designer'] })
    const cookie = await sessionCookieFor(user)
    const soon = new Date(Date.now() + 2 * 24 * 3600 * 1000)
    await Session.update({ expiresAt: soon }, { where: { userId: user.id } })
    const response = await call(listPatterns, { cookie })
    expect(response.status).toBe(200)
    expect(response.headers.get('set-cookie')).toMatch(/wreathwright_session=\w+/)
    const session = await Session.findOne({ where: { userId: user.id } })
    expect(session!.expiresAt.getTime()).toBeGreaterThan(soon.getTime())
  })
})

describe('origin check', () => {
  it('refuses a state-changing request from another site, changing nothing', async () => {
    const user = await createUser({ roles: ['designer'] })
    const cookie = await sessionCookieFor(user)
    const response = await call(createPattern, { method: 'POST', cookie, origin: 'https://evil.example', body: { name: 'Forged' } })
    expect(response.status).toBe(403)
    expect((await call(listPatterns, { cookie })).json?.patterns).toEqual([])
  })

  it('refuses a state-changing request with no Origin header', async () => {
    const response = await call(signUp, { method: 'POST', origin: null, body: newAccount() })
    expect(response.status).toBe(403)
    expect(await User.count()).toBe(0)
  })

  it('lets reads through without an Origin header', async () => {
    const user = await createUser({ roles: ['designer'] })
    const response = await call(listPatterns, { cookie: await sessionCookieFor(user), origin: null })
    expect(response.status).toBe(200)
  })
})
