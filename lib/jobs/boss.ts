import 'server-only'
import type { ClientBase } from 'pg'
import PgBoss from 'pg-boss'
import type { Transaction } from 'sequelize'
import { serverEnv } from '@/lib/env'

/**
 * The durable queue every background job waits in (mail, payment events, booklets): pg-boss, in
 * the app's own PostgreSQL (schema `pgboss`, made and upgraded by pg-boss under an advisory lock,
 * so several app instances may start at once). Jobs are fetched with `FOR UPDATE SKIP LOCKED`, so
 * instances sharing the queue never run one job twice at the same time. Each kind of job makes its
 * own queue with its retry policy (lib/mail/queue.ts, lib/jobs/queue.ts).
 */

/** The schema pg-boss keeps its tables in (its default, named here so the tests can look in it). */
export const QUEUE_SCHEMA = 'pgboss'

/**
 * pg-boss's options for the app's instances. Finished jobs (whose data may hold links) are deleted
 * a day after they are archived, past the longest link's life (24 hours).
 */
export function bossOptions(settings: { supervise: boolean }): PgBoss.ConstructorOptions {
  return {
    connectionString: serverEnv().DATABASE_URL,
    schema: QUEUE_SCHEMA,
    application_name: 'wreathwright-jobs',
    // A few connections are plenty: a job at a time per queue and instance.
    max: 3,
    supervise: settings.supervise,
    schedule: false,
    migrate: true,
    archiveCompletedAfterSeconds: 60 * 60,
    deleteAfterDays: 1,
  }
}

/**
 * The instance jobs are inserted through: started once per process (its inserts run on the
 * caller's connection). Kept on globalThis: Next bundles server code more than once, and a dev
 * server's reloads should not open new pools. Each queue it was made ready for is remembered with
 * it, so a closed sender's replacement makes them again.
 */
interface Sender {
  readonly boss: Promise<PgBoss>
  readonly ready: Map<string, Promise<PgBoss>>
}
const globalForQueue = globalThis as typeof globalThis & { wreathwrightJobSender?: Sender }

function sender(): Sender {
  if (!globalForQueue.wreathwrightJobSender) {
    const boss = (async () => {
      const started = new PgBoss(bossOptions({ supervise: false }))
      started.on('error', (error: Error) => console.error(`job queue: ${error.message}`))
      await started.start()
      return started
    })()
    const made: Sender = { boss, ready: new Map() }
    // A failed start (database down) is tried again by the next job, not remembered.
    boss.catch(() => {
      if (globalForQueue.wreathwrightJobSender === made) globalForQueue.wreathwrightJobSender = undefined
    })
    globalForQueue.wreathwrightJobSender = made
  }
  return globalForQueue.wreathwrightJobSender
}

/**
 * The sending instance, once `prepare` (which makes the queues of one kind of job, under the name
 * `kind`) has run on it; `prepare` runs once per instance, again after a failure.
 */
export function senderFor(kind: string, prepare: (boss: PgBoss) => Promise<void>): Promise<PgBoss> {
  const current = sender()
  let ready = current.ready.get(kind)
  if (!ready) {
    ready = current.boss.then(async (boss) => {
      await prepare(boss)
      return boss
    })
    ready.catch(() => current.ready.delete(kind))
    current.ready.set(kind, ready)
  }
  return ready
}

/**
 * Inserts a job through the caller's transaction: pg-boss runs its insert on the transaction's own
 * connection (Sequelize keeps it on the transaction), so the job commits or rolls back with the
 * caller's rows. queueMail and the other jobs (lib/jobs/queue.ts) all queue this way.
 */
export async function sendInTransaction(boss: PgBoss, queue: string, data: object, transaction: Transaction): Promise<void> {
  const connection = (transaction as unknown as { connection: ClientBase }).connection
  const jobId = await boss.send(queue, data, { db: { executeSql: (text: string, values: unknown[]) => connection.query(text, values) } })
  if (!jobId) throw new Error(`the ${queue} queue refused the job`)
}

/** Stops the sending instance and closes its pool (tests and scripts, before they exit). */
export async function closeQueueSender(): Promise<void> {
  const current = globalForQueue.wreathwrightJobSender
  globalForQueue.wreathwrightJobSender = undefined
  const boss = await current?.boss.catch(() => undefined)
  await boss?.stop({ graceful: false, close: true })
}
