/**
 * Paper sizes in PDF points and the printable rectangle inside the margin. Sizes are written in
 * the unit of their standard and converted once, through lib/units.ts.
 */
import type { BookletOptions, PaperName } from '@/lib/schemas/booklet'
import { inchesToPoints, millimetresToPoints } from '@/lib/units'

export interface Paper {
  readonly name: PaperName
  /** The name people know it by, for the booklet's own text. */
  readonly title: string
  /** Portrait width and height, points. */
  readonly widthPt: number
  readonly heightPt: number
}

/** Sheet sizes: ANSI/ASME Y14.1 (Letter, Legal, Tabloid) and ISO 216:2007 (A4, A3). */
export const PAPERS: Readonly<Record<PaperName, Paper>> = {
  letter: { name: 'letter', title: 'US Letter (8.5 × 11 in)', widthPt: inchesToPoints(8.5), heightPt: inchesToPoints(11) },
  legal: { name: 'legal', title: 'US Legal (8.5 × 14 in)', widthPt: inchesToPoints(8.5), heightPt: inchesToPoints(14) },
  tabloid: { name: 'tabloid', title: 'Tabloid (11 × 17 in)', widthPt: inchesToPoints(11), heightPt: inchesToPoints(17) },
  a4: { name: 'a4', title: 'A4 (210 × 297 mm)', widthPt: millimetresToPoints(210), heightPt: millimetresToPoints(297) },
  a3: { name: 'a3', title: 'A3 (297 × 420 mm)', widthPt: millimetresToPoints(297), heightPt: millimetresToPoints(420) },
}

/** A rectangle on a page, points, origin top left, y down (as jsPDF places things). */
export interface PageRect {
  readonly x: number
  readonly y: number
  readonly width: number
  readonly height: number
}

/** One page's size and its printable area. */
export interface PageFrame {
  readonly widthPt: number
  readonly heightPt: number
  /** Inside the margin: nothing is drawn outside it. */
  readonly printable: PageRect
}

/**
 * The page of the chosen paper and orientation, with its printable rectangle.
 *
 * @example pageFrame({ paper: 'letter', orientation: 'landscape', marginInches: 0.4 }).widthPt // 792
 */
export function pageFrame(options: Pick<BookletOptions, 'paper' | 'orientation' | 'marginInches'>): PageFrame {
  const paper = PAPERS[options.paper]
  const landscape = options.orientation === 'landscape'
  const widthPt = landscape ? paper.heightPt : paper.widthPt
  const heightPt = landscape ? paper.widthPt : paper.heightPt
  const margin = inchesToPoints(options.marginInches)
  return { widthPt, heightPt, printable: { x: margin, y: margin, width: widthPt - 2 * margin, height: heightPt - 2 * margin } }
}
