import { randomUUID } from 'node:crypto'
import { afterAll, afterEach, beforeEach, describe, expect, it } from 'vitest'
import { POST as signUp } from '@/app/api/auth/sign-up/route'
import { POST as verifyEmail } from '@/app/api/auth/verify-email/route'
import { DELETE as withdraw } from '@/app/api/patterns/[id]/invitations/[invitationId]/route'
import { GET as listInvitations, POST as invite } from '@/app/api/patterns/[id]/invitations/route'
import { GET as readPattern, PATCH as updatePattern } from '@/app/api/patterns/[id]/route'
import { GET as listRevisions } from '@/app/api/patterns/[id]/revisions/route'
import { wreathFile } from '@/lib/booklet/test-support/designs'
import { PEER_ADDRESS_HEADER } from '@/lib/client-address'
import { RATE_LIMITS } from '@/lib/rate-limits'
import { getPatternForPrint, TEST_COPY_NOTICE } from '@/lib/services/patterns'
import { isTesterOf, listPatternsToTest, testerIdsOf } from '@/lib/services/invitations'
import type { PatternState } from '@/lib/schemas/pattern'
import { authorizeUploadRead } from '@/lib/services/uploads'
import { Invitation, Upload, User } from '@/models'
import { closeDatabase, freshDatabase } from '../support/database'
import { createPatternRow, createUser, sessionCookieFor } from '../support/factories'
import { clearMailQueue, firstLink, useMailWorker, waitForMail } from '../support/mail'
import { call } from '../support/requests'

/**
 * Tester invitations (issue 13) against the real route handlers, PostgreSQL, the mail queue and
 * the mail catcher: who may invite, what an invitation gives and when it stops giving it.
 */

useMailWorker()
beforeEach(async () => {
  await freshDatabase()
  // The rate-limit test leaves 30 messages queued; a later test would wait behind them.
  await clearMailQueue()
})
afterEach(() => {
  delete process.env.TESTER_INVITATION_DAYS
})
afterAll(closeDatabase)

/** An address no other test (or earlier run: the catcher keeps its mail) has used. */
const freshAddress = (name: string) => `${name}.${randomUUID().slice(0, 8)}@example.test`

async function person(roles: ('designer' | 'quilter' | 'admin')[], overrides: { displayName?: string; verified?: boolean; email?: string } = {}) {
  const user = await createUser({ roles, displayName: overrides.displayName ?? 'Test Person', email: overrides.email ?? freshAddress('person') })
  if (overrides.verified !== false) await user.update({ emailVerifiedAt: new Date() })
  return { user, cookie: await sessionCookieFor(user) }
}

async function patternIn(owner: { id: string }, state: PatternState = 'testing', name = 'Lantern Medallion') {
  return createPatternRow(owner, { state, design: wreathFile({ name }), name })
}

const inviteAs = (cookie: string, patternId: string, email: string) => call(invite, { method: 'POST', cookie, params: { id: patternId }, body: { email } })

