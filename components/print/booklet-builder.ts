/**
 * Builds booklets in a Web Worker (components/print/booklet.worker.ts), one at a time: asking for
 * a new booklet stops the one under way by ending its worker, since a booklet is written in one
 * synchronous run that cannot be interrupted otherwise. Where a worker cannot start, the booklet
 * is built on the main thread instead. Browser only.
 */
import type { Design } from '@/geometry'
import type { BookletFile } from '@/lib/booklet/booklet'
import type { FooterNotice } from '@/lib/booklet/chrome'
import type { SwatchImages } from '@/lib/booklet/swatches'
import type { BookletOptions } from '@/lib/schemas/booklet'

export interface BuildRequest {
  readonly id: number
  readonly design: Design
  readonly options: BookletOptions
  readonly swatches?: SwatchImages
  /** A notice with a person's name on every page (a tester's test copy). */
  readonly footer?: FooterNotice
}

export type BuildReply =
  | { readonly id: number; readonly kind: 'page'; readonly page: number }
  | { readonly id: number; readonly kind: 'done'; readonly file: BookletFile }
  | { readonly id: number; readonly kind: 'error'; readonly message: string }

/** A built booklet and where it was built (the preview says so, for the tests). */
export type BuiltFile = BookletFile & { readonly builtIn: 'worker' | 'main thread' }

/** The error a build that was stopped for a newer one rejects with. */
export class BuildCancelled extends Error {
  constructor() {
    super('a newer booklet was asked for')
  }
}

/** The booklet built on the main thread: the fallback where no worker can start. */
async function buildHere(design: Design, options: BookletOptions, onPage: (page: number) => void, swatches: SwatchImages | undefined, footer: FooterNotice | undefined): Promise<BuiltFile> {
  const { buildBookletFile } = await import('@/lib/booklet/booklet')
  // Let "building" paint before the tab is busy.
  await new Promise((resolve) => setTimeout(resolve, 0))
  return { ...buildBookletFile(design, options, { onPage, swatches, footer }), builtIn: 'main thread' }
}

/**
 * One builder per print dialog.
 *
 * @example const builder = createBookletBuilder(); const file = await builder.build(design, options, (page) => show(page), swatches); builder.dispose()
 */
export function createBookletBuilder(): {
  build(design: Design, options: BookletOptions, onPage: (page: number) => void, swatches?: SwatchImages, footer?: FooterNotice): Promise<BuiltFile>
  cancel(): void
  dispose(): void
} {
  let worker: Worker | null = null
  let workerFailed = false
  let nextId = 0
  let pending: { id: number; reject: (error: Error) => void } | null = null

  const startWorker = (): Worker | null => {
    if (workerFailed || typeof Worker === 'undefined') return null
    try {
      worker ??= new Worker(new URL('./booklet.worker.ts', import.meta.url), { type: 'module' })
      return worker
    } catch {
      workerFailed = true
      return null
    }
  }
  const stopWorker = (): void => {
    worker?.terminate()
    worker = null
  }
  const cancel = (): void => {
    if (!pending) return
    // The worker is in the middle of a synchronous build: ending it is the only way to stop it.
    stopWorker()
    pending.reject(new BuildCancelled())
    pending = null
  }

  return {
    build(design, options, onPage, swatches, footer) {
      cancel()
      const running = startWorker()
      if (!running) return buildHere(design, options, onPage, swatches, footer)
      const id = ++nextId
      return new Promise<BuiltFile>((resolve, reject) => {
        pending = { id, reject }
        const settle = (): boolean => {
          if (pending?.id !== id) return false
          pending = null
          return true
        }
        running.onmessage = (event: MessageEvent<BuildReply>) => {
          const message = event.data
          if (message.id !== id) return
          if (message.kind === 'page') onPage(message.page)
          else if (message.kind === 'done' && settle()) resolve({ ...message.file, builtIn: 'worker' })
          else if (message.kind === 'error' && settle()) reject(new Error(message.message))
        }
        running.onerror = (event) => {
          // The worker could not load or crashed: build here this time and every time after.
          event.preventDefault()
          console.warn(`The booklet worker failed (${event.message}); building on the main thread instead.`)
          workerFailed = true
          stopWorker()
          if (settle()) buildHere(design, options, onPage, swatches, footer).then(resolve, reject)
        }
        // The swatch bytes are copied, not moved: the next build may need them again.
        running.postMessage({ id, design, options, swatches, footer } satisfies BuildRequest)
      })
    },
    cancel,
    dispose() {
      cancel()
      stopWorker()
    },
  }
}
