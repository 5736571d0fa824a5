import { QueryTypes } from 'sequelize'
import { afterAll, describe, expect, it } from 'vitest'
import { database } from '@/lib/db'
import { createMigrator } from '@/lib/migrator'
import { closeDatabase, freshDatabase } from '../support/database'
import { createUser } from '../support/factories'

afterAll(closeDatabase)

async function tableNames(): Promise<string[]> {
  const rows = await database().query<{ name: string }>(
    "SELECT table_name::text AS name FROM information_schema.tables WHERE table_schema = 'public' AND table_name <> 'schema_migrations' ORDER BY 1",
    { type: QueryTypes.SELECT },
  )
  return rows.map((row) => row.name)
}

describe('migrations', () => {
  it('go all the way down and up again', async () => {
    await freshDatabase()
    const migrator = createMigrator(database())
    const applied = (await migrator.executed()).length
    expect(applied).toBeGreaterThan(0)
    expect(await tableNames()).toEqual(['pattern_revisions', 'patterns', 'rate_limits', 'sessions', 'users'])

    await migrator.down({ to: 0 })
    expect(await tableNames()).toEqual([])
    expect(await migrator.executed()).toEqual([])

    await migrator.up()
    expect((await migrator.executed()).length).toBe(applied)
    expect(await tableNames()).toEqual(['pattern_revisions', 'patterns', 'rate_limits', 'sessions', 'users'])
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
})

