import { afterAll, beforeEach, describe, expect, it } from 'vitest'
import { GET as health } from '@/app/api/health/route'
import { DELETE as deletePattern, GET as readPattern, PATCH as updatePattern } from '@/app/api/patterns/[id]/route'
import { GET as listRevisions } from '@/app/api/patterns/[id]/revisions/route'
import { GET as listPatterns, POST as createPattern } from '@/app/api/patterns/route'
import { database } from '@/lib/db'
import { MAX_SEAMS, MAX_SECTIONS } from '@/lib/limits'
import { Pattern, PatternRevision } from '@/models'
import { closeDatabase, freshDatabase } from '../support/database'
import { createPatternRow, createUser, sessionCookieFor } from '../support/factories'
import { call } from '../support/requests'

beforeEach(freshDatabase)
afterAll(closeDatabase)

async function personWith(roles: Parameters<typeof createUser>[0] extends infer O ? (O extends { roles?: infer R } ? R : never) : never) {
  const user = await createUser({ roles })
  return { user, cookie: await sessionCookieFor(user) }
}

const ring = (overrides: Record<string, unknown> = {}) => ({
  format: 'wreathwright-design',
  version: 1,
  name: 'Acorn ring',
  units: 'in',
  ring: { innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate' },
  seams: [{ id: 's1', from: [4, 0], to: [0, 4] }],
  ...overrides,
})

describe('/api/health', () => {
  it('reports the database as reachable', async () => {
    const response = await call(health)
    expect(response.status).toBe(200)
    expect(response.json).toEqual({ status: 'ok', database: 'ok' })
  })
})

describe('who may do what with patterns', () => {
  it('does not let a quilter create or list patterns', async () => {
    const { cookie } = await personWith(['quilter'])
    expect((await call(createPattern, { method: 'POST', cookie, body: { name: 'Mine' } })).status).toBe(403)
    expect((await call(listPatterns, { cookie })).status).toBe(403)
    expect(await Pattern.count()).toBe(0)
  })

  it('does not let a tester create patterns', async () => {
    const { cookie } = await personWith(['tester', 'quilter'])
    expect((await call(createPattern, { method: 'POST', cookie, body: { name: 'Mine' } })).status).toBe(403)
  })

  it('asks a visitor who is not signed in to sign in', async () => {
    expect((await call(listPatterns)).status).toBe(401)
    expect((await call(createPattern, { method: 'POST', body: { name: 'Mine' } })).status).toBe(401)
  })

  it("hides another designer's draft: not found to read, and no change or delete", async () => {
    const owner = await personWith(['designer'])
    const other = await personWith(['designer'])
    const draft = await createPatternRow(owner.user, { name: 'Secret draft' })
    const params = { id: draft.id }
    expect((await call(readPattern, { cookie: other.cookie, params })).status).toBe(404)
    expect((await call(listRevisions, { cookie: other.cookie, params })).status).toBe(404)
    const patch = await call(updatePattern, { method: 'PATCH', cookie: other.cookie, params, body: { revision: 1, name: 'Taken' } })
    expect(patch.status).toBe(404)
    expect((await call(deletePattern, { method: 'DELETE', cookie: other.cookie, params })).status).toBe(404)
    await draft.reload()
    expect(draft.name).toBe('Secret draft')
    expect((await call(listPatterns, { cookie: other.cookie })).json?.patterns).toEqual([])
  })

  it("lets an admin read, change and delete any designer's pattern", async () => {
    const owner = await personWith(['designer'])
    const admin = await personWith(['admin'])
    const draft = await createPatternRow(owner.user, { name: 'Needs a fix' })
    const params = { id: draft.id }
    expect((await call(readPattern, { cookie: admin.cookie, params })).json?.pattern.name).toBe('Needs a fix')
    const patch = await call(updatePattern, { method: 'PATCH', cookie: admin.cookie, params, body: { revision: 1, name: 'Fixed' } })
    expect(patch.status).toBe(200)
    expect((await call(deletePattern, { method: 'DELETE', cookie: admin.cookie, params })).status).toBe(204)
    expect(await Pattern.count()).toBe(0)
  })

  it('lets an admin create patterns of their own', async () => {
    const admin = await personWith(['admin'])
    expect((await call(createPattern, { method: 'POST', cookie: admin.cookie, body: { name: 'House sample' } })).status).toBe(201)
  })
})

describe('a designer works on their patterns', () => {
  it('creates, reads, lists, renames and deletes, keeping every revision', async () => {
    const { cookie } = await personWith(['designer'])
    const created = await call(createPattern, { method: 'POST', cookie, body: { name: '  Acorn ring  ', design: ring() } })
    expect(created.status).toBe(201)
    const id = created.json?.pattern.id as string
    expect(created.json?.pattern).toMatchObject({ name: 'Acorn ring', state: 'draft', revision: 1 })

    const read = await call(readPattern, { cookie, params: { id } })
    expect(read.json?.pattern.design.seams).toEqual([{ id: 's1', from: [4, 0], to: [0, 4] }])

    const renamed = await call(updatePattern, { method: 'PATCH', cookie, params: { id }, body: { revision: 1, name: 'Oak ring' } })
    expect(renamed.status).toBe(200)
    expect(renamed.json?.pattern).toMatchObject({ name: 'Oak ring', revision: 2 })

    const list = await call(listPatterns, { cookie })
    expect(list.json?.patterns.map((p: { name: string }) => p.name)).toEqual(['Oak ring'])

    const revisions = await call(listRevisions, { cookie, params: { id } })
    expect(revisions.json?.revisions.map((r: { revision: number; name: string }) => [r.revision, r.name])).toEqual([
      [2, 'Oak ring'],
      [1, 'Acorn ring'],
    ])

    expect((await call(deletePattern, { method: 'DELETE', cookie, params: { id } })).status).toBe(204)
    expect((await call(readPattern, { cookie, params: { id } })).status).toBe(404)
    expect(await PatternRevision.count()).toBe(0)
  })

  it('starts a pattern without a design as an empty ring that is a valid design file', async () => {
    const { cookie } = await personWith(['designer'])
    const created = await call(createPattern, { method: 'POST', cookie, body: { name: 'Blank' } })
    expect(created.json?.pattern.design).toMatchObject({ format: 'wreathwright-design', version: 2, seams: [] })
  })

  it('refuses a save from a stale revision with 409 and changes nothing', async () => {
    const { user, cookie } = await personWith(['designer'])
    const pattern = await createPatternRow(user, { name: 'Two tabs' })
    const params = { id: pattern.id }
    const first = await call(updatePattern, { method: 'PATCH', cookie, params, body: { revision: 1, name: 'From tab one' } })
    expect(first.status).toBe(200)
    const stale = await call(updatePattern, { method: 'PATCH', cookie, params, body: { revision: 1, name: 'From tab two', design: ring() } })
    expect(stale.status).toBe(409)
    expect(stale.json?.error.currentRevision).toBe(2)
    await pattern.reload()
    expect(pattern).toMatchObject({ name: 'From tab one', revision: 2 })
    expect(await PatternRevision.count({ where: { patternId: pattern.id } })).toBe(2)
  })

  it('lets two saves race from the same revision: exactly one wins', async () => {
    const { user, cookie } = await personWith(['designer'])
    const pattern = await createPatternRow(user)
    const params = { id: pattern.id }
    const results = await Promise.all(
      ['Left', 'Right'].map((name) => call(updatePattern, { method: 'PATCH', cookie, params, body: { revision: 1, name } })),
    )
    expect(results.map((r) => r.status).sort()).toEqual([200, 409])
    expect(await PatternRevision.count({ where: { patternId: pattern.id } })).toBe(2)
  })

  it('names the field paths of a bad design with 422 and keeps the saved one', async () => {
    const { user, cookie } = await personWith(['designer'])
    const pattern = await createPatternRow(user, { design: ring() as never })
    const bad = ring({ ring: { innerRadius: 0, outerRadius: -3, repeats: 40, repeatMode: 'rotate' }, colour: 'red' })
    const response = await call(updatePattern, { method: 'PATCH', cookie, params: { id: pattern.id }, body: { revision: 1, design: bad } })
    expect(response.status).toBe(422)
    const paths = response.json?.error.issues.map((issue: { path: string }) => issue.path)
    expect(paths).toEqual(expect.arrayContaining(['design.ring.outerRadius', 'design.ring.repeats', 'design']))
    await pattern.reload()
    expect(pattern.revision).toBe(1)
    expect((pattern.design as { ring: { outerRadius: number } }).ring.outerRadius).toBe(9)
  })

  it('answers a body that is not JSON with 400 and one without a name with 422 on "name"', async () => {
    const { cookie } = await personWith(['designer'])
    expect((await call(createPattern, { method: 'POST', cookie, rawBody: 'name=Acorn' })).status).toBe(400)
    const unnamed = await call(createPattern, { method: 'POST', cookie, body: { name: '   ' } })
    expect(unnamed.status).toBe(422)
    expect(unnamed.json?.error.issues[0].path).toBe('name')
    const noRevision = await call(createPattern, { method: 'POST', cookie, body: {} })
    expect(noRevision.json?.error.issues[0].path).toBe('name')
  })

  it('requires the revision on every change', async () => {
    const { user, cookie } = await personWith(['designer'])
    const pattern = await createPatternRow(user)
    const response = await call(updatePattern, { method: 'PATCH', cookie, params: { id: pattern.id }, body: { name: 'No revision' } })
    expect(response.status).toBe(422)
    expect(response.json?.error.issues[0].path).toBe('revision')
  })

  it('moves a pattern through its life only in allowed steps', async () => {
    const { user, cookie } = await personWith(['designer'])
    const pattern = await createPatternRow(user)
    const params = { id: pattern.id }
    const skip = await call(updatePattern, { method: 'PATCH', cookie, params, body: { revision: 1, state: 'published' } })
    expect(skip.status).toBe(422)
    expect(skip.json?.error.issues[0].path).toBe('state')
    expect((await call(updatePattern, { method: 'PATCH', cookie, params, body: { revision: 1, state: 'testing' } })).status).toBe(200)
    // Publishing needs a price (tests/integration/pattern-states.test.ts has every rule).
    expect((await call(updatePattern, { method: 'PATCH', cookie, params, body: { revision: 2, state: 'published', price: { priceCents: 1000, currency: 'EUR' } } })).status).toBe(200)
  })

  it('answers 404 for an id that is not a pattern id', async () => {
    const { cookie } = await personWith(['designer'])
    expect((await call(readPattern, { cookie, params: { id: 'not-a-uuid' } })).status).toBe(404)
  })
})

describe('pattern revisions', () => {
  it('cannot be changed once written (the database refuses)', async () => {
    const { user } = await personWith(['designer'])
    const pattern = await createPatternRow(user)
    await expect(
      database().query(`UPDATE pattern_revisions SET name = 'rewritten' WHERE pattern_id = '${pattern.id}'`),
    ).rejects.toThrow(/immutable/)
  })

  it('outlive the deletion of a person who saved one, forgetting only who it was', async () => {
    const { user: owner } = await personWith(['designer'])
    const { user: admin, cookie } = await personWith(['admin'])
    const pattern = await createPatternRow(owner)
    await call(updatePattern, { method: 'PATCH', cookie, params: { id: pattern.id }, body: { revision: 1, name: 'Fixed by the admin' } })
    await admin.destroy()
    const revisions = await PatternRevision.findAll({ where: { patternId: pattern.id }, order: [['revision', 'ASC']] })
    expect(revisions.map((r) => [r.revision, r.name, r.savedById])).toEqual([
      [1, 'Test ring', owner.id],
      [2, 'Fixed by the admin', null],
    ])
  })
})

describe('reading a design again', () => {
  it('answers a design changed by hand under the same revision as it now stands, and the good one read earlier no more', async () => {
    const { user, cookie } = await personWith(['designer'])
    const pattern = await createPatternRow(user, { name: 'Kept wreath' })
    const repeatsAndRevision = async () => {
      const { json } = await call(readPattern, { cookie, params: { id: pattern.id } })
      const { revision, design } = (json as { pattern: { revision: number; design: { ring: { repeats: number } } } }).pattern
      return [revision, design.ring.repeats]
    }
    expect(await repeatsAndRevision()).toEqual([1, 4])
    // A restore or a hand edit: the text changes, the revision does not.
    await database().query(`UPDATE patterns SET design = jsonb_set(design, '{ring,repeats}', '5') WHERE id = :id`, { replacements: { id: pattern.id } })
    expect(await repeatsAndRevision()).toEqual([1, 5])
    await database().query(`UPDATE patterns SET design = jsonb_set(design, '{ring,outerRadius}', '-3') WHERE id = :id`, { replacements: { id: pattern.id } })
    expect((await call(readPattern, { cookie, params: { id: pattern.id } })).status).toBe(500)
  })
})

describe('a stored design that no longer reads as a design', () => {
  async function corrupted() {
    const owner = await personWith(['designer'])
    const pattern = await createPatternRow(owner.user, { name: 'Damaged wreath' })
    // A hand edit of the database: an outer radius no ring can have.
    await database().query(`UPDATE patterns SET design = jsonb_set(design, '{ring,outerRadius}', '-3') WHERE id = :id`, {
      replacements: { id: pattern.id },
    })
    return { ...owner, pattern }
  }

  it('is a clear error naming the pattern and the field, not a crash', async () => {
    const { cookie, pattern } = await corrupted()
    const response = await call(readPattern, { cookie, params: { id: pattern.id } })
    expect(response.status).toBe(500)
    const error = (response.json as { error: { message: string; patternId: string; patternName: string; issues: { path: string }[] } }).error
    expect(error.message).toContain('Damaged wreath')
    expect(error.message).toContain(pattern.id)
    expect(error.message).toContain('design.ring.outerRadius')
    expect(error).toMatchObject({ patternId: pattern.id, patternName: 'Damaged wreath' })
    expect(error.issues).toContainEqual(expect.objectContaining({ path: 'ring.outerRadius' }))
    expect(error.message).not.toMatch(/Something went wrong/)
  })

  it('refuses a rename over it and changes nothing, but a valid design saved over it repairs it', async () => {
    const { cookie, pattern } = await corrupted()
    const renamed = await call(updatePattern, { method: 'PATCH', cookie, params: { id: pattern.id }, body: { revision: 1, name: 'Renamed' } })
    expect(renamed.status).toBe(500)
    await pattern.reload()
    expect([pattern.name, pattern.revision]).toEqual(['Damaged wreath', 1])
    const repaired = await call(updatePattern, { method: 'PATCH', cookie, params: { id: pattern.id }, body: { revision: 1, design: ring() } })
    expect(repaired.status).toBe(200)
    expect((await call(readPattern, { cookie, params: { id: pattern.id } })).status).toBe(200)
  })

  it('still lists on the shelf, which shows no designs', async () => {
    const { cookie } = await corrupted()
    const response = await call(listPatterns, { cookie })
    expect(response.status).toBe(200)
    expect((response.json as { patterns: { name: string }[] }).patterns.map((p) => p.name)).toEqual(['Damaged wreath'])
  })
})

describe('the limits of what is stored (lib/limits.ts)', () => {
  it('refuses too many seams with 422 naming the field and the limit, and stores nothing', async () => {
    const { cookie } = await personWith(['designer'])
    const seams = Array.from({ length: MAX_SEAMS + 1 }, (_, i) => ({ id: `s${i}`, from: [1 + (i % 7), 0], to: [0, 1 + (i % 5)] }))
    const response = await call(createPattern, { method: 'POST', cookie, body: { name: 'Too big', design: ring({ seams }) } })
    expect(response.status).toBe(422)
    expect(response.json?.error.issues).toContainEqual({ path: 'design.seams', message: `at most ${MAX_SEAMS} seams` })
    expect(await Pattern.count()).toBe(0)
  })

  it('refuses NUL in a name and a lone surrogate in a design with 422 naming the field', async () => {
    const { user, cookie } = await personWith(['designer'])
    const nul = await call(createPattern, { method: 'POST', cookie, body: { name: 'Acorn\u0000ring' } })
    expect(nul.status).toBe(422)
    expect(nul.json?.error.issues[0].path).toBe('name')
    const pattern = await createPatternRow(user)
    // JSON.stringify writes a lone surrogate as the escape \udc00, as a browser would send it.
    const lone = await call(updatePattern, { method: 'PATCH', cookie, params: { id: pattern.id }, body: { revision: 1, design: ring({ seams: [{ id: 's\udc00', from: [4, 0], to: [0, 4] }] }) } })
    expect(lone.status).toBe(422)
    expect(lone.json?.error.issues[0].path).toBe('design.seams.0.id')
    const renamed = await call(updatePattern, { method: 'PATCH', cookie, params: { id: pattern.id }, body: { revision: 1, name: 'Leaf \ud83c' } })
    expect(renamed.status).toBe(422)
    expect(renamed.json?.error.issues[0].path).toBe('name')
    await pattern.reload()
    expect([pattern.name, pattern.revision]).toEqual(['Test ring', 1])
  })

  it('stores a name exactly as the reply shows it: NFC, trimmed', async () => {
    const { cookie } = await personWith(['designer'])
    const created = await call(createPattern, { method: 'POST', cookie, body: { name: '  Cafe\u0301 ring ' } })
    expect(created.status).toBe(201)
    expect(created.json?.pattern.name).toBe('Caf\u00e9 ring')
    const stored = await Pattern.findByPk(created.json?.pattern.id as string)
    expect(stored?.name).toBe(created.json?.pattern.name)
  })

  it('refuses a 5,000-deep assembly with 422 on design.order.assembly, not a 500', async () => {
    const { cookie } = await personWith(['designer'])
    // Written by hand: JSON.stringify itself recurses once per level.
    const assembly = `${'['.repeat(5000)}"A"${',"B"]'.repeat(5000)}`
    const design = JSON.stringify(ring({ order: { sections: [{ label: 'A', areas: [[1, 1]] }], assembly: 'PLACE' } })).replace('"PLACE"', assembly)
    const response = await call(createPattern, { method: 'POST', cookie, rawBody: `{"name":"Deep","design":${design}}` })
    expect(response.status).toBe(422)
    expect(response.json?.error.issues[0]).toEqual({ path: 'design.order.assembly', message: `at most ${MAX_SECTIONS} levels of joins (one per section)` })
  })

  it('lists patterns with their summary, without reading a single design', async () => {
    const { user, cookie } = await personWith(['designer'])
    await call(createPattern, { method: 'POST', cookie, body: { name: 'Acorn ring', design: ring() } })
    await createPatternRow(user, { name: 'Blank' })
    const queries: string[] = []
    // Sequelize hands every query to options.logging (its typings leave `options` out).
    const options = (database() as unknown as { options: { logging: unknown } }).options
    const logging = options.logging
    options.logging = (sql: string) => void queries.push(sql)
    let response
    try {
      response = await call(listPatterns, { cookie })
    } finally {
      options.logging = logging
    }
    expect(response.status).toBe(200)
    expect(response.json?.patterns.map((p: { name: string; repeats: number; outerDiameterInches: number; seamCount: number }) => [p.name, p.repeats, p.outerDiameterInches, p.seamCount])).toEqual([
      ['Blank', 4, expect.any(Number), 0],
      ['Acorn ring', 4, 18, 1],
    ])
    const patternQueries = queries.filter((sql) => /FROM "patterns"/.test(sql))
    expect(patternQueries).toHaveLength(1)
    expect(patternQueries[0]).not.toMatch(/"design"/)
  })

  it('keeps the summary in step with the design on every save', async () => {
    const { user, cookie } = await personWith(['designer'])
    const pattern = await createPatternRow(user, { design: ring() as never })
    const seams = [{ id: 's1', from: [4, 0], to: [0, 4] }, { id: 's2', from: [6, 0], to: [0, 6] }]
    const response = await call(updatePattern, { method: 'PATCH', cookie, params: { id: pattern.id }, body: { revision: 1, design: ring({ units: 'cm', ring: { innerRadius: 0, outerRadius: 25.4, repeats: 6, repeatMode: 'rotate' }, seams }) } })
    expect(response.status).toBe(200)
    await pattern.reload()
    // 25.4 cm = 10 in (1959 agreement), 20 in across.
    expect([pattern.repeats, pattern.outerDiameterInches, pattern.seamCount]).toEqual([6, 20, 2])
  })
})
