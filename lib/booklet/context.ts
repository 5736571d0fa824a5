/**
 * The booklet being written: the jsPDF document, the page frame and a page counter. Each part
 * asks for a new page through `startPage`, so every page has the same size and orientation.
 */
import { jsPDF } from 'jspdf'
import type { BookletModel } from './model'
import { pageFrame, type PageFrame } from './paper'
import { readSwatches, type ReadySwatch, type SwatchImages } from './swatches'

export interface BookletContext {
  readonly doc: jsPDF
  readonly frame: PageFrame
  readonly model: BookletModel
  /** The swatch images that could be read, by fabric role (lib/booklet/swatches.ts). */
  readonly swatches: ReadonlyMap<string, ReadySwatch>
  /** Pages written so far. */
  pages: number
}

/**
 * A new, empty booklet for the model's paper (points as the unit: 1 unit = 1/72 in), with the
 * swatch images given, per fabric role, read once.
 *
 * @example const context = createContext(model); startPage(context)
 */
export function createContext(model: BookletModel, swatchImages?: SwatchImages): BookletContext {
  const frame = pageFrame(model.options)
  const doc = new jsPDF({
    unit: 'pt',
    format: [frame.widthPt, frame.heightPt],
    orientation: frame.widthPt > frame.heightPt ? 'landscape' : 'portrait',
    // Four decimals keep A4's 595.2756 pt and the 2 cm square's 56.6929 pt as written.
    floatPrecision: 4,
    compress: true,
  })
  doc.setProperties({ title: `${model.design.name} - pattern booklet`, creator: 'Wreathwright' })
  return { doc, frame, model, swatches: readSwatches(doc, swatchImages), pages: 0 }
}

/** Starts the next page (the document's first page already exists). Returns its number, from 1. */
export function startPage(context: BookletContext): number {
  if (context.pages > 0) {
    context.doc.addPage([context.frame.widthPt, context.frame.heightPt], context.frame.widthPt > context.frame.heightPt ? 'landscape' : 'portrait')
  }
  context.pages += 1
  return context.pages
}
