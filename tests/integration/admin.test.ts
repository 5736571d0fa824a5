import { randomUUID } from 'node:crypto'
import fs from 'node:fs'
import path from 'node:path'
import { afterAll, beforeEach, describe, expect, it } from 'vitest'
import { GET as listAudit } from '@/app/api/admin/audit/route'
import { POST as decideRequest } from '@/app/api/admin/designer-requests/[id]/route'
import { GET as listRequests } from '@/app/api/admin/designer-requests/route'
import { GET as listMail } from '@/app/api/admin/mail/route'
import { PATCH as updateUser } from '@/app/api/admin/users/[id]/route'
import { POST as signIn } from '@/app/api/auth/sign-in/route'
import { closeQueueSender } from '@/lib/jobs/boss'
import type { Role } from '@/lib/roles'
import { AdminAuditEntry, Order, OutgoingMail, Session } from '@/models'
import { emptyAdminLogs } from '../support/audit-log'
import { closeDatabase, freshDatabase } from '../support/database'
import { createPatternRow, createUser, sessionCookieFor, TEST_PASSWORD } from '../support/factories'
import { call } from '../support/requests'

beforeEach(async () => {
  await freshDatabase()
  await emptyAdminLogs()
})
afterAll(async () => {
  await closeQueueSender()
  await closeDatabase()
})

const admin = () => createUser({ email: 'odile@desk.test', displayName: 'Odile Admin', roles: ['admin'] })

type Handler = (request: Request, context: { params: Promise<Record<string, string>> }) => Promise<Response>

/** Every route handler under app/api/admin, found in the folder so that a new one cannot be missed. */
async function adminRoutes(): Promise<{ file: string; method: string; handler: Handler }[]> {
  const root = path.resolve('app/api/admin')
  const files = (fs.readdirSync(root, { recursive: true }) as string[]).filter((file) => path.basename(file) === 'route.ts').sort()
  const routes = []
  for (const file of files) {
    const handlers = (await import(path.join(root, file))) as Record<string, Handler>
    for (const method of ['GET', 'POST', 'PUT', 'PATCH', 'DELETE']) if (handlers[method]) routes.push({ file, method, handler: handlers[method]! })
  }
  return routes
}

/** A body each route accepts, so that a refusal can only be about who is asking. */
const VALID_BODY: Record<string, unknown> = { PATCH: { roles: ['quilter', 'tester'] }, POST: { decision: 'decline' } }
/** Routes of the desk that act on something else than a person: their own body. */
const VALID_BODY_OF: Record<string, unknown> = { 'listings/[id]/route.ts': { hidden: true } }

describe('who gets into the admin API', () => {
  it('answers strangers 401 and designers, testers and quilters 404 on every admin route; admins get through', async () => {
    const routes = await adminRoutes()
    expect(routes.map((route) => `${route.method} ${route.file}`)).toEqual(
      expect.arrayContaining([
        'GET audit/route.ts',
        'GET designer-requests/route.ts',
        'POST designer-requests/[id]/route.ts',
        'GET mail/route.ts',
        'GET users/route.ts',
        'PATCH users/[id]/route.ts',
      ]),
    )
    const target = await createUser({ roles: ['quilter'] })
    await target.update({ designerRequestedAt: new Date() })
    const people: [string, Role[]][] = [['designer', ['designer', 'quilter']], ['tester', ['tester', 'quilter']], ['quilter', ['quilter']]]
    const cookies = await Promise.all(people.map(async ([, roles]) => sessionCookieFor(await createUser({ roles }))))
    const adminCookie = await sessionCookieFor(await admin())
    // The shop's listings are patterns: hiding one (listings/[id]) needs a pattern's id.
    const listing = await createPatternRow(await createUser({ roles: ['designer'] }), { state: 'published' })
    // A refund acts on an order: one never paid through the provider, which the admin's call
    // reaches past the permission and is answered 409 for (nothing is refunded, nothing logged).
    const order = await Order.create({ id: randomUUID(), buyerId: target.id, patternId: listing.id, amountCents: 1200, currency: 'USD', checkoutSessionId: `cs_test_${randomUUID()}`, state: 'pending' })
    for (const { file, method, handler } of routes) {
      const id = file.startsWith('listings/') ? listing.id : file.startsWith('orders/') ? order.id : target.id
      const options = { method, body: VALID_BODY_OF[file] ?? VALID_BODY[method], params: { id } }
      const label = `${method} ${file}`
      expect((await call(handler, options)).status, `${label} as a stranger`).toBe(401)
      for (const [index, cookie] of cookies.entries()) {
        expect((await call(handler, { ...options, cookie })).status, `${label} as a ${people[index]![0]}`).toBe(404)
      }
      expect((await call(handler, { ...options, cookie: adminCookie })).status, `${label} as an admin`).toBe(file.startsWith('orders/') ? 409 : 200)
    }
    // Nothing the others sent changed anything: only the admin's two changes are in the log.
    expect((await AdminAuditEntry.findAll()).map((entry) => entry.action).sort()).toEqual(['decline-designer-request', 'grant-role', 'hide-listing'])
  })
})

