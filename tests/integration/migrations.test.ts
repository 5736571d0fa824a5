import { QueryTypes } from 'sequelize'
import { afterAll, describe, expect, it } from 'vitest'
import { database } from '@/lib/db'
import { createMigrator } from '@/lib/migrator'
import { closeDatabase, freshDatabase } from '../support/database'

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
})
