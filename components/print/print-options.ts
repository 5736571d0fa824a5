/**
 * The print dialog's form state turned into booklet options through the shared schema, and the
 * file name the download gets. No React, so it can be tested on its own.
 */
import type { BookletPage, FoundationTiling } from '@/lib/booklet/page-list'
import { bookletOptionsSchema, BOOKLET_PARTS, type BookletOptions, type BookletPart, type PaperName } from '@/lib/schemas/booklet'
import { EXTRA_PERCENT_RANGE, WIDTH_OF_FABRIC_RANGE_INCHES } from '@/lib/schemas/cutting-settings'
import { centimetresToInches, inchesToCentimetres } from '@/lib/units'

export interface PrintFormState {
  readonly paper: PaperName
  readonly orientation: 'portrait' | 'landscape'
  readonly colorway: string
  /** As typed, in the design's units. */
  readonly diameter: string
  readonly units: 'in' | 'cm'
  readonly parts: readonly BookletPart[]
  readonly margin: string
  readonly overlap: string
  /** The usable width of fabric as typed, in the design's units. */
  readonly widthOfFabric: string
  /** The extra on every amount as typed, percent. */
  readonly extraPercent: string
}

/**
 * A length in inches as the form shows it in the design's units (centimetres to a tenth).
 *
 * @example lengthInUnits(40, 'cm') // '101.6'
 */
export function lengthInUnits(inches: number, units: 'in' | 'cm'): string {
  return units === 'cm' ? String(Math.round(inchesToCentimetres(inches) * 10) / 10) : String(inches)
}

/** Friendly names of the booklet's parts for the checkboxes. */
export const PART_TITLES: Readonly<Record<BookletPart, string>> = {
  cover: 'Cover, fabric and cutting list',
  cutting: 'Cutting diagrams, fabric by fabric',
  cautions: 'Printing notes and cautions',
  steps: 'Sewing steps, joins and finishing',
  foundations: 'Foundations (true scale, tiled)',
  templates: 'Leaf and berry templates',
  guide: 'Stem ring and curl placement guide',
}

export const ALL_PARTS: readonly BookletPart[] = BOOKLET_PARTS

/**
 * Booklet options from the form, or the first problem in words.
 *
 * @example printOptionsFrom({ paper: 'a4', orientation: 'portrait', colorway: 'Holly', diameter: '24', units: 'in', parts: ['foundations'], margin: '0.4', overlap: '0.5', widthOfFabric: '40', extraPercent: '10' })
 * // { ok: true, options: { paper: 'a4', finishedDiameterInches: 24, … } }
 */
export function printOptionsFrom(state: PrintFormState): { ok: true; options: BookletOptions } | { ok: false; message: string } {
  const diameter = Number(state.diameter)
  if (state.diameter.trim() === '' || !Number.isFinite(diameter) || diameter <= 0) return { ok: false, message: 'The finished diameter must be a positive number.' }
  const margin = Number(state.margin)
  const overlap = Number(state.overlap)
  // An empty field is no number (Number('') is 0, which the extra would accept).
  const typed = (text: string): number => (text.trim() === '' ? Number.NaN : Number(text))
  const width = typed(state.widthOfFabric)
  const parsed = bookletOptionsSchema.safeParse({
    paper: state.paper,
    orientation: state.orientation,
    colorway: state.colorway || undefined,
    finishedDiameterInches: state.units === 'cm' ? centimetresToInches(diameter) : diameter,
    parts: ALL_PARTS.filter((part) => state.parts.includes(part)),
    marginInches: margin,
    overlapInches: overlap,
    widthOfFabricIn: state.units === 'cm' ? centimetresToInches(width) : width,
    extraPercent: typed(state.extraPercent),
  })
  if (parsed.success) return { ok: true, options: parsed.data }
  const issue = parsed.error.issues[0]
  const field = String(issue?.path[0] ?? '')
  const names: Record<string, string> = {
    parts: 'Choose at least one part of the booklet.',
    marginInches: 'The margin must be between 0.1 and 1.5 in.',
    overlapInches: 'The overlap must be between 0.25 and 2 in.',
    finishedDiameterInches: 'The finished diameter must be at most 200 in.',
    // The shared range of the cutting settings, in the units the width was typed in.
    widthOfFabricIn: `The usable width of fabric must be between ${lengthInUnits(WIDTH_OF_FABRIC_RANGE_INCHES[0], state.units)} and ${lengthInUnits(WIDTH_OF_FABRIC_RANGE_INCHES[1], state.units)} ${state.units}.`,
    extraPercent: `The extra must be between ${EXTRA_PERCENT_RANGE[0]} and ${EXTRA_PERCENT_RANGE[1]} %.`,
  }
  return { ok: false, message: names[field] ?? `${field}: ${issue?.message ?? 'invalid'}` }
}

/**
 * A file name for the booklet: pattern, colourway, size and paper, safe on every system.
 *
 * @example bookletFileName('Hollyberry Wreath', { paper: 'letter', colorway: 'Holly', finishedDiameterInches: 24 }) // 'hollyberry-wreath-holly-24in-letter.pdf'
 */
export function bookletFileName(name: string, options: Pick<BookletOptions, 'paper' | 'colorway' | 'finishedDiameterInches'>): string {
  const slug = (text: string): string => text.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '')
  const size = options.finishedDiameterInches ? `${Math.round(options.finishedDiameterInches * 100) / 100}in` : ''
  return `${[slug(name) || 'pattern', options.colorway ? slug(options.colorway) : '', size, options.paper].filter(Boolean).join('-')}.pdf`
}

/** What the preview says about a built booklet before it is downloaded. */
export interface BookletSummary {
  readonly pageCount: number
  /** "13 pages" */
  readonly headline: string
  /** One line per foundation: "Foundation A for every repeat (all 4), make 4: 4 pages (2 rows × 2 columns)". */
  readonly foundations: readonly string[]
  /** Pages of each part written, for parts that wrote any. */
  readonly parts: readonly { part: BookletPart; title: string; pages: number }[]
}

const plural = (count: number, word: string): string => `${count} ${word}${count === 1 ? '' : 's'}`

/**
 * The page count, the pages of each part and the tiles of each foundation of a built booklet.
 *
 * @example bookletSummary({ pages, tilings }).foundations[0] // 'Foundation A for every repeat (all 4), make 4: 4 pages (2 rows × 2 columns)'
 */
export function bookletSummary(booklet: { pages: readonly BookletPage[]; tilings: readonly FoundationTiling[] }): BookletSummary {
  const { pages, tilings } = booklet
  const parts = ALL_PARTS.flatMap((part) => {
    const count = pages.filter((page) => page.part === part).length
    return count > 0 ? [{ part, title: PART_TITLES[part], pages: count }] : []
  })
  const foundations = tilings.map((tiling) => {
    const layout = tiling.pages > 1 ? ` (${plural(tiling.rows, 'row')} × ${plural(tiling.columns, 'column')})` : ''
    return `Foundation ${tiling.section} for ${tiling.repeatName}, make ${tiling.count}: ${plural(tiling.pages, 'page')}${layout}`
  })
  return { pageCount: pages.length, headline: plural(pages.length, 'page'), foundations, parts }
}

/**
 * A thumbnail's alternative text.
 *
 * @example thumbnailAlt({ number: 3, description: 'foundation A, sheet 2 of 4 (row 1, column 2)' }) // 'page 3: foundation A, sheet 2 of 4 (row 1, column 2)'
 */
export function thumbnailAlt(page: Pick<BookletPage, 'number' | 'description'>): string {
  return `page ${page.number}: ${page.description}`
}
