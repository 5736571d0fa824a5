import { QueryTypes } from 'sequelize'
import { afterAll, beforeEach, describe, expect, it, vi } from 'vitest'
import { PATCH as setVisibility } from '@/app/api/admin/listings/[id]/route'
import { GET as getOne } from '@/app/api/shop/patterns/[id]/route'
import { GET as listPatterns } from '@/app/api/shop/patterns/route'
import { wreathFile } from '@/lib/booklet/test-support/designs'
import { database } from '@/lib/db'
import { createMigrator } from '@/lib/migrator'
import type { Role } from '@/lib/roles'
import type { DesignFile } from '@/lib/schemas/design'
import type { PatternCurrency, PatternState } from '@/lib/schemas/pattern'
import { SHOP_PAGE_SIZE } from '@/lib/schemas/shop-listings'
import { noteListingChange } from '@/lib/shop/listing-changes'
import { listShopPatterns, setSkillNotes, SHOP_PAGE_FRESH_MS, shopCovers } from '@/lib/services/shop-listings'
import { AdminAuditEntry, Pattern } from '@/models'
import { emptyAdminLogs } from '../support/audit-log'
import { closeDatabase, freshDatabase } from '../support/database'
import { createPatternRow, createUser, sessionCookieFor } from '../support/factories'
import { call } from '../support/requests'

beforeEach(async () => {
  await freshDatabase()
  await emptyAdminLogs()
})
afterAll(closeDatabase)

/** Colourways of known families: greens and a cream; blues and a cream; reds only. */
const HOLLY = { name: 'Holly', fabrics: { background: { name: 'Cream', color: '#f4ecd8' }, band: { name: 'Holly green', color: '#2f5540' }, sky: { name: 'Sage', color: '#7da37a' } } }
const HARBOUR = { name: 'Harbour', fabrics: { background: { name: 'Cream', color: '#f6f1e7' }, band: { name: 'Teal', color: '#4f8a8b' }, sky: { name: 'Ink', color: '#1d3557' } } }
const POPPY = { name: 'Poppy', fabrics: { background: { name: 'Poppy', color: '#c0392b' }, band: { name: 'Brick', color: '#9b2915' }, sky: { name: 'Crimson', color: '#dc143c' } } }

interface ListedOptions {
  name?: string
  state?: PatternState
  priceCents?: number
  currency?: PatternCurrency
  repeats?: number
  colorways?: DesignFile['colorways']
}

/** A pattern of `owner` in a state (published by default) with a price, through the model so its summaries are written. */
async function pattern(owner: { id: string }, options: ListedOptions = {}) {
  const name = options.name ?? 'Test ring'
  const base = wreathFile({ name, colorways: options.colorways ?? [HOLLY] })
  const design = { ...base, ring: { ...base.ring, repeats: options.repeats ?? 4 } }
  const row = await createPatternRow(owner, { name, state: options.state ?? 'published', design })
  if (options.priceCents !== null) await row.update({ priceCents: options.priceCents ?? 1200, currency: options.currency ?? 'USD' })
  return row
}

const designer = (displayName = 'Marta Quill', roles: Role[] = ['designer', 'quilter']) => createUser({ displayName, roles })

/** The names the listing answers with for a query string, in its order. */
async function names(query = '', cookie?: string): Promise<string[]> {
  const response = await call(listPatterns, { path: `/api/shop/patterns${query}`, cookie })
  expect(response.status, `${query}: ${JSON.stringify(response.json)}`).toBe(200)
  return response.json!.patterns.map((listing: { name: string }) => listing.name)
}

