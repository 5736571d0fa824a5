import 'server-only'
import PgBoss from 'pg-boss'
import { database } from '@/lib/db'
import { mailSettings, paymentSettings } from '@/lib/env'
import { bossOptions } from './boss'
import { startMailWorker, stopMailWorker } from '@/lib/mail/worker'
import { processPaymentEvent, recordFailedProcessing } from '@/lib/payments/process'
import { ensurePaymentQueue, PAYMENT_EVENTS_QUEUE, type PaymentEventJob } from './queue'

/**
 * The app's background workers, started together by instrumentation.ts in every app instance
 * (they share the queues, and pg-boss hands each job to one of them):
 * - the mail worker (lib/mail/worker.ts), unless MAIL_WORKER=off;
 * - the payment worker, which applies verified payment events (lib/payments/process.ts), unless
 *   PAYMENTS_WORKER=off. A failed try is tried again by the queue; after the last it is 'failed'
 *   in the payment log.
 */

const globalForWorker = globalThis as typeof globalThis & { wreathwrightPaymentWorker?: Promise<PgBoss> }

/** Starts this process's payment worker; calling it again while it runs does nothing. */
export function startPaymentWorker(overrides: { pollSeconds?: number } = {}): Promise<void> {
  if (!globalForWorker.wreathwrightPaymentWorker) {
    const starting = (async () => {
      // Binds this bundle's copy of the models to the shared connection (see lib/db.ts).
      database()
      const boss = new PgBoss(bossOptions({ supervise: true }))
      boss.on('error', (error: Error) => console.error(`payment queue: ${error.message}`))
      await boss.start()
      await ensurePaymentQueue(boss)
      const pollingIntervalSeconds = overrides.pollSeconds ?? paymentSettings().pollSeconds
      await boss.work<PaymentEventJob>(PAYMENT_EVENTS_QUEUE, { batchSize: 1, includeMetadata: true, pollingIntervalSeconds }, async ([job]) => {
        if (!job) return
        try {
          await processPaymentEvent(job.data.eventId)
        } catch (error) {
          const last = job.retryCount >= job.retryLimit
          await recordFailedProcessing(job.data.eventId, error, last).catch(() => undefined)
          console.warn(`payments: event row ${job.data.eventId} failed (${(error as Error).message})${last ? '' : '; will retry'}`)
          throw error
        }
      })
      return boss
    })()
    starting.catch(() => (globalForWorker.wreathwrightPaymentWorker = undefined))
    globalForWorker.wreathwrightPaymentWorker = starting
  }
  return globalForWorker.wreathwrightPaymentWorker.then(() => undefined)
}

/** Stops the payment worker, letting an event being applied finish first, and closes its pool. */
export async function stopPaymentWorker(timeoutMs = 10_000): Promise<void> {
  const starting = globalForWorker.wreathwrightPaymentWorker
  globalForWorker.wreathwrightPaymentWorker = undefined
  const boss = await starting?.catch(() => null)
  await boss?.stop({ graceful: true, close: true, timeout: timeoutMs })
}

/**
 * The app's own workers (instrumentation.ts): started in the background, so a database that is not
 * up yet delays the work and not the app; stopped on SIGTERM or SIGINT, letting a job being done
 * finish (an unfinished one is tried again by the next start).
 */
export function runJobWorkersInThisProcess(): void {
  const run = (name: string, wanted: () => boolean, start: () => Promise<unknown>) =>
    Promise.resolve()
      .then(() => (wanted() ? start() : undefined))
      .catch((error: Error) => console.error(`${name}: the worker did not start: ${error.message}`))
  void run('mail', () => mailSettings().worker, startMailWorker)
  void run('payments', () => paymentSettings().worker, startPaymentWorker)
  for (const signal of ['SIGTERM', 'SIGINT'] as const) {
    process.once(signal, () => void Promise.allSettled([stopMailWorker(), stopPaymentWorker()]).finally(() => process.exit(0)))
  }
}