describe('who may invite', () => {
  it('lets the designer invite, list and withdraw; answers 201 with a waiting invitation for an address without an account', async () => {
    const designer = await person(['designer'])
    const pattern = await patternIn(designer.user)
    const email = freshAddress('newcomer')
    const created = await inviteAs(designer.cookie, pattern.id, email.toUpperCase())
    expect(created.status).toBe(201)
    expect(created.json?.invitation).toMatchObject({ email, state: 'waiting', testerName: null })
    const listed = await call(listInvitations, { cookie: designer.cookie, params: { id: pattern.id } })
    expect(listed.json?.invitations.map((i: { email: string }) => i.email)).toEqual([email])
    const withdrawn = await call(withdraw, { method: 'DELETE', cookie: designer.cookie, params: { id: pattern.id, invitationId: created.json?.invitation.id } })
    expect(withdrawn.status).toBe(200)
    expect(withdrawn.json?.invitation.state).toBe('withdrawn')
  })

  it.each([
    ['another designer', ['designer'], 404],
    ['a quilter', ['quilter'], 404],
  ] as const)('refuses %s to invite, list or withdraw (not found, as for a missing pattern)', async (_who, roles, status) => {
    const designer = await person(['designer'])
    const other = await person([...roles])
    const pattern = await patternIn(designer.user)
    const invitation = (await inviteAs(designer.cookie, pattern.id, freshAddress('sam'))).json?.invitation
    expect((await inviteAs(other.cookie, pattern.id, freshAddress('friend'))).status).toBe(status)
    expect((await call(listInvitations, { cookie: other.cookie, params: { id: pattern.id } })).status).toBe(status)
    expect((await call(withdraw, { method: 'DELETE', cookie: other.cookie, params: { id: pattern.id, invitationId: invitation.id } })).status).toBe(status)
    expect(await Invitation.count()).toBe(1)
    expect((await Invitation.findByPk(invitation.id))?.withdrawnAt).toBeNull()
  })

  it('refuses a tester of the pattern (403): testers do not invite testers, nor see who else was invited', async () => {
    const designer = await person(['designer'])
    const tester = await person(['quilter'])
    const pattern = await patternIn(designer.user)
    await inviteAs(designer.cookie, pattern.id, tester.user.email)
    expect((await inviteAs(tester.cookie, pattern.id, freshAddress('friend'))).status).toBe(403)
    expect((await call(listInvitations, { cookie: tester.cookie, params: { id: pattern.id } })).status).toBe(403)
  })

  it('lets an admin invite to anyone’s pattern', async () => {
    const designer = await person(['designer'])
    const admin = await person(['admin'])
    const pattern = await patternIn(designer.user)
    expect((await inviteAs(admin.cookie, pattern.id, freshAddress('sam'))).status).toBe(201)
  })

  it('asks a visitor to sign in first', async () => {
    const designer = await person(['designer'])
    const pattern = await patternIn(designer.user)
    expect((await call(invite, { method: 'POST', params: { id: pattern.id }, body: { email: freshAddress('x') } })).status).toBe(401)
  })
})

describe('what an invitation needs', () => {
  it.each(['published', 'retired'] as const)('refuses to invite to a %s pattern (409)', async (state) => {
    const designer = await person(['designer'])
    const pattern = await patternIn(designer.user, state)
    const response = await inviteAs(designer.cookie, pattern.id, freshAddress('late'))
    expect(response.status).toBe(409)
    expect(response.json?.error.message).toContain('draft or in testing')
  })

  it('accepts a draft (the round is prepared before it starts)', async () => {
    const designer = await person(['designer'])
    const pattern = await patternIn(designer.user, 'draft')
    expect((await inviteAs(designer.cookie, pattern.id, freshAddress('early'))).status).toBe(201)
  })

  it.each([
    ['not-an-address', 'email'],
    ['', 'email'],
  ])('refuses the address %j naming %s', async (email, path) => {
    const designer = await person(['designer'])
    const pattern = await patternIn(designer.user)
    const response = await inviteAs(designer.cookie, pattern.id, email)
    expect(response.status).toBe(422)
    expect(response.json?.error.issues[0].path).toBe(path)
  })

  it('refuses the designer’s own address and an address invited already', async () => {
    const designer = await person(['designer'])
    const pattern = await patternIn(designer.user)
    const own = await inviteAs(designer.cookie, pattern.id, designer.user.email)
    expect(own.status).toBe(422)
    expect(own.json?.error.issues[0].path).toBe('email')
    const email = freshAddress('twice')
    expect((await inviteAs(designer.cookie, pattern.id, email)).status).toBe(201)
    expect((await inviteAs(designer.cookie, pattern.id, email)).status).toBe(409)
  })

  it(`stops a designer after ${RATE_LIMITS.invitationsPerDesigner.points} invitations an hour (429 with Retry-After)`, async () => {
    const designer = await person(['designer'])
    const pattern = await patternIn(designer.user)
    for (let n = 0; n < RATE_LIMITS.invitationsPerDesigner.points; n += 1) {
      expect((await inviteAs(designer.cookie, pattern.id, freshAddress(`t${n}`))).status).toBe(201)
    }
    const refused = await inviteAs(designer.cookie, pattern.id, freshAddress('one-more'))
    expect(refused.status).toBe(429)
    expect(Number(refused.headers.get('retry-after'))).toBeGreaterThan(0)
  })
})

