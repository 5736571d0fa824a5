import 'server-only'
import PgBoss from 'pg-boss'
import type { Transporter } from 'nodemailer'
import { mailSettings, type MailSettings } from '@/lib/env'
import { database } from '@/lib/db'
import { bossOptions } from '@/lib/jobs/boss'
import { OutgoingMail } from '@/models'
import { MAIL_QUEUE, type MailJob } from './kinds'
import { ensureMailQueue } from './queue'
import { renderMail } from './render'
import { createTransport } from './transport'

/**
 * The mail worker: takes each job off the queue, renders its message, hands it to SMTP and marks
 * its row in the mail log. A failed try throws, so pg-boss tries again later (retryLimit tries
 * after the first, each delay double the last); after the last one the row is 'failed'.
 *
 * It logs a message's id, kind and state only: never its address, link, token or body.
 *
 * Sending is at least once: a crash after SMTP accepted a message but before its row says 'sent'
 * sends it again when the job is retried.
 */

/** The settings a worker runs with; tests pass a wrong port or short delays. */
export type MailWorkerSettings = Pick<MailSettings, 'smtp' | 'from' | 'retryLimit' | 'retryDelaySeconds' | 'pollSeconds'>

interface RunningWorker {
  boss: PgBoss
  transport: Transporter
}

const globalForWorker = globalThis as typeof globalThis & { wreathwrightMailWorker?: Promise<RunningWorker | null> }

/** The header that names a message's kind, so tests (and people) can tell messages apart. */
export const KIND_HEADER = 'X-Wreathwright-Mail-Kind'

/**
 * Why a try failed, for the mail log: the error's code and message with any address of a page
 * removed (an SMTP server might quote the message back), cut short.
 *
 * @example describeFailure(Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:1'), { code: 'ESOCKET' })) // 'ESOCKET: connect ECONNREFUSED 127.0.0.1:1'
 */
export function describeFailure(error: unknown): string {
  const code = typeof error === 'object' && error && 'code' in error ? String((error as { code: unknown }).code) : 'ERROR'
  const message = error instanceof Error ? error.message : String(error)
  return `${code}: ${message.replace(/\bhttps?:\/\/\S+/gi, '[link]')}`.slice(0, 300)
}

async function deliver(job: PgBoss.JobWithMetadata<MailJob>, transport: Transporter, from: string): Promise<void> {
  const { mailId, kind } = job.data
  const row = await OutgoingMail.findByPk(mailId)
  // Sent before (the job was retried after a crash) or no longer logged: nothing to do.
  if (!row || row.state === 'sent') return
  const attempts = row.attempts + 1
  try {
    const message = await renderMail(kind, job.data.data)
    await transport.sendMail({ from, to: job.data.to, subject: message.subject, text: message.text, html: message.html, headers: { [KIND_HEADER]: kind } })
  } catch (error) {
    const last = job.retryCount >= job.retryLimit
    await row.update({ attempts, lastError: describeFailure(error), state: last ? 'failed' : 'queued' })
    const code = describeFailure(error).split(':')[0]
    console.warn(last ? `mail: ${mailId} (${kind}) failed after ${attempts} tries (${code})` : `mail: ${mailId} (${kind}) try ${attempts} failed (${code}); will retry`)
    throw new Error(`sending ${mailId} failed (${code})`, { cause: error })
  }
  await row.update({ attempts, state: 'sent', sentAt: new Date(), lastError: null })
  console.info(`mail: ${mailId} (${kind}) sent`)
}

/**
 * Starts this process's mail worker (lib/jobs/worker.ts does, unless MAIL_WORKER=off). Without
 * SMTP settings it says so once and does not start: messages wait in the queue. Calling it again
 * while it runs does nothing.
 */
export function startMailWorker(overrides: Partial<MailWorkerSettings> = {}): Promise<boolean> {
  if (!globalForWorker.wreathwrightMailWorker) {
    const starting = (async (): Promise<RunningWorker | null> => {
      const settings: MailWorkerSettings = { ...mailSettings(), ...overrides }
      if (!settings.smtp) {
        console.warn('mail: SMTP_PORT is not set; messages are queued and wait until a worker with SMTP settings runs')
        return null
      }
      // Binds this bundle's copy of the models to the shared connection (see lib/db.ts).
      database()
      const transport = createTransport(settings.smtp)
      const boss = new PgBoss(bossOptions({ supervise: true }))
      boss.on('error', (error: Error) => console.error(`mail queue: ${error.message}`))
      await boss.start()
      await ensureMailQueue(boss, settings)
      await boss.work<MailJob>(MAIL_QUEUE, { batchSize: 1, includeMetadata: true, pollingIntervalSeconds: settings.pollSeconds }, async ([job]) => {
        if (job) await deliver(job, transport, settings.from)
      })
      return { boss, transport }
    })()
    starting.catch(() => (globalForWorker.wreathwrightMailWorker = undefined))
    globalForWorker.wreathwrightMailWorker = starting
  }
  return globalForWorker.wreathwrightMailWorker.then((worker) => worker !== null)
}

/** Stops the worker, letting a message being sent finish first (up to `timeoutMs`), and closes its pool. */
export async function stopMailWorker(timeoutMs = 10_000): Promise<void> {
  const starting = globalForWorker.wreathwrightMailWorker
  globalForWorker.wreathwrightMailWorker = undefined
  const worker = await starting?.catch(() => null)
  if (!worker) return
  await worker.boss.stop({ graceful: true, close: true, timeout: timeoutMs })
  worker.transport.close()
}
