/**
 * Page furniture every page shares: the header line, the page number, and the test squares with
 * the instruction to print at actual size (common practice in sewing-pattern publishing: a square
 * of known size on every true-scale page shows at once whether the printer scaled it).
 */
import type { jsPDF } from 'jspdf'
import { centimetresToPoints, inchesToPoints } from '@/lib/units'
import type { PageFrame, PageRect } from './paper'
import { solidPen } from './draw'

/** 1 in test square side, points (ISO 32000-1:2008 §8.3.2.3: 1 in = 72 pt). */
export const INCH_SQUARE_PT = inchesToPoints(1)
/** 2 cm test square side, points (1 in = 25.4 mm exactly): 56.6929 pt. */
export const TWO_CENTIMETRE_SQUARE_PT = centimetresToPoints(2)

/** Height of the test-square band at the foot of a true-scale page, points. */
export const TEST_BAND_HEIGHT_PT = INCH_SQUARE_PT + 14
/** Height of the header band of a page, points. */
export const HEADER_HEIGHT_PT = 34

export const PRINT_AT_ACTUAL_SIZE = 'Print at 100 % (actual size). Do not scale or fit to page.'

/** Text in Helvetica at a size, black unless told. */
export function font(doc: jsPDF, size: number, style: 'normal' | 'bold' | 'italic' = 'normal', grey = 0): void {
  doc.setFont('helvetica', style)
  doc.setFontSize(size)
  doc.setTextColor(grey, grey, grey)
}

/**
 * Writes the page header: a bold title on the left, a small note under it, and an optional
 * label on the right (a tile's name), all inside the printable area.
 *
 * @example drawHeader(doc, frame, 'Foundation A', 'Printed side', 'sheet 2 of 4')
 */
export function drawHeader(doc: jsPDF, frame: PageFrame, title: string, note: string, label?: string): void {
  const { x, y, width } = frame.printable
  font(doc, 14, 'bold')
  const labelWidth = label ? doc.getTextWidth(label) + 12 : 0
  font(doc, 11, 'bold')
  doc.text(fitText(doc, title, width - labelWidth), x, y + 11)
  font(doc, 7.5, 'normal', 60)
  doc.text(fitText(doc, note, width - labelWidth), x, y + 23)
  if (label) {
    font(doc, 14, 'bold')
    // Inset a little: pdfjs measures bold glyphs a hair wider than jsPDF does.
    doc.text(label, x + width - 2, y + 20, { align: 'right' })
  }
  solidPen(doc, 0.5, [150, 150, 150])
  doc.line(x, y + HEADER_HEIGHT_PT - 4, x + width, y + HEADER_HEIGHT_PT - 4)
}

/** Shortens a line with an ellipsis until it fits `width` points at the current font. */
export function fitText(doc: jsPDF, text: string, width: number): string {
  if (doc.getTextWidth(text) <= width) return text
  let cut = text
  while (cut.length > 1 && doc.getTextWidth(`${cut}...`) > width) cut = cut.slice(0, -1)
  return `${cut}...`
}

/**
 * Draws the 1 in and 2 cm test squares as `re` rectangles, labelled, with the print-at-100 %
 * instruction beside them, in a band starting at `top`. Returns the band's rectangle.
 *
 * @example drawTestSquares(doc, frame.printable.x, frame.printable.y + frame.printable.height - TEST_BAND_HEIGHT_PT, 200)
 */