describe('what an invitation gives', () => {
  it('makes a person with a verified account a tester at once, and e-mails them the pattern’s page', async () => {
    const designer = await person(['designer'], { displayName: 'Mara Quill' })
    const tester = await person(['quilter'], { displayName: 'Sam Reed' })
    const pattern = await patternIn(designer.user)
    const created = await inviteAs(designer.cookie, pattern.id, tester.user.email)
    expect(created.json?.invitation).toMatchObject({ state: 'accepted', testerName: 'Sam Reed' })
    expect(await testerIdsOf(pattern.id)).toEqual([tester.user.id])
    expect(await isTesterOf(tester.user.id, pattern.id)).toBe(true)
    const mail = await waitForMail({ to: tester.user.email, kind: 'tester-invitation' })
    expect(mail.subject).toBe('Mara Quill invites you to test “Lantern Medallion” on Wreathwright')
    expect(mail.text).toContain('Hello Sam Reed,')
    expect(new URL(firstLink(mail, '/testing/')).pathname).toBe(`/testing/${pattern.id}`)
    // Reads the pattern and its revisions, and prints it as a test copy with their name.
    expect((await call(readPattern, { cookie: tester.cookie, params: { id: pattern.id } })).status).toBe(200)
    expect((await call(listRevisions, { cookie: tester.cookie, params: { id: pattern.id } })).status).toBe(200)
    const printable = await getPatternForPrint({ id: tester.user.id, roles: tester.user.roles }, pattern.id)
    expect(printable.footer).toEqual({ person: 'Sam Reed', notice: TEST_COPY_NOTICE })
    expect(await listPatternsToTest({ id: tester.user.id, roles: tester.user.roles })).toEqual([
      expect.objectContaining({ patternId: pattern.id, name: 'Lantern Medallion', designerName: 'Mara Quill', open: true }),
    ])
  })

  it('prints plain for the designer: no footer', async () => {
    const designer = await person(['designer'])
    const pattern = await patternIn(designer.user)
    expect((await getPatternForPrint({ id: designer.user.id, roles: designer.user.roles }, pattern.id)).footer).toBeNull()
  })

  it('leads a newcomer from the e-mail to sign-up, and confirming the address makes them a tester and names the pattern', async () => {
    const designer = await person(['designer'])
    const pattern = await patternIn(designer.user)
    const email = freshAddress('newcomer')
    await inviteAs(designer.cookie, pattern.id, email)
    const invitationMail = await waitForMail({ to: email, kind: 'tester-invitation' })
    const link = new URL(firstLink(invitationMail, '/sign-up'))
    expect(link.searchParams.get('next')).toBe(`/testing/${pattern.id}`)
    expect(await testerIdsOf(pattern.id)).toEqual([])

    expect((await call(signUp, { method: 'POST', body: { email, password: 'pressing-seams-open', displayName: 'Nia Bloom' }, headers: { [PEER_ADDRESS_HEADER]: '198.51.100.40' } })).status).toBe(202)
    const newcomer = await User.findOne({ where: { email } })
    // Signed up but not yet confirmed: not a tester (the address is not proven theirs).
    expect(await isTesterOf(newcomer!.id, pattern.id)).toBe(false)
    const verification = await waitForMail({ to: email, kind: 'verify-email' })
    const token = new URLSearchParams(new URL(firstLink(verification, '/verify-email')).hash.slice(1)).get('token')
    const verified = await call(verifyEmail, { method: 'POST', body: { token } })
    expect(verified.status).toBe(200)
    expect(verified.json).toEqual({ verified: true, next: `/testing/${pattern.id}` })
    expect(await testerIdsOf(pattern.id)).toEqual([newcomer!.id])
    const cookie = await sessionCookieFor(newcomer!)
    expect((await call(readPattern, { cookie, params: { id: pattern.id } })).status).toBe(200)
  })

  it('is claimed by a person who moves their account to the invited address and confirms it', async () => {
    const designer = await person(['designer'])
    const mover = await person(['quilter'])
    const pattern = await patternIn(designer.user)
    const email = freshAddress('moving')
    await inviteAs(designer.cookie, pattern.id, email)
    const { issueAccountToken } = await import('@/lib/auth/account-tokens')
    const { confirmEmailChange } = await import('@/lib/services/account-settings')
    const { database } = await import('@/lib/db')
    const token = await database().transaction((transaction) => issueAccountToken(mover.user.id, 'change-email', { transaction, newEmail: email }))
    await confirmEmailChange(token)
    expect(await isTesterOf(mover.user.id, pattern.id)).toBe(true)
  })

  it('waits for an unverified account to confirm its address before it counts', async () => {
    const designer = await person(['designer'])
    const unverified = await person(['quilter'], { verified: false })
    const pattern = await patternIn(designer.user)
    expect((await inviteAs(designer.cookie, pattern.id, unverified.user.email)).json?.invitation.state).toBe('waiting')
    expect((await call(readPattern, { cookie: unverified.cookie, params: { id: pattern.id } })).status).toBe(404)
  })
})