describe('granting and revoking roles', () => {
  it('grants and revokes, writing one audit entry per change: who, what, whom, when', async () => {
    const odile = await admin()
    const cookie = await sessionCookieFor(odile)
    const person = await createUser({ email: 'wren@example.test', displayName: 'Wren Hollis', roles: ['quilter', 'tester'] })
    const before = new Date()
    const response = await call(updateUser, { method: 'PATCH', cookie, params: { id: person.id }, body: { roles: ['designer', 'quilter'] } })
    expect(response.status).toBe(200)
    expect(response.json?.user).toMatchObject({ id: person.id, roles: ['designer', 'quilter'], disabledAt: null })
    await person.reload()
    expect(person.roles).toEqual(['designer', 'quilter'])

    const entries = await AdminAuditEntry.findAll({ order: [['id', 'ASC']] })
    expect(entries.map((entry) => ({ actorId: entry.actorId, action: entry.action, targetId: entry.targetId, details: entry.details }))).toEqual([
      { actorId: odile.id, action: 'grant-role', targetId: person.id, details: { role: 'designer' } },
      { actorId: odile.id, action: 'revoke-role', targetId: person.id, details: { role: 'tester' } },
    ])
    expect(entries[0]!.actorLabel).toBe('Odile Admin <odile@desk.test>')
    expect(entries[0]!.targetLabel).toBe('Wren Hollis <wren@example.test>')
    expect(entries[0]!.createdAt.getTime()).toBeGreaterThanOrEqual(before.getTime() - 1000)

    // The audit API lists them newest first, and the session of the person has the new roles at once.
    const audit = await call(listAudit, { cookie })
    expect(audit.json).toMatchObject({ page: 1, total: 2, pageCount: 1 })
    expect(audit.json?.rows.map((row: { action: string }) => row.action)).toEqual(['revoke-role', 'grant-role'])
    expect(audit.json?.rows[0]).toMatchObject({ actor: 'Odile Admin <odile@desk.test>', target: 'Wren Hollis <wren@example.test>', details: { role: 'tester' } })
  })

  it('refuses an unknown role with 422 naming its place, and changes nothing', async () => {
    const cookie = await sessionCookieFor(await admin())
    const person = await createUser({ roles: ['quilter'] })
    const response = await call(updateUser, { method: 'PATCH', cookie, params: { id: person.id }, body: { roles: ['quilter', 'wizard'] } })
    expect(response.status).toBe(422)
    expect(response.json?.error.issues).toEqual([expect.objectContaining({ path: 'roles.1' })])
    expect(await AdminAuditEntry.count()).toBe(0)
    const empty = await call(updateUser, { method: 'PATCH', cookie, params: { id: person.id }, body: {} })
    expect(empty.status).toBe(422)
  })

  it('will not let an admin remove their own admin role or disable themselves, and says why', async () => {
    const odile = await admin()
    const cookie = await sessionCookieFor(odile)
    const demote = await call(updateUser, { method: 'PATCH', cookie, params: { id: odile.id }, body: { roles: ['quilter'] } })
    expect(demote.status).toBe(422)
    expect(demote.json?.error.issues).toEqual([{ path: 'roles', message: expect.stringMatching(/cannot remove your own admin role/) }])
    const disable = await call(updateUser, { method: 'PATCH', cookie, params: { id: odile.id }, body: { disabled: true } })
    expect(disable.status).toBe(422)
    expect(disable.json?.error.issues).toEqual([{ path: 'disabled', message: expect.stringMatching(/cannot disable your own account/) }])
    await odile.reload()
    expect(odile.roles).toEqual(['admin'])
    expect(odile.disabledAt).toBeNull()
    expect(await AdminAuditEntry.count()).toBe(0)
    // Another admin may do it.
    const other = await createUser({ roles: ['admin'] })
    const byOther = await call(updateUser, { method: 'PATCH', cookie: await sessionCookieFor(other), params: { id: odile.id }, body: { roles: ['quilter'] } })
    expect(byOther.status).toBe(200)
  })

  it('answers 404 for an account that does not exist', async () => {
    const cookie = await sessionCookieFor(await admin())
    for (const id of ['00000000-0000-4000-8000-000000000000', 'not-an-id']) {
      expect((await call(updateUser, { method: 'PATCH', cookie, params: { id }, body: { disabled: true } })).status).toBe(404)
    }
  })
})

