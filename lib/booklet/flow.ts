/**
 * Text pages that run on: a column of paragraphs, headings and small drawings that starts a
 * new page (with the part's header) whenever the next block would not fit above the foot.
 */
import { drawHeader, drawPageNumber, font, HEADER_HEIGHT_PT } from './chrome'
import { startPage, type BookletContext } from './context'

export interface Flow {
  /** Current top of the free space, points from the page top. */
  y: number
  readonly left: number
  readonly width: number
  /** Makes sure `height` points fit below `y`, starting a new page if not. */
  ensure(height: number): void
  heading(text: string): void
  paragraph(text: string, options?: { size?: number; style?: 'normal' | 'bold' | 'italic'; indent?: number; grey?: number }): void
  gap(points: number): void
}

/** Lines are wrapped this much short of the column: pdfjs measures some glyph runs a little wider than jsPDF. */
export const WRAP_SLACK_PT = 6

/** Room kept at the foot for the page number, points. */
const FOOT_PT = 14

/**
 * Starts a run of text pages with a header on each.
 *
 * @example const flow = startFlow(context, 'Sewing steps', 'Read each step before you sew it.'); flow.paragraph('Set a short stitch.')
 */
export function startFlow(context: BookletContext, title: string, note: string): Flow {
  const { doc, frame } = context
  const { x, y, width, height } = frame.printable
  const bottom = y + height - FOOT_PT
  const name = context.model.design.name
  const newPage = (): number => {
    const page = startPage(context)
    drawHeader(doc, frame, `${name} - ${title}`, note)
    drawPageNumber(doc, frame, page, name)
    return y + HEADER_HEIGHT_PT + 6
  }
  const flow: Flow = {
    y: newPage(),
    left: x,
    width,
    ensure(needed: number) {
      if (flow.y + needed > bottom) flow.y = newPage()
    },
    heading(text: string) {
      flow.ensure(40)
      font(doc, 12, 'bold')
      flow.y += 12
      doc.text(text, x, flow.y)
      flow.y += 6
    },
    paragraph(text, options = {}) {
      const size = options.size ?? 9
      const indent = options.indent ?? 0
      font(doc, size, options.style ?? 'normal', options.grey ?? 0)
      const lines: string[] = doc.splitTextToSize(text, width - indent - WRAP_SLACK_PT)
      const lineHeight = size * 1.3
      for (const line of lines) {
        flow.ensure(lineHeight)
        font(doc, size, options.style ?? 'normal', options.grey ?? 0)
        flow.y += lineHeight
        doc.text(line, x + indent, flow.y - size * 0.3)
      }
      flow.y += 2
    },
    gap(points: number) {
      flow.y += points
    },
  }
  return flow
}
