import { randomUUID } from 'node:crypto'
import { afterAll, beforeEach, describe, expect, it } from 'vitest'
import { POST as confirmEmailChange } from '@/app/api/account/email/confirm/route'
import { POST as requestEmailChange } from '@/app/api/account/email/route'
import { POST as changePassword } from '@/app/api/account/password/route'
import { DELETE as deleteAccount, GET as getAccount, PATCH as renameAccount } from '@/app/api/account/route'
import { POST as endOtherSessions } from '@/app/api/account/sessions/end-others/route'
import { POST as signIn } from '@/app/api/auth/sign-in/route'
import { GET as listPatterns } from '@/app/api/patterns/route'
import { PEER_ADDRESS_HEADER } from '@/lib/client-address'
import { getObject, objectKey, putObject } from '@/lib/object-store'
import { RATE_LIMITS } from '@/lib/rate-limits'
import { EMAIL_CHANGE_ANSWER } from '@/lib/services/account-settings'
import { OutgoingMail, Pattern, PatternRevision, PatternStateChange, Session, Upload, User } from '@/models'
import { closeDatabase, freshDatabase } from '../support/database'
import { createPatternRow, createUser, TEST_PASSWORD } from '../support/factories'
import { firstLink, useMailWorker, waitForMail } from '../support/mail'
import { call, sessionFromSetCookie } from '../support/requests'

/** The account page's API: name, address change, password change, sessions, deletion. */

useMailWorker()
beforeEach(freshDatabase)
afterAll(closeDatabase)

const freshAddress = (name: string) => `${name}.${randomUUID().slice(0, 8)}@example.test`
const FIREFOX = 'Mozilla/5.0 (Windows NT 10.0; Win64; x64; rv:128.0) Gecko/20100101 Firefox/128.0'
const IPHONE = 'Mozilla/5.0 (iPhone; CPU iPhone OS 17_1 like Mac OS X) AppleWebKit/605.1.15 (KHTML, like Gecko) Version/17.1 Mobile/15E148 Safari/604.1'

/** Signs in through the route, as a browser with this User-Agent; returns the Cookie header. */
async function signInFrom(email: string, userAgent: string, password = TEST_PASSWORD): Promise<string> {
  const response = await call(signIn, { method: 'POST', body: { email, password }, headers: { 'user-agent': userAgent, [PEER_ADDRESS_HEADER]: '198.51.100.20' } })
  expect(response.status).toBe(200)
  return sessionFromSetCookie(response.headers)!
}

const tokenIn = (link: string) => new URLSearchParams(new URL(link).hash.slice(1)).get('token')!

describe('the account page API', () => {
  it('is for signed-in people only', async () => {
    expect((await call(getAccount)).status).toBe(401)
    expect((await call(renameAccount, { method: 'PATCH', body: { displayName: 'X' } })).status).toBe(401)
  })

  it('lists the sessions by device, marks this one, and signs out everywhere else', async () => {
    const user = await createUser({ email: freshAddress('ada') })
    const laptop = await signInFrom(user.email, FIREFOX)
    const phone = await signInFrom(user.email, IPHONE)
    const overview = await call(getAccount, { cookie: laptop })
    expect(overview.status).toBe(200)
    const sessions = overview.json?.account.sessions as { device: string; current: boolean }[]
    expect(sessions.map((session) => [session.device, session.current]).sort()).toEqual([
      ['Firefox 128 on Windows', true],
      ['Mobile Safari 17 on iOS, iPhone', false],
    ])
    // The cookie's secret is never part of the answer.
    expect(JSON.stringify(overview.json)).not.toContain(laptop.split('=')[1])

    const ended = await call(endOtherSessions, { method: 'POST', cookie: laptop })
    expect(ended.json).toEqual({ endedSessions: 1 })
    expect((await call(getAccount, { cookie: phone })).status).toBe(401)
    expect((await call(getAccount, { cookie: laptop })).status).toBe(200)
  })

  it('notes when a session was last seen, at most every few minutes', async () => {
    const user = await createUser({ email: freshAddress('ada') })
    const cookie = await signInFrom(user.email, FIREFOX)
    const long = new Date(Date.now() - 60 * 60 * 1000)
    await Session.update({ lastSeenAt: long }, { where: { userId: user.id } })
    await call(getAccount, { cookie })
    const seen = (await Session.findOne({ where: { userId: user.id } }))!.lastSeenAt
    expect(seen.getTime()).toBeGreaterThan(Date.now() - 60_000)
    // A second request right after does not write again.
    const recent = new Date(Date.now() - 60_000)
    await Session.update({ lastSeenAt: recent }, { where: { userId: user.id } })
    await call(getAccount, { cookie })
    expect((await Session.findOne({ where: { userId: user.id } }))!.lastSeenAt.getTime()).toBe(recent.getTime())
  })

  it('changes the display name', async () => {
    const user = await createUser({ email: freshAddress('ada') })
    const cookie = await signInFrom(user.email, FIREFOX)
    const renamed = await call(renameAccount, { method: 'PATCH', cookie, body: { displayName: '  Ada Quill ' } })
    expect(renamed.json).toEqual({ displayName: 'Ada Quill' })
    expect((await User.findByPk(user.id))?.displayName).toBe('Ada Quill')
  })
})

