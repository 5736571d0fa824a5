/**
 * The usual cautions of the trade, in our own words, and the instructions for printing and
 * taping the tiled pages.
 */
import type { BookletContext } from './context'
import { startFlow } from './flow'

/** The cautions, one paragraph each. */
export const CAUTIONS: readonly string[] = [
  'Rotary cutters are very sharp. Close the blade every time you put the cutter down, cut away from your body and keep your fingers behind the ruler edge.',
  'Irons get hot enough to burn. Keep the cord out of the way, never leave a hot iron unattended, and switch it off when you step away.',
  'Small stuffed parts (berries) and folded inserts (leaves) can come loose: a quilt carrying them is not suitable for infants or young children, who could choke on them.',
  'These are general notes, not a safety standard. Use your own judgement and follow the safety rules where you live and the instructions that came with your tools.',
]

/** How to print and assemble tiled pages. */
export const PRINTING_NOTES: readonly string[] = [
  'Print at 100 % (actual size); turn off "fit to page", "shrink oversized pages" and similar settings. Measure the 1 in and 2 cm test squares on a foundation page before going on.',
  'Foundations larger than one page are split into sheets numbered row by row ("sheet 2 of 4", with its row and column in words in the header); the page map at the foot of each page shows where each sheet belongs, and the targets in an overlap name the sheet that lies over it.',
  'To join two pages: trim one along the thin grey frame of its drawing area, lay it over its neighbour so the frame meets the dotted line and the round targets sit on each other, then tape.',
  'Foundations are printed mirrored (the printed side is the mirror image of the finished quilt): that is intended, the fabric goes on the unprinted side.',
]

/**
 * Writes the printing notes and the cautions on their own page(s).
 *
 * @example writeCautions(context)
 */
export function writeCautions(context: BookletContext): void {
  const flow = startFlow(context, 'Printing notes and cautions', 'Read before you print, cut or sew.')
  flow.heading('Printing and taping the pages')
  PRINTING_NOTES.forEach((note) => flow.paragraph(`- ${note}`))
  flow.gap(6)
  flow.heading('Cautions')
  CAUTIONS.forEach((caution) => flow.paragraph(`- ${caution}`))
}
