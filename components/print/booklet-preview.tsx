'use client'

/**
 * The print room's preview: the booklet's page count, the tiles of each foundation and a
 * thumbnail of every page, drawn from the very bytes the download button saves. Thumbnails are
 * drawn one at a time, those in view first, with a pause between pages so a long booklet never
 * holds up the tab.
 */
import { useCallback, useEffect, useRef, useState } from 'react'
import { pageFrame } from '@/lib/booklet/paper'
import { bookletSummary, thumbnailAlt } from './print-options'
import { PROGRESS_DELAY_MS, type BuiltBooklet, type PreviewState } from './use-booklet-preview'

/** Thumbnail width, CSS pixels. */
const THUMBNAIL_WIDTH_PX = 120

interface Thumbnails {
  /** Object URL of each page's picture, by page index; undefined until drawn. */
  readonly urls: readonly (string | undefined)[]
  readonly drawn: number
  readonly failure: string | null
  /** True once drawing has taken longer than a moment. */
  readonly slow: boolean
  /** A ref callback for the element of page `index`, so pages in view are drawn first. */
  readonly watch: (index: number) => (element: HTMLElement | null) => void
}

interface Drawing {
  readonly booklet: BuiltBooklet | null
  readonly urls: readonly (string | undefined)[]
  readonly failure: string | null
  readonly slow: boolean
}

const NOTHING_DRAWN: Drawing = { booklet: null, urls: [], failure: null, slow: false }

/** Draws every page of the booklet in the background, the pages in view first. */
function useThumbnails(booklet: BuiltBooklet | null): Thumbnails {
  // What has been drawn, and for which booklet: drawings of an older booklet read as none.
  const [drawing, setDrawing] = useState<Drawing>(NOTHING_DRAWN)
  const inView = useRef(new Set<number>())
  const observer = useRef<IntersectionObserver | null>(null)
  const wake = useRef<(() => void) | null>(null)

  // Made on first use: refs are attached before effects run.
  const getObserver = useCallback((): IntersectionObserver => {
    observer.current ??= new IntersectionObserver((entries) => {
      for (const entry of entries) {
        const index = Number((entry.target as HTMLElement).dataset.pageIndex)
        if (entry.isIntersecting) inView.current.add(index)
        else inView.current.delete(index)
      }
      wake.current?.()
    }, { rootMargin: '200px' })
    return observer.current
  }, [])
  useEffect(() => () => {
    observer.current?.disconnect()
    observer.current = null
  }, [])

  // One ref callback per page index, kept, so React does not detach and attach it on every render.
  const watchers = useRef(new Map<number, (element: HTMLElement | null) => () => void>())
  const watch = useCallback((index: number) => {
    let watcher = watchers.current.get(index)
    if (!watcher) {
      watcher = (element: HTMLElement | null) => {
        if (element) {
          element.dataset.pageIndex = String(index)
          getObserver().observe(element)
        }
        return () => {
          if (element) observer.current?.unobserve(element)
          inView.current.delete(index)
        }
      }
      watchers.current.set(index, watcher)
    }
    return watcher
  }, [getObserver])

  useEffect(() => {
    if (!booklet) return
    let stopped = false
    let close: (() => void) | null = null
    const made: string[] = []
    const update = (change: Partial<Drawing>): void =>
      setDrawing((current) => ({ ...(current.booklet === booklet ? current : { ...NOTHING_DRAWN, booklet }), ...change }))
    const slowTimer = setTimeout(() => update({ slow: true }), PROGRESS_DELAY_MS)
    void (async () => {
      try {
        const { openThumbnails } = await import('./pdf-thumbnails')
        if (stopped) return
        const source = await openThumbnails(booklet.bytes)
        close = source.close
        if (stopped) return source.close()
        const waiting = new Set(Array.from({ length: source.pageCount }, (_, index) => index))
        const drawn: (string | undefined)[] = []
        while (waiting.size > 0 && !stopped) {
          const visible = [...waiting].filter((index) => inView.current.has(index))
          const index = Math.min(...(visible.length > 0 ? visible : waiting))
          waiting.delete(index)
          const url = await source.draw(index + 1, THUMBNAIL_WIDTH_PX)
          if (stopped) {
            URL.revokeObjectURL(url)
            return
          }
          made.push(url)
          drawn[index] = url
          update({ urls: [...drawn] })
          // A pause between pages keeps the tab answering clicks and keys.
          await new Promise<void>((resolve) => {
            wake.current = resolve
            setTimeout(resolve, 0)
          })
        }
      } catch (error) {
        if (!stopped) update({ failure: `The thumbnails could not be drawn: ${error instanceof Error ? error.message : String(error)}` })
      }
    })()
    return () => {
      stopped = true
      clearTimeout(slowTimer)
      close?.()
      for (const url of made) URL.revokeObjectURL(url)
    }
  }, [booklet])

  const current = drawing.booklet === booklet ? drawing : NOTHING_DRAWN
  return { urls: current.urls, drawn: current.urls.filter(Boolean).length, failure: current.failure, slow: current.slow, watch }
}

