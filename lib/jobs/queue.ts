import 'server-only'
import type PgBoss from 'pg-boss'
import type { Transaction } from 'sequelize'
import { senderFor, sendInTransaction } from './boss'

/**
 * The app's background jobs beside mail, on the same durable queue (pg-boss in the app's
 * PostgreSQL, lib/jobs/boss.ts). Each kind of job has its queue and retry policy here; workers
 * are in lib/jobs/worker.ts.
 */

/** Verified payment events waiting to be applied (lib/payments/process.ts). */
export const PAYMENT_EVENTS_QUEUE = 'payment-events'

export interface PaymentEventJob {
  /** The payment_events row. */
  eventId: string
}

/**
 * The payment events' policy: tries again after 2 s, 4 s, 8 s … (ten tries, about half an hour in
 * all) when processing fails, e.g. while the database is briefly away.
 */
const PAYMENT_QUEUE_OPTIONS = { name: PAYMENT_EVENTS_QUEUE, retryLimit: 10, retryDelay: 2, retryBackoff: true }

export async function ensurePaymentQueue(boss: PgBoss): Promise<void> {
  await boss.createQueue(PAYMENT_EVENTS_QUEUE, PAYMENT_QUEUE_OPTIONS)
  await boss.updateQueue(PAYMENT_EVENTS_QUEUE, PAYMENT_QUEUE_OPTIONS)
}

/** Buyers' booklets waiting to be built by the booklet worker (scripts/booklet-worker.ts). */
export const BOOKLETS_QUEUE = 'booklets'

export interface BookletBuildJob {
  /** The booklet_builds row. */
  buildId: string
}

/**
 * The booklets' policy: two more tries, 5 s and 10 s later, when a build fails (the store briefly
 * away); a booklet that cannot be written fails the same way each time, so no more than that.
 * A build that runs past 10 minutes is given up (expired) and tried again.
 */
const BOOKLETS_QUEUE_OPTIONS = { name: BOOKLETS_QUEUE, retryLimit: 2, retryDelay: 5, retryBackoff: true, expireInSeconds: 10 * 60 }

export async function ensureBookletQueue(boss: PgBoss): Promise<void> {
  await boss.createQueue(BOOKLETS_QUEUE, BOOKLETS_QUEUE_OPTIONS)
  await boss.updateQueue(BOOKLETS_QUEUE, BOOKLETS_QUEUE_OPTIONS)
}

/** The sending instance, with the job queues made on it. */
function jobSender(): Promise<PgBoss> {
  return senderFor('jobs', async (boss) => {
    await ensurePaymentQueue(boss)
    await ensureBookletQueue(boss)
  })
}

/**
 * Queues a job in the caller's transaction: it is inserted through the transaction's own
 * connection, so it commits or rolls back with the caller's rows (as queueMail does).
 */
export function queueJob(queue: typeof PAYMENT_EVENTS_QUEUE, data: PaymentEventJob, transaction: Transaction): Promise<void>
export function queueJob(queue: typeof BOOKLETS_QUEUE, data: BookletBuildJob, transaction: Transaction): Promise<void>
export async function queueJob(queue: string, data: object, transaction: Transaction): Promise<void> {
  await sendInTransaction(await jobSender(), queue, data, transaction)
}
