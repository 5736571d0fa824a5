import { afterAll, beforeEach, describe, expect, it } from 'vitest'
import { PATCH as updatePattern, GET as readPattern } from '@/app/api/patterns/[id]/route'
import { GET as listStateChanges } from '@/app/api/patterns/[id]/state-changes/route'
import { wreathFile } from '@/lib/booklet/test-support/designs'
import type { DesignFile } from '@/lib/schemas/design'
import type { PatternState } from '@/lib/schemas/pattern'
import { Pattern, PatternStateChange } from '@/models'
import { closeDatabase, freshDatabase } from '../support/database'
import { createPatternRow, createUser, sessionCookieFor } from '../support/factories'
import { call } from '../support/requests'

beforeEach(freshDatabase)
afterAll(closeDatabase)

async function person(roles: ('designer' | 'quilter' | 'tester' | 'admin')[], displayName = 'Test Person') {
  const user = await createUser({ roles, displayName })
  return { user, cookie: await sessionCookieFor(user) }
}

/** A sewable wreath with two complete colourways (lib/booklet/test-support/designs.ts). */
const ready = (): DesignFile => wreathFile()
/** The same wreath with a seam floating free in the repeat: the plan has an error. */
const unsewable = (): DesignFile => wreathFile({ seams: [...wreathFile().seams, { id: 'stray', from: [2, 5], to: [2.5, 5.5] }] })
/** The same wreath whose every colourway gives the berries no fabric. */
const withoutBerryFabric = (): DesignFile => {
  const file = wreathFile()
  return { ...file, colorways: file.colorways!.map(({ fabrics: { berry: _berry, ...fabrics }, ...rest }) => ({ ...rest, fabrics })) }
}

async function patternIn(owner: { id: string }, state: PatternState, design: DesignFile = ready(), price: { priceCents: number; currency: 'EUR' } | null = null) {
  const pattern = await createPatternRow(owner, { state, design })
  if (price) await pattern.update(price)
  return pattern
}

const change = (cookie: string, pattern: Pattern, body: Record<string, unknown>) =>
  call(updatePattern, { method: 'PATCH', cookie, params: { id: pattern.id }, body: { revision: pattern.revision, ...body } })

describe('moving a pattern from state to state', () => {
  it('lets its designer take it draft → testing → draft → testing → published → retired → published, each move recorded with who and when', async () => {
    const designer = await person(['designer'], 'Mara Quill')
    const pattern = await patternIn(designer.user, 'draft')
    const moves: [PatternState, Record<string, unknown>?][] = [['testing'], ['draft'], ['testing'], ['published', { price: { priceCents: 1250, currency: 'EUR' } }], ['retired'], ['published']]
    for (const [state, extra] of moves) {
      await pattern.reload()
      const response = await change(designer.cookie, pattern, { state, ...extra })
      expect(response.status, `to ${state}: ${JSON.stringify(response.json)}`).toBe(200)
      expect(response.json?.pattern.state).toBe(state)
    }
    const history = await call(listStateChanges, { cookie: designer.cookie, params: { id: pattern.id } })
    expect(history.status).toBe(200)
    expect(history.json?.stateChanges.map((c: { from: string; to: string }) => `${c.from}→${c.to}`)).toEqual([
      'draft→testing', 'testing→draft', 'draft→testing', 'testing→published', 'published→retired', 'retired→published',
    ])
    expect(history.json?.stateChanges.every((c: { by: string; at: string }) => c.by === 'Mara Quill' && !Number.isNaN(Date.parse(c.at)))).toBe(true)
    const read = await call(readPattern, { cookie: designer.cookie, params: { id: pattern.id } })
    expect(read.json?.pattern).toMatchObject({ state: 'published', priceCents: 1250, currency: 'EUR' })
  })

  it('lets an admin move anyone’s pattern, recorded under the admin’s name', async () => {
    const designer = await person(['designer'])
    const admin = await person(['admin'], 'Desk Admin')
    const pattern = await patternIn(designer.user, 'draft')
    expect((await change(admin.cookie, pattern, { state: 'testing' })).status).toBe(200)
    const [recorded] = await PatternStateChange.findAll({ where: { patternId: pattern.id } })
    expect(recorded).toMatchObject({ fromState: 'draft', toState: 'testing', changedById: admin.user.id })
  })

  it.each([
    ['another designer', ['designer'], 404],
    ['a quilter', ['quilter'], 404],
  ] as const)('refuses %s (not found, as for a missing pattern), and records nothing', async (_who, roles, status) => {
    const designer = await person(['designer'])
    const stranger = await person([...roles])
    const pattern = await patternIn(designer.user, 'draft')
    expect((await change(stranger.cookie, pattern, { state: 'testing' })).status).toBe(status)
    await pattern.reload()
    expect(pattern.state).toBe('draft')
    expect(await PatternStateChange.count()).toBe(0)
  })

  it('refuses a tester of the pattern (they may read it, not move it)', async () => {
    const designer = await person(['designer'])
    const tester = await person(['quilter'])
    const pattern = await patternIn(designer.user, 'testing')
    const { Invitation } = await import('@/models')
    await Invitation.create({ patternId: pattern.id, email: tester.user.email, invitedById: designer.user.id, userId: tester.user.id, acceptedAt: new Date(), withdrawnAt: null, expiresAt: new Date(Date.now() + 86_400_000) })
    expect((await call(readPattern, { cookie: tester.cookie, params: { id: pattern.id } })).status).toBe(200)
    expect((await change(tester.cookie, pattern, { state: 'draft' })).status).toBe(403)
    expect(await PatternStateChange.count()).toBe(0)
  })

  it('refuses a former designer who still owns the pattern', async () => {
    const owner = await person(['quilter'])
    const pattern = await patternIn(owner.user, 'draft')
    expect((await change(owner.cookie, pattern, { state: 'testing' })).status).toBe(403)
  })

  it('asks a visitor to sign in first', async () => {
    const designer = await person(['designer'])
    const pattern = await patternIn(designer.user, 'draft')
    expect((await call(updatePattern, { method: 'PATCH', params: { id: pattern.id }, body: { revision: 1, state: 'testing' } })).status).toBe(401)
  })
})

