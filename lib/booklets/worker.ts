import 'server-only'
import PgBoss from 'pg-boss'
import { database } from '@/lib/db'
import { BOOKLETS_QUEUE, ensureBookletQueue, type BookletBuildJob } from '@/lib/jobs/queue'
import { bossOptions } from '@/lib/jobs/boss'
import { bookletOptionsSchema } from '@/lib/schemas/booklet'
import { runBookletBuild } from '@/lib/services/booklets'
import { buyerFooter } from './footer'
import { writingThread, type WritingThread } from './threads'

/**
 * The booklet worker (run as its own process by scripts/booklet-worker.ts): `concurrency` pollers
 * on the 'booklets' queue, each with its own writing thread, so that many booklets are built at
 * once and none of it runs in the web process.
 */
export interface BookletWorker {
  /** Lets builds in hand finish (up to `timeoutMs`), then closes the queue's pool and the threads. */
  stop(timeoutMs?: number): Promise<void>
}

export async function startBookletWorker(settings: { concurrency: number; pollSeconds: number; niceness?: number | null }): Promise<BookletWorker> {
  database()
  // A pool of its own: one connection per poller, and one for pg-boss's upkeep.
  const boss = new PgBoss({ ...bossOptions({ supervise: true }), application_name: 'wreathwright-booklets', max: settings.concurrency + 2 })
  boss.on('error', (error: Error) => console.error(`booklet queue: ${error.message}`))
  await boss.start()
  await ensureBookletQueue(boss)
  const threads: WritingThread[] = []
  for (let index = 0; index < settings.concurrency; index += 1) {
    const thread = writingThread({ niceness: settings.niceness ?? null })
    threads.push(thread)
    // pg-boss 10 takes one job per poller at a time: several pollers are how it builds several at once.
    await boss.work<BookletBuildJob>(BOOKLETS_QUEUE, { batchSize: 1, includeMetadata: true, pollingIntervalSeconds: settings.pollSeconds }, async ([job]) => {
      if (!job) return
      const lastTry = job.retryCount >= job.retryLimit
      const started = Date.now()
      try {
        await runBookletBuild(job.data.buildId, {
          write: (request, onPage) => thread.write(request, onPage),
          footerFor: (person, licenceNumber, options) => buyerFooter(person, licenceNumber, bookletOptionsSchema.parse(options)),
          lastTry,
        })
        console.log(`booklet-worker: built ${job.data.buildId} in ${Date.now() - started} ms`)
      } catch (error) {
        console.warn(`booklet-worker: build ${job.data.buildId} failed (${(error as Error).message})${lastTry ? '' : '; will retry'}`)
        throw error
      }
    })
  }
  return {
    async stop(timeoutMs = 10_000) {
      await boss.stop({ graceful: true, close: true, timeout: timeoutMs })
      await Promise.allSettled(threads.map((thread) => thread.stop()))
    },
  }
}
