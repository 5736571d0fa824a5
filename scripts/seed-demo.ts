/** Loads the demo data into the database named by DATABASE_URL (idempotent). */
import { closeDatabase } from '../lib/db'
import { seedDemoData } from './demo-data'

try {
  const loaded = await seedDemoData()
  console.log(`seed: ${loaded.people} people and ${loaded.patterns} patterns added`)
} catch (error) {
  console.error(`seed: ${(error as Error).message}`)
  process.exitCode = 1
} finally {
  await closeDatabase()
}
