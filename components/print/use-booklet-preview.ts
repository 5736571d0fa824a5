'use client'

/**
 * The booklet behind the print room's preview: rebuilt in a Web Worker a moment after the options
 * stop changing, a build under way stopped when the options change again, and the bytes kept so
 * the download is exactly what the thumbnails show.
 */
import { useEffect, useRef, useState } from 'react'
import type { BookletPage, FoundationTiling } from '@/lib/booklet/page-list'
import type { FooterNotice } from '@/lib/booklet/chrome'
import type { SwatchImages } from '@/lib/booklet/swatches'
import type { BookletOptions } from '@/lib/schemas/booklet'
import type { Design } from '@/geometry'
import { BuildCancelled, createBookletBuilder } from './booklet-builder'

/** Wait this long after the last change before building (typing a diameter is several changes). */
export const PREVIEW_DEBOUNCE_MS = 300
/** Show progress only when a step takes longer than this. */
export const PROGRESS_DELAY_MS = 300

export interface BuiltBooklet {
  /** The options it was built from, as a key: a preview is current while the key matches. */
  readonly key: string
  readonly options: BookletOptions
  readonly bytes: Uint8Array
  readonly pages: readonly BookletPage[]
  readonly tilings: readonly FoundationTiling[]
  /** Where it was built: in the worker, or on the main thread where no worker could start. */
  readonly builtIn: 'worker' | 'main thread'
}

export type PreviewState =
  | { readonly kind: 'waiting' }
  /** `previous`: the last booklet built, still shown (dimmed) while the next one is made. */
  | {
    readonly kind: 'building'
    readonly key: string
    /** True once building has taken longer than a moment. */
    readonly slow: boolean
    /** The page being written, from 1. */
    readonly page: number
    readonly previous: BuiltBooklet | null
  }
  | { readonly kind: 'built'; readonly booklet: BuiltBooklet }
  | { readonly kind: 'error'; readonly message: string }

/**
 * A stable key for booklet options (the schema's field order is fixed) and the fabrics whose
 * swatch images were handed in.
 */
export function optionsKey(options: BookletOptions, swatches?: SwatchImages): string {
  const withSwatches = Object.keys(swatches ?? {}).sort()
  return withSwatches.length > 0 ? `${JSON.stringify(options)} swatches:${withSwatches.join(',')}` : JSON.stringify(options)
}

/**
 * Builds the booklet for the current options, debounced; `options` null (invalid form) or an
 * invalid design gives the error `problem`. Pass memoized options and swatches: a new object is a
 * new request.
 *
 * @example const preview = useBookletPreview(design, options.ok ? options.options : null, options.ok ? null : options.message, swatches)
 */
export function useBookletPreview(
  design: Design | null,
  options: BookletOptions | null,
  problem: string | null,
  swatches?: SwatchImages,
  footer?: FooterNotice,
): PreviewState {
  const [state, setState] = useState<PreviewState>({ kind: 'waiting' })
  const key = options ? optionsKey(options, swatches) : null
  // The latest request; a build that finishes after another was asked for is thrown away.
  const latest = useRef(0)
  const builder = useRef<ReturnType<typeof createBookletBuilder> | null>(null)
  useEffect(() => () => {
    builder.current?.dispose()
    builder.current = null
  }, [])

  useEffect(() => {
    // Any change makes a build under way stale, even one to options that cannot be built.
    const request = ++latest.current
    if (problem || !design || !options || key === null) return
    let slowTimer: ReturnType<typeof setTimeout> | undefined
    const build = async (): Promise<void> => {
      if (request !== latest.current) return
      setState((current) => ({
        kind: 'building', key, slow: false, page: 1,
        previous: current.kind === 'built' ? current.booklet : current.kind === 'building' ? current.previous : null,
      }))
      slowTimer = setTimeout(() => {
        if (request === latest.current) setState((current) => (current.kind === 'building' ? { ...current, slow: true } : current))
      }, PROGRESS_DELAY_MS)
      const onPage = (page: number): void => {
        if (request === latest.current) setState((current) => (current.kind === 'building' && current.key === key ? { ...current, page } : current))
      }
      try {
        builder.current ??= createBookletBuilder()
        const file = await builder.current.build(design, options, onPage, swatches, footer)
        if (request !== latest.current) return
        setState({ kind: 'built', booklet: { key, options, bytes: file.bytes, pages: file.pages, tilings: file.tilings, builtIn: file.builtIn } })
      } catch (error) {
        if (request !== latest.current || error instanceof BuildCancelled) return
        setState({ kind: 'error', message: `The booklet could not be built: ${error instanceof Error ? error.message : String(error)}` })
      } finally {
        clearTimeout(slowTimer)
      }
    }
    const debounce = setTimeout(() => void build(), PREVIEW_DEBOUNCE_MS)
    return () => {
      clearTimeout(debounce)
      clearTimeout(slowTimer)
      // The options changed: the booklet under way is stale, stop it.
      builder.current?.cancel()
    }
  }, [key, options, problem, design, swatches, footer])

  if (problem || !design || !options) return { kind: 'error', message: problem ?? 'The booklet cannot be built from these options.' }
  return state
}