export function drawTestSquares(doc: jsPDF, left: number, top: number, textWidth: number): PageRect {
  const squareTop = top + 10
  solidPen(doc, 0.5)
  // Exactly 72 × 72 pt and 56.6929 × 56.6929 pt, drawn as rectangles so a reader can measure them.
  doc.rect(left, squareTop, INCH_SQUARE_PT, INCH_SQUARE_PT, 'S')
  const cmLeft = left + INCH_SQUARE_PT + 10
  doc.rect(cmLeft, squareTop, TWO_CENTIMETRE_SQUARE_PT, TWO_CENTIMETRE_SQUARE_PT, 'S')
  font(doc, 8, 'bold')
  doc.text('1 in', left + INCH_SQUARE_PT / 2, squareTop + INCH_SQUARE_PT / 2 + 3, { align: 'center' })
  doc.text('2 cm', cmLeft + TWO_CENTIMETRE_SQUARE_PT / 2, squareTop + TWO_CENTIMETRE_SQUARE_PT / 2 + 3, { align: 'center' })
  font(doc, 6.5, 'normal', 60)
  doc.text('Test squares', left, top + 6)
  const textLeft = cmLeft + TWO_CENTIMETRE_SQUARE_PT + 10
  font(doc, 8, 'bold')
  const lines: string[] = doc.splitTextToSize(PRINT_AT_ACTUAL_SIZE, textWidth - 6)
  doc.text(lines, textLeft, squareTop + 8)
  font(doc, 7, 'normal', 40)
  const check: string[] = doc.splitTextToSize('Measure both squares before you cut or sew. If they are not exactly 1 in and 2 cm, turn off any "fit" or "shrink" setting and print the page again.', textWidth - 6)
  doc.text(check, textLeft, squareTop + 10 + lines.length * 10)
  return { x: left, y: top, width: textLeft + textWidth - left, height: TEST_BAND_HEIGHT_PT }
}

/**
 * Writes "page n" at the foot of the printable area, right aligned.
 *
 * @example drawPageNumber(doc, frame, 3)
 */
export function drawPageNumber(doc: jsPDF, frame: PageFrame, pageNumber: number, patternName: string): void {
  const { x, y, width, height } = frame.printable
  font(doc, 7, 'normal', 90)
  doc.text(`${patternName} - page ${pageNumber}`, x + width - 2, y + height - 2, { align: 'right' })
}

/**
 * A notice printed at the foot of every page with a person's name, e.g. a tester's
 * `{ person: 'Sam Reed', notice: 'test copy – not for sale' }` or a buyer's
 * `{ person: 'Ada Lovelace', notice: 'licensed to Ada Lovelace for personal use' }`.
 */
export interface FooterNotice {
  /** Whose copy this is. */
  readonly person: string
  /** What the copy is; the line reads "{notice} · {person}". */
  readonly notice: string
}

/** Height of the footer line's text, points. */
const FOOTER_SIZE_PT = 7

/**
 * The footer line as printed (one line, no more than 160 characters).
 *
 * @example footerLine({ person: 'Sam Reed', notice: 'test copy – not for sale' }) // 'test copy – not for sale · Sam Reed'
 */
export function footerLine(footer: FooterNotice): string {
  const line = `${footer.notice} · ${footer.person}`.replace(/\s+/g, ' ').trim()
  return line.length > 160 ? `${line.slice(0, 159)}…` : line
}

/**
 * Writes the footer notice centred at the foot of the printable area of every page written so
 * far: after the whole booklet, so that every part (foundations, templates and text alike) gets
 * it. Centred, it keeps clear of the test squares (left) and the page number (right).
 *
 * jsPDF's standard Helvetica covers WinAnsi only: characters outside it (the en dash is inside)
 * would print as garbage, so they are replaced with "?".
 *
 * @example drawFooterOnEveryPage(doc, frame, { person: 'Sam Reed', notice: 'test copy – not for sale' })
 */
export function drawFooterOnEveryPage(doc: jsPDF, frame: PageFrame, footer: FooterNotice): void {
  const { x, y, width, height } = frame.printable
  const text = fitLine(doc, toWinAnsi(footerLine(footer)), width / 2)
  for (let page = 1; page <= doc.getNumberOfPages(); page += 1) {
    doc.setPage(page)
    font(doc, FOOTER_SIZE_PT, 'bold', 70)
    doc.text(text, x + width / 2, y + height - 1, { align: 'center' })
  }
}

/** fitText at the footer's font. */
function fitLine(doc: jsPDF, text: string, width: number): string {
  font(doc, FOOTER_SIZE_PT, 'bold', 70)
  return fitText(doc, text, width)
}

/** Characters Helvetica in jsPDF can print (Latin-1 plus the WinAnsi extras such as – and ’); the rest become "?". */
function toWinAnsi(text: string): string {
  return [...text].map((c) => (c.charCodeAt(0) <= 0xff || '–—‘’“”•…€'.includes(c) ? c : '?')).join('')
}
