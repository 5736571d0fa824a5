/**
 * Page thumbnails of PDF bytes, drawn in the browser by pdfjs-dist. Parsing runs in pdfjs's own
 * worker, served from this app's build: the bundler copies pdf.worker.min.mjs out of node_modules
 * because of the `new URL(…, import.meta.url)` below, so nothing is fetched from elsewhere.
 * Browser only: import it lazily from an effect.
 */
import type { PDFDocumentLoadingTask, PDFDocumentProxy, RenderTask } from 'pdfjs-dist'

type Pdfjs = typeof import('pdfjs-dist')

let loading: Promise<Pdfjs> | null = null

/** pdfjs-dist, loaded once, with its worker set. */
function loadPdfjs(): Promise<Pdfjs> {
  loading ??= import('pdfjs-dist').then((pdfjs) => {
    pdfjs.GlobalWorkerOptions.workerSrc = new URL('pdfjs-dist/build/pdf.worker.min.mjs', import.meta.url).toString()
    return pdfjs
  })
  return loading
}

/** An open PDF whose pages can be drawn small, one at a time. */
export interface ThumbnailSource {
  readonly pageCount: number
  /**
   * Draws page `pageNumber` (from 1) `widthPx` CSS pixels wide and returns a PNG object URL
   * (the caller revokes it). Rejects when the source was closed meanwhile.
   */
  draw(pageNumber: number, widthPx: number): Promise<string>
  /** Stops any drawing under way and frees the document. */
  close(): void
}

/**
 * Opens PDF bytes for thumbnails. The bytes are copied, since pdfjs hands its buffer to the
 * worker: the caller's bytes stay whole for the download.
 *
 * @example const source = await openThumbnails(bytes); const url = await source.draw(1, 140); source.close()
 */
export async function openThumbnails(bytes: Uint8Array): Promise<ThumbnailSource> {
  const pdfjs = await loadPdfjs()
  // isEvalSupported: false: pdfjs never tries `new Function` (the page's policy has no 'unsafe-eval').
  const task: PDFDocumentLoadingTask = pdfjs.getDocument({ data: bytes.slice(), verbosity: 0, isEvalSupported: false })
  const doc: PDFDocumentProxy = await task.promise
  let closed = false
  let rendering: RenderTask | null = null
  return {
    pageCount: doc.numPages,
    async draw(pageNumber, widthPx) {
      if (closed) throw new Error('closed')
      const page = await doc.getPage(pageNumber)
      const unscaled = page.getViewport({ scale: 1 })
      // Sharp on high-density screens, but never more than twice the CSS size.
      const density = Math.min(2, globalThis.devicePixelRatio || 1)
      const viewport = page.getViewport({ scale: (widthPx * density) / unscaled.width })
      const canvas = document.createElement('canvas')
      canvas.width = Math.ceil(viewport.width)
      canvas.height = Math.ceil(viewport.height)
      rendering = page.render({ canvas, viewport, background: '#ffffff' })
      try {
        await rendering.promise
      } finally {
        rendering = null
        page.cleanup()
      }
      if (closed) throw new Error('closed')
      const blob = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, 'image/png'))
      if (!blob) throw new Error(`page ${pageNumber} could not be drawn`)
      return URL.createObjectURL(blob)
    },
    close() {
      closed = true
      rendering?.cancel()
      void task.destroy()
    },
  }
}
