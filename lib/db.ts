import { ConnectionRefusedError, ConnectionTimedOutError, HostNotFoundError, HostNotReachableError, Sequelize } from 'sequelize'
import pg from 'pg'
import { initModels } from '@/models'
import { serverEnv } from '@/lib/env'
import { noteWritesOf } from '@/lib/row-changes'

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

/**
 * A read (a plain SELECT, no row lock) whose connection broke under it: the database restarted,
 * failed over, or dropped the connection while it sat idle in the pool. Nothing was changed, so it
 * is safe to ask again on a new connection (the broken one is dropped: Sequelize marks it invalid
 * when it errs, and the pool's validate refuses it). A write whose connection broke is never
 * asked again here: it may have happened.
 */
const BROKEN_CONNECTION = /Connection terminated unexpectedly|terminating connection due to administrator command|ECONNRESET|not queryable/

// An arrow function on purpose: retry-as-promised calls a `match` entry as a predicate when it
// cannot be used with `instanceof` (an arrow function has no prototype).
const isBrokenRead = (error: unknown): boolean => {
  const { sql, original } = error as { sql?: unknown; original?: { message?: unknown; code?: unknown } }
  if (typeof sql !== 'string' || !/^\s*SELECT\b/i.test(sql) || /\bFOR\s+(NO\s+KEY\s+)?(UPDATE|SHARE)\b/i.test(sql)) return false
  return BROKEN_CONNECTION.test(String(original?.message)) || original?.code === 'ECONNRESET' || original?.code === '57P01'
}

/**
 * When a statement is asked again (Sequelize's `retry`): after errors of opening a connection (the
 * statement was never sent, so this is safe for any statement, a write included) and after a read
 * whose connection broke (above). Up to five tries, 0.2 s, 0.3 s, 0.45 s and 0.7 s apart (about
 * 1.7 s in all: our choice, the length of a quick restart), before the error reaches the request.
 */
const RETRY_ON_CONNECTION_ERRORS = {
  max: 5,
  backoffBase: 200,
  backoffExponent: 1.5,
  match: [
    ConnectionRefusedError,
    HostNotReachableError,
    HostNotFoundError,
    ConnectionTimedOutError,
    /ECONNREFUSED|the database system is (starting up|shutting down)/,
    isBrokenRead,
  ],
}

/**
 * What a read that may be a moment stale passes, e.g. `Pattern.findAll({ where, ...STALE_READ })`:
 * with read replicas (DATABASE_READ_URLS) it goes to one of them; without, to the one database.
 * Everything else goes to the primary: sessions, rate limits and queues, every write, every
 * transaction (its reads included), and any read that must see a write just made.
 */
export const STALE_READ = { useMaster: false } as const

/** One replica's connection settings from its URL (as Sequelize reads DATABASE_URL). */
function replicaSettings(url: string) {
  const parsed = new URL(url)
  const dialectOptions = Object.fromEntries(parsed.searchParams)
  return {
    host: parsed.hostname,
    port: parsed.port ? Number(parsed.port) : 5432,
    username: decodeURIComponent(parsed.username),
    password: decodeURIComponent(parsed.password),
    database: decodeURIComponent(parsed.pathname.replace(/^\//, '')),
    ...(Object.keys(dialectOptions).length > 0 ? { dialectOptions } : {}),
  }
}

/**
 * node-postgres's Client with a listener for 'error' from the moment it is made. A client emits
 * 'error' when its connection breaks while no statement is running on it: PostgreSQL restarting
 * ends every session with 57P01 (admin_shutdown), a fail-over or a dropped idle connection does
 * the same. Node throws an 'error' nobody listens to as an uncaught exception, which ends the
 * process. Sequelize adds its own listener (it marks the connection invalid and destroys it) only
 * once the connection is made and handed back to its code, a turn of the event loop later; an
 * error read from the socket before that (in the same chunk as the server's ready message, as
 * happens when the server shuts down while connections are being opened) had no listener: the
 * restart test saw such 57P01 errors as unhandled. This listener is there from the start: it logs
 * one line (the failure stays visible) and marks the connection invalid, so the pool's validate
 * never hands it out again and opens a new connection instead. A statement that was running when
 * the connection broke gets its own error as before (a read is asked again: RETRY_ON_CONNECTION_ERRORS).
 */
class ListenedClient extends pg.Client {
  constructor(config?: string | pg.ClientConfig) {
    super(config)
    this.on('error', (error: Error & { code?: unknown }) => {
      // Sequelize's connection manager reads this flag in `validate` (lib/dialects/postgres/connection-manager.js).
      const pooled = this as unknown as { _invalid?: boolean }
      // One line per connection: the end of its socket that follows a 57P01 is the same failure.
      if (pooled._invalid) return
      pooled._invalid = true
      console.error(`database: a connection broke${typeof error.code === 'string' ? ` (${error.code})` : ''}: ${error.message}; the pool opens another`)
    })
  }
}

/** The pg module as Sequelize uses it (`dialectModule`), with ListenedClient for its connections. */
export const pgWithErrorListeners: typeof pg = { ...pg, Client: ListenedClient }

export function createSequelize(databaseUrl: string, options: { log?: boolean; readUrls?: readonly string[] } = {}): Sequelize {
  const readUrls = options.readUrls ?? []
  const sequelize = new Sequelize(databaseUrl, {
    dialect: 'postgres',
    // Handing Sequelize the module directly keeps it working when the app is bundled; its Client
    // listens for errors from the start (ListenedClient).
    dialectModule: pgWithErrorListeners,
    logging: options.log ? console.log : false,
    pool: { max: 10, min: 0, idle: 10_000 },
    define: { underscored: true },
    retry: RETRY_ON_CONNECTION_ERRORS,
    ...(readUrls.length > 0
      ? {
          // The primary is DATABASE_URL itself (`write: {}` takes its settings); reads go to it too
          // unless they pass STALE_READ.
          replication: { write: {}, read: readUrls.map(replicaSettings) },
          query: { useMaster: true },
        }
      : {}),
  })
  // Writes through the models drop the answers this process kept of their rows (lib/row-changes.ts).
  noteWritesOf(sequelize)
  return sequelize
}

/** DATABASE_READ_URLS as a list. */
function readUrlsOf(setting: string | undefined): string[] {
  return (setting ?? '').split(',').map((url) => url.trim()).filter((url) => url.length > 0)
}

/** The shared Sequelize instance, with every model initialised on it. */
export function database(): Sequelize {
  if (!globalForDatabase.wreathwrightSequelize) {
    const env = serverEnv()
    globalForDatabase.wreathwrightSequelize = createSequelize(env.DATABASE_URL, { log: env.DATABASE_LOG === 'true', readUrls: readUrlsOf(env.DATABASE_READ_URLS) })
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
