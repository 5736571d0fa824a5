import 'server-only'
import type { ClientBase } from 'pg'
import PgBoss from 'pg-boss'
import type { Transaction } from 'sequelize'
import { mailSettings, serverEnv, type MailSettings } from '@/lib/env'
import { MAIL_QUEUE } from './kinds'

/**
 * The durable queue messages wait in: pg-boss, in the app's own PostgreSQL (schema `pgboss`, made
 * and upgraded by pg-boss under an advisory lock, so several app instances may start at once).
 * Jobs are fetched with `FOR UPDATE SKIP LOCKED`, so instances sharing the queue never send one
 * message twice at the same time.
 */

/** What the queue's retries follow; the worker passes shorter ones in tests. */
export type RetryPolicy = Pick<MailSettings, 'retryLimit' | 'retryDelaySeconds'>

/** The schema pg-boss keeps its tables in (its default, named here so the tests can look in it). */
export const QUEUE_SCHEMA = 'pgboss'

/**
 * pg-boss's options for the mail queue. Finished jobs (whose data holds the links) are deleted
 * a day after they are archived, past the longest link's life (24 hours).
 */
export function bossOptions(settings: { supervise: boolean }): PgBoss.ConstructorOptions {
  return {
    connectionString: serverEnv().DATABASE_URL,
    schema: QUEUE_SCHEMA,
    application_name: 'wreathwright-mail',
    // A few connections are plenty: one message at a time per instance.
    max: 3,
    supervise: settings.supervise,
    schedule: false,
    migrate: true,
    archiveCompletedAfterSeconds: 60 * 60,
    deleteAfterDays: 1,
  }
}

/** Creates the mail queue if it is missing (each instance may, at any time) with the retry policy. */
export async function ensureMailQueue(boss: PgBoss, retry: RetryPolicy = mailSettings()): Promise<void> {
  const options = { name: MAIL_QUEUE, retryLimit: retry.retryLimit, retryDelay: retry.retryDelaySeconds, retryBackoff: true }
  // createQueue is a no-op when the queue exists; updateQueue then brings its policy up to date.
  await boss.createQueue(MAIL_QUEUE, options)
  await boss.updateQueue(MAIL_QUEUE, options)
}

/**
 * The instance `queueMail` inserts jobs through: started once per process (it only makes sure the
 * schema and the queue exist; its inserts run on the caller's connection). Kept on globalThis: Next
 * bundles server code more than once, and a dev server's reloads should not open new pools.
 */
const globalForQueue = globalThis as typeof globalThis & { wreathwrightMailSender?: Promise<PgBoss> }

export function senderBoss(): Promise<PgBoss> {
  if (!globalForQueue.wreathwrightMailSender) {
    const starting = (async () => {
      const boss = new PgBoss(bossOptions({ supervise: false }))
      boss.on('error', (error: Error) => console.error(`mail queue: ${error.message}`))
      await boss.start()
      await ensureMailQueue(boss)
      return boss
    })()
    // A failed start (database down) is tried again by the next message, not remembered.
    starting.catch(() => (globalForQueue.wreathwrightMailSender = undefined))
    globalForQueue.wreathwrightMailSender = starting
  }
  return globalForQueue.wreathwrightMailSender
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
export async function closeMailQueue(): Promise<void> {
  const starting = globalForQueue.wreathwrightMailSender
  globalForQueue.wreathwrightMailSender = undefined
  const boss = await starting?.catch(() => undefined)
  await boss?.stop({ graceful: false, close: true })
}