describe('changing the e-mail address', () => {
  it('needs the current password', async () => {
    const user = await createUser({ email: freshAddress('ada') })
    const cookie = await signInFrom(user.email, FIREFOX)
    const wrong = await call(requestEmailChange, { method: 'POST', cookie, body: { newEmail: freshAddress('new'), currentPassword: 'not-my-password' } })
    expect(wrong.status).toBe(422)
    expect(wrong.json?.error.issues).toEqual([{ path: 'currentPassword', message: 'That is not your current password.' }])
    expect(await OutgoingMail.count({ where: { userId: user.id } })).toBe(0)
  })

  it('counts wrong current passwords as sign-in attempts, so a borrowed session cannot guess the password', async () => {
    const user = await createUser({ email: freshAddress('ada') })
    const cookie = await signInFrom(user.email, FIREFOX)
    const attempt = () => call(requestEmailChange, { method: 'POST', cookie, body: { newEmail: freshAddress('new'), currentPassword: 'a-guess-at-it' }, headers: { [PEER_ADDRESS_HEADER]: '203.0.113.9' } })
    for (let i = 0; i < RATE_LIMITS.signInPerAccountAndAddress.points; i++) expect((await attempt()).status).toBe(422)
    expect((await attempt()).status).toBe(429)
  })

  it('changes the address only once the link sent to the new one is used, and tells the old one', async () => {
    const user = await createUser({ email: freshAddress('ada'), displayName: 'Ada Quill' })
    const cookie = await signInFrom(user.email, FIREFOX)
    const newEmail = freshAddress('ada.new')
    const asked = await call(requestEmailChange, { method: 'POST', cookie, body: { newEmail, currentPassword: TEST_PASSWORD } })
    expect(asked.status).toBe(202)
    expect(asked.json).toEqual(EMAIL_CHANGE_ANSWER)
    expect((await User.findByPk(user.id))?.email).toBe(user.email)

    const notice = await waitForMail({ to: user.email, kind: 'email-change-notice' })
    expect(notice.text).toContain(newEmail)
    const token = tokenIn(firstLink(await waitForMail({ to: newEmail, kind: 'email-change-verify' }), '/account/confirm-email'))

    const confirmed = await call(confirmEmailChange, { method: 'POST', body: { token } })
    expect(confirmed.status).toBe(200)
    const after = await User.findByPk(user.id)
    expect(after?.email).toBe(newEmail)
    expect(after?.emailVerifiedAt).toBeInstanceOf(Date)
    expect((await call(confirmEmailChange, { method: 'POST', body: { token } })).status).toBe(400)
  })

  it('answers alike when the new address has an account, and sends it nothing', async () => {
    const user = await createUser({ email: freshAddress('ada') })
    const other = await createUser({ email: freshAddress('bea') })
    const cookie = await signInFrom(user.email, FIREFOX)
    const asked = await call(requestEmailChange, { method: 'POST', cookie, body: { newEmail: other.email, currentPassword: TEST_PASSWORD } })
    expect(asked.status).toBe(202)
    expect(asked.json).toEqual(EMAIL_CHANGE_ANSWER)
    expect(await OutgoingMail.count({ where: { toAddress: other.email } })).toBe(0)
  })
})