describe('the shop’s listing API', () => {
  it('lists only published, priced patterns no admin hid, to strangers as to anyone, without designs', async () => {
    const marta = await designer()
    await pattern(marta, { name: 'Draft ring', state: 'draft' })
    await pattern(marta, { name: 'Testing ring', state: 'testing' })
    await pattern(marta, { name: 'Retired ring', state: 'retired' })
    const hidden = await pattern(marta, { name: 'Hidden ring' })
    await hidden.update({ hiddenAt: new Date() })
    const listed = await pattern(marta, { name: 'Listed ring', priceCents: 1450, currency: 'EUR', repeats: 6, colorways: [HOLLY, HARBOUR] })

    const response = await call(listPatterns, { path: '/api/shop/patterns' })
    expect(response.status).toBe(200)
    expect(response.json).toMatchObject({ page: 1, pageSize: SHOP_PAGE_SIZE, pageCount: 1, total: 1 })
    expect(response.json!.patterns).toEqual([
      {
        id: listed.id,
        name: 'Listed ring',
        designer: 'Marta Quill',
        priceCents: 1450,
        currency: 'EUR',
        repeats: 6,
        // wreathFile's ring: outer radius 9 in, so 18 in across.
        finishedDiameterIn: 18,
        // Each colourway's colours lightest first, whatever order its fabrics are listed in.
        colorways: [
          { name: 'Holly', colours: ['#f4ecd8', '#7da37a', '#2f5540'] },
          { name: 'Harbour', colours: ['#f6f1e7', '#4f8a8b', '#1d3557'] },
        ],
        colourFamilies: ['greens', 'blues', 'neutrals'],
        skillNotes: null,
        coverUrl: null,
        revision: listed.revision,
        publishedAt: listed.publishedAt!.toISOString(),
      },
    ])
    // Signed in, the same list.
    expect(await names('', await sessionCookieFor(await createUser()))).toEqual(['Listed ring'])
    // One listing by id: the listed one; the others are not found, like a malformed id.
    expect((await call(getOne, { params: { id: listed.id } })).json?.pattern.name).toBe('Listed ring')
    for (const id of [hidden.id, 'not-an-id', '00000000-0000-4000-8000-000000000000']) {
      expect((await call(getOne, { params: { id } })).status, id).toBe(404)
    }
  })

  it('searches pattern and designer names in any letter case, with % and _ as plain letters', async () => {
    const marta = await designer('Marta Quill')
    const ines = await designer('Inès Fairlie')
    await pattern(marta, { name: 'Hollyberry Wreath' })
    await pattern(ines, { name: '100% Holly' })
    await pattern(ines, { name: 'Compass_Rose' })
    expect((await names('?q=HOLLY')).sort()).toEqual(['100% Holly', 'Hollyberry Wreath'])
    expect(await names('?q=quill')).toEqual(['Hollyberry Wreath'])
    expect((await names('?q=fairlie')).sort()).toEqual(['100% Holly', 'Compass_Rose'])
    expect(await names('?q=%25')).toEqual(['100% Holly'])
    expect(await names('?q=_')).toEqual(['Compass_Rose'])
    expect(await names('?q=nothing-like-it')).toEqual([])
    // `designer` looks at the designer's name only.
    expect((await names('?designer=IN%C3%88S')).sort()).toEqual(['100% Holly', 'Compass_Rose'])
    expect(await names('?designer=holly')).toEqual([])
    // Empty fields of the page's form mean "any".
    expect((await names('?q=&designer=&colour=&repeats=&minPriceCents=&maxPriceCents=&sort=&page=')).length).toBe(3)
  })

  it('filters by colour family, repeats and price range, both ends included', async () => {
    const marta = await designer()
    await pattern(marta, { name: 'Green ring', colorways: [HOLLY], repeats: 4, priceCents: 900 })
    await pattern(marta, { name: 'Blue ring', colorways: [HARBOUR], repeats: 6, priceCents: 1200 })
    await pattern(marta, { name: 'Red ring', colorways: [POPPY], repeats: 8, priceCents: 1500 })
    expect(await names('?colour=greens')).toEqual(['Green ring'])
    expect(await names('?colour=blues')).toEqual(['Blue ring'])
    expect(await names('?colour=reds')).toEqual(['Red ring'])
    expect((await names('?colour=neutrals')).sort()).toEqual(['Blue ring', 'Green ring'])
    expect(await names('?colour=purples')).toEqual([])
    expect(await names('?repeats=6')).toEqual(['Blue ring'])
    expect((await names('?minPriceCents=1200&sort=name'))).toEqual(['Blue ring', 'Red ring'])
    expect((await names('?maxPriceCents=1200&sort=name'))).toEqual(['Blue ring', 'Green ring'])
    expect(await names('?minPriceCents=1000&maxPriceCents=1200')).toEqual(['Blue ring'])
    expect(await names('?colour=neutrals&repeats=4')).toEqual(['Green ring'])
  })

  it('sorts by name, by price up and down, and newest on sale first', async () => {
    const marta = await designer()
    const b = await pattern(marta, { name: 'banksia ring', priceCents: 1500 })
    const a = await pattern(marta, { name: 'Aster Ring', priceCents: 1200 })
    const c = await pattern(marta, { name: 'Clover Ring', priceCents: 900 })
    const day = 24 * 60 * 60 * 1000
    await Pattern.update({ publishedAt: new Date(Date.now() - 3 * day) }, { where: { id: a.id } })
    await Pattern.update({ publishedAt: new Date(Date.now() - 2 * day) }, { where: { id: c.id } })
    await Pattern.update({ publishedAt: new Date(Date.now() - 1 * day) }, { where: { id: b.id } })
    expect(await names('?sort=name')).toEqual(['Aster Ring', 'banksia ring', 'Clover Ring'])
    expect(await names('?sort=price')).toEqual(['Clover Ring', 'Aster Ring', 'banksia ring'])
    expect(await names('?sort=-price')).toEqual(['banksia ring', 'Aster Ring', 'Clover Ring'])
    expect(await names('?sort=newest')).toEqual(['banksia ring', 'Clover Ring', 'Aster Ring'])
    expect(await names('')).toEqual(['banksia ring', 'Clover Ring', 'Aster Ring'])
  })

  it('pages through the list', async () => {
    const marta = await designer()
    const count = SHOP_PAGE_SIZE + 2
    for (let index = 0; index < count; index += 1) await pattern(marta, { name: `Ring ${String(index).padStart(2, '0')}` })
    const first = await call(listPatterns, { path: '/api/shop/patterns?sort=name' })
    expect(first.json).toMatchObject({ page: 1, total: count, pageCount: 2 })
    expect(first.json!.patterns).toHaveLength(SHOP_PAGE_SIZE)
    const second = await names('?sort=name&page=2')
    expect(second).toEqual([`Ring ${SHOP_PAGE_SIZE}`, `Ring ${SHOP_PAGE_SIZE + 1}`])
    expect(await names('?sort=name&page=3')).toEqual([])
  })

  it('refuses a bad parameter with 422 naming it', async () => {
    const cases: [string, string][] = [
      ['?colour=mauve', 'colour'],
      ['?repeats=1', 'repeats'],
      ['?repeats=six', 'repeats'],
      ['?minPriceCents=-5', 'minPriceCents'],
      ['?minPriceCents=1.5', 'minPriceCents'],
      ['?minPriceCents=1500&maxPriceCents=900', 'maxPriceCents'],
      ['?sort=cheapest', 'sort'],
      ['?page=0', 'page'],
      ['?colour=reds&color=reds', 'color'],
      [`?q=${'x'.repeat(101)}`, 'q'],
    ]
    for (const [query, parameter] of cases) {
      const response = await call(listPatterns, { path: `/api/shop/patterns${query}` })
      expect(response.status, query).toBe(422)
      expect(response.json?.error.issues.map((issue: { path: string }) => issue.path), query).toEqual([parameter])
    }
  })

  it('keeps the colour families beside the pattern when its design changes', async () => {
    const marta = await designer()
    const row = await pattern(marta, { colorways: [HOLLY] })
    expect(await names('?colour=reds')).toEqual([])
    await row.update({ design: wreathFile({ name: 'Test ring', colorways: [POPPY] }) })
    expect(await names('?colour=reds')).toEqual(['Test ring'])
    expect(await names('?colour=greens')).toEqual([])
  })
})

