import path from 'node:path'
import { pathToFileURL } from 'node:url'
import type { QueryInterface, Sequelize } from 'sequelize'
import { SequelizeStorage, Umzug } from 'umzug'

const migrationsFolder = path.resolve(import.meta.dirname, '..', 'migrations')

/**
 * The line printed for one of umzug's log records: one per migration once it has run or been
 * undone, nothing for its start (umzug logs both as objects, which read as noise in a terminal).
 *
 * @example migrationLine({ event: 'migrated', name: '20261202-0001-create-users-and-sessions.ts', durationSeconds: 0.031 }) // 'migrated 20261202-0001-create-users-and-sessions.ts (0.03 s)'
 */
export function migrationLine(record: Record<string, unknown>): string | null {
  const { event, name, durationSeconds } = record
  if ((event === 'migrated' || event === 'reverted') && typeof name === 'string') {
    return `${event} ${name}${typeof durationSeconds === 'number' ? ` (${durationSeconds.toFixed(2)} s)` : ''}`
  }
  if (event === 'migrating' || event === 'reverting') return null
  // Anything else umzug might log (none today) is shown as it comes rather than lost.
  return JSON.stringify(record)
}

/** umzug's logger interface, writing migrationLine's lines. */
function lineLogger(write: (line: string) => void) {
  const log = (record: Record<string, unknown>) => {
    const line = migrationLine(record)
    if (line !== null) write(line)
  }
  return { info: log, warn: log, error: log, debug: () => undefined }
}

/**
 * The migrations in migrations/, in file-name order, recorded in the table `schema_migrations`.
 * Used by scripts/migrate.ts, the demo, and the integration tests. With `log`, each migration that
 * runs prints one line, e.g. `migrated 20261202-0001-create-users-and-sessions.ts (0.03 s)`.
 */
export function createMigrator(sequelize: Sequelize, options: { log?: boolean } = {}) {
  return new Umzug<QueryInterface>({
    migrations: {
      glob: ['*.ts', { cwd: migrationsFolder, ignore: ['*.test.ts', '*.d.ts'] }],
      resolve: ({ name, path: file, context }) => {
        const load = () => import(pathToFileURL(file!).href)
        return {
          name,
          up: async () => (await load()).up({ context }),
          down: async () => (await load()).down({ context }),
        }
      },
    },
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: options.log ? lineLogger((line) => console.log(line)) : undefined,
  })
}
