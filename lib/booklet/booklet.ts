/**
 * The pattern booklet: cover, cutting diagrams, sewing steps, foundations, templates, placement guide and cautions,
 * in one PDF at true scale. Pure: the same code runs in the browser (the print dialog) and in
 * Node (the command line, the tests); no file or network access.
 */
import type { jsPDF } from 'jspdf'
import type { Design } from '@/geometry'
import { bookletOptionsSchema, type BookletOptionsInput, type BookletPart } from '@/lib/schemas/booklet'
import { writeCautions } from './cautions'
import { drawFooterOnEveryPage, type FooterNotice } from './chrome'
import { createContext, type BookletContext } from './context'
import { writeCover } from './cover'
import { writeCuttingDiagrams } from './cutting-diagrams'
import { writeFoundationPages, type FoundationSheet } from './foundation-pages'
import { bookletModel, type BookletModel } from './model'
import { describePages, foundationTilings, type BookletPage, type FoundationTiling } from './page-list'
import { writeSteps } from './steps'
import type { SwatchImages } from './swatches'
import { writePlacementGuide, writeTemplates } from './templates'
import type { TileLayout } from './tiling'

/** A written booklet and what tests and callers may want to know about it. */
export interface WrittenBooklet {
  readonly doc: jsPDF
  readonly model: BookletModel
  readonly foundations: readonly { sheet: FoundationSheet; layout: TileLayout }[]
  /** First page number of each part written. */
  readonly partPages: Partial<Record<BookletPart, number>>
  /** What every page shows, in plain words, in page order (for thumbnails and summaries). */
  readonly pages: readonly BookletPage[]
  /** How each foundation lies across the pages, in the order printed. */
  readonly tilings: readonly FoundationTiling[]
}

/** What a caller may hand in besides the options. */
export interface BookletExtras {
  /** Hears the number of each page as it is begun, for a progress display. */
  readonly onPage?: (page: number) => void
  /**
   * Swatch images by fabric role, prepared by the caller (the print room fetches the colourway's
   * swatch uploads); drawn beside each fabric's colour. Any that cannot be read are left out.
   */
  readonly swatches?: SwatchImages
  /**
   * A notice with a person's name at the foot of every page: a tester's "test copy – not for
   * sale", a buyer's licence. Left out, pages carry none.
   */
  readonly footer?: FooterNotice
}

/**
 * Writes the booklet into a jsPDF document (for tests that look inside; most callers want
 * `buildBooklet`). Options are parsed with the shared schema, so defaults apply.
 *
 * @example writeBooklet(design, { paper: 'a4' }).doc.getNumberOfPages()
 */
export function writeBooklet(design: Design, input: BookletOptionsInput, extras: BookletExtras = {}): WrittenBooklet {
  const { onPage, swatches, footer } = extras
  const options = bookletOptionsSchema.parse(input)
  const model = bookletModel(design, options)
  const context = createContext(model, swatches)
  if (onPage) {
    // Every page after the first is added through jsPDF, which announces it before it is counted.
    onPage(1)
    context.doc.internal.events.subscribe('addPage', () => onPage(context.pages + 1))
  }
  const partPages: Partial<Record<BookletPart, number>> = {}
  let foundations: { sheet: FoundationSheet; layout: TileLayout }[] = []
  const include = new Set(options.parts)
  const mark = (part: BookletPart): void => {
    partPages[part] = context.pages + 1
  }
  // Printed in the schema's order whatever order the parts were asked in.
  if (include.has('cover')) {
    mark('cover')
    writeCover(context)
  }
  if (include.has('cutting')) {
    mark('cutting')
    writeCuttingDiagrams(context)
  }
  if (include.has('cautions')) {
    mark('cautions')
    writeCautions(context)
  }
  if (include.has('steps')) {
    mark('steps')
    writeSteps(context)
  }
  if (include.has('foundations')) {
    mark('foundations')
    foundations = writeFoundationPages(context)
  }
  if (include.has('templates')) {
    mark('templates')
    writeTemplates(context)
  }
  if (include.has('guide')) {
    mark('guide')
    writePlacementGuide(context)
  }
  const written = ensureOnePage(context)
  if (footer) drawFooterOnEveryPage(context.doc, context.frame, footer)
  const kinds = foundations.map(({ sheet, layout }) => ({ kind: sheet.kind, layout }))
  const pages = written ? describePages({ partPages, foundations: kinds, pageCount: context.pages }) : [{ number: 1, part: options.parts[0]!, description: 'no parts were chosen' }]
  const tilings = foundationTilings(kinds, partPages.foundations ?? 1)
  return { doc: context.doc, model, foundations, partPages, pages, tilings }
}

/** A PDF always has a page; a booklet of nothing still says what it is. False when it had to add one. */
function ensureOnePage(context: BookletContext): boolean {
  if (context.pages > 0) return true
  context.pages = 1
  context.doc.text(`${context.model.design.name}: no parts were chosen.`, context.frame.printable.x, context.frame.printable.y + 12)
  return false
}

/**
 * The booklet as PDF bytes.
 *
 * @example
 * const bytes = buildBooklet(design, { paper: 'letter', colorway: 'Holly', finishedDiameterInches: 24 })
 * // bytes starts with '%PDF-'
 */
export function buildBooklet(design: Design, options: BookletOptionsInput): Uint8Array {
  return new Uint8Array(writeBooklet(design, options).doc.output('arraybuffer'))
}

/** A booklet file and what its pages show. */
export interface BookletFile {
  readonly bytes: Uint8Array
  readonly pages: readonly BookletPage[]
  readonly tilings: readonly FoundationTiling[]
}

/**
 * The booklet as PDF bytes with the description of each page beside them (the print room shows
 * and downloads these same bytes).
 *
 * @example buildBookletFile(design, { paper: 'a4' }).pages[0]?.description // 'cover, fabric and cutting list, page 1 of 2' (a cover of two pages)
 */
export function buildBookletFile(design: Design, options: BookletOptionsInput, extras: BookletExtras = {}): BookletFile {
  const written = writeBooklet(design, options, extras)
  return { bytes: new Uint8Array(written.doc.output('arraybuffer')), pages: written.pages, tilings: written.tilings }
}