describe('each rule a state change must pass, refused with 422 naming it on `state`', () => {
  it.each([
    ['draft', 'published', 'a draft pattern cannot become published'],
    ['draft', 'retired', 'a draft pattern cannot become retired'],
    ['testing', 'retired', 'a testing pattern cannot become retired'],
    ['published', 'draft', 'a published pattern cannot become draft'],
    ['published', 'testing', 'a published pattern cannot become testing'],
    ['retired', 'draft', 'a retired pattern cannot become draft'],
  ] as const)('%s → %s is no step of a pattern’s life', async (from, to, message) => {
    const designer = await person(['designer'])
    const pattern = await patternIn(designer.user, from, ready(), { priceCents: 900, currency: 'EUR' })
    const response = await change(designer.cookie, pattern, { state: to })
    expect(response.status).toBe(422)
    expect(response.json?.error.issues).toEqual([{ path: 'state', message }])
  })

  it.each(['testing', 'published'] as const)('going to %s needs a sewing plan without an error', async (to) => {
    const designer = await person(['designer'])
    const pattern = await patternIn(designer.user, to === 'testing' ? 'draft' : 'testing', unsewable(), { priceCents: 900, currency: 'EUR' })
    const response = await change(designer.cookie, pattern, { state: to })
    expect(response.status).toBe(422)
    expect(response.json?.error.issues[0].path).toBe('state')
    expect(response.json?.error.issues[0].message).toMatch(/^the sewing plan has an error: .+/)
    expect(response.json?.error.message).toContain(`cannot become ${to}`)
  })

  it.each(['testing', 'published'] as const)('going to %s needs a colourway that gives every fabric role a fabric', async (to) => {
    const designer = await person(['designer'])
    const pattern = await patternIn(designer.user, to === 'testing' ? 'draft' : 'testing', withoutBerryFabric(), { priceCents: 900, currency: 'EUR' })
    const response = await change(designer.cookie, pattern, { state: to })
    expect(response.status).toBe(422)
    expect(response.json?.error.issues).toEqual([{ path: 'state', message: 'colourway Holly leaves role berry without a fabric' }])
  })

  it('is content with one complete colourway among incomplete ones', async () => {
    const designer = await person(['designer'])
    const file = wreathFile()
    const { berry: _berry, ...hollyWithoutBerry } = file.colorways![0]!.fabrics
    const design = { ...file, colorways: [{ ...file.colorways![0]!, fabrics: hollyWithoutBerry }, file.colorways![1]!] }
    const pattern = await patternIn(designer.user, 'draft', design)
    expect((await change(designer.cookie, pattern, { state: 'testing' })).status).toBe(200)
  })

  it('going to published needs a price; one sent with the move counts', async () => {
    const designer = await person(['designer'])
    const pattern = await patternIn(designer.user, 'testing')
    const refused = await change(designer.cookie, pattern, { state: 'published' })
    expect(refused.status).toBe(422)
    expect(refused.json?.error.issues).toEqual([{ path: 'state', message: 'it needs a price' }])
    await pattern.reload()
    expect(pattern.state).toBe('testing')
    expect(await PatternStateChange.count()).toBe(0)
    const published = await change(designer.cookie, pattern, { state: 'published', price: { priceCents: 1800, currency: 'USD' } })
    expect(published.status).toBe(200)
    expect(published.json?.pattern).toMatchObject({ state: 'published', priceCents: 1800, currency: 'USD' })
  })

  it('checks the design as the same request leaves it: a repaired design sent with the move passes', async () => {
    const designer = await person(['designer'])
    const pattern = await patternIn(designer.user, 'draft', unsewable())
    expect((await change(designer.cookie, pattern, { state: 'testing', design: ready() })).status).toBe(200)
  })
})

