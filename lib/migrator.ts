import path from 'node:path'
import { pathToFileURL } from 'node:url'
import type { QueryInterface, Sequelize } from 'sequelize'
import { SequelizeStorage, Umzug } from 'umzug'

const migrationsFolder = path.resolve(import.meta.dirname, '..', 'migrations')

/**
 * The migrations in migrations/, in file-name order, recorded in the table `schema_migrations`.
 * Used by scripts/migrate.ts, the demo, and the integration tests.
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
    logger: options.log ? console : undefined,
  })
}
