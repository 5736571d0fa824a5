/**
 * What each page of a written booklet shows, in plain words, returned beside the PDF so the print
 * room can label its thumbnails and count the tiles of each foundation without reading text back
 * out of the PDF. Pure: built from the first page of each part and the foundations' tile layouts.
 */
import { BOOKLET_PARTS, type BookletPart } from '@/lib/schemas/booklet'
import type { FoundationKind } from './model'
import { sheetName, type TileLayout } from './tiling'

/** Where a foundation page sits among the pages of its foundation. */
export interface FoundationPagePlace {
  readonly section: string
  /** True for the mirrored repeats of an alternately mirrored ring. */
  readonly mirroredRepeat: boolean
  /** This page among the foundation's pages, from 1. */
  readonly sheet: number
  readonly sheets: number
  /** The tile's place as the page header prints it (the tiling's label, e.g. "row 1, column 2"). */
  readonly tile: string
}

/** One page of the booklet. */
export interface BookletPage {
  /** From 1, as printed at the page foot. */
  readonly number: number
  readonly part: BookletPart
  /** Plain words for the page, e.g. "foundation A, sheet 2 of 4 (row 1, column 2)" or "sewing steps, page 1 of 3". */
  readonly description: string
  /** Set on foundation pages only. */
  readonly foundation?: FoundationPagePlace
}

/** How one foundation lies across the pages. */
export interface FoundationTiling {
  readonly section: string
  readonly mirroredRepeat: boolean
  /** Which repeats, in the maker's words. */
  readonly repeatName: string
  /** How many of this foundation to print and sew. */
  readonly count: number
  /** Booklet pages this foundation takes (its tiles). */
  readonly pages: number
  readonly rows: number
  readonly columns: number
  /** Its first booklet page, from 1. */
  readonly firstPage: number
}

/** Each part's name as the page descriptions use it. */
export const PART_PAGE_NAMES: Readonly<Record<BookletPart, string>> = {
  cover: 'cover, fabric and cutting list',
  cutting: 'cutting diagrams',
  cautions: 'printing notes and cautions',
  steps: 'sewing steps',
  foundations: 'foundations',
  templates: 'templates',
  guide: 'placement guide',
}

/**
 * The foundation's name in words: "foundation A", or "foundation A (mirror image)".
 *
 * @example foundationName({ section: 'B', mirroredRepeat: true }) // 'foundation B (mirror image)'
 */
export function foundationName(foundation: { section: string; mirroredRepeat: boolean }): string {
  return `foundation ${foundation.section}${foundation.mirroredRepeat ? ' (mirror image)' : ''}`
}

/**
 * The pages of a booklet: every part's pages run from its first page to the page before the next
 * written part (a part that wrote nothing takes none); foundation pages follow their layouts,
 * one page per tile, in the order the foundations were written.
 *
 * @example
 * describePages({ partPages: { cover: 1, foundations: 3 }, foundations: [{ kind, layout }], pageCount: 6 })[3]
 * // { number: 4, part: 'foundations', description: 'foundation A, sheet 2 of 4 (row 1, column 2)', foundation: { … } }
 */
export function describePages(input: {
  readonly partPages: Partial<Record<BookletPart, number>>
  readonly foundations: readonly { kind: FoundationKind; layout: TileLayout }[]
  readonly pageCount: number
}): BookletPage[] {
  const { partPages, pageCount } = input
  const starts = BOOKLET_PARTS.flatMap((part) => (partPages[part] === undefined ? [] : [{ part, first: partPages[part] }]))
  const pages: BookletPage[] = []
  starts.forEach(({ part, first }, index) => {
    const end = (starts[index + 1]?.first ?? pageCount + 1) - 1
    const count = end - first + 1
    if (count <= 0) return
    if (part === 'foundations') {
      pages.push(...foundationPages(first, input.foundations))
      return
    }
    for (let number = first; number <= end; number += 1) {
      const along = count > 1 ? `, page ${number - first + 1} of ${count}` : ''
      pages.push({ number, part, description: `${PART_PAGE_NAMES[part]}${along}` })
    }
  })
  return pages
}

function foundationPages(first: number, foundations: readonly { kind: FoundationKind; layout: TileLayout }[]): BookletPage[] {
  const pages: BookletPage[] = []
  let number = first
  for (const { kind, layout } of foundations) {
    const sheets = layout.tiles.length
    for (const tile of layout.tiles) {
      const place: FoundationPagePlace = { section: kind.section, mirroredRepeat: kind.mirroredRepeat, sheet: tile.sheet, sheets, tile: tile.label }
      // The page's own names, as its header prints them: "sheet 2 of 4", then the tile's place.
      const where = sheets > 1 ? ` (${tile.label})` : ''
      pages.push({ number, part: 'foundations', description: `${foundationName(kind)}, ${sheetName(tile.sheet, sheets)}${where}`, foundation: place })
      number += 1
    }
  }
  return pages
}

/**
 * How each foundation is tiled, in the order printed.
 *
 * @example foundationTilings(written.foundations.map(({ sheet, layout }) => ({ kind: sheet.kind, layout })), 5)[0] // { section: 'A', pages: 4, rows: 2, columns: 2, … }
 */
export function foundationTilings(foundations: readonly { kind: FoundationKind; layout: TileLayout }[], firstPage: number): FoundationTiling[] {
  let page = firstPage
  return foundations.map(({ kind, layout }) => {
    const tiling: FoundationTiling = {
      section: kind.section, mirroredRepeat: kind.mirroredRepeat, repeatName: kind.repeatName, count: kind.count,
      pages: layout.tiles.length, rows: layout.rows, columns: layout.columns, firstPage: page,
    }
    page += layout.tiles.length
    return tiling
  })
}
