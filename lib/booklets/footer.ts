/**
 * The notice at the foot of every page of a buyer's booklet: their licence number, that it is for
 * personal use, not for resale or sharing, and their name (the usual notice of sold patterns, in
 * our own words). The booklet fits its footer into half the printable width and cuts the rest
 * with "…", so the longest wording that fits is chosen, and the name and number always fit.
 */
import { jsPDF } from 'jspdf'
import { footerLine, type FooterNotice } from '@/lib/booklet/chrome'
import { pageFrame } from '@/lib/booklet/paper'
import type { BookletOptions } from '@/lib/schemas/booklet'

/** The footer's type, as lib/booklet/chrome.ts prints it: Helvetica Bold, 7 pt. */
const FOOTER_FONT_SIZE_PT = 7

/** Wordings from the fullest to the shortest; the first that fits is printed. */
const WORDINGS = [
  (licence: string) => `Licence ${licence} – for personal use, not for resale or sharing`,
  (licence: string) => `Licence ${licence} – personal use only, no resale or sharing`,
  (licence: string) => `Licence ${licence} – personal use only`,
  (licence: string) => `Licence ${licence}`,
] as const

let measuring: jsPDF | undefined

/** The printed width of a footer line, points. */
function lineWidth(line: string): number {
  measuring ??= new jsPDF({ unit: 'pt' })
  measuring.setFont('helvetica', 'bold')
  measuring.setFontSize(FOOTER_FONT_SIZE_PT)
  return measuring.getTextWidth(line)
}

/**
 * The buyer's footer for a booklet with these options.
 *
 * @example buyerFooter('Elsie Varga', 'WL-001001', { paper: 'letter', orientation: 'portrait', marginInches: 0.4 }).person // 'Elsie Varga'
 */
export function buyerFooter(person: string, licenceNumber: string, options: Pick<BookletOptions, 'paper' | 'orientation' | 'marginInches'>): FooterNotice {
  const room = pageFrame(options).printable.width / 2
  for (const wording of WORDINGS) {
    const footer = { person, notice: wording(licenceNumber) }
    if (lineWidth(footerLine(footer)) <= room) return footer
  }
  return { person, notice: WORDINGS[WORDINGS.length - 1]!(licenceNumber) }
}