describe('covers', () => {
  it('draws each colourway of a listed pattern as SVG in its colours', async () => {
    const row = await pattern(await designer(), { colorways: [HOLLY, POPPY] })
    const listing = { id: row.id, name: row.name, revision: row.revision }
    const [holly, poppy, again] = await shopCovers([{ listing, colorway: 'Holly' }, { listing, colorway: 'Poppy' }, { listing, colorway: 'Holly' }])
    expect(holly).toContain('fill="#2f5540"')
    expect(holly).not.toContain('fill="#9b2915"')
    expect(poppy).toContain('fill="#9b2915"')
    expect(again).toContain('fill="#2f5540"')
  })
})

describe('skill notes', () => {
  it('are set by the pattern’s designer, shown in the listing, and refused to others', async () => {
    const marta = await designer()
    const row = await pattern(marta)
    await setSkillNotes({ id: marta.id, roles: marta.roles }, row.id, '  Curved piecing; folded leaves.\nConfident beginners welcome. ')
    const listing = (await call(getOne, { params: { id: row.id } })).json?.pattern
    expect(listing.skillNotes).toBe('Curved piecing; folded leaves.\nConfident beginners welcome.')
    const other = await designer('Someone Else')
    await expect(setSkillNotes({ id: other.id, roles: other.roles }, row.id, 'Mine now')).rejects.toMatchObject({ status: 404 })
    await expect(setSkillNotes({ id: marta.id, roles: marta.roles }, row.id, 'x'.repeat(2001))).rejects.toMatchObject({ status: 422 })
    await setSkillNotes({ id: marta.id, roles: marta.roles }, row.id, '')
    expect((await call(getOne, { params: { id: row.id } })).json?.pattern.skillNotes).toBeNull()
  })
})

