import { Sequelize } from 'sequelize'
import pg from 'pg'
import { initModels } from '@/models'
import { serverEnv } from '@/lib/env'

/**
 * The one connection to PostgreSQL. Created on first use and kept on globalThis so that the dev
 * server's hot reloads reuse one pool instead of opening a new one per edit.
 */
const globalForDatabase = globalThis as typeof globalThis & { wreathwrightSequelize?: Sequelize }

/**
 * Next.js bundles server code more than once (pages and route handlers are separate bundles in one
 * process), so each copy of the model classes must be bound to the shared instance by its own copy
 * of this module. This flag is per copy; the instance on globalThis is shared.
 */
let modelsBoundTo: Sequelize | undefined

export function createSequelize(databaseUrl: string, options: { log?: boolean } = {}): Sequelize {
  return new Sequelize(databaseUrl, {
    dialect: 'postgres',
    // Handing Sequelize the module directly keeps it working when the app is bundled.
    dialectModule: pg,
    logging: options.log ? console.log : false,
    pool: { max: 10, min: 0, idle: 10_000 },
    define: { underscored: true },
  })
}

/** The shared Sequelize instance, with every model initialised on it. */
export function database(): Sequelize {
  if (!globalForDatabase.wreathwrightSequelize) {
    const env = serverEnv()
    globalForDatabase.wreathwrightSequelize = createSequelize(env.DATABASE_URL, { log: env.DATABASE_LOG === 'true' })
  }
  const sequelize = globalForDatabase.wreathwrightSequelize
  if (modelsBoundTo !== sequelize) {
    initModels(sequelize)
    modelsBoundTo = sequelize
  }
  return sequelize
}

/** Closes the shared pool (tests and scripts call this before they exit). */
export async function closeDatabase(): Promise<void> {
  const sequelize = globalForDatabase.wreathwrightSequelize
  globalForDatabase.wreathwrightSequelize = undefined
  await sequelize?.close()
}
