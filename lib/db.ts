import { Sequelize } from 'sequelize'
import pg from 'pg'
import { initModels } from '@/models'
import { serverEnv } from '@/lib/env'

/**
 * The one connection to PostgreSQL. Created on first use and kept on globalThis so that the dev
 * server's hot reloads reuse one pool instead of opening a new one per edit.
 */
const globalForDatabase = globalThis as typeof globalThis & { wreathwrightSequelize?: Sequelize }

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
    const sequelize = createSequelize(env.DATABASE_URL, { log: env.DATABASE_LOG === 'true' })
    initModels(sequelize)
    globalForDatabase.wreathwrightSequelize = sequelize
  }
  return globalForDatabase.wreathwrightSequelize
}

/** Closes the shared pool (tests and scripts call this before they exit). */
export async function closeDatabase(): Promise<void> {
  const sequelize = globalForDatabase.wreathwrightSequelize
  globalForDatabase.wreathwrightSequelize = undefined
  await sequelize?.close()
}