describe('disabling an account', () => {
  it('ends every session of it at once and keeps it from signing in until it is re-enabled', async () => {
    const cookie = await sessionCookieFor(await admin())
    const person = await createUser({ email: 'elm@example.test', roles: ['quilter'] })
    await sessionCookieFor(person)
    await sessionCookieFor(person)
    expect(await Session.count({ where: { userId: person.id } })).toBe(2)

    const disabled = await call(updateUser, { method: 'PATCH', cookie, params: { id: person.id }, body: { disabled: true } })
    expect(disabled.status).toBe(200)
    expect(disabled.json?.user.disabledAt).toEqual(expect.any(String))
    expect(await Session.count({ where: { userId: person.id } })).toBe(0)
    const refused = await call(signIn, { method: 'POST', body: { email: 'elm@example.test', password: TEST_PASSWORD } })
    expect(refused.status).toBeGreaterThanOrEqual(400)
    expect(await Session.count({ where: { userId: person.id } })).toBe(0)

    const enabled = await call(updateUser, { method: 'PATCH', cookie, params: { id: person.id }, body: { disabled: false } })
    expect(enabled.json?.user.disabledAt).toBeNull()
    const signedIn = await call(signIn, { method: 'POST', body: { email: 'elm@example.test', password: TEST_PASSWORD } })
    expect(signedIn.status).toBe(200)
    expect((await AdminAuditEntry.findAll({ order: [['id', 'ASC']] })).map((entry) => entry.action)).toEqual(['disable-account', 'enable-account'])

    // Asking for what already is records nothing.
    await call(updateUser, { method: 'PATCH', cookie, params: { id: person.id }, body: { disabled: false } })
    expect(await AdminAuditEntry.count()).toBe(2)
  })
})