describe('the price', () => {
  it.each([
    [{ priceCents: 0, currency: 'EUR' }, 'price.priceCents'],
    [{ priceCents: -5, currency: 'EUR' }, 'price.priceCents'],
    [{ priceCents: 12.5, currency: 'EUR' }, 'price.priceCents'],
    [{ priceCents: 1200, currency: 'JPY' }, 'price.currency'],
    [{ priceCents: 1200, currency: 'eur' }, 'price.currency'],
    [{ priceCents: 1200 }, 'price.currency'],
  ])('refuses %j naming %s', async (price, path) => {
    const designer = await person(['designer'])
    const pattern = await patternIn(designer.user, 'draft')
    const response = await change(designer.cookie, pattern, { price })
    expect(response.status).toBe(422)
    expect(response.json?.error.issues[0].path).toBe(path)
  })

  it('is set and cleared by the designer; a published pattern keeps its price', async () => {
    const designer = await person(['designer'])
    const pattern = await patternIn(designer.user, 'draft')
    expect((await change(designer.cookie, pattern, { price: { priceCents: 995, currency: 'GBP' } })).json?.pattern).toMatchObject({ priceCents: 995, currency: 'GBP' })
    await pattern.reload()
    expect((await change(designer.cookie, pattern, { price: null })).json?.pattern).toMatchObject({ priceCents: null, currency: null })
    const published = await patternIn(designer.user, 'published', ready(), { priceCents: 900, currency: 'EUR' })
    const refused = await change(designer.cookie, published, { price: null })
    expect(refused.status).toBe(422)
    expect(refused.json?.error.issues[0].path).toBe('price')
  })

  it('cannot be set by anyone but the designer or an admin', async () => {
    const designer = await person(['designer'])
    const other = await person(['designer'])
    const pattern = await patternIn(designer.user, 'draft')
    expect((await change(other.cookie, pattern, { price: { priceCents: 100, currency: 'EUR' } })).status).toBe(404)
    await pattern.reload()
    expect(pattern.priceCents).toBeNull()
  })

  it('is guarded by the database too: no price without a currency, none at zero', async () => {
    const designer = await person(['designer'])
    const pattern = await patternIn(designer.user, 'draft')
    await expect(pattern.update({ priceCents: 500, currency: null })).rejects.toThrow(/patterns_price_with_currency/)
    await expect(pattern.update({ priceCents: 0, currency: 'EUR' })).rejects.toThrow(/patterns_price_positive/)
  })
})

describe('the history', () => {
  it('is for the designer: a tester or another designer does not see it', async () => {
    const designer = await person(['designer'])
    const other = await person(['designer'])
    const pattern = await patternIn(designer.user, 'draft')
    expect((await call(listStateChanges, { cookie: other.cookie, params: { id: pattern.id } })).status).toBe(404)
  })

  it('keeps a change made by a person whose account was later deleted, without their name', async () => {
    const designer = await person(['designer'])
    const admin = await person(['admin'], 'Gone Admin')
    const pattern = await patternIn(designer.user, 'draft')
    await change(admin.cookie, pattern, { state: 'testing' })
    await admin.user.destroy()
    const history = await call(listStateChanges, { cookie: designer.cookie, params: { id: pattern.id } })
    expect(history.json?.stateChanges).toEqual([expect.objectContaining({ from: 'draft', to: 'testing', by: null })])
  })
})
