import { Worker } from 'node:worker_threads'
import type { ThreadMessage, ThreadRequest, ThreadSettings } from './build-thread'
import { lowerEveryThread } from './priority'

/**
 * The booklet worker's writing threads: one per build it takes at a time, each kept for the next
 * build (starting one loads the booklet code, about half a second). A thread that dies is replaced
 * at the next build.
 *
 * The worker process runs under tsx, which registers its TypeScript loader on the main thread
 * only; a thread registers it again before loading build-thread.ts.
 */

export interface BuiltPdf {
  readonly bytes: Uint8Array
  readonly pageCount: number
}

export interface WritingThread {
  /** Writes one booklet, calling `onPage` as each page is begun. */
  write(request: ThreadRequest, onPage: (page: number) => void): Promise<BuiltPdf>
  stop(): Promise<void>
}

const THREAD_FILE = new URL('./build-thread.ts', import.meta.url).href

function startThread(settings: ThreadSettings): Worker {
  const source = `import('tsx/esm/api').then(({ register }) => { register(); return import(${JSON.stringify(THREAD_FILE)}) })`
  const thread = new Worker(source, { eval: true, workerData: settings })
  // A new thread may have made Node start helper threads of its own (its libuv pool on first use):
  // lower those too once it is up (lib/booklets/priority.ts).
  if (settings.niceness !== null) {
    const niceness = settings.niceness
    thread.once('online', () => lowerEveryThread(niceness))
  }
  return thread
}

/**
 * A writing thread, started at its first build. `niceness` (null: leave it) is the CPU priority
 * the thread gives itself (lib/booklets/priority.ts).
 */
export function writingThread(settings: ThreadSettings = { niceness: null }): WritingThread {
  let thread: Worker | undefined
  return {
    write(request, onPage) {
      const current = (thread ??= startThread(settings))
      return new Promise<BuiltPdf>((resolve, reject) => {
        const finish = () => {
          current.off('message', onMessage)
          current.off('error', onError)
          current.off('exit', onExit)
        }
        const onMessage = (message: ThreadMessage) => {
          if (message.kind === 'page') return onPage(message.page)
          finish()
          if (message.kind === 'done') resolve({ bytes: message.bytes, pageCount: message.pageCount })
          else reject(new Error(message.message))
        }
        const onError = (error: Error) => {
          finish()
          thread = undefined
          reject(error)
        }
        const onExit = (code: number) => onError(new Error(`the booklet thread stopped (exit code ${code})`))
        current.on('message', onMessage)
        current.on('error', onError)
        current.on('exit', onExit)
        current.postMessage(request)
      })
    },
    async stop() {
      await thread?.terminate()
      thread = undefined
    },
  }
}