describe('when an invitation gives nothing', () => {
  it('a withdrawn invitation: the tester loses the pattern at once (404), and its e-mailed link claims nothing', async () => {
    const designer = await person(['designer'])
    const tester = await person(['quilter'])
    const pattern = await patternIn(designer.user)
    const invitation = (await inviteAs(designer.cookie, pattern.id, tester.user.email)).json?.invitation
    expect((await call(readPattern, { cookie: tester.cookie, params: { id: pattern.id } })).status).toBe(200)
    await call(withdraw, { method: 'DELETE', cookie: designer.cookie, params: { id: pattern.id, invitationId: invitation.id } })
    expect((await call(readPattern, { cookie: tester.cookie, params: { id: pattern.id } })).status).toBe(404)
    await expect(getPatternForPrint({ id: tester.user.id, roles: tester.user.roles }, pattern.id)).rejects.toThrow('No such pattern')
    expect(await listPatternsToTest({ id: tester.user.id, roles: tester.user.roles })).toEqual([])
  })

  it('a withdrawn invitation of a newcomer is not claimed when they confirm their address', async () => {
    const designer = await person(['designer'])
    const newcomer = await person(['quilter'], { verified: false })
    const pattern = await patternIn(designer.user)
    const invitation = (await inviteAs(designer.cookie, pattern.id, newcomer.user.email)).json?.invitation
    await call(withdraw, { method: 'DELETE', cookie: designer.cookie, params: { id: pattern.id, invitationId: invitation.id } })
    const { claimInvitationsOf } = await import('@/lib/services/invitations')
    const { database } = await import('@/lib/db')
    expect(await database().transaction((transaction) => claimInvitationsOf(newcomer.user, transaction))).toEqual([])
    expect(await isTesterOf(newcomer.user.id, pattern.id)).toBe(false)
  })

  it('an expired invitation (TESTER_INVITATION_DAYS): refused like none, listed as expired, and the address may be invited again', async () => {
    process.env.TESTER_INVITATION_DAYS = '1'
    const designer = await person(['designer'])
    const tester = await person(['quilter'])
    const pattern = await patternIn(designer.user)
    const invitation = (await inviteAs(designer.cookie, pattern.id, tester.user.email)).json?.invitation
    // 1 day, as the setting says (within the test's own run time).
    expect(Date.parse(invitation.expiresAt) - Date.parse(invitation.createdAt)).toBe(24 * 60 * 60 * 1000)
    await Invitation.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { id: invitation.id } })
    expect((await call(readPattern, { cookie: tester.cookie, params: { id: pattern.id } })).status).toBe(404)
    expect(await isTesterOf(tester.user.id, pattern.id)).toBe(false)
    const listed = await call(listInvitations, { cookie: designer.cookie, params: { id: pattern.id } })
    expect(listed.json?.invitations[0].state).toBe('expired')
    expect((await inviteAs(designer.cookie, pattern.id, tester.user.email)).status).toBe(201)
    expect(await isTesterOf(tester.user.id, pattern.id)).toBe(true)
  })

  it('defaults to 30 days', async () => {
    const designer = await person(['designer'])
    const pattern = await patternIn(designer.user)
    const invitation = (await inviteAs(designer.cookie, pattern.id, freshAddress('sam'))).json?.invitation
    expect(Date.parse(invitation.expiresAt) - Date.parse(invitation.createdAt)).toBe(30 * 24 * 60 * 60 * 1000)
  })

  it('a tester cannot see a pattern they were not invited to, even of the same designer', async () => {
    const designer = await person(['designer'])
    const tester = await person(['quilter'])
    const invited = await patternIn(designer.user, 'testing', 'Invited')
    const other = await patternIn(designer.user, 'testing', 'Not invited')
    await inviteAs(designer.cookie, invited.id, tester.user.email)
    expect((await call(readPattern, { cookie: tester.cookie, params: { id: invited.id } })).status).toBe(200)
    expect((await call(readPattern, { cookie: tester.cookie, params: { id: other.id } })).status).toBe(404)
    expect((await listPatternsToTest({ id: tester.user.id, roles: tester.user.roles })).map((p) => p.name)).toEqual(['Invited'])
  })

  it('a pattern back in draft is closed to its testers until it is in testing again', async () => {
    const designer = await person(['designer'])
    const tester = await person(['quilter'])
    const pattern = await patternIn(designer.user)
    await inviteAs(designer.cookie, pattern.id, tester.user.email)
    await call(updatePattern, { method: 'PATCH', cookie: designer.cookie, params: { id: pattern.id }, body: { revision: 1, state: 'draft' } })
    expect((await call(readPattern, { cookie: tester.cookie, params: { id: pattern.id } })).status).toBe(404)
    expect(await listPatternsToTest({ id: tester.user.id, roles: tester.user.roles })).toEqual([expect.objectContaining({ patternId: pattern.id, open: false })])
  })
})

