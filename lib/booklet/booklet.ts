/**
 * The pattern booklet: cover, sewing steps, foundations, templates, placement guide and cautions,
 * in one PDF at true scale. Pure: the same code runs in the browser (the print dialog) and in
 * Node (the command line, the tests); no file or network access.
 */
import type { jsPDF } from 'jspdf'
import type { Design } from '@/geometry'
import { bookletOptionsSchema, type BookletOptionsInput, type BookletPart } from '@/lib/schemas/booklet'
import { writeCautions } from './cautions'
import { createContext, type BookletContext } from './context'
import { writeCover } from './cover'
import { writeFoundationPages, type FoundationSheet } from './foundation-pages'
import { bookletModel, type BookletModel } from './model'
import { writeSteps } from './steps'
import { writePlacementGuide, writeTemplates } from './templates'
import type { TileLayout } from './tiling'

/** A written booklet and what tests and callers may want to know about it. */
export interface WrittenBooklet {
  readonly doc: jsPDF
  readonly model: BookletModel
  readonly foundations: readonly { sheet: FoundationSheet; layout: TileLayout }[]
  /** First page number of each part written. */
  readonly partPages: Partial<Record<BookletPart, number>>
}

/**
 * Writes the booklet into a jsPDF document (for tests that look inside; most callers want
 * `buildBooklet`). Options are parsed with the shared schema, so defaults apply.
 *
 * @example writeBooklet(design, { paper: 'a4' }).doc.getNumberOfPages()
 */
export function writeBooklet(design: Design, input: BookletOptionsInput): WrittenBooklet {
  const options = bookletOptionsSchema.parse(input)
  const model = bookletModel(design, options)
  const context = createContext(model)
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
  ensureOnePage(context)
  return { doc: context.doc, model, foundations, partPages }
}

/** A PDF always has a page; a booklet of nothing still says what it is. */
function ensureOnePage(context: BookletContext): void {
  if (context.pages > 0) return
  context.pages = 1
  context.doc.text(`${context.model.design.name}: no parts were chosen.`, context.frame.printable.x, context.frame.printable.y + 12)
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
