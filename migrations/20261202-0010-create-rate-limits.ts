import type { QueryInterface } from 'sequelize'

/**
 * The counters of lib/rate-limits.ts, kept by rate-limiter-flexible's RateLimiterPostgres so that
 * every app instance sees the same counts. The columns are the ones that library reads and writes
 * (rate-limiter-flexible 11.4.0, lib/RateLimiterPostgres.js `_getCreateTableStmt`): `key` is the
 * limit's prefix and a hash of what is counted, `points` the count in the current window and
 * `expire` the window's end in milliseconds since 1970. We create the table here rather than let
 * the library create it at run time, so the schema is versioned and the app needs no DDL rights.
 */
export async function up({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.sequelize.query(`
    CREATE TABLE rate_limits (
      key varchar(255) PRIMARY KEY,
      points integer NOT NULL DEFAULT 0,
      expire bigint
    )`)
  // The library deletes rows whose window ended an hour ago every five minutes.
  await queryInterface.sequelize.query('CREATE INDEX rate_limits_expire ON rate_limits (expire)')
}

export async function down({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.dropTable('rate_limits')
}
