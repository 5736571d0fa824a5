import 'server-only'
import type PgBoss from 'pg-boss'
import { mailSettings, type MailSettings } from '@/lib/env'
import { MAIL_QUEUE } from './kinds'

/** What the mail queue's retries follow; the worker passes shorter ones in tests. */
export type RetryPolicy = Pick<MailSettings, 'retryLimit' | 'retryDelaySeconds'>

/**
 * Creates the mail queue (on the job queue, lib/jobs/boss.ts) if it is missing, with the retry
 * policy; each instance may, at any time.
 */
export async function ensureMailQueue(boss: PgBoss, retry: RetryPolicy = mailSettings()): Promise<void> {
  const options = { name: MAIL_QUEUE, retryLimit: retry.retryLimit, retryDelay: retry.retryDelaySeconds, retryBackoff: true }
  // createQueue is a no-op when the queue exists; updateQueue then brings its policy up to date.
  await boss.createQueue(MAIL_QUEUE, options)
  await boss.updateQueue(MAIL_QUEUE, options)
}
