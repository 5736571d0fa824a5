/**
 * One booklet-writing thread of the booklet worker (lib/booklets/threads.ts): the booklet code is
 * synchronous and takes a second or more, so it runs here, off the worker's main thread, which
 * keeps polling the queue and writing progress. Messages: in, `{ design, options, footer }`; out,
 * `{ kind: 'page', page }` as each page is begun, then `{ kind: 'done', bytes, pageCount }` or
 * `{ kind: 'failed', message }`.
 */
import { parentPort, workerData } from 'node:worker_threads'
import type { Design } from '@/geometry'
import { writeBooklet } from '@/lib/booklet/booklet'
import type { FooterNotice } from '@/lib/booklet/chrome'
import type { BookletOptionsInput } from '@/lib/schemas/booklet'
import { lowerThisThread } from './priority'

export interface ThreadRequest {
  readonly design: Design
  readonly options: BookletOptionsInput
  readonly footer: FooterNotice
}

export type ThreadMessage =
  | { readonly kind: 'page'; readonly page: number }
  | { readonly kind: 'done'; readonly bytes: Uint8Array; readonly pageCount: number }
  | { readonly kind: 'failed'; readonly message: string }

/** What the worker starts a thread with (lib/booklets/threads.ts). */
export interface ThreadSettings {
  /** The thread's CPU niceness, or null to keep the one it inherited. */
  readonly niceness: number | null
}

const port = parentPort
if (port) {
  // Inherited from the thread that started this one on Linux, but set here too so that a writing
  // thread never competes with the web app at a higher priority than the worker chose.
  const settings = workerData as ThreadSettings | undefined
  if (typeof settings?.niceness === 'number') lowerThisThread(settings.niceness)
  port.on('message', (request: ThreadRequest) => {
    const reply = (message: ThreadMessage, transfer: ArrayBuffer[] = []) => port.postMessage(message, transfer)
    try {
      const written = writeBooklet(request.design, request.options, { footer: request.footer, onPage: (page) => reply({ kind: 'page', page }) })
      const bytes = new Uint8Array(written.doc.output('arraybuffer'))
      reply({ kind: 'done', bytes, pageCount: written.doc.getNumberOfPages() }, [bytes.buffer as ArrayBuffer])
    } catch (error) {
      reply({ kind: 'failed', message: error instanceof Error ? error.message : String(error) })
    }
  })
}
