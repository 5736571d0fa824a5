import { QueryTypes } from 'sequelize'
import { afterAll, describe, expect, it } from 'vitest'
import { database } from '@/lib/db'
import { createMigrator } from '@/lib/migrator'
import { closeDatabase, freshDatabase } from '../support/database'
import { createUser } from '../support/factories'
import { parseDesign } from '@/lib/schemas/design'
import { DEMO_PATTERNS, seedDemoData } from '@/scripts/demo-data'

afterAll(closeDatabase)

async function tableNames(): Promise<string[]> {
  const rows = await database().query<{ name: string }>(
    "SELECT table_name::text AS name FROM information_schema.tables WHERE table_schema = 'public' AND table_name <> 'schema_migrations' ORDER BY 1",
    { type: QueryTypes.SELECT },
  )
  return rows.map((row) => row.name)
}

/** Tables the migrations must make (each later migration may add more; going down and up must give the same list back). */
const CORE_TABLES = ['account_tokens', 'admin_audit_entries', 'outgoing_mails', 'pattern_revisions', 'patterns', 'rate_limits', 'sessions', 'uploads', 'users']

describe('migrations', () => {
  it('go all the way down and up again', async () => {
    await freshDatabase()
    const migrator = createMigrator(database())
    const applied = (await migrator.executed()).length
    expect(applied).toBeGreaterThan(0)
    const tables = await tableNames()
    expect(tables).toEqual(expect.arrayContaining(CORE_TABLES))

    await migrator.down({ to: 0 })
    expect(await tableNames()).toEqual([])
    expect(await migrator.executed()).toEqual([])

    await migrator.up()
    expect((await migrator.executed()).length).toBe(applied)
    expect(await tableNames()).toEqual(tables)
  })

  it('keep a summary beside each design: added and backfilled from the stored designs, removed on the way down', async () => {
    await freshDatabase()
    const owner = await createUser({ roles: ['designer'] })
    const migrator = createMigrator(database())
    const summary = '20261202-0020-keep-a-design-summary-beside-each-pattern.ts'
    await migrator.down({ to: summary })
    const columns = async () =>
      (await database().query<{ name: string }>("SELECT column_name::text AS name FROM information_schema.columns WHERE table_name = 'patterns'", { type: QueryTypes.SELECT })).map((row) => row.name)
    expect(await columns()).not.toContain('seam_count')
    // Two designs stored before the summary existed: one in centimetres, one damaged by hand.
    const design = { format: 'wreathwright-design', version: 1, name: 'Old', units: 'cm', ring: { innerRadius: 0, outerRadius: 25.4, repeats: 6, repeatMode: 'rotate' }, seams: [{ id: 's1', from: [5, 0], to: [0, 5] }, { id: 's2', from: [8, 0], to: [0, 8] }] }
    await database().query('INSERT INTO patterns (owner_id, name, design) VALUES (:owner, :name, :design::jsonb), (:owner, :other, :damaged::jsonb)', {
      replacements: { owner: owner.id, name: 'Old ring', design: JSON.stringify(design), other: 'Damaged', damaged: JSON.stringify({ ring: 'none' }) },
    })
    await migrator.up()
    const rows = await database().query('SELECT name, repeats, outer_diameter_inches, seam_count FROM patterns ORDER BY name', { type: QueryTypes.SELECT })
    expect(rows).toEqual([
      { name: 'Damaged', repeats: 0, outer_diameter_inches: 0, seam_count: 0 },
      // 25.4 cm outer radius = 10 in (1 in = 25.4 mm exactly, 1959 agreement): 20 in across.
      { name: 'Old ring', repeats: 6, outer_diameter_inches: 20, seam_count: 2 },
    ])
  })

  it('turn stored designs of version 1 into version 2 and back; revisions stay as they were saved', async () => {
    await freshDatabase()
    const owner = await createUser({ roles: ['designer'] })
    const migrator = createMigrator(database())
    const version2 = '20261202-0060-design-format-version-2.ts'
    await migrator.down({ to: version2 })
    // A design saved as version 1, with its first revision, and a design damaged by hand.
    const v1 = {
      format: 'wreathwright-design', version: 1, name: 'Old', units: 'in', ring: { innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate' }, seams: [],
      colorways: [{ name: 'Holly', fabrics: { 'leaf-dark': '#2f5540', background_shade: '#e1e8ee' } }, { name: 'Frost', fabrics: { 'leaf-dark': '#41607a', background_shade: '#dde6ee' } }],
    }
    const [[pattern]] = (await database().query(
      'INSERT INTO patterns (owner_id, name, design) VALUES (:owner, :name, :design::jsonb), (:owner, :other, :damaged::jsonb) RETURNING id',
      { replacements: { owner: owner.id, name: 'Old ring', design: JSON.stringify(v1), other: 'Damaged', damaged: JSON.stringify({ version: 1, colorways: 'none' }) } },
    )) as [{ id: string }[], unknown]
    await database().query('INSERT INTO pattern_revisions (pattern_id, revision, name, state, design) VALUES (:id, 1, :name, :state, :design::jsonb)', {
      replacements: { id: pattern!.id, name: 'Old ring', state: 'draft', design: JSON.stringify(v1) },
    })
    const designs = async () =>
      Object.fromEntries((await database().query<{ name: string; design: unknown }>('SELECT name, design FROM patterns ORDER BY name', { type: QueryTypes.SELECT })).map((row) => [row.name, row.design]))

    await migrator.up()
    const upgraded = await designs()
    expect(upgraded['Old ring']).toEqual({
      ...v1,
      version: 2,
      colorways: [
        { name: 'Holly', fabrics: { 'leaf-dark': { name: 'Leaf dark', color: '#2f5540' }, background_shade: { name: 'Background shade', color: '#e1e8ee' } } },
        { name: 'Frost', fabrics: { 'leaf-dark': { name: 'Leaf dark', color: '#41607a' }, background_shade: { name: 'Background shade', color: '#dde6ee' } } },
      ],
    })
    // The migration and the reader agree: the stored version 2 design is what reading the version 1 design gives.
    const read = parseDesign(v1)
    expect(read.ok && read.file).toEqual(upgraded['Old ring'])
    // A damaged design is left for the schema to report; the revision is history, kept as saved (and upgraded when read).
    expect(upgraded.Damaged).toEqual({ version: 1, colorways: 'none' })
    const [revision] = await database().query<{ design: unknown }>('SELECT design FROM pattern_revisions WHERE pattern_id = :id', { replacements: { id: pattern!.id }, type: QueryTypes.SELECT })
    expect(revision!.design).toEqual(v1)

    // Down: the demo's version 2 designs become version 1, each fabric its colour only (names are lost).
    await seedDemoData()
    await migrator.down({ to: version2 })
    const downgraded = await designs()
    expect(downgraded['Old ring']).toEqual(v1)
    for (const { design } of DEMO_PATTERNS) {
      const stored = downgraded[design.name] as { version: number; colorways: { name: string; fabrics: Record<string, unknown> }[] }
      expect(stored.version, design.name).toBe(1)
      expect(stored.colorways, design.name).toEqual(design.colorways!.map((c) => ({ name: c.name, fabrics: Object.fromEntries(Object.entries(c.fabrics).map(([role, f]) => [role, f.color])) })))
    }
    // And up again: version 2, every fabric named by its role in words, every design valid.
    await migrator.up()
    const again = await designs()
    for (const { design } of DEMO_PATTERNS) {
      const parsed = parseDesign(again[design.name])
      expect(parsed.ok, design.name).toBe(true)
      if (!parsed.ok) continue
      expect((again[design.name] as { version: number }).version).toBe(2)
      expect(parsed.file.colorways!.map((c) => c.name)).toEqual(design.colorways!.map((c) => c.name))
      expect(parsed.file.colorways![0]!.fabrics.binding).toEqual({ name: 'Binding', color: design.colorways![0]!.fabrics.binding!.color })
    }
  })
})
