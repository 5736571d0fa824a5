/**
 * npm run db:migrate            apply every pending migration
 * npm run db:rollback           undo the last one
 * npm run db:rollback -- --all  undo all of them
 * Reads DATABASE_URL.
 */
import { createSequelize } from '../lib/db'
import { createMigrator } from '../lib/migrator'

const [direction = 'up', flag] = process.argv.slice(2)
const databaseUrl = process.env.DATABASE_URL
if (!databaseUrl) {
  console.error('migrate: DATABASE_URL is not set')
  process.exit(2)
}
if (direction !== 'up' && direction !== 'down') {
  console.error(`migrate: unknown direction "${direction}" (up or down)`)
  process.exit(2)
}

const sequelize = createSequelize(databaseUrl)
const migrator = createMigrator(sequelize, { log: true })
try {
  // Each migration that runs prints its own line (lib/migrator.ts); say so when none did.
  if (direction === 'up') {
    if ((await migrator.up()).length === 0) console.log('migrate: nothing to migrate, every migration is applied')
  } else if ((await migrator.down(flag === '--all' ? { to: 0 } : undefined)).length === 0) {
    console.log('migrate: nothing to undo, no migration is applied')
  }
} catch (error) {
  console.error(`migrate: ${error instanceof Error ? error.message : String(error)}`)
  process.exitCode = 1
} finally {
  await sequelize.close()
}