describe('designer requests', () => {
  async function requester(email: string) {
    const person = await createUser({ email, displayName: 'Fern Ashdown', roles: ['quilter'] })
    await person.update({ designerRequestedAt: new Date('2026-11-30T10:00:00Z') })
    return person
  }

  it('lists the pending ones; approving gives the designer role, queues the e-mail and records it', async () => {
    const odile = await admin()
    const cookie = await sessionCookieFor(odile)
    const fern = await requester('fern@example.test')
    await createUser({ roles: ['quilter'] })
    const pending = await call(listRequests, { cookie })
    expect(pending.json?.rows.map((row: { id: string }) => row.id)).toEqual([fern.id])

    const approved = await call(decideRequest, { method: 'POST', cookie, params: { id: fern.id }, body: { decision: 'approve' } })
    expect(approved.status).toBe(200)
    expect(approved.json?.user).toMatchObject({ roles: ['quilter', 'designer'], designerRequestedAt: null })
    const mail = await OutgoingMail.findAll({ where: { userId: fern.id } })
    expect(mail.map((row) => ({ to: row.toAddress, kind: row.kind }))).toEqual([{ to: 'fern@example.test', kind: 'designer-request-decided' }])
    const [entry] = await AdminAuditEntry.findAll()
    expect(entry).toMatchObject({ actorId: odile.id, action: 'approve-designer-request', targetId: fern.id, details: { requestedAt: '2026-11-30T10:00:00.000Z' } })
    expect((await call(listRequests, { cookie })).json?.rows).toEqual([])

    // Deciding again is a conflict, not a second e-mail.
    const again = await call(decideRequest, { method: 'POST', cookie, params: { id: fern.id }, body: { decision: 'decline' } })
    expect(again.status).toBe(409)
    expect(await OutgoingMail.count({ where: { userId: fern.id } })).toBe(1)
  })

  it('declining keeps the roles, queues the e-mail and records it', async () => {
    const cookie = await sessionCookieFor(await admin())
    const fern = await requester('fern.decline@example.test')
    const declined = await call(decideRequest, { method: 'POST', cookie, params: { id: fern.id }, body: { decision: 'decline' } })
    expect(declined.json?.user).toMatchObject({ roles: ['quilter'], designerRequestedAt: null })
    expect(await OutgoingMail.count({ where: { userId: fern.id, kind: 'designer-request-decided' } })).toBe(1)
    expect((await AdminAuditEntry.findAll()).map((entry) => entry.action)).toEqual(['decline-designer-request'])
    const bad = await call(decideRequest, { method: 'POST', cookie, params: { id: fern.id }, body: { decision: 'maybe' } })
    expect(bad.status).toBe(422)
    expect(bad.json?.error.issues[0].path).toBe('decision')
  })

  it('granting the designer role on the people page settles a pending request too', async () => {
    const cookie = await sessionCookieFor(await admin())
    const fern = await requester('fern.grant@example.test')
    await call(updateUser, { method: 'PATCH', cookie, params: { id: fern.id }, body: { roles: ['quilter', 'designer'] } })
    await fern.reload()
    expect(fern.designerRequestedAt).toBeNull()
    expect((await AdminAuditEntry.findOne())?.details).toEqual({ role: 'designer', designerRequestSettled: true })
  })
})

describe('the mail log', () => {
  it('shows to, kind, state and times, never what a message said', async () => {
    const cookie = await sessionCookieFor(await admin())
    const fern = await createUser({ email: 'fern.mail@example.test', roles: ['quilter'] })
    await fern.update({ designerRequestedAt: new Date() })
    await call(decideRequest, { method: 'POST', cookie, params: { id: fern.id }, body: { decision: 'approve' } })
    const log = await call(listMail, { cookie })
    expect(log.status).toBe(200)
    expect(log.json).toMatchObject({ page: 1, total: 1, pageSize: 50 })
    expect(Object.keys(log.json?.rows[0]).sort()).toEqual(['attempts', 'id', 'kind', 'lastError', 'queuedAt', 'sentAt', 'state', 'to'])
    expect(log.json?.rows[0]).toMatchObject({ to: 'fern.mail@example.test', kind: 'designer-request-decided' })
    expect(JSON.stringify(log.json)).not.toContain('studioUrl')
    expect(log.json).toHaveProperty('mailViewUrl')
  })
})
