/**
 * Read replicas (DATABASE_READ_URLS, lib/db.ts): only reads that pass STALE_READ go to a replica;
 * everything else — plain reads, writes, transactions and the reads inside them — goes to the
 * primary (DATABASE_URL). The "replica" here is the test database itself reached under another
 * application_name, which tells the two pools apart.
 */
import { QueryTypes } from 'sequelize'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { closeDatabase, database, STALE_READ } from '@/lib/db'
import { Pattern } from '@/models'
import { freshDatabase } from '../support/database'

const REPLICA_NAME = 'wreathwright-replica-test'
const readUrls = process.env.DATABASE_READ_URLS

beforeAll(async () => {
  const replica = new URL(process.env.DATABASE_URL!)
  replica.searchParams.set('application_name', REPLICA_NAME)
  // Before anything opens the app's pool.
  process.env.DATABASE_READ_URLS = replica.toString()
  await freshDatabase()
})
afterAll(async () => {
  await closeDatabase()
  if (readUrls === undefined) delete process.env.DATABASE_READ_URLS
  else process.env.DATABASE_READ_URLS = readUrls
})

const SERVED_BY = "SELECT current_setting('application_name') AS name"

async function servedBy(options: object = {}): Promise<string> {
  const [row] = await database().query<{ name: string }>(SERVED_BY, { type: QueryTypes.SELECT, ...options })
  return row!.name
}

describe('DATABASE_READ_URLS', () => {
  it('sends only reads marked STALE_READ to a replica', async () => {
    expect(await servedBy()).not.toBe(REPLICA_NAME)
    expect(await servedBy(STALE_READ)).toBe(REPLICA_NAME)
    const inTransaction = await database().transaction((transaction) => servedBy({ transaction, ...STALE_READ }))
    expect(inTransaction).not.toBe(REPLICA_NAME)
    // A model read may say so too.
    await expect(Pattern.findAll({ ...STALE_READ, attributes: ['id'], limit: 1 })).resolves.toEqual([])
  })
})