describe('hiding a listing', () => {
  it('is for admins only (strangers 401, others 404), takes the listing out of the shop and back, each change in the audit log', async () => {
    const marta = await designer()
    const row = await pattern(marta, { name: 'Contested ring' })
    const admin = await createUser({ email: 'odile@desk.test', displayName: 'Odile Admin', roles: ['admin'] })
    const adminCookie = await sessionCookieFor(admin)
    const hide = { method: 'PATCH', params: { id: row.id }, body: { hidden: true } }

    expect((await call(setVisibility, hide)).status).toBe(401)
    for (const roles of [['designer', 'quilter'], ['quilter'], ['tester', 'quilter']] as Role[][]) {
      expect((await call(setVisibility, { ...hide, cookie: await sessionCookieFor(await createUser({ roles })) })).status, roles.join()).toBe(404)
    }
    // The pattern's own designer may not hide (or unhide) it either.
    expect((await call(setVisibility, { ...hide, cookie: await sessionCookieFor(marta) })).status).toBe(404)
    expect(await AdminAuditEntry.count()).toBe(0)
    expect(await names()).toEqual(['Contested ring'])

    const hidden = await call(setVisibility, { ...hide, cookie: adminCookie })
    expect(hidden.status).toBe(200)
    expect(hidden.json).toEqual({ id: row.id, hidden: true })
    expect(await names()).toEqual([])
    expect((await call(getOne, { params: { id: row.id } })).status).toBe(404)
    // The admin still finds it, marked hidden, to put it back.
    expect((await call(getOne, { params: { id: row.id }, cookie: adminCookie })).json).toMatchObject({ pattern: { id: row.id }, hidden: true })
    // The pattern stays published: its licence holders keep it.
    await row.reload()
    expect(row.state).toBe('published')
    expect(row.hiddenAt).not.toBeNull()
    // Hiding what is hidden changes nothing and records nothing.
    expect((await call(setVisibility, { ...hide, cookie: adminCookie })).status).toBe(200)

    expect((await call(setVisibility, { ...hide, body: { hidden: false }, cookie: adminCookie })).json).toEqual({ id: row.id, hidden: false })
    expect(await names()).toEqual(['Contested ring'])

    const entries = await AdminAuditEntry.findAll({ order: [['id', 'ASC']] })
    expect(entries.map((entry) => ({ actorId: entry.actorId, action: entry.action, targetId: entry.targetId }))).toEqual([
      { actorId: admin.id, action: 'hide-listing', targetId: row.id },
      { actorId: admin.id, action: 'show-listing', targetId: row.id },
    ])
    expect(entries[0]!.actorLabel).toBe('Odile Admin <odile@desk.test>')
    expect(entries[0]!.targetLabel).toBe('pattern “Contested ring”')
  })

  it('refuses a body without `hidden` (422) and an unknown pattern (404)', async () => {
    const cookie = await sessionCookieFor(await createUser({ roles: ['admin'] }))
    const row = await pattern(await designer())
    const bad = await call(setVisibility, { method: 'PATCH', cookie, params: { id: row.id }, body: { hidden: 'yes' } })
    expect(bad.status).toBe(422)
    expect(bad.json?.error.issues[0].path).toBe('hidden')
    const missing = await call(setVisibility, { method: 'PATCH', cookie, params: { id: '00000000-0000-4000-8000-000000000000' }, body: { hidden: true } })
    expect(missing.status).toBe(404)
    expect(await AdminAuditEntry.count()).toBe(0)
  })
})

