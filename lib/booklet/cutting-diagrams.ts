/**
 * The booklet's "Cutting diagrams" part, after the cutting list: for every fabric of the chosen
 * colourway, its strips drawn to scale across the usable width of fabric (the core's
 * `fabricRequirements` at the options' width of fabric and extra, 40 in and 10 % unless set), each sub-cut filled, outlined and
 * labelled by what it is for, turned pieces marked by a corner notch, and each strip in words
 * under the drawing. The data is lib/fabric/cutting-diagram.ts, the same the fabric page draws.
 */
import type { jsPDF } from 'jspdf'
import { cuttingDiagram, type CuttingDiagram, type DiagramCut } from '@/lib/fabric/cutting-diagram'
import { formatMetres, formatYards } from '@/lib/fabric/fabric-table'
import { formatInches } from '@/lib/units'
import { font } from './chrome'
import type { BookletContext } from './context'
import { rgb, solidPen } from './draw'
import { startFlow, type Flow } from './flow'
import { bookletRequirements } from './model'
import { drawFabricMark } from './swatches'

/** Room above a fabric's drawing for its name and amounts, points. */
const FABRIC_HEADING_PT = 30
/** The smallest label drawn, points: below this a piece is named in the words under the drawing only. */
const SMALLEST_LABEL_PT = 3.5

/** The diagram's scale, points per inch: the usable width fills the column, and the deepest strip fits a page. */
function diagramScale(flow: Flow, diagram: CuttingDiagram, pageRoomPt: number): number {
  const deepest = Math.max(...diagram.strips.map((strip) => strip.heightIn), 1)
  return Math.min(flow.width / diagram.widthOfFabricIn, (pageRoomPt - FABRIC_HEADING_PT - 20) / deepest)
}

/** Black or white ink, whichever reads better on the fill (BT.709 luma). */
function inkOn(fill: [number, number, number]): number {
  return 0.2126 * fill[0] + 0.7152 * fill[1] + 0.0722 * fill[2] > 140 ? 20 : 255
}

function drawCut(doc: jsPDF, cut: DiagramCut, left: number, top: number, scale: number, fill: [number, number, number]): void {
  const x = left + cut.xIn * scale
  const y = top + cut.yIn * scale
  const w = cut.widthIn * scale
  const h = cut.heightIn * scale
  doc.setFillColor(...fill)
  solidPen(doc, 0.5, [40, 40, 40])
  doc.rect(x, y, w, h, 'FD')
  const ink = inkOn(fill)
  if (cut.turned) {
    const notch = Math.min(6, w / 3, h / 3)
    doc.setFillColor(ink, ink, ink)
    doc.triangle(x + w - notch, y, x + w, y, x + w, y + notch, 'F')
  }
  const size = Math.min(8, h * 0.5, (w * 0.9) / Math.max(1, cut.label.length * 0.55))
  if (size < SMALLEST_LABEL_PT) return
  font(doc, size, 'bold', ink)
  doc.text(cut.label, x + w / 2, y + h / 2 + size * 0.35, { align: 'center' })
}

/** One fabric: heading with colour chip (and swatch image) and amounts, then strip by strip, each with its words. */
function writeDiagram(context: BookletContext, flow: Flow, fabric: string, diagram: CuttingDiagram, amounts: string, pageRoomPt: number): void {
  const { doc } = context
  const scale = diagramScale(flow, diagram, pageRoomPt)
  const fill = rgb(diagram.color ?? undefined)
  const first = diagram.strips[0]
  flow.ensure(FABRIC_HEADING_PT + (first ? first.heightIn * scale : 0) + 12)
  flow.y += 8
  const nameAt = drawFabricMark(doc, diagram.color ?? undefined, context.swatches.get(fabric), flow.left, flow.y)
  font(doc, 10, 'bold')
  doc.text(diagram.name, nameAt, flow.y + 8.5)
  font(doc, 8, 'normal', 60)
  doc.text(amounts, nameAt, flow.y + 19)
  flow.y += FABRIC_HEADING_PT - 6
  for (const strip of diagram.strips) {
    const height = strip.heightIn * scale
    flow.ensure(height + 16)
    const top = flow.y - strip.yIn * scale
    // The strip across the whole usable width (dashed): what no piece covers is left over.
    doc.setFillColor(240, 240, 238)
    doc.setLineDashPattern([3, 2], 0)
    doc.setLineWidth(0.5)
    doc.setDrawColor(120, 120, 120)
    doc.rect(flow.left, flow.y, diagram.widthOfFabricIn * scale, height, 'FD')
    doc.setLineDashPattern([], 0)
    for (const cut of strip.cuts) drawCut(doc, cut, flow.left, top, scale, fill)
    flow.y += height + 2
    flow.paragraph(strip.words, { size: 7.5, grey: 30 })
  }
}

/**
 * Writes the cutting diagrams of the model's colourway, a fabric after another.
 *
 * @example writeCuttingDiagrams(context)
 */
export function writeCuttingDiagrams(context: BookletContext): void {
  const { model } = context
  const requirements = bookletRequirements(model)
  const width = formatInches(requirements.widthOfFabricIn)
  const flow = startFlow(context, 'Cutting diagrams', `Strips cut across a ${width} usable width of fabric, then sub-cut as labelled; a corner notch marks a piece turned 90°.`)
  const pageRoomPt = context.frame.printable.height - 60
  flow.paragraph(
    `Lay each fabric flat with ${width} of usable width across (selvedges off), cut the strips one after another from the cut end, then cut each strip into the pieces drawn in it. Every cut runs straight from edge to edge. The amounts add ${requirements.extraPercent} % and are rounded up to 1/8 yd (4 1/2 in) or 10 cm.`,
    { size: 8.5, grey: 50 },
  )
  for (const problem of requirements.problems) flow.paragraph(problem.message, { size: 9, style: 'bold' })
  for (const fabric of requirements.fabrics) {
    if (fabric.strips.length === 0) continue
    const diagram = cuttingDiagram(fabric, requirements.widthOfFabricIn, 'in')
    const precut = fabric.fatEighth ? ', or a fat eighth' : fabric.fatQuarter ? ', or a fat quarter' : ''
    const amounts = `${formatYards(fabric.yards)} (${formatMetres(fabric.metres)})${precut}; ${diagram.cuts.length} piece${diagram.cuts.length === 1 ? '' : 's'} in ${diagram.strips.length} strip${diagram.strips.length === 1 ? '' : 's'}, ${formatInches(fabric.lengthIn)} long`
    writeDiagram(context, flow, fabric.fabric, diagram, amounts, pageRoomPt)
  }
}
