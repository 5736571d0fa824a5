/**
 * The booklet worker: a process of its own, beside the web app, that builds buyers' booklets from
 * the 'booklets' queue (lib/booklets/worker.ts) with the same booklet code as the print room and
 * `cli pdf`, and stores them in the object store. Run it with
 * `tsx --conditions=react-server scripts/booklet-worker.ts` and the app's settings (DATABASE_URL,
 * S3_*, BOOKLET_WORKER_CONCURRENCY, BOOKLET_POLL_SECONDS); `npm run demo` and `npm test` start it.
 * SIGTERM or SIGINT stops it after the builds in hand (an unfinished one is tried again later).
 */
import { lowerAutogroup, lowerEveryThread, WORKER_NICENESS } from '../lib/booklets/priority'
import { startBookletWorker } from '../lib/booklets/worker'
import { closeDatabase } from '../lib/db'
import { bookletSettings } from '../lib/env'

try {
  // Writing booklets is all CPU; on a machine shared with the web app, every thread of the worker
  // (not only the main one: lib/booklets/priority.ts) yields to it, so pages keep answering fast
  // while booklets build. Where lowering the priority is not allowed, it runs as it is.
  const lowered = lowerEveryThread(WORKER_NICENESS)
  const grouped = lowerAutogroup(WORKER_NICENESS)
  const settings = bookletSettings()
  const worker = await startBookletWorker({ concurrency: settings.workerConcurrency, pollSeconds: settings.pollSeconds, niceness: WORKER_NICENESS })
  console.log(`booklet-worker: ready (pid ${process.pid}, ${settings.workerConcurrency} at a time, ${lowered.lowered} of ${lowered.threads} threads at niceness ${WORKER_NICENESS}${grouped ? ', and its scheduling group' : ''})`)
  let stopping = false
  const stop = () => {
    if (stopping) return
    stopping = true
    void worker
      .stop()
      .then(() => closeDatabase())
      .then(() => process.exit(0), () => process.exit(1))
  }
  process.once('SIGTERM', stop)
  process.once('SIGINT', stop)
} catch (error) {
  console.error(`booklet-worker: could not start: ${(error as Error).message}`)
  process.exit(1)
}