describe('changing the password', () => {
  it('needs the current one, checks the new one, ends the other sessions and mails the owner', async () => {
    const user = await createUser({ email: freshAddress('ada'), roles: ['designer'] })
    const laptop = await signInFrom(user.email, FIREFOX)
    const phone = await signInFrom(user.email, IPHONE)

    const wrong = await call(changePassword, { method: 'POST', cookie: laptop, body: { currentPassword: 'nope-nope-nope', newPassword: 'a-brand-new-binding-stitch' } })
    expect(wrong.status).toBe(422)
    const weak = await call(changePassword, { method: 'POST', cookie: laptop, body: { currentPassword: TEST_PASSWORD, newPassword: 'password1234' } })
    expect(weak.json?.error.issues[0].path).toBe('newPassword')

    const changed = await call(changePassword, { method: 'POST', cookie: laptop, body: { currentPassword: TEST_PASSWORD, newPassword: 'a-brand-new-binding-stitch' } })
    expect(changed.json).toEqual({ endedSessions: 1 })
    expect((await call(listPatterns, { cookie: phone })).status).toBe(401)
    expect((await call(listPatterns, { cookie: laptop })).status).toBe(200)
    await waitForMail({ to: user.email, kind: 'password-changed' })
  })
})

describe('deleting the account', () => {
  it('needs the password and DELETE; removes uploads and drafts and testing patterns, retires published ones and keeps them and retired ones without an owner', async () => {
    const designer = await createUser({ email: freshAddress('ada'), roles: ['designer'] })
    const cookie = await signInFrom(designer.email, FIREFOX)
    const draft = await createPatternRow(designer, { name: 'Draft', state: 'draft' })
    const testing = await createPatternRow(designer, { name: 'Testing', state: 'testing' })
    const published = await createPatternRow(designer, { name: 'Published', state: 'published' })
    const retired = await createPatternRow(designer, { name: 'Retired', state: 'retired' })
    const key = objectKey(`account-test-${randomUUID()}.png`)
    await putObject(key, new Uint8Array([1, 2, 3]), 'image/png')
    await Upload.create({ ownerId: designer.id, kind: 'swatch', key, contentType: 'image/png', width: 1, height: 1, bytes: 3, palette: null })

    const unconfirmed = await call(deleteAccount, { method: 'DELETE', cookie, body: { currentPassword: TEST_PASSWORD, confirm: 'delete' } })
    expect(unconfirmed.status).toBe(422)
    const wrong = await call(deleteAccount, { method: 'DELETE', cookie, body: { currentPassword: 'not-my-password', confirm: 'DELETE' } })
    expect(wrong.status).toBe(422)
    expect(await User.count({ where: { id: designer.id } })).toBe(1)

    const deleted = await call(deleteAccount, { method: 'DELETE', cookie, body: { currentPassword: TEST_PASSWORD, confirm: 'DELETE' } })
    expect(deleted.status).toBe(200)
    expect(deleted.headers.get('set-cookie')).toMatch(/Max-Age=0/)
    expect(await User.count({ where: { id: designer.id } })).toBe(0)
    // The image left the object store too, not only its row.
    expect(await getObject(key)).toBeNull()
    expect(await Session.count({ where: { userId: designer.id } })).toBe(0)
    expect(await Pattern.count({ where: { id: [draft.id, testing.id] } })).toBe(0)
    const kept = await Pattern.findAll({ where: { id: [published.id, retired.id] }, order: [['name', 'ASC']] })
    // The published one left the shop: retired, with its revision and history like any state change.
    expect(kept.map((pattern) => [pattern.name, pattern.ownerId, pattern.state])).toEqual([
      ['Published', null, 'retired'],
      ['Retired', null, 'retired'],
    ])
    expect(await PatternRevision.count({ where: { patternId: published.id, savedById: null } })).toBe(2)
    expect((await PatternStateChange.findAll({ where: { patternId: published.id } })).map((change) => [change.fromState, change.toState, change.changedById])).toEqual([
      ['published', 'retired', null],
    ])
    expect((await call(getAccount, { cookie })).status).toBe(401)
  })
})
