/**
 * PostgreSQL restarts while the app runs: the app (its database module and route handlers, in
 * this process, as `next start` runs them) answers again once the database is back, without a
 * restart of its own — and a read asked while the database is coming back waits for it
 * (lib/db.ts retries statements that could not get a connection) instead of failing.
 *
 * The cluster restarted here is this file's own, made in a temporary folder on a free port
 * (scripts/postgres.ts, as `npm test` makes the run's): the run's shared cluster is never stopped.
 */
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { GET as health } from '@/app/api/health/route'
import { GET as readPattern, PATCH as updatePattern } from '@/app/api/patterns/[id]/route'
import { DATABASE_RETRY_AFTER_SECONDS } from '@/lib/database-unavailable'
import { closeDatabase, database } from '@/lib/db'
import { createMigrator } from '@/lib/migrator'
import { freePort } from '@/scripts/processes'
import { startCluster, type Cluster } from '@/scripts/postgres'
import { createPatternRow, createUser, sessionCookieFor } from '../support/factories'
import { call } from '../support/requests'

const folder = fs.mkdtempSync(path.join(os.tmpdir(), 'wreathwright-restart-test-'))
fs.chmodSync(folder, 0o755)
const sharedDatabaseUrl = process.env.DATABASE_URL
let cluster: Cluster
let port: number

function start(): Cluster {
  return startCluster(path.join(folder, 'postgres'), port, { throwaway: true, passwordFile: path.join(folder, 'postgres.password') })
}

beforeAll(async () => {
  port = await freePort()
  cluster = start()
  cluster.createDatabase('wreathwright_restart')
  // Before anything opens the app's pool: the app's database is this cluster's.
  process.env.DATABASE_URL = cluster.url('wreathwright_restart')
  await createMigrator(database()).up()
})

afterAll(async () => {
  await closeDatabase()
  try {
    cluster?.stop()
  } catch {
    // Already stopped by a failed test.
  }
  process.env.DATABASE_URL = sharedDatabaseUrl
  fs.rmSync(folder, { recursive: true, force: true })
})

/** The server process's id (a new one after a restart: the old connections really went with it). */
function postmasterPid(): string {
  return fs.readFileSync(path.join(cluster.folder, 'postmaster.pid'), 'utf8').split('\n')[0]!
}

describe('PostgreSQL restarted under the running app', () => {
  it('answers again once the database is back, on the same pool, and a read during the restart waits for it', async () => {
    const designer = await createUser({ roles: ['designer', 'quilter'] })
    const cookie = await sessionCookieFor(designer)
    const pattern = await createPatternRow(designer, { name: 'Ember Ring' })
    const read = () => call(readPattern, { path: `/api/patterns/${pattern.id}`, cookie, params: { id: pattern.id } })
    // Several connections in the pool, all of which the restart will break.
    const answers = await Promise.all([read(), read(), read(), read()])
    expect(answers.map((answer) => answer.status)).toEqual([200, 200, 200, 200])
    const before = postmasterPid()

    cluster.stop()
    // Down: the app says so (after its few quick retries) rather than hanging: 503 with
    // Retry-After (lib/http.ts, lib/database-unavailable.ts), not a 500 that reads like a bug.
    const whileDown = Date.now()
    const healthDown = await call(health)
    expect(healthDown.status).toBe(503)
    expect(healthDown.headers.get('retry-after')).toBe(String(DATABASE_RETRY_AFTER_SECONDS))
    const down = await read()
    expect(down.status).toBe(503)
    expect(down.headers.get('retry-after')).toBe(String(DATABASE_RETRY_AFTER_SECONDS))
    expect(down.json?.error).toEqual({ message: expect.stringMatching(/^The database could not be reached, so nothing was changed/), retryAfterSeconds: DATABASE_RETRY_AFTER_SECONDS })
    expect(Date.now() - whileDown).toBeLessThan(10_000)

    // Up again on the same port: the very first request is answered, on the app's existing pool.
    cluster = start()
    expect(postmasterPid()).not.toBe(before)
    const first = await read()
    expect(first.status).toBe(200)
    expect(first.json?.pattern.name).toBe('Ember Ring')
    expect((await call(health)).status).toBe(200)
    const saved = await call(updatePattern, { method: 'PATCH', path: `/api/patterns/${pattern.id}`, cookie, params: { id: pattern.id }, body: { revision: 1, name: 'Ember Ring II' } })
    expect(saved.status).toBe(200)
    expect(saved.json?.pattern.revision).toBe(2)

    // A read asked while the database is down, which comes back within the retries' second or two.
    cluster.stop()
    const pending = read()
    // The stop and start here block this process (spawnSync), as a slow restart would; the
    // read's retries run once it is back.
    await new Promise((resolve) => setTimeout(resolve, 100))
    cluster = start()
    const during = await pending
    expect(during.status).toBe(200)
    expect(during.json?.pattern.name).toBe('Ember Ring II')
  })
})