describe('the migration that adds the listing columns', () => {
  it('backfills swatches, colour families and the date on sale from what is stored, and removes them on the way down', async () => {
    const owner = await designer()
    const migrator = createMigrator(database())
    await migrator.down({ to: '20261202-0130-shop-listings.ts' })
    const columns = async () =>
      (await database().query<{ name: string }>("SELECT column_name::text AS name FROM information_schema.columns WHERE table_name = 'patterns'", { type: QueryTypes.SELECT })).map((row) => row.name)
    expect(await columns()).not.toContain('colour_families')
    // Stored before the shop: a published ring with a state change on record, a draft, a damaged design.
    const insert = (name: string, state: string, design: unknown) =>
      database().query<{ id: string }>('INSERT INTO patterns (owner_id, name, state, design) VALUES (:owner, :name, :state, CAST(:design AS jsonb)) RETURNING id', {
        type: QueryTypes.SELECT,
        replacements: { owner: owner.id, name, state, design: JSON.stringify(design) },
      })
    const [published] = await insert('Old ring', 'published', wreathFile({ name: 'Old ring', colorways: [HOLLY, POPPY] }))
    await insert('Draft ring', 'draft', wreathFile({ name: 'Draft ring', colorways: [] }))
    await insert('Damaged', 'draft', { colorways: 'none' })
    const onSale = new Date('2026-11-20T09:00:00Z')
    await database().query("INSERT INTO pattern_state_changes (pattern_id, from_state, to_state, created_at) VALUES (:id, 'testing', 'published', :at)", {
      replacements: { id: published!.id, at: onSale },
    })
    await migrator.up()
    const rows = await database().query<{ name: string; colour_families: string[]; colorway_swatches: unknown; published_at: Date | null; hidden_at: Date | null }>(
      'SELECT name, colour_families, colorway_swatches, published_at, hidden_at FROM patterns ORDER BY name',
      { type: QueryTypes.SELECT },
    )
    expect(rows).toEqual([
      { name: 'Damaged', colour_families: [], colorway_swatches: [], published_at: null, hidden_at: null },
      { name: 'Draft ring', colour_families: [], colorway_swatches: [], published_at: null, hidden_at: null },
      {
        name: 'Old ring',
        colour_families: ['reds', 'greens', 'neutrals'],
        colorway_swatches: [
          { name: 'Holly', colours: ['#f4ecd8', '#7da37a', '#2f5540'] },
          { name: 'Poppy', colours: ['#c0392b', '#dc143c', '#9b2915'] },
        ],
        published_at: onSale,
        hidden_at: null,
      },
    ])
  })
})

describe('the pages the shop keeps', () => {
  it('show a change made through the models at once, inside a transaction once it commits', async () => {
    const owner = await designer()
    const listed = await pattern(owner, { name: 'Kept ring' })
    expect(await names()).toEqual(['Kept ring'])
    await listed.update({ name: 'Renamed ring' })
    expect(await names()).toEqual(['Renamed ring'])
    await database().transaction(async (transaction) => {
      await Pattern.update({ hiddenAt: new Date() }, { where: { id: listed.id }, transaction })
      // Not committed yet: the shop still lists it, and must not keep that past the commit.
      expect(await names()).toEqual(['Renamed ring'])
    })
    expect(await names()).toEqual([])
  })

  it('show a change made in plain SQL once the kept page is SHOP_PAGE_FRESH_MS old, as another web instance’s change', async () => {
    const owner = await designer()
    const listed = await pattern(owner, { name: 'Kept ring' })
    const now = Date.now()
    const clock = vi.spyOn(Date, 'now').mockReturnValue(now)
    try {
      expect(await names()).toEqual(['Kept ring'])
      await database().query("UPDATE patterns SET name = 'Changed elsewhere' WHERE id = :id", { replacements: { id: listed.id } })
      clock.mockReturnValue(now + SHOP_PAGE_FRESH_MS - 1)
      expect(await names()).toEqual(['Kept ring'])
      clock.mockReturnValue(now + SHOP_PAGE_FRESH_MS)
      expect(await names()).toEqual(['Changed elsewhere'])
    } finally {
      clock.mockRestore()
    }
  })

  it('read once for many who ask together, and keep no failed read', async () => {
    const owner = await designer()
    await pattern(owner, { name: 'Kept ring' })
    noteListingChange()
    const read = await Promise.all(Array.from({ length: 20 }, () => listShopPatterns({ sort: 'name', page: 1 })))
    expect(new Set(read).size).toBe(1)
    const sequelize = database()
    const count = vi.spyOn(sequelize, 'query')
    noteListingChange()
    await Promise.all(Array.from({ length: 20 }, () => listShopPatterns({ sort: 'name', page: 1 })))
    const statements = count.mock.calls.length
    count.mockRestore()
    // findAndCountAll: one count and one select, for twenty who asked.
    expect(statements).toBe(2)

    const failing = vi.spyOn(Pattern, 'findAndCountAll').mockRejectedValueOnce(new Error('connection lost'))
    noteListingChange()
    await expect(listShopPatterns({ sort: 'name', page: 1 })).rejects.toThrow('connection lost')
    expect((await listShopPatterns({ sort: 'name', page: 1 })).patterns.map((listing) => listing.name)).toEqual(['Kept ring'])
    failing.mockRestore()
  })
})
