import { closeDatabase, database } from '@/lib/db'
import { createMigrator } from '@/lib/migrator'
import { noteListingChange } from '@/lib/shop/listing-changes'

/**
 * Brings the test database (DATABASE_URL, started by scripts/run-tests.ts) to the latest schema
 * and empties every table, so each test file starts from nothing.
 */
export async function freshDatabase(): Promise<void> {
  if (!process.env.DATABASE_URL) throw new Error('DATABASE_URL is not set: run integration tests through `npm test`')
  const sequelize = database()
  await createMigrator(sequelize).up()
  await sequelize.query('TRUNCATE users, sessions, patterns, pattern_revisions, rate_limits, uploads RESTART IDENTITY CASCADE')
  // Plain SQL passes the models' hooks: the shop's kept pages must go with the rows.
  noteListingChange()
}

export { closeDatabase }