describe('the swatches of a pattern in testing', () => {
  it('are readable by its testers (for their booklets), not by a tester of another pattern nor once the invitation is withdrawn', async () => {
    const designer = await person(['designer'])
    const tester = await person(['quilter'])
    const otherTester = await person(['quilter'])
    const swatch = await Upload.create({ ownerId: designer.user.id, kind: 'swatch', key: `swatches/${randomUUID()}.png`, contentType: 'image/png', width: 8, height: 8, bytes: 100, palette: null })
    const file = wreathFile()
    const holly = file.colorways![0]!
    const design = { ...file, colorways: [{ ...holly, fabrics: { ...holly.fabrics, berry: { ...holly.fabrics.berry!, swatch: swatch.id } } }, file.colorways![1]!] }
    const pattern = await createPatternRow(designer.user, { state: 'testing', design })
    const other = await patternIn(designer.user, 'testing', 'Other')
    const invitation = (await inviteAs(designer.cookie, pattern.id, tester.user.email)).json?.invitation
    await inviteAs(designer.cookie, other.id, otherTester.user.email)
    const actor = (p: { user: User }) => ({ id: p.user.id, roles: p.user.roles })
    expect((await authorizeUploadRead(actor(tester), swatch.id)).id).toBe(swatch.id)
    await expect(authorizeUploadRead(actor(otherTester), swatch.id)).rejects.toThrow('No such upload')
    await call(withdraw, { method: 'DELETE', cookie: designer.cookie, params: { id: pattern.id, invitationId: invitation.id } })
    await expect(authorizeUploadRead(actor(tester), swatch.id)).rejects.toThrow('No such upload')
  })
})