/** The words the live region says for a state, and the progress bar's value. */
function progressOf(state: PreviewState, thumbnails: Thumbnails): { text: string; value?: number; max?: number; show: boolean } {
  if (state.kind === 'waiting') return { text: '', show: false }
  if (state.kind === 'error') return { text: state.message, show: false }
  if (state.kind === 'building') return { text: state.slow ? `Building the booklet: page ${state.page}…` : '', show: state.slow }
  const total = state.booklet.pages.length
  if (thumbnails.failure) return { text: thumbnails.failure, show: false }
  if (thumbnails.drawn < total) {
    return { text: thumbnails.slow ? `Drawing thumbnails ${thumbnails.drawn} of ${total}` : '', value: thumbnails.drawn, max: total, show: thumbnails.slow }
  }
  return { text: `Preview ready: ${total} page${total === 1 ? '' : 's'}.`, show: false }
}

/**
 * The preview beside the print options.
 *
 * @example <BookletPreview state={preview} current={preview.kind === 'built' && preview.booklet.key === key} />
 */
export function BookletPreview({ state, current }: { state: PreviewState; current: boolean }) {
  const booklet = state.kind === 'built' ? state.booklet : state.kind === 'building' ? state.previous : null
  const thumbnails = useThumbnails(booklet)
  const progress = progressOf(state, thumbnails)
  const summary = booklet ? bookletSummary(booklet) : null
  const frame = booklet ? pageFrame(booklet.options) : null

  return (
    <section aria-labelledby="print-preview-heading" className="min-w-0 space-y-3" data-testid="print-preview" data-booklet-bytes={booklet?.bytes.length} data-built-in={booklet?.builtIn}>
      <h3 id="print-preview-heading" className="text-base font-semibold">
        Preview{summary ? `: ${summary.headline}` : ''}
      </h3>
      <p id="print-status" role="status" aria-live="polite" className={`text-sm ${state.kind === 'error' || thumbnails.failure ? 'text-madder-700' : 'text-stone-600'}`}>
        {progress.text}
      </p>
      {progress.show && (
        <progress className="h-2 w-full max-w-xs" value={progress.value} max={progress.max} aria-label="Preview progress">
          {progress.text}
        </progress>
      )}
      {summary && (
        <div className={`space-y-2 text-sm ${current ? '' : 'opacity-60'}`} data-testid="print-summary">
          <p>
            <span data-testid="print-page-count">{summary.headline}</span> in all
            {summary.parts.length > 0 && `: ${summary.parts.map((part) => `${part.title.toLowerCase()} ${part.pages}`).join('; ')}.`}
          </p>
          {summary.foundations.length > 0 && (
            <ul className="list-disc pl-5" aria-label="Tiles per foundation" data-testid="print-tiling">
              {summary.foundations.map((line) => (
                <li key={line}>{line}</li>
              ))}
            </ul>
          )}
        </div>
      )}
      {booklet && frame && (
        <ol className={`grid max-h-[36rem] grid-cols-[repeat(auto-fill,minmax(7.5rem,1fr))] gap-3 overflow-y-auto pr-1 ${current ? '' : 'opacity-60'}`} aria-label="Booklet pages">
          {booklet.pages.map((page, index) => {
            const url = thumbnails.urls[index]
            const alt = thumbnailAlt(page)
            return (
              <li key={page.number} ref={thumbnails.watch(index)} className="space-y-1 text-center text-xs text-stone-600">
                {url ? (
                  // eslint-disable-next-line @next/next/no-img-element -- a picture drawn in the browser, not a file to optimise
                  <img src={url} alt={alt} width={THUMBNAIL_WIDTH_PX} className="mx-auto w-full border border-stone-300 bg-white shadow-sm" data-testid="page-thumbnail" />
                ) : (
                  <div
                    role="img"
                    aria-label={`${alt} (not drawn yet)`}
                    className="mx-auto w-full animate-pulse border border-stone-200 bg-linen-100"
                    style={{ aspectRatio: `${frame.widthPt} / ${frame.heightPt}` }}
                  />
                )}
                <span aria-hidden="true">{page.foundation && page.foundation.sheets > 1 ? `${page.number} · ${page.foundation.section} ${page.foundation.sheet}/${page.foundation.sheets}` : page.number}</span>
              </li>
            )
          })}
        </ol>
      )}
    </section>
  )
}
